import { findCatchFailures } from './find-catch-failures';
import { findRtOutliers } from './find-rt-outliers';
import type { Exclusion, ExclusionRules, ManualExclusion, ResultTrial } from './types';

/** The exclusions and the trials that stay in the fits. */
export interface ExclusionDecision {
  readonly exclusions: readonly Exclusion[];
  readonly included: readonly ResultTrial[];
}

const keyOf = (participant: number, trialIndex: number | null) => `${participant}:${trialIndex ?? '*'}`;

/**
 * Applies the automatic rules (catch accuracy, RT outliers by MAD) and the manual decisions: a manual `exclude`
 * leaves a participant or a trial out; a manual `keep` overrides the automatic exclusion of the same participant or
 * trial (it stays listed, marked overridden). Catch trials never enter the fits (they are the anchors); misses carry
 * no answer. Returns every exclusion (participants first, then trials) and the included non-catch answered trials.
 */
export function decideExclusions(trials: readonly ResultTrial[], rules: ExclusionRules, manual: readonly ManualExclusion[]): ExclusionDecision {
  const keeps = new Map(manual.filter((m) => m.action === 'keep').map((m) => [keyOf(m.participant, m.trialIndex), m.id]));
  const automatic = [...findCatchFailures(trials, rules.catchAccuracyMin), ...findRtOutliers(trials, rules.rtMadK)].map((e) => {
    const keep = keeps.get(keyOf(e.participant, e.trialIndex));
    return keep === undefined ? e : { ...e, isOverridden: true, manualId: keep };
  });
  const manualOut: Exclusion[] = manual
    .filter((m) => m.action === 'exclude')
    .map((m) => ({ participant: m.participant, trialIndex: m.trialIndex, rule: 'manual', reason: m.reason, isOverridden: false, manualId: m.id }));
  const exclusions = [...automatic, ...manualOut].sort(
    (a, b) => Number(a.trialIndex !== null) - Number(b.trialIndex !== null) || a.participant - b.participant || (a.trialIndex ?? -1) - (b.trialIndex ?? -1),
  );
  const out = new Set(exclusions.filter((e) => !e.isOverridden).map((e) => keyOf(e.participant, e.trialIndex)));
  const included = trials.filter((t) => !t.isCatch && t.choseB !== null && !out.has(keyOf(t.participant, null)) && !out.has(keyOf(t.participant, t.trialIndex)));
  return { exclusions, included };
}
