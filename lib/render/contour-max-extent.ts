import { contourConvexHull } from '../shape/contour-convex-hull';
import type { Contour } from '../shape/types';

/**
 * The maximum extent of an outline: the largest distance between two of its vertices (maximum Feret diameter,
 * the longest caliper width), in shape units. The farthest pair lies on the convex hull (`lib/shape`'s Andrew
 * monotone chain) and is an antipodal pair of it, so rotating calipers (Shamos 1978; Preparata & Shamos,
 * Computational Geometry, §4.2.3) find it in O(h) after the hull: for each hull edge, the vertex farthest from
 * its line. Each edge's two ends are compared with that vertex and its two neighbours, so a pair that ties the
 * maximum to rounding is never skipped; the result is exactly the all-pairs maximum (tested against it).
 */
export function contourMaxExtent(contour: Contour): number {
  if (contour.x.length < 2) return 0;
  const { x, y } = contourConvexHull(contour);
  const h = x.length;
  if (h < 2) return 0;
  let best = 0;
  const consider = (i: number, j: number): void => {
    const dx = (x[j] as number) - (x[i] as number);
    const dy = (y[j] as number) - (y[i] as number);
    const d2 = dx * dx + dy * dy;
    if (d2 > best) best = d2;
  };
  if (h <= 3) {
    for (let i = 0; i < h; i++) for (let j = i + 1; j < h; j++) consider(i, j);
    return Math.sqrt(best);
  }
  // Twice the area of triangle (a, b, k): the distance of k from the line through a and b, times |ab|.
  const height = (a: number, b: number, k: number): number =>
    ((x[b] as number) - (x[a] as number)) * ((y[k] as number) - (y[a] as number)) - ((y[b] as number) - (y[a] as number)) * ((x[k] as number) - (x[a] as number));
  let j = 1;
  for (let i = 0; i < h; i++) {
    const next = i + 1 === h ? 0 : i + 1;
    // Advance the opposite caliper while the next vertex is farther from edge (i, next); the hull is convex, so
    // the distance rises then falls around it. At most h steps per edge, whatever rounding does.
    for (let steps = 0; steps < h; steps++) {
      const after = j + 1 === h ? 0 : j + 1;
      if (!(height(i, next, after) > height(i, next, j))) break;
      j = after;
    }
    const before = j === 0 ? h - 1 : j - 1;
    const after = j + 1 === h ? 0 : j + 1;
    consider(i, before);
    consider(i, j);
    consider(i, after);
    consider(next, before);
    consider(next, j);
    consider(next, after);
  }
  return Math.sqrt(best);
}
