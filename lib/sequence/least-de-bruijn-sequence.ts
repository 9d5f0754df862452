import { checkWholeNumber } from './check-whole-number';
import { lyndonWords } from './lyndon-words';
import { SequenceError } from './sequence-error';
import { SEQUENCE_LIMITS } from './sequence-limits';

/**
 * The lexicographically least de Bruijn cycle B(k, n) over 0…k−1: kⁿ symbols in which every length-n word occurs
 * exactly once cyclically. Lyndon-word (FKM) construction: the concatenation, in lexicographic order, of the Lyndon
 * words whose length divides n (Fredricksen & Maiorana 1978). k ≥ 1, n ≥ 1, kⁿ ≤ 2²⁰.
 * B(2,3) = 00010111; B(3,2) = 001021122.
 */
export function leastDeBruijnSequence(k: number, n: number): number[] {
  checkWholeNumber('k', k, 1);
  checkWholeNumber('n', n, 1);
  const length = k ** n;
  if (length > SEQUENCE_LIMITS.maxCycleLength) {
    throw new SequenceError(
      'invalid-argument',
      `B(${k}, ${n}) has ${length} symbols; the limit is ${SEQUENCE_LIMITS.maxCycleLength}.`,
      { field: 'n', value: n, maximum: SEQUENCE_LIMITS.maxCycleLength },
    );
  }
  const cycle: number[] = [];
  for (const word of lyndonWords(k, n)) {
    if (n % word.length === 0) cycle.push(...word);
  }
  return cycle;
}
