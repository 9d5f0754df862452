import { checkBoundaryAngle } from './check-boundary-angle';
import type { PlaneVector } from './types';

const DEG = Math.PI / 180;

/**
 * The unit normal of the boundary at `angleDeg` (degrees in [0, 180), counter-clockwise from +a): the direction
 * θ + 90°, i.e. (−sin θ, cos θ). θ = 0 → (0, 1) (+b); θ = 90° → (−1, 0) (−a). Side 'A' is the side it points to.
 * Throws `BoundaryError` 'angle-out-of-range'.
 */
export function boundaryNormal(angleDeg: number): PlaneVector {
  const theta = checkBoundaryAngle(angleDeg) * DEG;
  // -0 + 0 turns a negative zero into +0, so θ = 0 gives exactly (0, 1).
  return { a: -Math.sin(theta) + 0, b: Math.cos(theta) };
}
