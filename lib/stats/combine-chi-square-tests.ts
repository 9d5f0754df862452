import { chiSquareSurvival } from './chi-square-survival';
import type { SlopeComparison } from './compare-slopes';
import { StatsError } from './stats-error';

/**
 * The group test from independent χ² tests (e.g. one `compareSlopes` per participant): the statistics and their
 * degrees of freedom add, since a sum of independent χ² variables is χ² with the summed df, and p is the upper
 * tail of that (`chiSquareSurvival`). Throws `StatsError` for an empty list or a negative or non-finite entry.
 */
export function combineChiSquareTests(tests: readonly { readonly statistic: number; readonly df: number }[]): SlopeComparison {
  if (tests.length === 0) throw new StatsError('invalid-option', 'combineChiSquareTests needs at least one test.');
  let statistic = 0;
  let df = 0;
  for (const test of tests) {
    if (!(Number.isFinite(test.statistic) && test.statistic >= 0 && Number.isFinite(test.df) && test.df > 0)) {
      throw new StatsError('invalid-option', `A χ² test needs a statistic ≥ 0 and df > 0; got ${test.statistic}, ${test.df}.`);
    }
    statistic += test.statistic;
    df += test.df;
  }
  return { statistic, df, p: chiSquareSurvival(statistic, df) };
}
