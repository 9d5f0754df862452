import { countTransitions } from './count-transitions';
import { peakOnsetRate } from './peak-onset-rate';
import { firstOnsetOffset } from './first-onset-offset';
import { SEQUENCE_LIMITS } from './sequence-limits';
import type { RunOrderCondition, RunSummary, RunTiming, RunTrial } from './types';

/**
 * Rounding slack when dividing a run's duration by the TR: floating sums of millisecond times may land a hair
 * above a whole number of volumes (300.00000000001 s / 2 s must give 150, not 151).
 */
const VOLUME_TOLERANCE = 1e-9;

/**
 * Figures for one scheduled run: duration (s, from the first stored volume to the end of the last ITI), stored
 * volumes ⌈duration / TR⌉, acquired volumes (stored + discarded dummies), trials per condition, the first-order
 * transition counts and whether they are flat, and the flash check (peak stimulus onsets per second, null events
 * excluded, against WCAG 2.3.1's limit of 3).
 */
export function summarizeRun(trials: readonly RunTrial[], conditions: readonly RunOrderCondition[], timing: RunTiming): RunSummary {
  const last = trials[trials.length - 1];
  const duration = last === undefined ? firstOnsetOffset(timing) : last.onset + last.duration + last.iti;
  const volumes = Math.ceil(duration / timing.tr - VOLUME_TOLERANCE);
  const discardedDummies = timing.dummyVolumesStored ? 0 : (timing.dummyVolumes ?? 0);
  const sequence = trials.map((trial) => trial.condition);
  const conditionCounts = conditions.map((_, index) => sequence.filter((condition) => condition === index).length);
  const transitionCounts = countTransitions(sequence, conditions.length);
  const first = transitionCounts[0]?.[0];
  const isTransitionFlat = transitionCounts.every((row) => row.every((count) => count === first));
  const stimulusOnsets = trials.filter((trial) => !conditions[trial.condition]?.isNullEvent).map((trial) => trial.onset);
  const peak = peakOnsetRate(stimulusOnsets);
  return {
    trials: trials.length,
    duration,
    volumes,
    acquiredVolumes: volumes + discardedDummies,
    conditionCounts,
    transitionCounts,
    isTransitionFlat,
    peakOnsetRate: peak,
    exceedsFlashLimit: peak > SEQUENCE_LIMITS.flashLimitPerSecond,
  };
}
