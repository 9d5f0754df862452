import { checkOutline } from '../shape/check-outline';
import type { Contour, RasterExtent } from '../shape/types';
import { SpaceError } from './space-error';

/** Rasters are at most this many pixels a side, as `lib/shape`'s `rasterizeContour` allows. */
export const MAX_SILHOUETTE_RESOLUTION = 4096;

/**
 * A filled outline on a square raster as horizontal runs of set pixels. Row r's runs are `runs[2m]` (first
 * column) and `runs[2m + 1]` (one past the last) for m from `rowStart[r]` to `rowStart[r + 1] − 1`, left to
 * right and disjoint (two may touch). Row 0 is the top (largest y), as in `lib/shape`'s bitmasks.
 */
export interface SilhouetteRuns {
  readonly resolution: number;
  /** Set pixels. */
  readonly count: number;
  /** First and last rows holding a run; top > bottom when the mask is empty. */
  readonly top: number;
  readonly bottom: number;
  readonly rowStart: Int32Array;
  readonly runs: Int32Array;
  /**
   * When no row holds more than one run: row r's run as `span[2r]`, `span[2r + 1]` (0, 0 for an empty row);
   * otherwise null. A star-shaped silhouette has one run a row.
   */
  readonly span: Int32Array | null;
}

/** Sorts `values[from … to − 1]` ascending in place (a row has a handful of crossings). */
function sortSlice(values: Float64Array, from: number, to: number): void {
  for (let i = from + 1; i < to; i++) {
    const v = values[i] as number;
    let j = i - 1;
    while (j >= from && (values[j] as number) > v) {
      values[j + 1] = values[j] as number;
      j--;
    }
    values[j + 1] = v;
  }
}

/**
 * The pixels `lib/shape`'s `rasterizeContour` sets — a pixel is set when its centre is inside the polygon
 * (even–odd rule, half-open edges [min y, max y)), row 0 at the top of the square `extent` — as runs per row,
 * computed with the same floating-point expressions for every scanline centre, crossing and column, so the
 * pixels are identical. Each edge visits only the rows it spans (O(N + resolution + crossings) instead of
 * O(resolution · N)), and no bitmask is built. Raises `lib/shape`'s `ShapeError` for an unusable outline and
 * `SpaceError` (`invalid-argument`) for a bad resolution or extent.
 */
export function silhouetteRuns(contour: Contour, resolution: number, extent: RasterExtent): SilhouetteRuns {
  checkOutline(contour);
  if (!Number.isInteger(resolution) || resolution < 1 || resolution > MAX_SILHOUETTE_RESOLUTION) {
    throw new SpaceError('invalid-argument', `resolution = ${resolution} must be a whole number of pixels from 1 to ${MAX_SILHOUETTE_RESOLUTION}`);
  }
  if (!(extent.size > 0) || !Number.isFinite(extent.minX) || !Number.isFinite(extent.minY)) {
    throw new SpaceError('invalid-argument', 'the raster extent needs a finite corner and a positive size');
  }
  const pixel = extent.size / resolution;
  const topY = extent.minY + extent.size;
  const { x, y } = contour;
  const n = x.length;
  // Scanline centre of a row, exactly as rasterizeContour computes it.
  const centre = (row: number): number => extent.minY + extent.size - (row + 0.5) * pixel;

  // Phase 1: each edge's candidate rows (one row of slack either side), counted, then its crossings bucketed.
  const firstRow = new Int32Array(n);
  const lastRow = new Int32Array(n);
  const perRow = new Int32Array(resolution + 1);
  for (let i = 0; i < n; i++) {
    const j = i + 1 === n ? 0 : i + 1;
    const y0 = y[i] as number, y1 = y[j] as number;
    const low = y0 < y1 ? y0 : y1, high = y0 < y1 ? y1 : y0;
    const first = Math.max(0, Math.floor((topY - high) / pixel - 0.5) - 1);
    const last = Math.min(resolution - 1, Math.ceil((topY - low) / pixel - 0.5) + 1);
    firstRow[i] = first;
    lastRow[i] = last;
    for (let row = first; row <= last; row++) {
      const yc = centre(row);
      if ((y0 <= yc && yc < y1) || (y1 <= yc && yc < y0)) perRow[row + 1] = (perRow[row + 1] as number) + 1;
    }
  }
  for (let row = 0; row < resolution; row++) perRow[row + 1] = (perRow[row + 1] as number) + (perRow[row] as number);
  const crossings = new Float64Array(perRow[resolution] as number);
  const fill = perRow.slice(0, resolution);
  for (let i = 0; i < n; i++) {
    const j = i + 1 === n ? 0 : i + 1;
    const y0 = y[i] as number, y1 = y[j] as number;
    for (let row = firstRow[i] as number, last = lastRow[i] as number; row <= last; row++) {
      const yc = centre(row);
      if ((y0 <= yc && yc < y1) || (y1 <= yc && yc < y0)) {
        crossings[fill[row] as number] = (x[i] as number) + (((x[j] as number) - (x[i] as number)) * (yc - y0)) / (y1 - y0);
        fill[row] = (fill[row] as number) + 1;
      }
    }
  }

  // Phase 2: per row, sorted crossings paired into runs of pixel centres inside [enter, leave).
  const rowStart = new Int32Array(resolution + 1);
  const found: number[] = [];
  let count = 0, top = resolution, bottom = -1;
  for (let row = 0; row < resolution; row++) {
    rowStart[row] = found.length >> 1;
    const from = perRow[row] as number, to = perRow[row + 1] as number;
    sortSlice(crossings, from, to);
    for (let c = from; c + 1 < to; c += 2) {
      const start = Math.max(0, Math.ceil(((crossings[c] as number) - extent.minX) / pixel - 0.5));
      const end = Math.min(resolution, Math.ceil(((crossings[c + 1] as number) - extent.minX) / pixel - 0.5));
      if (end > start) {
        found.push(start, end);
        count += end - start;
      }
    }
    if (found.length >> 1 > (rowStart[row] as number)) {
      if (top > row) top = row;
      bottom = row;
    }
  }
  rowStart[resolution] = found.length >> 1;
  const runs = Int32Array.from(found);

  // Phase 3: the one-run-a-row form, when it applies.
  let span: Int32Array | null = new Int32Array(2 * resolution);
  for (let row = 0; row < resolution && span; row++) {
    const m = rowStart[row] as number;
    const inRow = (rowStart[row + 1] as number) - m;
    if (inRow > 1) span = null;
    else if (inRow === 1) {
      span[2 * row] = runs[2 * m] as number;
      span[2 * row + 1] = runs[2 * m + 1] as number;
    }
  }
  return { resolution, count, top, bottom, rowStart, runs, span };
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
 * 1 − IoU = 1 − |A ∩ B| / (|A| + |B| − |A ∩ B|) of two masks on the same raster; 0 for two empty masks. The
 * pairwise distance of `silhouetteRdm` and `silhouetteRdmRows`.
 */
export function silhouetteRunsDistance(a: SilhouetteRuns, b: SilhouetteRuns): number {
  const intersection = a.count === 0 || b.count === 0 ? 0 : runsIntersection(a, b);
  const union = a.count + b.count - intersection;
  return union === 0 ? 0 : 1 - intersection / union;
}
