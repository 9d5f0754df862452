import { peakOnsetRate } from '../sequence/peak-onset-rate';
import { FASTEST_RESPONSE_MS, STUDY_LIMITS } from './study-limits';
import type { StudyDesign } from './types';

/** Trials simulated back to back; enough for the pattern of one trial and its neighbours to repeat in any window. */
const SIMULATED_TRIALS = 8;

/** Onset times (s) of `trials` identical trials of `lengthMs`, each with onsets at `offsetsMs` into the trial. */
function onsetsOf(offsetsMs: readonly number[], lengthMs: number, trials: number): number[] {
  const onsets: number[] = [];
  for (let i = 0; i < trials; i++) for (const o of offsetsMs) onsets.push((i * lengthMs + o) / 1000);
  return onsets;
}

/**
 * The flash check: the highest number of onsets (a fixation mark, a probe or pair, each stimulus of a sequential
 * pair) in any one-second window, per task, assuming every response comes as fast as a person can answer
 * (`FASTEST_RESPONSE_MS`, or the response window if shorter), so it is the worst case. `isAboveLimit` when a task
 * exceeds 3 per second (WCAG 2.3.1).
 */
export function checkFlashRate(design: StudyDesign): { peakPerSecond: number; isAboveLimit: boolean; byTask: { categorisation: number | null; similarity: number | null } } {
  let categorisation: number | null = null;
  let similarity: number | null = null;
  if (design.categorisation) {
    const t = design.categorisation.timing;
    const length = t.fixationMs + t.probeMs + t.blankMs + Math.min(FASTEST_RESPONSE_MS, t.responseMs) + t.itiMs;
    categorisation = peakOnsetRate(onsetsOf([0, t.fixationMs], length, SIMULATED_TRIALS));
  }
  if (design.similarity) {
    const { timing: t, presentation } = design.similarity;
    const offsets = presentation === 'sequential' ? [0, t.fixationMs, t.fixationMs + t.stimulusMs + t.gapMs] : [0, t.fixationMs];
    const shown = presentation === 'sequential' ? 2 * t.stimulusMs + t.gapMs : t.stimulusMs;
    similarity = peakOnsetRate(onsetsOf(offsets, t.fixationMs + shown + Math.min(FASTEST_RESPONSE_MS, t.responseMs) + t.itiMs, SIMULATED_TRIALS));
  }
  const peakPerSecond = Math.max(categorisation ?? 0, similarity ?? 0);
  return { peakPerSecond, isAboveLimit: peakPerSecond > STUDY_LIMITS.maxOnsetsPerSecond, byTask: { categorisation, similarity } };
}
