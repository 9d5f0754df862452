/**
 * A seeded stream of pseudo-random numbers (see `seededRandom`). `next()` is uniform on [0, 1);
 * `nextInt(m)` is uniform on the integers 0…m−1.
 */
export interface SeededRandom {
  next(): number;
  nextInt(maxExclusive: number): number;
}

/** A sequence of condition indices 0…n−1 (trials in presentation order, or the items of a cycle). */
export type Sequence = readonly number[];

/** An ordered pair of condition indices (from, to): `to` presented right after `from`. */
export type OrderedPair = readonly [from: number, to: number];

/** Outcome of `checkDeBruijnCycle`: valid iff the length is kⁿ, every symbol is in 0…k−1 and no word repeats. */
export interface DeBruijnCheck {
  readonly isValid: boolean;
  readonly length: number;
  readonly expectedLength: number;
  /** Positions holding something other than an integer 0…k−1. */
  readonly invalidPositions: readonly number[];
  /** Length-n words that never occur cyclically, in lexicographic order. */
  readonly missingWords: readonly (readonly number[])[];
  /** Words that occur more than once, with their counts. */
  readonly repeatedWords: readonly { readonly word: readonly number[]; readonly count: number }[];
}

/** Outcome of `checkPairBalance`: balanced iff every ordered pair occurs exactly `index` times between neighbours. */
export interface PairBalanceCheck {
  readonly isBalanced: boolean;
  /** Required count of every ordered pair (self-pairs included). */
  readonly index: number;
  /** counts[a][b] = times b directly follows a. Empty when some symbol is invalid. */
  readonly counts: readonly (readonly number[])[];
  readonly invalidPositions: readonly number[];
  readonly missingPairs: readonly OrderedPair[];
  /** Pairs whose count differs from `index` but is not zero. */
  readonly unevenPairs: readonly { readonly pair: OrderedPair; readonly count: number }[];
}

/** Outcome of `checkType1Index1Sequence`. */
export interface Type1Index1Check {
  readonly isValid: boolean;
  readonly length: number;
  /** n² + 1. */
  readonly expectedLength: number;
  /** 0-based indices of the blocks (after the initial symbol) that are not permutations of 0…n−1. */
  readonly badBlocks: readonly number[];
  readonly pairs: PairBalanceCheck;
}

/**
 * Inter-trial interval (ITI) distribution, all times in seconds (≥ 0). Drawn per trial from a seeded stream and
 * rounded to the millisecond.
 * - `fixed`: always `duration`.
 * - `uniform`: uniform on [min, max], min < max.
 * - `truncated-exponential`: min + X, X exponential truncated to [0, max − min], its rate chosen so that the
 *   ITIs have mean `mean`; requires min < mean < (min + max)/2 (the mean of the uniform limit).
 */
export type ItiDistribution =
  | { readonly kind: 'fixed'; readonly duration: number }
  | { readonly kind: 'uniform'; readonly min: number; readonly max: number }
  | { readonly kind: 'truncated-exponential'; readonly mean: number; readonly min: number; readonly max: number };

/** Timing of every run, in seconds. */
export interface RunTiming {
  /** Stimulus duration of every trial (and of null events), > 0. */
  readonly trialDuration: number;
  /** Interval after each trial, before the next onset (the last one closes the run). */
  readonly iti: ItiDistribution;
  /** Repetition time of the acquisition, > 0. For EEG, any sampling block (e.g. 1 s) to count "volumes". */
  readonly tr: number;
  /** Volumes acquired before the first trial for the signal to reach steady state; integer ≥ 0 (default 0). */
  readonly dummyVolumes?: number;
  /**
   * Whether the dummy volumes are written to the data file (default false). BIDS onsets count from the first
   * stored volume, so stored dummies shift every onset by dummyVolumes × tr.
   */
  readonly dummyVolumesStored?: boolean;
}

/** How condition indices are ordered within a run. */
export type SequenceType =
  /** De Bruijn order-2 cycle plus its first item: n² + 1 trials, every ordered pair once. */
  | { readonly kind: 'de-bruijn' }
  /** Type-1 index-1: n² + 1 trials in n permuted blocks, every ordered pair once (n = 2 or n ≥ 6). */
  | { readonly kind: 'type1-index1'; readonly timeBudgetMs?: number }
  /** `blocks` shuffled permutations with no immediate repeat; not carry-over balanced. */
  | { readonly kind: 'shuffled-blocks'; readonly blocks: number };

