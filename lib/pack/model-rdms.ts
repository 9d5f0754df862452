import type { Contour } from '../shape/types';
import { descriptorSpectrum } from '../space/descriptor-spectrum';
import { designRdm } from '../space/design-rdm';
import { silhouetteRdm } from '../space/silhouette-rdm';
import { rdmFromRows } from '../space/rdm-from-rows';
import { silhouetteExtent } from '../space/silhouette-extent';
import { spectrumRdm } from '../space/spectrum-rdm';
import { splitRdmRows } from '../space/split-rdm-rows';
import type { Rdm, RdmRows } from '../space/types';
import type { PackJobRunner } from './pack-job';
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

/**
 * The same three RDMs as `modelRdms`, with the same values, the contour and silhouette ones split into
 * `PACK_LIMITS.rdmBlocks` and `silhouetteBlocks` blocks of rows (`splitRdmRows`), all handed to `run` at once and joined
 * (`rdmFromRows`); the design RDM is computed here meanwhile. `onProgress(fraction)` as blocks complete.
 */
export async function computeModelRdms(stimuli: readonly PackStimulus[], contours: readonly Contour[], run: PackJobRunner, onProgress?: (fraction: number) => void): Promise<ModelRdms> {
  const n = stimuli.length;
  const blocks = splitRdmRows(n, PACK_LIMITS.rdmBlocks);
  const silhouetteBlocks = splitRdmRows(n, PACK_LIMITS.silhouetteBlocks);
  const spectra = stimuli.map((s) => descriptorSpectrum(s.descriptor));
  const extent = silhouetteExtent(contours);
  let done = 0;
  const total = blocks.length + silhouetteBlocks.length;
  const counted = (rows: RdmRows): RdmRows => {
    done++;
    onProgress?.(done / total);
    return rows;
  };
  const contourRows = blocks.map((b) => run({ kind: 'contour-rows', spectra, from: b.from, to: b.to }).then(counted));
  const silhouetteRows = silhouetteBlocks.map((b) =>
    run({ kind: 'silhouette-rows', contours: contours.slice(b.from), size: n, from: b.from, to: b.to, resolution: PACK_LIMITS.silhouetteResolution, extent }).then(counted),
  );
  const design = designRdm(stimuli);
  return { design, contour: rdmFromRows(n, await Promise.all(contourRows)), silhouette: rdmFromRows(n, await Promise.all(silhouetteRows)) };
}
