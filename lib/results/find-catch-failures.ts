import type { Exclusion, ResultTrial } from './types';

/**
 * Participants whose catch-trial accuracy (answers on the anchors themselves; a miss counts as wrong) is below
 * `minAccuracy` (0…1): a standard attention check. Participants without catch trials are never flagged, and
 * `minAccuracy` 0 turns the rule off. One participant-level exclusion each, in participant order.
 */
export function findCatchFailures(trials: readonly ResultTrial[], minAccuracy: number): Exclusion[] {
  if (!(minAccuracy > 0)) return [];
  const counts = new Map<number, { total: number; correct: number }>();
  for (const t of trials) {
    if (!t.isCatch) continue;
    const c = counts.get(t.participant) ?? { total: 0, correct: 0 };
    c.total++;
    if (t.isCorrect === true) c.correct++;
    counts.set(t.participant, c);
  }
  return [...counts.entries()]
    .sort((a, b) => a[0] - b[0])
    .filter(([, c]) => c.correct / c.total < minAccuracy)
    .map(([participant, c]) => ({
      participant,
      trialIndex: null,
      rule: 'catch-accuracy' as const,
      reason: `Catch accuracy ${c.correct}/${c.total} (${Math.round((100 * c.correct) / c.total)} %) is below ${Math.round(100 * minAccuracy)} %.`,
      isOverridden: false,
      manualId: null,
    }));
}
