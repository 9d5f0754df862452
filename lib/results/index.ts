// lib/results — a norming study's categorisation results: exclusions (catch accuracy, RT outliers by MAD, manual
// decisions), per-direction binomial data per participant and pooled, and the analysis that fits and tests them
// with lib/stats. Pure and deterministic: same trials, options and seed → same numbers.

export type {
  AnalysisOptions,
  AnalysisProgress,
  AssembledData,
  CategorisationAnalysis,
  DirectionData,
  DirectionFit,
  Exclusion,
  ExclusionRule,
  ExclusionRules,
  ManualExclusion,
  ParticipantSlopeTest,
  ResultTrial,
} from './types';
export { medianOf } from './median-of';
export { findCatchFailures } from './find-catch-failures';
export { findRtOutliers, MAD_SCALE } from './find-rt-outliers';
export { decideExclusions, type ExclusionDecision } from './decide-exclusions';
export { assembleDirectionData } from './assemble-direction-data';
export { analyseCategorisation, analyseCategorisationNow, countFitSets, fitSetSeed } from './analyse-categorisation';
