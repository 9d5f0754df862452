import type { ShapeMoments } from './types';

/**
 * Second moments count as equal (no principal axis) when (λ1 − λ2)/(λ1 + λ2) is below this: a polygon of N
 * vertices carries second-moment errors of order N⁻² ≈ 1e-6 for N = 1,024.
 */
const ISOTROPY_TOLERANCE = 1e-6;
/** Third moments within this fraction of |A|^{5/2} of each other count as equal (rounding is ~1e-15). */
const SKEW_TIE_TOLERANCE = 1e-9;

/** Third moments of the shape rotated by α (standard rotation of a cubic form). */
function rotatedSkew(moments: ShapeMoments, alpha: number): { along: number; across: number } {
  const c = Math.cos(alpha);
  const s = Math.sin(alpha);
  const { xxx, xxy, xyy, yyy } = moments;
  return {
    along: c * c * c * xxx - 3 * c * c * s * xxy + 3 * c * s * s * xyy - s * s * s * yyy,
    across: s * s * s * xxx + 3 * s * s * c * xxy + 3 * s * c * c * xyy + c * c * c * yyy,
  };
}

/**
 * Orientation stage shared by the descriptor and contour normalisations: the rotation that puts the major principal axis on +x, or undefined
 * when the second moments are equal. Of the two directions, the one where the third moment along x is
 * positive (the longer tail points to +x); if that is zero, the third moment along y positive; else both
 * are returned for a tie-break.
 */
export function principalAxisRotations(moments: ShapeMoments): readonly number[] | undefined {
  const { xx, xy, yy } = moments;
  const spread = xx + yy;
  if (!(Math.hypot(xx - yy, 2 * xy) > ISOTROPY_TOLERANCE * Math.abs(spread))) return undefined;
  const axis = Math.atan2(2 * xy, xx - yy) / 2;
  const options = [-axis, -axis + Math.PI];
  // Third moments scale as length⁵, i.e. as |A|^{5/2}.
  const skewTolerance = SKEW_TIE_TOLERANCE * Math.abs(moments.area) ** 2.5;
  for (const key of ['along', 'across'] as const) {
    const values = options.map((alpha) => rotatedSkew(moments, alpha)[key]);
    const [first = 0, second = 0] = values;
    if (Math.abs(first - second) > 2 * skewTolerance) return [first > second ? (options[0] as number) : (options[1] as number)];
  }
  return options;
}

