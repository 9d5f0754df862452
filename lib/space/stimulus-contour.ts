import { synthesizeContour } from '../shape/synthesize-contour';
import type { Contour, SynthesisMethod } from '../shape/types';
import type { Stimulus } from './types';

/** Options of `stimulusContour`. */
export interface StimulusContourOptions {
  /**
   * Check elliptic and complex contours for self-intersection (the engine's exact sweep). Default false: the
   * live view redraws every stimulus on every slider move, and validity is `checkSpace`'s job; a crossing
   * stimulus is drawn as it is.
   */
  readonly checkSimple?: boolean;
  /** Synthesis path (default `auto`, the engine's cheaper of a direct sum and an FFT). */
  readonly method?: SynthesisMethod;
  /** Arrays of length `samples` to write into (see `synthesizeContour`'s `output`). */
  readonly output?: Contour;
}

/**
 * The stimulus's outline: its descriptor synthesised by `lib/shape` at `samples` points (counter-clockwise,
 * starting at t = 0), shifted by `contourOffset` (the centroid normalisation of radial stimuli). Raises the
 * engine's `ShapeError` for a shape it refuses (r ≤ 0, too few samples for the highest harmonic, …).
 */
export function stimulusContour(stimulus: Stimulus, samples: number, options: StimulusContourOptions = {}): Contour {
  const contour = synthesizeContour(stimulus.descriptor, samples, {
    checkSimple: options.checkSimple ?? false,
    method: options.method ?? 'auto',
    ...(options.output ? { output: options.output } : {}),
  });
  const [dx, dy] = stimulus.contourOffset;
  if (dx === 0 && dy === 0) return contour;
  const { x, y } = contour;
  for (let i = 0; i < x.length; i++) {
    x[i] = (x[i] as number) + dx;
    y[i] = (y[i] as number) + dy;
  }
  return contour;
}
