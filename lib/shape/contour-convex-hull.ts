import { orientation } from './orientation';
import type { Contour } from './types';

/**
 * Convex hull of the vertices, counter-clockwise, collinear points dropped: Andrew's monotone chain (1979)
 * with the exact orientation predicate, O(N log N).
 */
export function contourConvexHull(contour: Contour): Contour {
  const { x, y } = contour;
  const order = Array.from({ length: x.length }, (_, i) => i).sort(
    (i, j) => (x[i] as number) - (x[j] as number) || (y[i] as number) - (y[j] as number),
  );
  const hull: number[] = [];
  const turnsLeft = (a: number, b: number, c: number): boolean =>
    orientation(x[a] as number, y[a] as number, x[b] as number, y[b] as number, x[c] as number, y[c] as number) > 0;
  // Lower chain, then upper chain.
  for (const i of order) {
    while (hull.length >= 2 && !turnsLeft(hull[hull.length - 2] as number, hull[hull.length - 1] as number, i)) hull.pop();
    hull.push(i);
  }
  const lowerSize = hull.length + 1;
  for (let s = order.length - 2; s >= 0; s--) {
    const i = order[s] as number;
    while (hull.length >= lowerSize && !turnsLeft(hull[hull.length - 2] as number, hull[hull.length - 1] as number, i)) hull.pop();
    hull.push(i);
  }
  hull.pop();
  return { x: Float64Array.from(hull, (i) => x[i] as number), y: Float64Array.from(hull, (i) => y[i] as number) };
}
