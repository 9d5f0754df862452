import { checkWholeNumber } from './check-whole-number';
import { countTransitions } from './count-transitions';
import { isSymbol } from './is-symbol';
import type { OrderedPair, PairBalanceCheck } from './types';

/**
 * Checks first-order carry-over balance of a trial list over n conditions (n ≥ 1): every ordered pair (a, b),
 * self-pairs included, must occur exactly `index` times between consecutive trials (index ≥ 1; 1 for de Bruijn
 * trial lists of n² + 1 and for type-1 index-1 sequences, Nonyane & Theobald 2007). Reports missing and uneven
 * pairs instead of throwing.
 */
export function checkPairBalance(trials: readonly number[], n: number, index = 1): PairBalanceCheck {
  checkWholeNumber('n', n, 1);
  checkWholeNumber('index', index, 1);
  const invalidPositions = trials.flatMap((symbol, position) => (isSymbol(symbol, n) ? [] : [position]));
  if (invalidPositions.length > 0) {
    return { isBalanced: false, index, counts: [], invalidPositions, missingPairs: [], unevenPairs: [] };
  }
  const counts = countTransitions(trials, n);
  const missingPairs: OrderedPair[] = [];
  const unevenPairs: { pair: OrderedPair; count: number }[] = [];
  counts.forEach((row, from) =>
    row.forEach((count, to) => {
      if (count === 0) missingPairs.push([from, to]);
      else if (count !== index) unevenPairs.push({ pair: [from, to], count });
    }),
  );
  const isBalanced = missingPairs.length === 0 && unevenPairs.length === 0;
  return { isBalanced, index, counts, invalidPositions, missingPairs, unevenPairs };
}
