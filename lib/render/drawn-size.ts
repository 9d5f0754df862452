import type { Contour } from '../shape/types';
import { pixelsToDegrees } from './pixels-to-degrees';
import { stimulusMeasure } from './stimulus-measure';
import type { DisplayProfile, DrawnSize, RenderFrame } from './types';

/** A stimulus's equal-area diameter and maximum extent as drawn in a frame, degrees of visual angle. */
export function drawnSize(contour: Contour, frame: RenderFrame, profile: DisplayProfile): DrawnSize {
  return {
    equalAreaDiameterDeg: pixelsToDegrees(stimulusMeasure(contour, 'equal-area-diameter') * frame.pxPerUnit, profile),
    maxExtentDeg: pixelsToDegrees(stimulusMeasure(contour, 'max-extent') * frame.pxPerUnit, profile),
  };
}
