import { contourConvexHull } from '../shape/contour-convex-hull';
import type { Contour } from '../shape/types';

/**
 * The maximum extent of an outline: the largest distance between two of its vertices (maximum Feret diameter,
 * the longest caliper width), in shape units. The farthest pair lies on the convex hull (`lib/shape`'s Andrew
 * monotone chain), so only hull vertices are compared, O(h²) with h ≤ N.
 */
export function contourMaxExtent(contour: Contour): number {
  if (contour.x.length < 2) return 0;
  const { x, y } = contourConvexHull(contour);
  const h = x.length;
  let best = 0;
  for (let i = 0; i < h; i++) {
    const xi = x[i] as number;
    const yi = y[i] as number;
    for (let j = i + 1; j < h; j++) {
      const dx = (x[j] as number) - xi;
      const dy = (y[j] as number) - yi;
      const d2 = dx * dx + dy * dy;
      if (d2 > best) best = d2;
    }
  }
  return Math.sqrt(best);
}
