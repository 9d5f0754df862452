// lib/study — norming-study trial plans (two-choice categorisation along diameters, pair similarity), seeded per
// participant, with their counts, duration estimate and flash check. Pure and deterministic: the browser runs the
// same code for the live preview.

export type {
  Anchor,
  CategorisationTask,
  CategorisationTiming,
  CategorisationTrial,
  PlanCell,
  PlanSummary,
  SimilarityTask,
  SimilarityTiming,
  SimilarityTrial,
  StudyDesign,
  StudyIssue,
  StudyStimuli,
  Trial,
  TrialPlan,
} from './types';
export { STUDY_LIMITS, FASTEST_RESPONSE_MS, READING_ALLOWANCE_S } from './study-limits';
export { categorisationLevels } from './categorisation-levels';
export { catchTrialsPerDirection } from './catch-trials-per-direction';
export { participantKeys } from './participant-keys';
export { balancedPairSubset, balancedPairCounts, isBalancedPairCount } from './balanced-pair-subset';
export { planCategorisation } from './plan-categorisation';
export { planSimilarity, allPairs } from './plan-similarity';
export { buildTrialPlan } from './build-trial-plan';
export { countPlannedTrials, countCategorisationTrials, countPairs } from './count-planned-trials';
export { checkStudyDesign } from './check-study-design';
export { estimateDuration, categorisationTrialMs, similarityTrialMs } from './estimate-duration';
export { checkFlashRate } from './check-flash-rate';
export { summarizePlan } from './summarize-plan';
