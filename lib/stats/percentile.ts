/**
 * The q-quantile (q in [0, 1]) of a sample by linear interpolation between order statistics (Hyndman & Fan 1996,
 * definition 7, the default of R and NumPy). Sorts a copy (numerically); NaN for an empty sample.
 */
export function percentile(values: ArrayLike<number>, q: number): number {
  if (values.length === 0) return Number.NaN;
  const sorted = Float64Array.from(values).sort();
  const h = (sorted.length - 1) * q;
  const lo = Math.floor(h);
  const hi = Math.min(lo + 1, sorted.length - 1);
  const a = sorted[lo] as number;
  const b = sorted[hi] as number;
  return a + (h - lo) * (b - a);
}
