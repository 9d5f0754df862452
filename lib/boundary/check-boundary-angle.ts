import { BoundaryError } from './boundary-error';
import { BOUNDARY_LIMITS } from './boundary-limits';

/** Returns a boundary angle unchanged if it is a number of degrees in [0, 180); throws `BoundaryError` 'angle-out-of-range' otherwise (NaN included). */
export function checkBoundaryAngle(angleDeg: number): number {
  if (!(Number.isFinite(angleDeg) && angleDeg >= 0 && angleDeg < BOUNDARY_LIMITS.maxAngleDeg)) {
    throw new BoundaryError('angle-out-of-range', `A boundary angle must be at least 0° and less than 180°; got ${String(angleDeg)}.`);
  }
  return angleDeg;
}
