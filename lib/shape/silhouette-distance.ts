import { ShapeError } from './errors';
import type { Bitmask } from './types';

/** Set bits in a 32-bit word (SWAR popcount, Hacker's Delight §5-1). */
function popcount(word: number): number {
  let v = word - ((word >>> 1) & 0x55555555);
  v = (v & 0x33333333) + ((v >>> 2) & 0x33333333);
  return (Math.imul((v + (v >>> 4)) & 0x0f0f0f0f, 0x01010101) >>> 24) & 0xff;
}

/**
 * Silhouette distance 1 − IoU = 1 − |A ∩ B| / |A ∪ B| of two bitmasks rasterised on the same grid, by
 * word-wise AND/OR and popcount (no polygon booleans, so a 441 × 441 matrix stays cheap). In [0, 1]; two
 * empty masks are at distance 0.
 */
export function silhouetteDistance(a: Bitmask, b: Bitmask): number {
  if (a.resolution !== b.resolution || a.bits.length !== b.bits.length) {
    throw new ShapeError('invalid-argument', `masks differ in resolution (${a.resolution} vs ${b.resolution})`, { value: b.resolution });
  }
  let intersection = 0;
  let union = 0;
  for (let i = 0; i < a.bits.length; i++) {
    const p = a.bits[i] as number;
    const q = b.bits[i] as number;
    intersection += popcount(p & q);
    union += popcount(p | q);
  }
  return union === 0 ? 0 : 1 - intersection / union;
}
