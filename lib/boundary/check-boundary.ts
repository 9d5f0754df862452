import { BoundaryError } from './boundary-error';
import { BOUNDARY_KEY_PATTERN, MAX_BOUNDARY_KEY_LENGTH } from './boundary-limits';
import { checkBoundaryAngle } from './check-boundary-angle';
import type { Boundary } from './types';

/**
 * Returns the boundary unchanged if it is valid: a key matching `BOUNDARY_KEY_PATTERN` (≤ 40 characters), an
 * angle in [0°, 180°) and, if given, a finite prototype distance > 0 (axis units). Throws `BoundaryError`.
 */
export function checkBoundary(boundary: Boundary): Boundary {
  if (boundary.key.length > MAX_BOUNDARY_KEY_LENGTH || !BOUNDARY_KEY_PATTERN.test(boundary.key)) {
    throw new BoundaryError('invalid-key', `A boundary key is 1–40 lowercase letters, digits and single hyphens; got "${boundary.key}".`);
  }
  checkBoundaryAngle(boundary.angleDeg);
  const d = boundary.prototypeDistance;
  if (d !== undefined && !(Number.isFinite(d) && d > 0)) {
    throw new BoundaryError('invalid-argument', `The prototype distance of boundary "${boundary.key}" must be a number above 0; got ${String(d)}.`);
  }
  return boundary;
}