/** One condition given to `buildRunOrder`. */
export interface RunConditionInput {
  /** Written as `trial_type`: non-empty, no tabs, line breaks or surrounding spaces, not `n/a`. */
  readonly id: string;
  /** Stimulus path relative to the dataset's `stimuli/` folder (`stim_file`); absent → `n/a`. */
  readonly stimFile?: string | null;
}

/** A condition of a built run order; index i in the order's `conditions` is condition index i of every table. */
export interface RunOrderCondition {
  readonly id: string;
  readonly stimFile: string | null;
  readonly isNullEvent: boolean;
}

/** One trial (one row of `events.tsv`). Times in seconds from the first stored volume. */
export interface RunTrial {
  readonly onset: number;
  readonly duration: number;
  /** Index into the order's `conditions`. */
  readonly condition: number;
  readonly trialType: string;
  readonly stimFile: string | null;
  /** The interval after this trial, s. */
  readonly iti: number;
}

/** Figures for one run (or for the whole order). */
export interface RunSummary {
  readonly trials: number;
  /**
   * Seconds from the first stored volume to the end of the last ITI (includes stored dummy volumes). For the
   * order: the sum over runs.
   */
  readonly duration: number;
  /** Stored volumes: ⌈duration / tr⌉ (summed over runs for the order). */
  readonly volumes: number;
  /** Volumes to acquire: stored volumes plus the dummy volumes that are not stored. */
  readonly acquiredVolumes: number;
  /** Trials per condition, aligned with the order's `conditions`. */
  readonly conditionCounts: readonly number[];
  /** First-order transitions within runs, transitionCounts[a][b] = b directly after a. */
  readonly transitionCounts: readonly (readonly number[])[];
  /** True when every entry of `transitionCounts` is equal (flat heatmap). */
  readonly isTransitionFlat: boolean;
  /** Most stimulus onsets (null events excluded) in any 1-second window, per second. */
  readonly peakOnsetRate: number;
  /** peakOnsetRate > 3: exceeds WCAG 2.3.1's three flashes in any one-second period. */
  readonly exceedsFlashLimit: boolean;
}

/** One run: its trials in presentation order and its figures. `index` counts from 1, as in `run-<index>`. */
export interface Run {
  readonly index: number;
  /** Condition indices in presentation order. */
  readonly sequence: readonly number[];
  readonly trials: readonly RunTrial[];
  readonly summary: RunSummary;
}

/** A transition of the long sequence that no run presents because a cut falls between its two trials. */
export interface LostPair {
  /** The run whose last trial is `from` (1-based); `to` opens run `afterRun + 1`. */
  readonly afterRun: number;
  readonly from: number;
  readonly to: number;
  readonly fromId: string;
  readonly toId: string;
}

/** `independent`: each run a complete sequence of its own (default). `cut`: one long sequence cut into runs. */
export type RunMode = 'independent' | 'cut';

/** Options of `buildRunOrder`. */
export interface RunOrderOptions {
  /** 1 or more conditions (2 or more for the balanced types), distinct ids. */
  readonly conditions: readonly RunConditionInput[];
  readonly sequence: SequenceType;
  readonly timing: RunTiming;
  /** Number of runs, integer ≥ 1 (default 1). */
  readonly runs?: number;
  readonly runMode?: RunMode;
  /** Add null events (blank trials, `stim_file` n/a) as one more condition; `trialType` defaults to `null`. */
  readonly nullEvents?: boolean | { readonly trialType: string };
  /** Integer 0…2³²−1; every random choice (orders, labels, ITIs) derives from it. */
  readonly seed: number;
}

/** A built run order. */
export interface RunOrder {
  readonly sequenceType: SequenceType['kind'];
  readonly runMode: RunMode;
  readonly seed: number;
  readonly tr: number;
  readonly conditions: readonly RunOrderCondition[];
  readonly runs: readonly Run[];
  /** Transitions lost at the cuts (run mode `cut`; empty otherwise), one per cut, in order. */
  readonly lostPairs: readonly LostPair[];
  /** Totals over all runs; transitions count within runs only. */
  readonly summary: RunSummary;
}
