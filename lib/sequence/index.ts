// lib/sequence — carry-over balanced trial orders (de Bruijn cycles, type-1 index-1 sequences, shuffled blocks),
// run timing for scanning and EEG sessions, and BIDS `events.tsv` output. Pure and deterministic: randomness
// enters only through seeds, and the browser runs the same code.

export type {
  DeBruijnCheck,
  ItiDistribution,
  LostPair,
  OrderedPair,
  PairBalanceCheck,
  Run,
  RunConditionInput,
  RunMode,
  RunOrder,
  RunOrderCondition,
  RunOrderOptions,
  RunSummary,
  RunTiming,
  RunTrial,
  SeededRandom,
  Sequence,
  SequenceType,
  Type1Index1Check,
} from './types';
export { SequenceError, type SequenceErrorCode, type SequenceErrorDetails } from './sequence-error';
export { SEQUENCE_LIMITS } from './sequence-limits';

// Randomness
export { seededRandom, MAX_SEED } from './seeded-random';
export { xoshiro128StarStar } from './xoshiro128-star-star';
export { deriveSeed } from './derive-seed';
export { randomPermutation } from './random-permutation';

// De Bruijn cycles
export { deBruijnSequence, type DeBruijnOptions } from './de-bruijn-sequence';
export { leastDeBruijnSequence } from './least-de-bruijn-sequence';
export { lyndonWords } from './lyndon-words';
export { countDeBruijnCycles } from './count-de-bruijn-cycles';
export { countDeBruijnCyclesByEnumeration, type EnumerationOptions } from './count-de-bruijn-cycles-by-enumeration';
export { checkDeBruijnCycle } from './check-de-bruijn-cycle';
export { unrollCycle } from './unroll-cycle';

// Type-1 index-1 sequences and shuffled blocks
export { type1Index1Sequence, type Type1Index1Options } from './type1-index1-sequence';
export { searchChainedBlocks, type ChainedBlockSearchOptions } from './search-chained-blocks';
export { checkType1Index1Sequence } from './check-type1-index1-sequence';
export { shuffledBlocks, type ShuffledBlocksOptions } from './shuffled-blocks';

// Balance checks
export { countTransitions } from './count-transitions';
export { checkPairBalance } from './check-pair-balance';

// Run orders
export { buildRunOrder } from './build-run-order';
export { generateConditionOrder } from './generate-condition-order';
export { resolveConditions } from './resolve-conditions';
export { validateTiming } from './validate-timing';
export { drawItis } from './draw-itis';
export { truncatedExponentialRate } from './truncated-exponential-rate';
export { firstOnsetOffset } from './first-onset-offset';
export { scheduleRun } from './schedule-run';
export { cutIntoRuns, type CutSequence, type CutTransition } from './cut-into-runs';
export { summarizeRun } from './summarize-run';
export { combineRunSummaries } from './combine-run-summaries';
export { peakOnsetRate } from './peak-onset-rate';

// BIDS output
export { toEventsTsv, type EventsTsvOptions } from './to-events-tsv';
export { toEventsJson } from './to-events-json';
export { eventsFileName, type EventsFileNameParts } from './events-file-name';
export { runOrderFiles, type RunOrderFile } from './run-order-files';
