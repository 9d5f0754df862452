import { chiSquareSurvival } from './chi-square-survival';
import type { SlopeComparison } from './compare-slopes';
import { createPsychometricFitter } from './create-psychometric-fitter';
import { checkLapseOption } from './fit-psychometric';
import { goldenSectionMaximum } from './golden-section-maximum';
import { spreadBoundsFor } from './spread-bounds-for';
import { StatsError } from './stats-error';
import type { LapseOption, Link, PsychometricData } from './types';
import { validatePsychometricData } from './validate-psychometric-data';

/** Options of `testNoBias`: the link and the lapse shared by all groups (absent: λ = 0). */
export interface NoBiasOptions {
  readonly link: Link;
  readonly lapse?: LapseOption;
}

/** λ profiled to 1e−7, as in `compareSlopes`. */
const LAPSE_TOLERANCE = 1e-7;

/**
 * Likelihood-ratio test (Wilks 1938) that every group's threshold (PSE) is 0, i.e. no bias: G ≥ 1 groups, each
 * keeping its own spread in both models, against free thresholds; statistic 2(ℓ_free − ℓ_zero) referred to χ²
 * with G df (`chiSquareSurvival`). Both models share one symmetric lapse — 0, fixed, or profiled on [0, max]
 * separately in each model by golden section. Spread bounds come from the range of all levels pooled. Throws
 * `StatsError`.
 */
export function testNoBias(groups: readonly PsychometricData[], options: NoBiasOptions): SlopeComparison {
  if (groups.length < 1) throw new StatsError('invalid-option', 'testNoBias needs at least one group.');
  for (const g of groups) validatePsychometricData(g);
  checkLapseOption(options.lapse);
  const pooled: PsychometricData = { x: groups.flatMap((g) => g.x), n: groups.flatMap((g) => g.n), k: groups.flatMap((g) => g.k) };
  const spreadBounds = spreadBoundsFor(pooled, { link: options.link });
  // ℓ of all groups at a held λ, thresholds free or held at 0.
  const total = (lapse: number, fixedThreshold: number | undefined) =>
    groups.reduce(
      (s, g) => s + createPsychometricFitter(g.x, g.n, { link: options.link, spreadBounds, lapse: { fixed: lapse }, fixedThreshold }).fit(g.k).logLikelihood,
      0,
    );
  const best = (fixedThreshold: number | undefined) => {
    const lapse = options.lapse;
    if (lapse !== undefined && 'max' in lapse) return goldenSectionMaximum((l) => total(l, fixedThreshold), 0, lapse.max, LAPSE_TOLERANCE).value;
    return total(lapse?.fixed ?? 0, fixedThreshold);
  };
  const statistic = Math.max(0, 2 * (best(undefined) - best(0)));
  const df = groups.length;
  return { statistic, df, p: chiSquareSurvival(statistic, df) };
}
