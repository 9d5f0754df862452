import { checkOutline } from './check-outline';
import { ShapeError } from './errors';
import type { Bitmask, Contour, RasterExtent } from './types';

/** Rasters are at most this many pixels a side (a 4096² mask is 2 MB). */
const MAX_RESOLUTION = 4096;

function setRun(bits: Uint32Array, rowStart: number, from: number, to: number): void {
  for (let col = from; col < to; ) {
    const word = col >>> 5;
    const offset = col & 31;
    const count = Math.min(32 - offset, to - col);
    const run = count === 32 ? 0xffffffff : ((1 << count) - 1) << offset;
    bits[rowStart + word] = ((bits[rowStart + word] as number) | run) >>> 0;
    col += count;
  }
}

/**
 * Rasterises the region inside a closed polygon (even–odd rule) onto a `resolution` × `resolution` grid over
 * the square `extent`: a pixel is set when its centre is inside. Scanline filling, O(resolution · N); row 0 is
 * the top (largest y). Use one extent for every shape that will be compared.
 */
export function rasterizeContour(contour: Contour, options: { readonly resolution: number; readonly extent: RasterExtent }): Bitmask {
  checkOutline(contour);
  const { resolution, extent } = options;
  if (!Number.isInteger(resolution) || resolution < 1 || resolution > MAX_RESOLUTION) {
    throw new ShapeError('invalid-argument', `resolution = ${resolution} must be an integer from 1 to ${MAX_RESOLUTION}`, {
      value: resolution,
      minimum: 1,
      maximum: MAX_RESOLUTION,
    });
  }
  if (!(extent.size > 0) || !Number.isFinite(extent.minX) || !Number.isFinite(extent.minY)) {
    throw new ShapeError('invalid-argument', 'the raster extent needs a finite corner and a positive size', { value: extent.size });
  }
  const wordsPerRow = Math.ceil(resolution / 32);
  const bits = new Uint32Array(wordsPerRow * resolution);
  const pixel = extent.size / resolution;
  const { x, y } = contour;
  const n = x.length;
  const crossings: number[] = [];
  for (let row = 0; row < resolution; row++) {
    const yc = extent.minY + extent.size - (row + 0.5) * pixel;
    crossings.length = 0;
    for (let i = 0; i < n; i++) {
      const j = i + 1 === n ? 0 : i + 1;
      const y0 = y[i] as number;
      const y1 = y[j] as number;
      // Half-open rule: an edge counts when the scanline is in [min y, max y).
      if ((y0 <= yc && yc < y1) || (y1 <= yc && yc < y0)) {
        crossings.push((x[i] as number) + (((x[j] as number) - (x[i] as number)) * (yc - y0)) / (y1 - y0));
      }
    }
    crossings.sort((p, q) => p - q);
    for (let c = 0; c + 1 < crossings.length; c += 2) {
      // Pixel centres x_col = minX + (col + 0.5)·pixel inside [enter, leave).
      const from = Math.max(0, Math.ceil(((crossings[c] as number) - extent.minX) / pixel - 0.5));
      const to = Math.min(resolution, Math.ceil(((crossings[c + 1] as number) - extent.minX) / pixel - 0.5));
      if (to > from) setRun(bits, row * wordsPerRow, from, to);
    }
  }
  return { resolution, wordsPerRow, bits };
}
