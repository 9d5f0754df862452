import type { Contour, Point } from './types';

/** The contour's vertices as readonly [x, y] tuples. */
export function contourToPoints(contour: Contour): Point[] {
  return Array.from(contour.x, (px, i): Point => [px, contour.y[i] as number]);
}
