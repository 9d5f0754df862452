import type { Contour } from '../shape/types';
import { RenderError } from './render-error';
import { stimulusMeasure } from './stimulus-measure';
import type { RenderFrame, ResolvedRender } from './types';

/**
 * The one frame every stimulus of a pack is drawn in: the stimulus with the largest `sizeMeasure` gets exactly
 * `sizes.stimulusPx`, and every other keeps its size and position relative to it (all equal in size when the
 * space normalises scale by that measure); the shape origin sits at the canvas centre. Raises `RenderError`:
 * `invalid-argument` for no contours or a degenerate largest shape, `does-not-fit` when a shape (with half the
 * outline stroke) reaches past the canvas, naming the stimuli (`ids`, default their indices).
 */
export function frameStimuli(contours: readonly Contour[], render: ResolvedRender, ids?: readonly string[]): RenderFrame {
  if (contours.length === 0) throw new RenderError('invalid-argument', 'There are no stimuli to frame.');
  // Phase 1: one scale from the largest measure.
  let largest = 0;
  for (const contour of contours) largest = Math.max(largest, stimulusMeasure(contour, render.options.sizeMeasure));
  if (!(largest > 0) || !Number.isFinite(largest)) throw new RenderError('invalid-argument', 'The stimuli have no size to scale (zero area or extent).');
  const { canvasPx, canvasMm, stimulusPx, strokePx } = render.sizes;
  const pxPerUnit = stimulusPx / largest;
  const centrePx = canvasPx / 2;
  // Phase 2: every shape, with half the stroke outside its line, inside the canvas.
  const reach = centrePx - strokePx / 2;
  const outside: string[] = [];
  contours.forEach((contour, index) => {
    let extent = 0;
    for (let i = 0; i < contour.x.length; i++) extent = Math.max(extent, Math.abs(contour.x[i] as number), Math.abs(contour.y[i] as number));
    if (extent * pxPerUnit > reach) outside.push(ids?.[index] ?? String(index));
  });
  if (outside.length > 0) {
    const listed = outside.slice(0, 5).join(', ') + (outside.length > 5 ? ` and ${outside.length - 5} more` : '');
    throw new RenderError(
      'does-not-fit',
      `At ${render.options.sizeDeg}° some stimuli reach past a ${render.options.canvasDeg}° canvas (${listed}); enlarge the canvas or shrink the stimuli.`,
      [{ field: 'canvasDeg', code: 'canvas-too-small', message: `Stimuli past the canvas edge: ${listed}.` }],
    );
  }
  return { canvasPx, canvasMm, pxPerUnit, centrePx };
}
