import { medianOf } from './median-of';
import type { Exclusion, ResultTrial } from './types';

/**
 * 1/Φ⁻¹(3/4): scales the median absolute deviation to estimate the standard deviation of normal data
 * (Rousseeuw & Croux 1993; Leys et al. 2013, J. Exp. Soc. Psychol. 49:764, who recommend k = 2.5).
 */
export const MAD_SCALE = 1.4826;

/**
 * Trials whose response time lies more than `k` scaled MADs from the participant's median RT (Leys et al. 2013),
 * per participant over the answered, non-catch trials with an RT. A participant whose MAD is 0 (too few or
 * identical RTs) has no outliers. `k` null turns the rule off. Trial-level exclusions, by participant and trial.
 */
export function findRtOutliers(trials: readonly ResultTrial[], k: number | null): Exclusion[] {
  if (k === null || !(k > 0)) return [];
  const byParticipant = new Map<number, ResultTrial[]>();
  for (const t of trials) {
    if (t.isCatch || t.choseB === null || t.rtMs === null || !Number.isFinite(t.rtMs)) continue;
    const list = byParticipant.get(t.participant) ?? [];
    list.push(t);
    byParticipant.set(t.participant, list);
  }
  const out: Exclusion[] = [];
  for (const [participant, list] of [...byParticipant.entries()].sort((a, b) => a[0] - b[0])) {
    const rts = list.map((t) => t.rtMs as number);
    const median = medianOf(rts);
    const mad = MAD_SCALE * medianOf(rts.map((r) => Math.abs(r - median)));
    if (!(mad > 0)) continue;
    for (const t of list) {
      const distance = Math.abs((t.rtMs as number) - median) / mad;
      if (distance > k) {
        out.push({
          participant,
          trialIndex: t.trialIndex,
          rule: 'rt-outlier',
          reason: `RT ${Math.round(t.rtMs as number)} ms is ${distance.toFixed(1)} scaled MADs from the participant's median of ${Math.round(median)} ms (limit ${k}).`,
          isOverridden: false,
          manualId: null,
        });
      }
    }
  }
  return out.sort((a, b) => a.participant - b.participant || (a.trialIndex ?? -1) - (b.trialIndex ?? -1));
}
