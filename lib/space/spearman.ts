import { averageRanks } from './average-ranks';
import { SpaceError } from './space-error';

/**
 * Spearman's rank correlation ρ (Spearman 1904): the Pearson correlation of the two samples' average ranks
 * (ties share the mean rank), so it is exact with ties, where the shortcut 1 − 6Σd²/(n(n² − 1)) is not. In
 * [−1, 1]; NaN when either sample is constant (ρ is undefined). Samples of equal length ≥ 2, no NaN; raises
 * `SpaceError` otherwise.
 */
export function spearman(x: ArrayLike<number>, y: ArrayLike<number>): number {
  const n = x.length;
  if (y.length !== n || n < 2) throw new SpaceError('invalid-argument', `Spearman's ρ needs two samples of equal length ≥ 2 (got ${n} and ${y.length})`);
  for (let i = 0; i < n; i++) {
    if (Number.isNaN(x[i] as number) || Number.isNaN(y[i] as number)) throw new SpaceError('invalid-argument', `value ${i} is NaN; Spearman's ρ needs ordered values`);
  }
  const rx = averageRanks(x);
  const ry = averageRanks(y);
  // Both rank vectors have mean (n + 1)/2.
  const mean = (n + 1) / 2;
  let sxy = 0, sxx = 0, syy = 0;
  for (let i = 0; i < n; i++) {
    const dx = (rx[i] as number) - mean;
    const dy = (ry[i] as number) - mean;
    sxy += dx * dy;
    sxx += dx * dx;
    syy += dy * dy;
  }
  return sxx === 0 || syy === 0 ? NaN : sxy / Math.sqrt(sxx * syy);
}
