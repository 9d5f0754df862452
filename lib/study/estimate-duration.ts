import { countPlannedTrials } from './count-planned-trials';
import { READING_ALLOWANCE_S } from './study-limits';
import type { CategorisationTiming, SimilarityTask, StudyDesign } from './types';

/** The longest a categorisation trial can take, in ms: every screen at full length (a response at the deadline). */
export function categorisationTrialMs(t: CategorisationTiming): number {
  return t.fixationMs + t.probeMs + t.blankMs + t.responseMs + t.itiMs;
}

/** The longest a similarity trial can take, in ms; a sequential pair shows two stimuli with a gap between. */
export function similarityTrialMs(task: Pick<SimilarityTask, 'presentation' | 'timing'>): number {
  const t = task.timing;
  const stimuli = task.presentation === 'sequential' ? 2 * t.stimulusMs + t.gapMs : t.stimulusMs;
  return t.fixationMs + stimuli + t.responseMs + t.itiMs;
}

/**
 * An upper estimate of a participant's session in seconds: every trial at its longest, plus a fixed allowance for
 * consent, instructions and debrief. Real sessions are shorter by the time participants answer before the deadline.
 */
export function estimateDuration(design: StudyDesign, stimulusCount: number): { seconds: number; categorisationSeconds: number; similaritySeconds: number } {
  const counts = countPlannedTrials(design, stimulusCount);
  const categorisationSeconds = design.categorisation ? (counts.categorisation * categorisationTrialMs(design.categorisation.timing)) / 1000 : 0;
  const similaritySeconds = design.similarity ? (counts.similarity * similarityTrialMs(design.similarity)) / 1000 : 0;
  return { seconds: categorisationSeconds + similaritySeconds + READING_ALLOWANCE_S, categorisationSeconds, similaritySeconds };
}
