import { SequenceError } from './sequence-error';
import type { SeededRandom } from './types';
import { xoshiro128StarStar } from './xoshiro128-star-star';

/** Largest seed accepted: seeds are unsigned 32-bit integers, so they survive JSON, SQL and URLs intact. */
export const MAX_SEED = 0xffff_ffff;

/** 2³², the number of distinct 32-bit outputs; dividing by it maps an output onto [0, 1). */
const TWO_POW_32 = 4_294_967_296;

/** SplitMix32 step (a 32-bit variant of Steele, Lea & Flood 2014, SplitMix): spreads one seed over four words. */
function splitMix32(state: { value: number }): number {
  state.value = (state.value + 0x9e37_79b9) >>> 0;
  let z = state.value;
  z = Math.imul(z ^ (z >>> 16), 0x85eb_ca6b);
  z = Math.imul(z ^ (z >>> 13), 0xc2b2_ae35);
  return (z ^ (z >>> 16)) >>> 0;
}

/**
 * A seeded generator: xoshiro128** (Blackman & Vigna 2018) with its 128-bit state filled from the seed by
 * SplitMix32. `seed` is an integer 0…2³²−1; the same seed gives the same stream on every platform. This is the
 * only source of randomness in `lib/sequence`. `next()` is uniform on [0, 1) with 32-bit resolution;
 * `nextInt(m)` is uniform on 0…m−1 for an integer 1 ≤ m ≤ 2³² (rejection sampling, so unbiased).
 */
export function seededRandom(seed: number): SeededRandom {
  if (!Number.isInteger(seed) || seed < 0 || seed > MAX_SEED) {
    throw new SequenceError('invalid-seed', `A seed must be an integer from 0 to ${MAX_SEED}; got ${String(seed)}.`, {
      field: 'seed',
      value: seed,
    });
  }
  const spread = { value: seed };
  const words: [number, number, number, number] = [splitMix32(spread), splitMix32(spread), splitMix32(spread), splitMix32(spread)];
  // The all-zero state is xoshiro's fixed point; four SplitMix32 outputs are practically never all zero, but make sure.
  if (words.every((word) => word === 0)) words[0] = 1;
  const nextUint32 = xoshiro128StarStar(words);

  return {
    next: () => nextUint32() / TWO_POW_32,
    nextInt: (maxExclusive: number) => {
      if (!Number.isInteger(maxExclusive) || maxExclusive < 1 || maxExclusive > TWO_POW_32) {
        throw new SequenceError('invalid-argument', `nextInt needs an integer bound from 1 to 2³²; got ${maxExclusive}.`, {
          value: maxExclusive,
        });
      }
      // Reject the top (2³² mod m) outputs so that every residue is equally likely.
      const limit = TWO_POW_32 - (TWO_POW_32 % maxExclusive);
      for (;;) {
        const x = nextUint32();
        if (x < limit) return x % maxExclusive;
      }
    },
  };
}
