import { checkWholeNumber } from './check-whole-number';
import { isSymbol } from './is-symbol';
import { SequenceError } from './sequence-error';

/**
 * First-order transition counts of a trial list over n conditions (n ≥ 1): counts[a][b] is the number of times
 * condition b directly follows condition a. A list of t trials has t − 1 transitions; the list is not wrapped
 * around. Throws `invalid-argument` on a symbol outside 0…n−1.
 */
export function countTransitions(trials: readonly number[], n: number): number[][] {
  checkWholeNumber('n', n, 1);
  const counts = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  trials.forEach((symbol, position) => {
    if (!isSymbol(symbol, n)) {
      throw new SequenceError('invalid-argument', `Trial ${position} holds ${String(symbol)}, not a condition 0…${n - 1}.`, {
        value: symbol,
      });
    }
  });
  for (let i = 0; i + 1 < trials.length; i++) {
    const row = counts[trials[i] as number] as number[];
    const next = trials[i + 1] as number;
    row[next] = (row[next] as number) + 1;
  }
  return counts;
}
