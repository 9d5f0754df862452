import { catchTrialsPerDirection } from './catch-trials-per-direction';
import type { CategorisationTask, SimilarityTask, StudyDesign } from './types';

/** Trials of a categorisation task per participant: cells × repetitions, catch trials and practice. */
export function countCategorisationTrials(task: CategorisationTask): number {
  const main = task.steps * task.repetitions;
  return task.directionsDeg.length * (main + catchTrialsPerDirection(main, task.catchRate)) + task.practiceTrials;
}

/** Pairs in a similarity task's pair set for n stimuli: n(n − 1)/2, or K. */
export function countPairs(task: SimilarityTask, n: number): number {
  return task.pairSet === 'all' ? (n * (n - 1)) / 2 : (task.pairCount ?? 0);
}

/** Trials per participant, by task, without building a plan (the same for every participant). */
export function countPlannedTrials(design: StudyDesign, stimulusCount: number): { categorisation: number; similarity: number; total: number } {
  const categorisation = design.categorisation ? countCategorisationTrials(design.categorisation) : 0;
  const similarity = design.similarity ? countPairs(design.similarity, stimulusCount) * design.similarity.repetitions : 0;
  return { categorisation, similarity, total: categorisation + similarity };
}
