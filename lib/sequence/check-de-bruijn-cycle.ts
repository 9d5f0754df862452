import { checkWholeNumber } from './check-whole-number';
import { isSymbol } from './is-symbol';
import { SEQUENCE_LIMITS } from './sequence-limits';
import type { DeBruijnCheck } from './types';

/** Decodes a base-k word number into its n symbols, most significant first. */
function decodeWord(code: number, k: number, n: number): number[] {
  const word = new Array<number>(n).fill(0);
  for (let i = n - 1; i >= 0; i--) {
    word[i] = code % k;
    code = Math.floor(code / k);
  }
  return word;
}

/**
 * Checks that `cycle` is a de Bruijn cycle B(k, n): kⁿ symbols from 0…k−1 in which every length-n word occurs
 * exactly once when read cyclically (van Aardenne-Ehrenfest & de Bruijn 1951). Reports the missing and
 * repeated words instead of throwing; k ≥ 1, n ≥ 1, kⁿ ≤ 2²⁰.
 */
export function checkDeBruijnCycle(cycle: readonly number[], k: number, n: number): DeBruijnCheck {
  checkWholeNumber('k', k, 1);
  checkWholeNumber('n', n, 1);
  const expectedLength = k ** n;
  checkWholeNumber('kⁿ', expectedLength, 1, SEQUENCE_LIMITS.maxCycleLength);
  const invalidPositions = cycle.flatMap((symbol, position) => (isSymbol(symbol, k) ? [] : [position]));
  if (invalidPositions.length > 0 || cycle.length === 0) {
    return { isValid: false, length: cycle.length, expectedLength, invalidPositions, missingWords: [], repeatedWords: [] };
  }
  // Count every cyclic window as a base-k number.
  const counts = new Uint32Array(expectedLength);
  for (let start = 0; start < cycle.length; start++) {
    let code = 0;
    for (let i = 0; i < n; i++) code = code * k + (cycle[(start + i) % cycle.length] as number);
    counts[code] = (counts[code] as number) + 1;
  }
  const missingWords: number[][] = [];
  const repeatedWords: { word: number[]; count: number }[] = [];
  counts.forEach((count, code) => {
    if (count === 0) missingWords.push(decodeWord(code, k, n));
    else if (count > 1) repeatedWords.push({ word: decodeWord(code, k, n), count });
  });
  const isValid = cycle.length === expectedLength && missingWords.length === 0 && repeatedWords.length === 0;
  return { isValid, length: cycle.length, expectedLength, invalidPositions, missingWords, repeatedWords };
}
