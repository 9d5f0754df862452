import { MAX_SEED } from './seeded-random';
import { SequenceError } from './sequence-error';

/** Odd 32-bit constant ⌊2³²/φ⌋ (the golden ratio), the usual Weyl increment: spreads consecutive stream numbers. */
const GOLDEN_GAMMA = 0x9e37_79b9;

/** The 32-bit finaliser of MurmurHash3 (Appleby): every input bit affects every output bit. */
function mix32(value: number): number {
  let z = value >>> 0;
  z = Math.imul(z ^ (z >>> 16), 0x85eb_ca6b);
  z = Math.imul(z ^ (z >>> 13), 0xc2b2_ae35);
  return (z ^ (z >>> 16)) >>> 0;
}

/**
 * A child seed (0…2³²−1) for an independent random stream, derived from a parent seed and a path of stream
 * numbers (non-negative integers, e.g. `[run, STREAM_ITI]`) by hashing with the MurmurHash3 finaliser.
 * Same parent and path → same child; different paths give unrelated streams, so adding a run never changes
 * the draws of another.
 */
export function deriveSeed(seed: number, ...path: readonly number[]): number {
  if (!Number.isInteger(seed) || seed < 0 || seed > MAX_SEED) {
    throw new SequenceError('invalid-seed', `A seed must be an integer from 0 to ${MAX_SEED}; got ${String(seed)}.`, {
      field: 'seed',
      value: seed,
    });
  }
  let h = mix32(seed ^ GOLDEN_GAMMA);
  for (const step of path) {
    if (!Number.isInteger(step) || step < 0 || step > MAX_SEED) {
      throw new SequenceError('invalid-argument', `A stream number must be an integer from 0 to ${MAX_SEED}; got ${step}.`, {
        value: step,
      });
    }
    h = mix32((h + Math.imul(mix32(step), GOLDEN_GAMMA) + GOLDEN_GAMMA) >>> 0);
  }
  return h;
}
