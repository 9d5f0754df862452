import { searchChainedBlocks } from './search-chained-blocks';
import { seededRandom } from './seeded-random';
import { SequenceError } from './sequence-error';
import { SEQUENCE_LIMITS } from './sequence-limits';

/** The orders for which no type-1 index-1 sequence exists (Nonyane & Theobald 2007). */
const NONEXISTENT_ORDERS: readonly number[] = [3, 4, 5];

/** Options of `type1Index1Sequence`. */
export interface Type1Index1Options {
  /** Integer 0…2³²−1; the same seed always gives the same sequence. */
  readonly seed: number;
  /** Give up with `search-timeout` after this many milliseconds (default 5,000). */
  readonly timeBudgetMs?: number;
  /** Millisecond clock for the budget (default `performance.now`). */
  readonly now?: () => number;
}

/**
 * A type-1 index-1 sequence over the conditions 0…n−1 (Nonyane & Theobald 2007, BJMSP 60:339; Aguirre 2007,
 * NeuroImage 35:1480): n² + 1 trials, an initial symbol and then n blocks that are each a permutation of 0…n−1,
 * with every ordered pair (self-pairs included) exactly once between consecutive trials. They exist for n = 2 and
 * n ≥ 6; n = 3, 4, 5 throw `no-type1-index1`, offering the de Bruijn cycle instead. n ≤ 200.
 * Found by seeded randomised backtracking over blocks chained on their last symbol (`searchChainedBlocks`),
 * reproducible for a seed; n = 6…12 take milliseconds. Throws `search-timeout` when the budget runs out.
 */
export function type1Index1Sequence(n: number, options: Type1Index1Options): number[] {
  const maximum = SEQUENCE_LIMITS.maxBalancedConditions;
  if (!Number.isInteger(n) || n < 2) {
    throw new SequenceError('too-few-conditions', `A type-1 index-1 sequence needs at least 2 conditions; got ${String(n)}.`, {
      field: 'n',
      value: n,
      minimum: 2,
    });
  }
  if (n > maximum) {
    throw new SequenceError(
      'too-many-conditions',
      `A balanced order of ${n} conditions needs ${n * n + 1} trials (n² + 1); the limit is ${maximum} conditions.`,
      { field: 'n', value: n, conditions: n, trials: n * n + 1, maximum },
    );
  }
  if (NONEXISTENT_ORDERS.includes(n)) {
    throw new SequenceError(
      'no-type1-index1',
      `No type-1 index-1 sequence exists for ${n} conditions (only for 2 and for 6 or more). ` +
        `Use a de Bruijn order-2 cycle instead: ${n * n + 1} trials with every ordered pair once.`,
      { field: 'n', value: n, conditions: n, trials: n * n + 1, alternative: 'de-bruijn' },
    );
  }
  const timeBudgetMs = options.timeBudgetMs ?? SEQUENCE_LIMITS.defaultTimeBudgetMs;
  if (!(timeBudgetMs >= 0)) {
    throw new SequenceError('invalid-argument', `The time budget must be a number of milliseconds ≥ 0; got ${timeBudgetMs}.`, {
      field: 'timeBudgetMs',
      value: timeBudgetMs,
    });
  }
  const now = options.now ?? (() => performance.now());
  return searchChainedBlocks(n, seededRandom(options.seed), { timeBudgetMs, now });
}
