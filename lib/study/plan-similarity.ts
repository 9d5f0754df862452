import { deriveSeed } from '../sequence/derive-seed';
import { seededRandom } from '../sequence/seeded-random';
import { balancedPairSubset } from './balanced-pair-subset';
import { shuffle } from './shuffle';
import { STREAM_SIMILARITY } from './streams';
import type { SimilarityTask, SimilarityTrial } from './types';

/** Every unordered pair [i, j], i < j, of n items, in lexicographic order: n(n − 1)/2 pairs. */
export function allPairs(n: number): [number, number][] {
  const pairs: [number, number][] = [];
  for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) pairs.push([i, j]);
  return pairs;
}

/**
 * One participant's pair-similarity trials, numbered from `firstIndex`, all in block `block`. The pair set is
 * every pair, or a balanced random subset (`balancedPairSubset`, drawn per participant so the sample covers more
 * pairs); each pair is shown `repetitions` times with the order of its two stimuli alternating (by repetition,
 * pair and participant), and the whole list is shuffled.
 * Randomness: `deriveSeed(seed, participant, STREAM_SIMILARITY)`.
 */
export function planSimilarity(task: SimilarityTask, stimulusIds: readonly string[], seed: number, participant: number, firstIndex = 0, block = 0): SimilarityTrial[] {
  const random = seededRandom(deriveSeed(seed, participant, STREAM_SIMILARITY));
  const n = stimulusIds.length;
  const pairs = task.pairSet === 'all' ? allPairs(n) : balancedPairSubset(n, task.pairCount ?? 0, random);
  const drafts: Omit<SimilarityTrial, 'index'>[] = [];
  pairs.forEach(([a, b], pairIndex) => {
    for (let r = 0; r < task.repetitions; r++) {
      const swapped = (r + pairIndex + participant) % 2 === 1;
      const first = stimulusIds[swapped ? b : a] as string;
      const second = stimulusIds[swapped ? a : b] as string;
      drafts.push({ task: 'similarity', block, first, second, pairIndex });
    }
  });
  return shuffle(drafts, random).map((t, i) => ({ ...t, index: firstIndex + i }));
}
