import type { Contour } from '../shape/types';
import { descriptorSpectrum } from '../space/descriptor-spectrum';
import { designRdm } from '../space/design-rdm';
import { silhouetteRdm } from '../space/silhouette-rdm';
import { spectrumRdm } from '../space/spectrum-rdm';
import type { Rdm } from '../space/types';
import { PACK_LIMITS } from './pack-limits';
import type { PackStimulus } from './pack-stimuli';

/** The three model RDMs of a pack, over the same stimuli in the same order. */
export interface ModelRdms {
  readonly design: Rdm;
  readonly contour: Rdm;
  readonly silhouette: Rdm;
}

/**
 * The model dissimilarities `lib/space` defines, as its confound audit computes them: design — Euclidean
 * distance of designed (a, b), axis units (`designRdm`); contour — RMS corresponding-point distance after the
 * best translation, rotation and start point, shape units, from each descriptor's exact spectrum
 * (`descriptorSpectrum`, `spectrumRdm`); silhouette — 1 − IoU of the filled outlines on one common 256² raster
 * (`silhouetteRdm`). `onProgress(fraction)` runs over the three in turn.
 */
export function modelRdms(stimuli: readonly PackStimulus[], contours: readonly Contour[], onProgress?: (fraction: number) => void): ModelRdms {
  const design = designRdm(stimuli);
  onProgress?.(0.02);
  const contour = spectrumRdm(stimuli.map((s) => descriptorSpectrum(s.descriptor)), { onProgress: (f) => onProgress?.(0.02 + 0.38 * f) });
  const silhouette = silhouetteRdm(contours, { resolution: PACK_LIMITS.silhouetteResolution, onProgress: (f) => onProgress?.(0.4 + 0.6 * f) });
  return { design, contour, silhouette };
}
