import { contourEqualAreaDiameter } from '../shape/contour-equal-area-diameter';
import type { Contour } from '../shape/types';
import { contourMaxExtent } from './contour-max-extent';
import type { SizeMeasure } from './types';

/**
 * The size of an outline by a measure, in shape units: the equal-area diameter 2√(|A|/π) (A by the shoelace
 * formula) or the maximum extent (`contourMaxExtent`).
 */
export function stimulusMeasure(contour: Contour, measure: SizeMeasure): number {
  return measure === 'equal-area-diameter' ? contourEqualAreaDiameter(contour) : contourMaxExtent(contour);
}
