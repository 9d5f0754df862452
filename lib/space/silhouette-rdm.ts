import type { Contour, RasterExtent } from '../shape/types';
import { fillPairwiseRdm } from './fill-pairwise-rdm';
import { silhouetteRuns, type SilhouetteRuns } from './silhouette-runs';
import { SpaceError } from './space-error';
import type { Rdm } from './types';

/** Default raster: 256² pixels, `lib/shape`'s own default for silhouette distance (0.4 % of the extent). */
export const DEFAULT_SILHOUETTE_RESOLUTION = 256;
/** The common extent leaves this fraction of its size free on every side, so no shape touches the raster's edge. */
const EXTENT_MARGIN = 0.02;

/** Options of `silhouetteRdm`. */
export interface SilhouetteRdmOptions {
  /** Pixels per side (default 256). */
  readonly resolution?: number;
  /** The square every contour is rasterised on; default the union bounding square of all of them plus 2 %. */
  readonly extent?: RasterExtent;
  readonly onProgress?: (fraction: number) => void;
}

/** Stage: one square around every contour. */
function unionExtent(contours: readonly Contour[]): RasterExtent {
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (const { x, y } of contours) {
    for (let i = 0; i < x.length; i++) {
      minX = Math.min(minX, x[i] as number);
      maxX = Math.max(maxX, x[i] as number);
      minY = Math.min(minY, y[i] as number);
      maxY = Math.max(maxY, y[i] as number);
    }
  }
  const side = Math.max(maxX - minX, maxY - minY) || 1;
  const size = side * (1 + 2 * EXTENT_MARGIN);
  return { minX: (minX + maxX - size) / 2, minY: (minY + maxY - size) / 2, size };
}

/** Stage: |A ∩ B|, the overlap of the two masks' runs summed over the rows both occupy. */
function runsIntersection(a: SilhouetteRuns, b: SilhouetteRuns): number {
  const top = Math.max(a.top, b.top), bottom = Math.min(a.bottom, b.bottom);
  const pa = a.span, pb = b.span;
  if (pa && pb) {
    let overlap = 0;
    for (let k = 2 * top, end = 2 * bottom; k <= end; k += 2) {
      const fromA = pa[k] as number, fromB = pb[k] as number, toA = pa[k + 1] as number, toB = pb[k + 1] as number;
      const d = (toA < toB ? toA : toB) - (fromA > fromB ? fromA : fromB);
      if (d > 0) overlap += d;
    }
    return overlap;
  }
  const ra = a.runs, rb = b.runs, sa = a.rowStart, sb = b.rowStart;
  let count = 0;
  for (let row = top; row <= bottom; row++) {
    let i = sa[row] as number, j = sb[row] as number;
    const iEnd = sa[row + 1] as number, jEnd = sb[row + 1] as number;
    if (iEnd - i === 1 && jEnd - j === 1) {
      // The common case: one run each.
      const from = Math.max(ra[2 * i] as number, rb[2 * j] as number);
      const to = Math.min(ra[2 * i + 1] as number, rb[2 * j + 1] as number);
      if (to > from) count += to - from;
      continue;
    }
    // Merge-join two sorted lists of disjoint runs.
    while (i < iEnd && j < jEnd) {
      const aTo = ra[2 * i + 1] as number, bTo = rb[2 * j + 1] as number;
      const from = Math.max(ra[2 * i] as number, rb[2 * j] as number);
      const to = Math.min(aTo, bTo);
      if (to > from) count += to - from;
      if (aTo <= bTo) i++;
      else j++;
    }
  }
  return count;
}

/**
 * The silhouette RDM: entry (i, j) is 1 − IoU = 1 − |A ∩ B| / |A ∪ B| of the filled shapes on one common raster
 * (the pixels of `lib/shape`'s `rasterizeContour`: a pixel is set when its centre is inside, even–odd rule).
 * Each contour is rasterised once, straight to runs of set pixels per row (`silhouetteRuns`); each pair then
 * costs one overlap of runs per row both occupy (`runsIntersection` — the same integer as a word-wise AND and
 * popcount of the bitmasks, in a fraction of the time), with |A ∪ B| = |A| + |B| − |A ∩ B|.
 * Position matters (no alignment): the stimuli are compared as drawn. In [0, 1]; two empty masks are at 0. Row-major, symmetric, zero diagonal.
 */
export function silhouetteRdm(contours: readonly Contour[], options: SilhouetteRdmOptions = {}): Rdm {
  const resolution = options.resolution ?? DEFAULT_SILHOUETTE_RESOLUTION;
  if (!Number.isInteger(resolution) || resolution < 1) throw new SpaceError('invalid-argument', `resolution = ${resolution} must be a whole number of pixels ≥ 1`);
  const n = contours.length;
  if (n === 0) return { size: 0, values: new Float64Array(0) };
  // Phase 1: one extent, one mask per contour.
  const extent = options.extent ?? unionExtent(contours);
  const masks = contours.map((c) => silhouetteRuns(c, resolution, extent));
  // Phase 2: the pairs.
  return fillPairwiseRdm(
    n,
    (i, j) => {
      const a = masks[i] as SilhouetteRuns;
      const b = masks[j] as SilhouetteRuns;
      const intersection = a.count === 0 || b.count === 0 ? 0 : runsIntersection(a, b);
      const union = a.count + b.count - intersection;
      return union === 0 ? 0 : 1 - intersection / union;
    },
    options.onProgress,
  );
}
