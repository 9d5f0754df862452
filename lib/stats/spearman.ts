import { spearman as rankCorrelation } from '../space/spearman';
import { SpaceError } from '../space/space-error';
import { StatsError } from './stats-error';

/**
 * Spearman's rank correlation ρ (Spearman 1904) of two samples of equal length ≥ 2: the Pearson correlation of
 * their average ranks (ties share the mean rank), so it stays exact with ties. In [−1, 1]; NaN when either sample
 * is constant. `lib/space`'s implementation (the one the confound audit uses), raising `StatsError` here:
 * `length-mismatch` for unequal or too short samples, `not-finite` for NaN.
 */
export function spearman(a: ArrayLike<number>, b: ArrayLike<number>): number {
  if (a.length !== b.length || a.length < 2) throw new StatsError('length-mismatch', `Spearman's ρ needs two samples of equal length ≥ 2; got ${a.length} and ${b.length}.`);
  try {
    return rankCorrelation(a, b);
  } catch (error) {
    if (error instanceof SpaceError) throw new StatsError('not-finite', error.message);
    throw error;
  }
}
