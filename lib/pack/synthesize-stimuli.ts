import { ShapeError } from '../shape/errors';
import { synthesizeContour } from '../shape/synthesize-contour';
import type { Contour } from '../shape/types';
import { PackError } from './pack-error';
import type { PackStimulus } from './pack-stimuli';
import type { PackIssue } from './types';

/**
 * Each stimulus's outline at `samples` points (`lib/shape`'s `synthesizeContour`, counter-clockwise, from t = 0),
 * shifted by its `contourOffset` — what `lib/space`'s `stimulusContour` draws — with the engine's full validity
 * check (r > 0, no self-intersection). Raises `PackError` (`invalid-space`) listing every stimulus the engine
 * refuses, with its code and message.
 */
export function synthesizeStimuli(stimuli: readonly PackStimulus[], samples: number): Contour[] {
  const issues: PackIssue[] = [];
  const contours = stimuli.map((stimulus) => {
    try {
      const contour = synthesizeContour(stimulus.descriptor, samples, { checkSimple: true });
      const [dx, dy] = stimulus.contourOffset;
      if (dx !== 0 || dy !== 0) {
        for (let i = 0; i < contour.x.length; i++) {
          contour.x[i] = (contour.x[i] as number) + dx;
          contour.y[i] = (contour.y[i] as number) + dy;
        }
      }
      return contour;
    } catch (error) {
      if (!(error instanceof ShapeError)) throw error;
      issues.push({ field: `stimuli.${stimulus.id}`, code: error.code, message: `${stimulus.id}: ${error.message}` });
      return null;
    }
  });
  if (issues.length > 0) {
    throw new PackError('invalid-space', `${issues.length} stimuli cannot be drawn: ${issues.slice(0, 3).map((i) => i.message).join('; ')}${issues.length > 3 ? '; …' : ''}`, issues);
  }
  return contours as Contour[];
}
