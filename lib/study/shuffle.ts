import { randomPermutation } from '../sequence/random-permutation';
import type { SeededRandom } from '../sequence/types';

/** A new array with the items of `items` in a uniformly random order (Fisher–Yates, via `randomPermutation`). */
export function shuffle<T>(items: readonly T[], random: SeededRandom): T[] {
  return randomPermutation(items.length, random).map((i) => items[i] as T);
}
