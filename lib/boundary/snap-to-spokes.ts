import { BoundaryError } from './boundary-error';
import { BOUNDARY_LIMITS } from './boundary-limits';
import { checkBoundaryAngle } from './check-boundary-angle';

/**
 * The boundary angle (degrees in [0, 180)) nearest to `angleDeg` that runs along the spokes of a Rings layout
 * with `spokes` spokes (at 360°·s/spokes). Those diameters are at multiples of 360°/spokes for an even count
 * (each runs along two opposite spokes) and of 180°/spokes for an odd one (each runs along one spoke and between
 * two others — every multiple of 180°/S is, modulo 180°, some spoke's direction). Ties go to the larger angle;
 * 180° wraps to 0. Throws `BoundaryError` for a bad angle or a spoke count that is not a whole number ≥ 1.
 */
export function snapToSpokes(angleDeg: number, spokes: number): number {
  checkBoundaryAngle(angleDeg);
  if (!(Number.isInteger(spokes) && spokes >= 1)) {
    throw new BoundaryError('invalid-argument', `The spoke count must be a whole number of at least 1; got ${String(spokes)}.`);
  }
  const step = spokes % 2 === 0 ? 360 / spokes : BOUNDARY_LIMITS.maxAngleDeg / spokes;
  const index = Math.round(angleDeg / step);
  const count = Math.round(BOUNDARY_LIMITS.maxAngleDeg / step);
  // Index, not angle, is wrapped, so 180 comes back as exactly 0.
  return (index % count) * step;
}
