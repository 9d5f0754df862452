import type { BootstrapResult, Interval } from './bootstrap-fit';
import { percentile } from './percentile';
import { StatsError } from './stats-error';

/** Result of `slopeRatioInterval`: the fitted max/min slope ratio (≥ 1) and its 95 % percentile interval. */
export interface SlopeRatio {
  readonly ratio: number;
  readonly interval: Interval;
  readonly resamples: number;
}

/** Two-sided 95 % percentile interval, as in `bootstrapFit`. */
const LOWER_Q = 0.025;
const UPPER_Q = 0.975;

/**
 * The ratio of the steepest to the shallowest slope at threshold across G ≥ 2 groups (e.g. the pooled fit of each
 * direction), with a percentile 95 % interval from their bootstrap resamples: resample r of every group forms one
 * draw of the ratio (the groups' resamples are independent, so pairing them by index samples their joint
 * distribution). Every group needs the same number of resamples. The ratio of noisy slopes exceeds 1 even when the
 * true slopes are equal, so the interval, not the ratio, is what to read. Throws `StatsError`.
 */
export function slopeRatioInterval(groups: readonly BootstrapResult[]): SlopeRatio {
  if (groups.length < 2) throw new StatsError('invalid-option', `slopeRatioInterval needs at least two groups; got ${groups.length}.`);
  const resamples = (groups[0] as BootstrapResult).samples.slopeAtThreshold.length;
  if (groups.some((g) => g.samples.slopeAtThreshold.length !== resamples) || resamples === 0) {
    throw new StatsError('invalid-option', 'slopeRatioInterval needs the same, non-zero number of resamples in every group.');
  }
  const ratioOf = (slope: (g: BootstrapResult) => number) => {
    let max = Number.NEGATIVE_INFINITY;
    let min = Number.POSITIVE_INFINITY;
    for (const g of groups) {
      const s = slope(g);
      max = Math.max(max, s);
      min = Math.min(min, s);
    }
    return max / min;
  };
  const draws = new Float64Array(resamples);
  for (let r = 0; r < resamples; r++) draws[r] = ratioOf((g) => g.samples.slopeAtThreshold[r] as number);
  return {
    ratio: ratioOf((g) => g.fit.slopeAtThreshold),
    interval: [percentile(draws, LOWER_Q), percentile(draws, UPPER_Q)],
    resamples,
  };
}
