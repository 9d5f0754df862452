import { contourArea } from './contour-area';
import { contourConvexHull } from './contour-convex-hull';
import type { Contour } from './types';

/**
 * Convexity as solidity, the area-based convexity measure of shape analysis (common practice):
 * |A| / area of the convex hull, in (0, 1], exactly 1 for convex polygons.
 */
export function contourConvexity(contour: Contour): number {
  const hullArea = contourArea(contourConvexHull(contour));
  return hullArea === 0 ? 0 : Math.abs(contourArea(contour)) / hullArea;
}
