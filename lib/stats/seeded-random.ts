import { StatsError } from './stats-error';

/** Largest seed accepted: seeds are unsigned 32-bit integers, so they survive JSON, SQL and URLs intact. */
export const MAX_SEED = 0xffff_ffff;
/** 2³²: dividing a 32-bit output by it maps it onto [0, 1). */
const TWO_POW_32 = 4_294_967_296;
/** Weyl increment of Mulberry32 (an odd constant close to 2³²/φ, as in SplitMix). */
const WEYL_INCREMENT = 0x6d2b_79f5;

/**
 * A seeded uniform generator on [0, 1) with 32-bit resolution: Mulberry32 (Tommy Ettinger, 2017; a Weyl sequence
 * passed through a SplitMix-style output mix), period 2³². `seed` is an integer 0…2³²−1; the same seed gives the
 * same stream on every platform. The only source of randomness in `lib/stats`. Not for cryptography.
 */
export function seededRandom(seed: number): () => number {
  if (!Number.isInteger(seed) || seed < 0 || seed > MAX_SEED) {
    throw new StatsError('invalid-option', `A seed must be an integer from 0 to ${MAX_SEED}; got ${String(seed)}.`);
  }
  let state = seed >>> 0;
  return () => {
    state = (state + WEYL_INCREMENT) >>> 0;
    let z = state;
    z = Math.imul(z ^ (z >>> 15), z | 1);
    z ^= z + Math.imul(z ^ (z >>> 7), z | 61);
    return ((z ^ (z >>> 14)) >>> 0) / TWO_POW_32;
  };
}
