import type { SpacePosition } from '../space/types';
import { BoundaryError } from './boundary-error';
import { BOUNDARY_LIMITS } from './boundary-limits';
import { signedDistance } from './signed-distance';
import type { Boundary, BoundarySide } from './types';

/**
 * The side of a boundary a position lies on: 'A' when the signed distance (`signedDistance`) is above
 * `tolerance`, 'B' below −tolerance, 'on' (ambiguous) within it. `tolerance` in axis units, ≥ 0, default
 * `BOUNDARY_LIMITS.onTolerance` (1e-9). Throws `BoundaryError`.
 */
export function sideOf(
  position: SpacePosition,
  boundary: Pick<Boundary, 'angleDeg'>,
  tolerance: number = BOUNDARY_LIMITS.onTolerance,
): BoundarySide {
  if (!(Number.isFinite(tolerance) && tolerance >= 0)) {
    throw new BoundaryError('invalid-argument', `The tolerance must be a number of at least 0; got ${String(tolerance)}.`);
  }
  const distance = signedDistance(position, boundary);
  if (distance > tolerance) return 'A';
  if (distance < -tolerance) return 'B';
  return 'on';
}
