import type { RunSummary } from './types';

/**
 * Totals over runs for n conditions: trials, durations, stored and acquired volumes, condition counts and
 * within-run transition counts add up; the flash check takes the highest peak. Transitions between runs are not
 * counted (no trial follows another across a run break).
 */
export function combineRunSummaries(summaries: readonly RunSummary[], n: number): RunSummary {
  const transitionCounts = Array.from({ length: n }, (_, from) =>
    Array.from({ length: n }, (_, to) => summaries.reduce((sum, summary) => sum + (summary.transitionCounts[from]?.[to] ?? 0), 0)),
  );
  const first = transitionCounts[0]?.[0];
  const peakOnsetRate = Math.max(0, ...summaries.map((summary) => summary.peakOnsetRate));
  return {
    trials: summaries.reduce((sum, summary) => sum + summary.trials, 0),
    duration: summaries.reduce((sum, summary) => sum + summary.duration, 0),
    volumes: summaries.reduce((sum, summary) => sum + summary.volumes, 0),
    acquiredVolumes: summaries.reduce((sum, summary) => sum + summary.acquiredVolumes, 0),
    conditionCounts: Array.from({ length: n }, (_, index) => summaries.reduce((sum, summary) => sum + (summary.conditionCounts[index] ?? 0), 0)),
    transitionCounts,
    isTransitionFlat: transitionCounts.every((row) => row.every((count) => count === first)),
    peakOnsetRate,
    exceedsFlashLimit: summaries.some((summary) => summary.exceedsFlashLimit),
  };
}
