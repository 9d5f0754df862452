import type { BootstrapResult, GoodnessOfFit, Interval, LapseOption, Link, PsychometricData, PsychometricFit, SlopeComparison } from '@/lib/stats';

/**
 * One answered (or missed) categorisation trial, as the analysis sees it. Practice and similarity trials never get
 * here. `x` is the signed position along the diameter towards anchor B, as a fraction of ρmax (anchor B at +extent,
 * anchor A at −extent), so P(choosing B) rises with x.
 */
export interface ResultTrial {
  readonly participant: number;
  readonly trialIndex: number;
  readonly directionDeg: number;
  readonly x: number;
  /** Whether the participant picked anchor B; null for a trial without an answer (a miss). */
  readonly choseB: boolean | null;
  readonly rtMs: number | null;
  readonly isCatch: boolean;
  readonly isCorrect: boolean | null;
}

/** The automatic exclusion rules. */
export interface ExclusionRules {
  /** A participant whose catch-trial accuracy is below this (0…1) is left out; 0 turns the rule off. */
  readonly catchAccuracyMin: number;
  /** A trial whose RT is more than k scaled MADs from the participant's median is left out; null turns it off. */
  readonly rtMadK: number | null;
}

/** A manual decision: leave a participant (trialIndex null) or one trial out, or keep one an automatic rule left out. */
export interface ManualExclusion {
  readonly id: string;
  readonly participant: number;
  readonly trialIndex: number | null;
  readonly action: 'exclude' | 'keep';
  readonly reason: string;
}

export type ExclusionRule = 'catch-accuracy' | 'rt-outlier' | 'manual';

/** One participant (trialIndex null) or one trial left out of the fits, and why. */
export interface Exclusion {
  readonly participant: number;
  readonly trialIndex: number | null;
  readonly rule: ExclusionRule;
  readonly reason: string;
  /** An automatic exclusion a manual "keep" overrides: listed, but the data stay in. */
  readonly isOverridden: boolean;
  /** The manual decision behind this entry (an exclusion, or the keep that overrides it). */
  readonly manualId: string | null;
}

/** The binomial data of one direction: levels in increasing x, with the trial and miss counts behind them. */
export interface DirectionData {
  readonly directionDeg: number;
  readonly data: PsychometricData;
  readonly trials: number;
  readonly misses: number;
}

/** Per-participant and pooled (summed over participants) data, direction by direction. */
export interface AssembledData {
  readonly directionsDeg: readonly number[];
  readonly participants: readonly { readonly participant: number; readonly directions: readonly DirectionData[] }[];
  readonly pooled: readonly DirectionData[];
}

/** Options of the analysis. */
export interface AnalysisOptions {
  readonly link: Link;
  readonly lapse: LapseOption;
  /** Bootstrap resamples for the intervals and for the goodness of fit, each (≥ 1,000 for reporting). */
  readonly resamples: number;
  /** Integer 0…2³²−1; every fit set derives its own seed from it. */
  readonly seed: number;
  /** Significance level of the tests, in (0, 1). */
  readonly alpha: number;
}

/** One fitted set (a participant's direction, or a pooled direction), or why it could not be fitted. */
export interface DirectionFit {
  readonly directionDeg: number;
  /** null for the pooled fit. */
  readonly participant: number | null;
  readonly levels: readonly { readonly x: number; readonly n: number; readonly k: number }[];
  readonly trials: number;
  readonly misses: number;
  readonly fit: PsychometricFit | null;
  readonly intervals: BootstrapResult['intervals'] | null;
  readonly spreadAtBoundCount: number;
  readonly goodnessOfFit: GoodnessOfFit | null;
  /** Why there is no fit (too few levels, …), else null. */
  readonly problem: string | null;
}

/** A participant's test of a common slope across directions, or why it was not run. */
export interface ParticipantSlopeTest {
  readonly participant: number;
  readonly test: SlopeComparison | null;
  readonly problem: string | null;
}

/** The categorisation analysis: fits, tests and the verdict. */
export interface CategorisationAnalysis {
  readonly options: AnalysisOptions;
  readonly directionsDeg: readonly number[];
  readonly pooled: readonly DirectionFit[];
  readonly participants: readonly { readonly participant: number; readonly fits: readonly DirectionFit[] }[];
  readonly slopeTests: readonly ParticipantSlopeTest[];
  /** The group test: per-participant χ² summed (null when no participant could be tested). */
  readonly groupSlopeTest: SlopeComparison | null;
  /** Every pooled PSE = 0. */
  readonly noBiasTest: SlopeComparison | null;
  readonly slopeRatio: { readonly ratio: number; readonly interval: Interval; readonly resamples: number } | null;
  readonly verdict: { readonly hasSlopeDifference: boolean; readonly hasBias: boolean | null; readonly text: string } | null;
  /** Notes on what could not be computed. */
  readonly notes: readonly string[];
}

/** Progress of a running analysis: fit sets done out of the total (tests count as one step). */
export interface AnalysisProgress {
  readonly done: number;
  readonly total: number;
}
