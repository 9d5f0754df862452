import { ShapeError } from './errors';
import { SHAPE_LIMITS } from './shape-limits';
import type { Contour } from './types';

/**
 * Input checks shared by the fitting and distance functions: at least 3 vertices, equal x/y lengths, finite
 * coordinates, and (when given) a harmonic count that is an integer from 1 to 128.
 */
export function checkOutline(contour: Contour, harmonics?: number): void {
  const n = contour.x.length;
  if (contour.y.length !== n) {
    throw new ShapeError('invalid-argument', `x has ${n} values but y has ${contour.y.length}`, { value: contour.y.length });
  }
  if (n < 3) throw new ShapeError('too-few-points', `an outline needs at least 3 vertices, got ${n}`, { value: n, minimum: 3 });
  for (let i = 0; i < n; i++) {
    const px = contour.x[i] as number;
    const py = contour.y[i] as number;
    if (!Number.isFinite(px) || !Number.isFinite(py)) {
      throw new ShapeError('not-finite', `vertex ${i} is (${px}, ${py}); coordinates must be finite`, {
        vertex: i,
        value: Number.isFinite(px) ? py : px,
      });
    }
  }
  if (harmonics !== undefined && (!Number.isInteger(harmonics) || harmonics < 1 || harmonics > SHAPE_LIMITS.maxHarmonic)) {
    throw new ShapeError(
      'harmonic-out-of-range',
      `harmonics = ${harmonics} must be an integer from 1 to ${SHAPE_LIMITS.maxHarmonic}`,
      { harmonic: harmonics, value: harmonics, minimum: 1, maximum: SHAPE_LIMITS.maxHarmonic },
    );
  }
}
