import { contourArea } from './contour-area';
import { contourCentroid } from './contour-centroid';
import type { Contour, ShapeMoments } from './types';

/** Three-point Gauss–Legendre rule on [0, 1]: exact for polynomials up to degree 5 (the integrands are ≤ 4). */
const GAUSS_NODES = [0.5 - Math.sqrt(15) / 10, 0.5, 0.5 + Math.sqrt(15) / 10] as const;
const GAUSS_WEIGHTS = [5 / 18, 8 / 18, 5 / 18] as const;

/**
 * Area, area centroid and the central second and third area moments ∫∫ x^p y^q dA of a polygon, exact up to
 * rounding: Green's theorem turns each into ∮ x^{p+1} y^q/(p+1) dy, integrated along every edge with a
 * three-point Gauss–Legendre rule. Signs follow the orientation (all negated for a clockwise polygon).
 */
export function contourMoments(contour: Contour): ShapeMoments {
  const area = contourArea(contour);
  const centroid = contourCentroid(contour);
  const { x, y } = contour;
  const n = x.length;
  let xx = 0, xy = 0, yy = 0, xxx = 0, xxy = 0, xyy = 0, yyy = 0;
  for (let i = 0; i < n; i++) {
    const j = i + 1 === n ? 0 : i + 1;
    const u0 = (x[i] as number) - centroid[0];
    const v0 = (y[i] as number) - centroid[1];
    const du = (x[j] as number) - centroid[0] - u0;
    const dv = (y[j] as number) - centroid[1] - v0;
    for (let g = 0; g < 3; g++) {
      const s = GAUSS_NODES[g] as number;
      const w = (GAUSS_WEIGHTS[g] as number) * dv;
      const u = u0 + s * du;
      const v = v0 + s * dv;
      const u2 = u * u;
      xx += (w * u2 * u) / 3;
      xy += (w * u2 * v) / 2;
      yy += w * u * v * v;
      xxx += (w * u2 * u2) / 4;
      xxy += (w * u2 * u * v) / 3;
      xyy += (w * u2 * v * v) / 2;
      yyy += w * u * v * v * v;
    }
  }
  return { area, centroid, xx, xy, yy, xxx, xxy, xyy, yyy };
}
