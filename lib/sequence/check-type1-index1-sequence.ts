import { checkWholeNumber } from './check-whole-number';
import { checkPairBalance } from './check-pair-balance';
import type { Type1Index1Check } from './types';

/**
 * Checks a type-1 index-1 sequence over n conditions (Nonyane & Theobald 2007, BJMSP 60:339; Aguirre 2007,
 * NeuroImage 35:1480): n² + 1 symbols from 0…n−1, an initial symbol followed by n blocks that are each a
 * permutation of 0…n−1, with every ordered pair (self-pairs included) exactly once between consecutive items.
 * n ≥ 1. Reports the failing blocks and pairs instead of throwing.
 */
export function checkType1Index1Sequence(sequence: readonly number[], n: number): Type1Index1Check {
  checkWholeNumber('n', n, 1);
  const expectedLength = n * n + 1;
  const pairs = checkPairBalance(sequence, n, 1);
  const badBlocks: number[] = [];
  for (let block = 0; block < n; block++) {
    const items = sequence.slice(1 + block * n, 1 + (block + 1) * n);
    const isPermutation = items.length === n && new Set(items).size === n && items.every((item) => Number.isInteger(item) && item >= 0 && item < n);
    if (!isPermutation) badBlocks.push(block);
  }
  const isValid = sequence.length === expectedLength && badBlocks.length === 0 && pairs.isBalanced;
  return { isValid, length: sequence.length, expectedLength, badBlocks, pairs };
}
