import type { Contour, RasterExtent } from '../shape/types';
import { fillPairwiseRdm } from './fill-pairwise-rdm';
import { silhouetteExtent } from './silhouette-extent';
import { silhouetteRuns, silhouetteRunsDistance, type SilhouetteRuns } from './silhouette-runs';
import { SpaceError } from './space-error';
import type { Rdm } from './types';

/** Default raster: 256² pixels, `lib/shape`'s own default for silhouette distance (0.4 % of the extent). */
export const DEFAULT_SILHOUETTE_RESOLUTION = 256;

/** Options of `silhouetteRdm`. */
export interface SilhouetteRdmOptions {
  /** Pixels per side (default 256). */
  readonly resolution?: number;
  /** The square every contour is rasterised on; default `silhouetteExtent` (their bounding square plus 2 %). */
  readonly extent?: RasterExtent;
  readonly onProgress?: (fraction: number) => void;
}

/**
 * The silhouette RDM: entry (i, j) is 1 − IoU = 1 − |A ∩ B| / |A ∪ B| of the filled shapes on one common raster
 * (the pixels of `lib/shape`'s `rasterizeContour`: a pixel is set when its centre is inside, even–odd rule).
 * Each contour is rasterised once, straight to runs of set pixels per row (`silhouetteRuns`); each pair then
 * costs one overlap of runs per row both occupy (`silhouetteRunsDistance`: |A ∩ B| is the same integer as a
 * word-wise AND and popcount of the bitmasks, in a fraction of the time), |A ∪ B| = |A| + |B| − |A ∩ B|.
 * Position matters (no alignment): the stimuli are compared as drawn. In [0, 1]; two empty masks are at 0.
 * Row-major, symmetric, zero diagonal. Blocks of rows can be computed apart with `silhouetteRdmRows`.
 */
export function silhouetteRdm(contours: readonly Contour[], options: SilhouetteRdmOptions = {}): Rdm {
  const resolution = options.resolution ?? DEFAULT_SILHOUETTE_RESOLUTION;
  if (!Number.isInteger(resolution) || resolution < 1) throw new SpaceError('invalid-argument', `resolution = ${resolution} must be a whole number of pixels ≥ 1`);
  const n = contours.length;
  if (n === 0) return { size: 0, values: new Float64Array(0) };
  // Phase 1: one extent, one mask per contour.
  const extent = options.extent ?? silhouetteExtent(contours);
  const masks = contours.map((c) => silhouetteRuns(c, resolution, extent));
  // Phase 2: the pairs.
  return fillPairwiseRdm(
    n,
    (i, j) => silhouetteRunsDistance(masks[i] as SilhouetteRuns, masks[j] as SilhouetteRuns),
    options.onProgress,
  );
}
