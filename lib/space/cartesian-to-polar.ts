import type { PolarPosition, SpacePosition } from './types';
import { wrapAngle } from './wrap-angle';

/**
 * Cartesian → polar in the space's plane: ρ = √(a² + b²) ≥ 0 and θ = atan2(b, a) wrapped into [0, 2π),
 * counter-clockwise from +a towards +b. The origin maps to (0, 0).
 */
export function cartesianToPolar(position: SpacePosition): PolarPosition {
  const rho = Math.hypot(position.a, position.b);
  return { rho, angle: rho === 0 ? 0 : wrapAngle(Math.atan2(position.b, position.a)) };
}
