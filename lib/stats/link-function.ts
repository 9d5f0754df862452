import { INV_SQRT_2PI, normalCdf } from './normal-cdf';
import type { Link } from './types';

/** The sigmoid F of a link, its density f = F′, f(0) and the upper quartile z such that F(z) = 0.75. */
export interface LinkFunction {
  readonly cdf: (z: number) => number;
  readonly pdf: (z: number) => number;
  readonly densityAtZero: number;
  readonly upperQuartile: number;
}

/** ln 3: the logistic reaches 0.75 at z = ln 3. */
const LOGISTIC_QUARTILE = Math.log(3);
/** Φ⁻¹(0.75) = 0.6744897501960817 (standard normal quartile, Abramowitz & Stegun Table 26.5). */
const NORMAL_QUARTILE = 0.6744897501960817;

const LOGISTIC: LinkFunction = {
  // Written on the negative side so exp never overflows.
  cdf: (z) => (z >= 0 ? 1 / (1 + Math.exp(-z)) : Math.exp(z) / (1 + Math.exp(z))),
  pdf: (z) => {
    const e = Math.exp(-Math.abs(z));
    return e / ((1 + e) * (1 + e));
  },
  densityAtZero: 0.25,
  upperQuartile: LOGISTIC_QUARTILE,
};

const PROBIT: LinkFunction = {
  cdf: normalCdf,
  pdf: (z) => INV_SQRT_2PI * Math.exp((-z * z) / 2),
  densityAtZero: INV_SQRT_2PI,
  upperQuartile: NORMAL_QUARTILE,
};

/** The standard logistic F(z) = 1/(1 + e^(−z)) for `logit`, the standard normal Φ(z) for `probit`. */
export function linkFunction(link: Link): LinkFunction {
  return link === 'logit' ? LOGISTIC : PROBIT;
}
