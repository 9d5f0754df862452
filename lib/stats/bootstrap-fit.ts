import { percentile } from './percentile';
import { runParametricBootstrap, type BootstrapOptions } from './run-parametric-bootstrap';
import { linkFunction } from './link-function';
import type { FitOptions, PsychometricData, PsychometricFit } from './types';

export type { BootstrapOptions } from './run-parametric-bootstrap';

/** A percentile interval [lower, upper] in the units of its parameter. */
export type Interval = readonly [lower: number, upper: number];

/** The refitted parameters of every resample, in resample order (threshold and spread in units of x). */
export interface BootstrapSamples {
  readonly threshold: readonly number[];
  readonly spread: readonly number[];
  readonly lapse: readonly number[];
  readonly slopeAtThreshold: readonly number[];
}

/** Result of `bootstrapFit`: the fit to the data, 95 % percentile intervals and the resampled parameters. */
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
  readonly samples: BootstrapSamples;
}

/** Two-sided 95 % percentile interval: the 2.5 % and 97.5 % quantiles. */
const LOWER_Q = 0.025;
const UPPER_Q = 0.975;

/**
 * Parametric bootstrap of a psychometric fit (Wichmann & Hill 2001, Perception & Psychophysics 63:1314): fit the
 * data, draw `resamples` data sets of binomial counts from the fitted ψ at the observed levels and trial counts
 * (seeded, `runParametricBootstrap`), refit each with the same options (warm-started from the data's fit), and
 * report percentile 95 % intervals (Efron & Tibshirani 1993, §13.3). Throws `StatsError`.
 */
export function bootstrapFit(data: PsychometricData, options: FitOptions, bootstrap: BootstrapOptions): BootstrapResult {
  const count = Math.max(0, Math.trunc(bootstrap.resamples));
  const thresholds = new Float64Array(count);
  const spreads = new Float64Array(count);
  const lapses = new Float64Array(count);
  const slopes = new Float64Array(count);
  const densityAtZero = linkFunction(options.link).densityAtZero;
  let r = 0;
  let spreadAtBoundCount = 0;
  const fit = runParametricBootstrap(data, options, bootstrap, (refit) => {
    thresholds[r] = refit.threshold;
    spreads[r] = refit.spread;
    lapses[r] = refit.lapse;
    slopes[r] = ((1 - 2 * refit.lapse) * densityAtZero) / refit.spread;
    if (refit.spreadAtBound !== null) spreadAtBoundCount++;
    r++;
  });
  const interval = (values: Float64Array): Interval => [percentile(values, LOWER_Q), percentile(values, UPPER_Q)];
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
    samples: {
      threshold: Array.from(thresholds),
      spread: Array.from(spreads),
      lapse: Array.from(lapses),
      slopeAtThreshold: Array.from(slopes),
    },
  };
}
