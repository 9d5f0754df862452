import { rasterizeContour } from '../shape/rasterize-contour';
import type { Bitmask, Contour, RasterExtent } from '../shape/types';
import { fillPairwiseRdm } from './fill-pairwise-rdm';
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

/** A mask with its pixel count and the rows and words that hold any pixel. */
interface MaskSummary {
  readonly bits: Uint32Array;
  readonly count: number;
  readonly top: number;
  readonly bottom: number;
  readonly left: number;
  readonly right: number;
}

/** Set bits in a 32-bit word (SWAR popcount, Hacker's Delight §5-1). */
function popcount(word: number): number {
  let v = word - ((word >>> 1) & 0x55555555);
  v = (v & 0x33333333) + ((v >>> 2) & 0x33333333);
  return (Math.imul((v + (v >>> 4)) & 0x0f0f0f0f, 0x01010101) >>> 24) & 0xff;
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

/** Stage: pixel count and occupied rows and words of a mask. */
function summarize(mask: Bitmask): MaskSummary {
  const { bits, wordsPerRow, resolution } = mask;
  let count = 0, top = resolution, bottom = -1, left = wordsPerRow, right = -1;
  for (let row = 0; row < resolution; row++) {
    for (let w = 0; w < wordsPerRow; w++) {
      const word = bits[row * wordsPerRow + w] as number;
      if (word === 0) continue;
      count += popcount(word);
      top = Math.min(top, row);
      bottom = row;
      left = Math.min(left, w);
      right = Math.max(right, w);
    }
  }
  return { bits, count, top, bottom, left, right };
}

/** Stage: |A ∩ B| over the rows and words both masks occupy. */
function intersectionCount(a: MaskSummary, b: MaskSummary, wordsPerRow: number): number {
  const top = Math.max(a.top, b.top), bottom = Math.min(a.bottom, b.bottom);
  const left = Math.max(a.left, b.left), right = Math.min(a.right, b.right);
  const pa = a.bits, pb = b.bits;
  let count = 0;
  for (let row = top; row <= bottom; row++) {
    const base = row * wordsPerRow;
    for (let w = left; w <= right; w++) {
      const both = (pa[base + w] as number) & (pb[base + w] as number);
      // Inside a shape whole words are set; `&` yields −1 for all 32 bits.
      if (both === -1) count += 32;
      else if (both !== 0) count += popcount(both);
    }
  }
  return count;
}

/**
 * The silhouette RDM: entry (i, j) is 1 − IoU = 1 − |A ∩ B| / |A ∪ B| of the filled shapes on one common raster
 * (`lib/shape`'s `rasterizeContour`: a pixel is set when its centre is inside, even–odd rule). Each contour is
 * rasterised once; each pair costs one AND and popcount per word over the rows and words both occupy, with
 * |A ∪ B| = |A| + |B| − |A ∩ B|. Position matters (no alignment): the stimuli are compared as drawn. In [0, 1];
 * two empty masks are at 0. Row-major, symmetric, zero diagonal.
 */
export function silhouetteRdm(contours: readonly Contour[], options: SilhouetteRdmOptions = {}): Rdm {
  const resolution = options.resolution ?? DEFAULT_SILHOUETTE_RESOLUTION;
  if (!Number.isInteger(resolution) || resolution < 1) throw new SpaceError('invalid-argument', `resolution = ${resolution} must be a whole number of pixels ≥ 1`);
  const n = contours.length;
  if (n === 0) return { size: 0, values: new Float64Array(0) };
  // Phase 1: one extent, one mask per contour.
  const extent = options.extent ?? unionExtent(contours);
  const masks = contours.map((c) => summarize(rasterizeContour(c, { resolution, extent })));
  const wordsPerRow = Math.ceil(resolution / 32);
  // Phase 2: the pairs.
  return fillPairwiseRdm(
    n,
    (i, j) => {
      const a = masks[i] as MaskSummary;
      const b = masks[j] as MaskSummary;
      const intersection = a.count === 0 || b.count === 0 ? 0 : intersectionCount(a, b, wordsPerRow);
      const union = a.count + b.count - intersection;
      return union === 0 ? 0 : 1 - intersection / union;
    },
    options.onProgress,
  );
}
