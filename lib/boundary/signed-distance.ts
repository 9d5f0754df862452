import type { SpacePosition } from '../space/types';
import { boundaryNormal } from './boundary-normal';
import type { Boundary } from './types';

/**
 * Signed perpendicular distance of a position from a boundary, in axis units: position · normal, with the
 * normal at θ + 90° (`boundaryNormal`). Positive on side 'A' (where the normal points), negative on side 'B'.
 * θ = 0: the boundary is the a axis and (0, 1) is at +1. Throws `BoundaryError` for a bad angle.
 */
export function signedDistance(position: SpacePosition, boundary: Pick<Boundary, 'angleDeg'>): number {
  const normal = boundaryNormal(boundary.angleDeg);
  return position.a * normal.a + position.b * normal.b;
}
