import { BoundaryError } from './boundary-error';
import { BOUNDARY_LIMITS } from './boundary-limits';

/**
 * Any finite angle in degrees wrapped into [0, 180), the range of a boundary (a diameter at θ and θ + 180° is the
 * same line); for a drag that passes the end of the range, or a direction in [0, 360). Throws `BoundaryError`
 * 'angle-out-of-range' for NaN and ±Infinity.
 */
export function normalizeBoundaryAngle(angleDeg: number): number {
  if (!Number.isFinite(angleDeg)) {
    throw new BoundaryError('angle-out-of-range', `A boundary angle must be a finite number of degrees; got ${String(angleDeg)}.`);
  }
  const half = BOUNDARY_LIMITS.maxAngleDeg;
  let wrapped = angleDeg - half * Math.floor(angleDeg / half);
  // A tiny negative input underflows angle / 180 to −0 and stays negative; adding 180 may then round to 180.
  if (wrapped < 0) wrapped += half;
  // + 0 turns −0 into 0.
  return wrapped >= half ? 0 : wrapped + 0;
}
