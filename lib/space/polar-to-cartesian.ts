import type { PolarPosition, SpacePosition } from './types';

/**
 * Polar → Cartesian in the space's plane: a = ρ cos θ, b = ρ sin θ, with θ in radians counter-clockwise from
 * the +a axis (Axis A) towards +b (Axis B). Any finite ρ is accepted; a negative ρ points the opposite way,
 * which is how a diameter's far half is written.
 */
export function polarToCartesian(polar: PolarPosition): SpacePosition {
  return { a: polar.rho * Math.cos(polar.angle), b: polar.rho * Math.sin(polar.angle) };
}
