import { leastDeBruijnSequence } from './least-de-bruijn-sequence';
import { randomPermutation } from './random-permutation';
import { seededRandom } from './seeded-random';

/** Options of `deBruijnSequence`. */
export interface DeBruijnOptions {
  /** Integer 0…2³²−1. When given, the symbols are relabelled by a permutation drawn from this seed. */
  readonly seed?: number;
}

/**
 * A de Bruijn cycle B(k, n) over 0…k−1 (k ≥ 1, n ≥ 1, kⁿ ≤ 2²⁰): kⁿ symbols in which every length-n word occurs
 * exactly once cyclically (van Aardenne-Ehrenfest & de Bruijn 1951). Without a seed: the lexicographically least
 * cycle, by the Lyndon-word (FKM) construction. With a seed: that cycle with its labels mapped through a seeded
 * uniformly random permutation (Fisher–Yates), which is again a de Bruijn cycle. For trial lists of order 2 see
 * `unrollCycle` (k² + 1 trials).
 */
export function deBruijnSequence(k: number, n: number, options: DeBruijnOptions = {}): number[] {
  const cycle = leastDeBruijnSequence(k, n);
  if (options.seed === undefined) return cycle;
  const labels = randomPermutation(k, seededRandom(options.seed));
  return cycle.map((symbol) => labels[symbol] as number);
}
