import { randomPermutation } from '../sequence/random-permutation';
import type { SeededRandom } from '../sequence/types';

/**
 * Whether `pairCount` pairs of `n` stimuli can use every stimulus equally often: each stimulus then sits in
 * d = 2K / n pairs, which must be a whole number from 1 to n − 1, and odd d needs an even n (handshake lemma).
 */
export function isBalancedPairCount(n: number, pairCount: number): boolean {
  if (!Number.isInteger(n) || !Number.isInteger(pairCount) || n < 2 || pairCount < 1) return false;
  const degree = (2 * pairCount) / n;
  return Number.isInteger(degree) && degree <= n - 1 && (degree % 2 === 0 || n % 2 === 0);
}

/** The valid pair counts for `n` stimuli (K = n·d/2 for each feasible d), smallest first. */
export function balancedPairCounts(n: number): number[] {
  const counts: number[] = [];
  for (let degree = 1; degree < n; degree++) if (degree % 2 === 0 || n % 2 === 0) counts.push((n * degree) / 2);
  return counts;
}

/**
 * A random set of `pairCount` unordered pairs of stimuli 0…n−1 in which every stimulus appears in exactly
 * 2K / n pairs: a random d-regular circulant graph (distinct offsets s give n edges each, s = n/2 gives n/2)
 * on a random relabelling of the stimuli. Pairs come back as [lower, higher], sorted. Throws a RangeError when
 * `isBalancedPairCount` is false.
 */
export function balancedPairSubset(n: number, pairCount: number, random: SeededRandom): [number, number][] {
  if (!isBalancedPairCount(n, pairCount)) throw new RangeError(`No balanced set of ${pairCount} pairs of ${n} stimuli exists.`);
  const degree = (2 * pairCount) / n;
  const label = randomPermutation(n, random);
  // Offsets 1…⌊(n−1)/2⌋ each add 2 to every degree; the half-turn n/2 (n even) adds 1.
  const halfOffsets = Math.floor((n - 1) / 2);
  const chosen = randomPermutation(halfOffsets, random)
    .slice(0, Math.floor(degree / 2))
    .map((i) => i + 1);
  const pairs: [number, number][] = [];
  const add = (i: number, s: number) => {
    const a = label[i] as number;
    const b = label[(i + s) % n] as number;
    pairs.push(a < b ? [a, b] : [b, a]);
  };
  for (const s of chosen) for (let i = 0; i < n; i++) add(i, s);
  if (degree % 2 === 1) for (let i = 0; i < n / 2; i++) add(i, n / 2);
  return pairs.sort((p, q) => p[0] - q[0] || p[1] - q[1]);
}
