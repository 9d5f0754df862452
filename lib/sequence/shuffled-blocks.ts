import { checkWholeNumber } from './check-whole-number';
import { randomPermutation } from './random-permutation';
import { seededRandom } from './seeded-random';
import { SequenceError } from './sequence-error';
import { SEQUENCE_LIMITS } from './sequence-limits';

/** Options of `shuffledBlocks`. */
export interface ShuffledBlocksOptions {
  /** Integer 0…2³²−1; the same seed always gives the same order. */
  readonly seed: number;
}

/**
 * `blocks` consecutive blocks, each a uniformly random permutation of the conditions 0…n−1 (n ≥ 1, blocks ≥ 1,
 * n × blocks ≤ 100,000), with no immediate repeat: a block never starts with the condition that ended the block
 * before. Each block is a Fisher–Yates shuffle, redrawn while it would repeat (rejection sampling, so every
 * admissible block is equally likely; n/(n − 1) draws on average). Not carry-over balanced. n = 1 with more than
 * one block is refused (`no-immediate-repeat-impossible`).
 */
export function shuffledBlocks(n: number, blocks: number, options: ShuffledBlocksOptions): number[] {
  checkWholeNumber('n', n, 1);
  checkWholeNumber('blocks', blocks, 1);
  if (n * blocks > SEQUENCE_LIMITS.maxTrials) {
    throw new SequenceError('invalid-argument', `${n} × ${blocks} = ${n * blocks} trials; the limit is ${SEQUENCE_LIMITS.maxTrials}.`, {
      field: 'blocks',
      value: blocks,
      trials: n * blocks,
      maximum: SEQUENCE_LIMITS.maxTrials,
    });
  }
  if (n === 1 && blocks > 1) {
    throw new SequenceError(
      'no-immediate-repeat-impossible',
      'With one condition every trial repeats the one before; add a condition or a null event, or use one block.',
      { field: 'n', value: n, conditions: 1 },
    );
  }
  const random = seededRandom(options.seed);
  const order: number[] = [];
  for (let block = 0; block < blocks; block++) {
    const previous = order[order.length - 1];
    let permutation = randomPermutation(n, random);
    while (permutation[0] === previous) permutation = randomPermutation(n, random);
    order.push(...permutation);
  }
  return order;
}
