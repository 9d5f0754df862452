import { StatsError } from './stats-error';

/**
 * Pearson's product-moment correlation r of two samples of equal length ≥ 2, by two passes (means first, so no
 * cancellation of large sums). In [−1, 1]; NaN when either sample is constant. Raises `StatsError`
 * (`length-mismatch`).
 */
export function pearson(a: ArrayLike<number>, b: ArrayLike<number>): number {
  const n = a.length;
  if (b.length !== n || n < 2) throw new StatsError('length-mismatch', `A correlation needs two samples of equal length ≥ 2; got ${n} and ${b.length}.`);
  let ma = 0, mb = 0;
  for (let i = 0; i < n; i++) {
    ma += a[i] as number;
    mb += b[i] as number;
  }
  ma /= n;
  mb /= n;
  let sab = 0, saa = 0, sbb = 0;
  for (let i = 0; i < n; i++) {
    const da = (a[i] as number) - ma;
    const db = (b[i] as number) - mb;
    sab += da * db;
    saa += da * da;
    sbb += db * db;
  }
  return saa === 0 || sbb === 0 ? NaN : Math.max(-1, Math.min(1, sab / Math.sqrt(saa * sbb)));
}
