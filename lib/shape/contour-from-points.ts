import type { Contour, Point } from './types';

/** Copies readonly [x, y] points into a contour. A repeated closing point is kept; see `parseCsvOutline`. */
export function contourFromPoints(points: readonly Point[]): Contour {
  const x = new Float64Array(points.length);
  const y = new Float64Array(points.length);
  points.forEach(([px, py], i) => {
    x[i] = px;
    y[i] = py;
  });
  return { x, y };
}
