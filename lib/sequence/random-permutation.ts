import { SequenceError } from './sequence-error';
import type { SeededRandom } from './types';

/**
 * A uniformly random permutation of 0…n−1 (n a non-negative integer), by the Fisher–Yates shuffle in
 * Durstenfeld's in-place form (Knuth, TAOCP vol. 2, Algorithm 3.4.2P). Consumes n − 1 draws from `random`.
 */
export function randomPermutation(n: number, random: SeededRandom): number[] {
  if (!Number.isInteger(n) || n < 0) {
    throw new SequenceError('invalid-argument', `A permutation needs a whole number of items; got ${n}.`, { value: n });
  }
  const items = Array.from({ length: n }, (_, i) => i);
  for (let i = n - 1; i > 0; i--) {
    const j = random.nextInt(i + 1);
    const swap = items[i] as number;
    items[i] = items[j] as number;
    items[j] = swap;
  }
  return items;
}
