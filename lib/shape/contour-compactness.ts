import { contourArea } from './contour-area';
import { contourPerimeter } from './contour-perimeter';
import type { Contour } from './types';

/**
 * Compactness (isoperimetric quotient) 4π|A|/P², in (0, 1]; 1 only for a circle (the isoperimetric
 * inequality), π/4 for a square.
 */
export function contourCompactness(contour: Contour): number {
  const perimeter = contourPerimeter(contour);
  return perimeter === 0 ? 0 : (4 * Math.PI * Math.abs(contourArea(contour))) / (perimeter * perimeter);
}
