import { drawBinomial } from './draw-binomial';
import { evaluatePsychometric } from './evaluate-psychometric';
import { fitPsychometric } from './fit-psychometric';
import { percentile } from './percentile';
import { seededRandom } from './seeded-random';
import { StatsError } from './stats-error';
import type { FitOptions, PsychometricData, PsychometricFit } from './types';

/** Options of `bootstrapFit`: number of resamples (integer ≥ 1; 1,000 or more for 95 % intervals) and the seed. */
export interface BootstrapOptions {
  readonly resamples: number;
  readonly seed: number;
}

/** A percentile interval [lower, upper] in the units of its parameter. */
export type Interval = readonly [lower: number, upper: number];

/** Result of `bootstrapFit`: the fit to the data and 95 % percentile intervals of its parameters. */
export interface BootstrapResult {
  readonly fit: PsychometricFit;
  readonly resamples: number;
  readonly intervals: {
    readonly threshold: Interval;
    readonly spread: Interval;
    readonly lapse: Interval;
    readonly slopeAtThreshold: Interval;
  };
  /** Resamples whose spread stopped on a bound (separable or flat resamples): a widened interval's cause. */
  readonly spreadAtBoundCount: number;
}

/** Two-sided 95 % percentile interval: the 2.5 % and 97.5 % quantiles. */
const LOWER_Q = 0.025;
const UPPER_Q = 0.975;

/**
 * Parametric bootstrap of a psychometric fit (Wichmann & Hill 2001, Perception & Psychophysics 63:1314): fit the
 * data, draw `resamples` data sets of binomial counts from the fitted ψ at the observed levels and trial counts
 * (seeded, `seededRandom`), refit each with the same options, and report percentile 95 % intervals (Efron &
 * Tibshirani 1993, §13.3).
 */
export function bootstrapFit(data: PsychometricData, options: FitOptions, bootstrap: BootstrapOptions): BootstrapResult {
  if (!Number.isInteger(bootstrap.resamples) || bootstrap.resamples < 1) {
    throw new StatsError('invalid-option', `resamples must be a positive integer; got ${bootstrap.resamples}.`);
  }
  const fit = fitPsychometric(data, options);
  const random = seededRandom(bootstrap.seed);
  // Fitted ψ at each level, the generating probabilities.
  const psi = data.x.map((x) => evaluatePsychometric(fit.link, fit, x));

  const thresholds: number[] = [];
  const spreads: number[] = [];
  const lapses: number[] = [];
  const slopes: number[] = [];
  let spreadAtBoundCount = 0;
  for (let r = 0; r < bootstrap.resamples; r++) {
    const k = data.n.map((n, i) => drawBinomial(n, psi[i] as number, random));
    const refit = fitPsychometric({ x: data.x, n: data.n, k }, options);
    thresholds.push(refit.threshold);
    spreads.push(refit.spread);
    lapses.push(refit.lapse);
    slopes.push(refit.slopeAtThreshold);
    if (refit.bounds.spreadAtBound !== null) spreadAtBoundCount++;
  }
  const interval = (values: readonly number[]): Interval => [percentile(values, LOWER_Q), percentile(values, UPPER_Q)];
  return {
    fit,
    resamples: bootstrap.resamples,
    intervals: {
      threshold: interval(thresholds),
      spread: interval(spreads),
      lapse: interval(lapses),
      slopeAtThreshold: interval(slopes),
    },
    spreadAtBoundCount,
  };
}
