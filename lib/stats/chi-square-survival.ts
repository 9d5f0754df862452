import { regularizedGammaQ } from './regularized-gamma-q';

/**
 * Upper-tail probability P(X ≥ statistic) of a χ² distribution with `df` > 0 degrees of freedom: Q(df/2, x/2), the
 * regularised upper incomplete gamma function (`regularizedGammaQ`). 1 for a statistic ≤ 0.
 */
export function chiSquareSurvival(statistic: number, df: number): number {
  if (statistic <= 0) return 1;
  return regularizedGammaQ(df / 2, statistic / 2);
}
