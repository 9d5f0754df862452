import { deBruijnSequence } from './de-bruijn-sequence';
import { SequenceError } from './sequence-error';
import { SEQUENCE_LIMITS } from './sequence-limits';
import { shuffledBlocks } from './shuffled-blocks';
import { type1Index1Sequence } from './type1-index1-sequence';
import type { SequenceType } from './types';
import { unrollCycle } from './unroll-cycle';

/**
 * One complete order of condition indices 0…n−1 for a sequence type, from a seed (0…2³²−1):
 * de Bruijn — the seeded Lyndon-word (FKM) B(n, 2) cycle plus its first item, n² + 1 trials; type-1 index-1 —
 * the seeded block search, n² + 1 trials; shuffled blocks — n × blocks trials, no immediate repeat. The balanced
 * types need 2…200 conditions (`too-few-conditions`, `too-many-conditions` with the trial count).
 */
export function generateConditionOrder(type: SequenceType, n: number, seed: number): number[] {
  if (type.kind === 'shuffled-blocks') return shuffledBlocks(n, type.blocks, { seed });
  const maximum = SEQUENCE_LIMITS.maxBalancedConditions;
  if (n < 2) {
    throw new SequenceError('too-few-conditions', `A carry-over balanced order needs at least 2 conditions; got ${n}. Add null events or use shuffled blocks.`, {
      field: 'conditions',
      conditions: n,
      minimum: 2,
    });
  }
  if (n > maximum) {
    throw new SequenceError(
      'too-many-conditions',
      `A balanced order of ${n} conditions would need ${n * n + 1} trials (n² + 1); ` +
        `the limit is ${maximum} conditions. Choose fewer stimuli or use shuffled blocks.`,
      { field: 'conditions', value: n, conditions: n, trials: n * n + 1, maximum, alternative: 'shuffled-blocks' },
    );
  }
  switch (type.kind) {
    case 'de-bruijn':
      return unrollCycle(deBruijnSequence(n, 2, { seed }), 2);
    case 'type1-index1':
      return type1Index1Sequence(n, type.timeBudgetMs === undefined ? { seed } : { seed, timeBudgetMs: type.timeBudgetMs });
    default: {
      const unknown: { kind?: unknown } = type;
      throw new SequenceError('invalid-argument', `Unknown sequence type ${String(unknown.kind)}.`, { field: 'sequence.kind', value: unknown.kind });
    }
  }
}
