import { contourArea } from './contour-area';
import type { Contour } from './types';

/** Diameter of the circle with the polygon's area, 2√(|A|/π), in shape units (the equal-area radius is half). */
export function contourEqualAreaDiameter(contour: Contour): number {
  return 2 * Math.sqrt(Math.abs(contourArea(contour)) / Math.PI);
}
