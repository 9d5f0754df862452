import { chiSquareSurvival } from './chi-square-survival';
import { fitAtLapse } from './fit-at-lapse';
import { fitCommonSlope } from './fit-common-slope';
import { goldenSectionMaximum } from './golden-section-maximum';
import { spreadBoundsFor } from './spread-bounds-for';
import { StatsError } from './stats-error';
import type { Link, LapseOption, PsychometricData } from './types';
import { validatePsychometricData } from './validate-psychometric-data';

/** Options of `compareSlopes`: the link and the lapse shared by all groups (absent: λ = 0). */
export interface CompareSlopesOptions {
  readonly link: Link;
  readonly lapse?: LapseOption;
}

/** Likelihood-ratio test result: χ² statistic (≥ 0), degrees of freedom G − 1 and the upper-tail p. */
export interface SlopeComparison {
  readonly statistic: number;
  readonly df: number;
  readonly p: number;
}

/** λ profiled to 1e−7, as in `profileLapse`. */
const LAPSE_TOLERANCE = 1e-7;

/**
 * Likelihood-ratio test (Wilks 1938) of a common slope across G ≥ 2 groups (each keeping its own threshold)
 * against separate slopes: statistic 2(ℓ_separate − ℓ_common), referred to χ² with G − 1 df. Both models share one
 * symmetric lapse — 0, fixed, or profiled on [0, max] separately in each model. Spread bounds come from the range
 * of all levels pooled, identical in both models. Throws `StatsError`.
 */
export function compareSlopes(groups: readonly PsychometricData[], options: CompareSlopesOptions): SlopeComparison {
  if (groups.length < 2) throw new StatsError('invalid-option', `compareSlopes needs at least two groups; got ${groups.length}.`);
  for (const g of groups) validatePsychometricData(g);
  const pooled: PsychometricData = { x: groups.flatMap((g) => g.x), n: groups.flatMap((g) => g.n), k: groups.flatMap((g) => g.k) };
  const bounds = spreadBoundsFor(pooled, { link: options.link });
  const separate = (lapse: number) => groups.reduce((s, g) => s + fitAtLapse(g, options.link, lapse, bounds).logLikelihood, 0);
  const common = (lapse: number) => fitCommonSlope(groups, options.link, lapse, bounds).logLikelihood;

  let llSeparate: number;
  let llCommon: number;
  const lapse = options.lapse;
  if (lapse !== undefined && 'max' in lapse) {
    if (!(lapse.max >= 0 && lapse.max < 0.5)) throw new StatsError('invalid-option', `The lapse max must lie in [0, 0.5); got ${lapse.max}.`);
    llSeparate = goldenSectionMaximum(separate, 0, lapse.max, LAPSE_TOLERANCE).value;
    llCommon = goldenSectionMaximum(common, 0, lapse.max, LAPSE_TOLERANCE).value;
  } else {
    const fixed = lapse?.fixed ?? 0;
    if (!(fixed >= 0 && fixed < 0.5)) throw new StatsError('invalid-option', `The fixed lapse must lie in [0, 0.5); got ${fixed}.`);
    llSeparate = separate(fixed);
    llCommon = common(fixed);
  }
  const statistic = Math.max(0, 2 * (llSeparate - llCommon));
  const df = groups.length - 1;
  return { statistic, df, p: chiSquareSurvival(statistic, df) };
}
