import { findSelfIntersection } from './find-self-intersection';
import type { Contour } from './types';

/**
 * True when the closed polygon is simple: at least 3 finite vertices, no zero-length edge, and no two edges
 * meeting except adjacent edges at their shared vertex (touching and collinear overlap count as meeting).
 * Exact: Shamos–Hoey sweep with Shewchuk's orientation predicate (see `findSelfIntersection`).
 */
export function isSimpleContour(contour: Contour): boolean {
  const n = contour.x.length;
  if (n < 3 || contour.y.length !== n) return false;
  for (let i = 0; i < n; i++) {
    if (!Number.isFinite(contour.x[i]) || !Number.isFinite(contour.y[i])) return false;
  }
  return findSelfIntersection(contour) === undefined;
}
