import { createPsychometricFitter } from './create-psychometric-fitter';
import { linkFunction } from './link-function';
import { saturatedLogLikelihood } from './saturated-log-likelihood';
import { spreadBoundsFor } from './spread-bounds-for';
import { StatsError } from './stats-error';
import type { FitOptions, PsychometricData, PsychometricFit } from './types';
import type { FitterResult } from './create-psychometric-fitter';
import { validatePsychometricData } from './validate-psychometric-data';

/** λ must stay below 0.5: at 0.5 ψ is flat and the threshold and spread are undefined. */
const LAPSE_LIMIT = 0.5;

/** Throws `invalid-option` unless a lapse option lies in [0, 0.5). */
export function checkLapseOption(lapse: FitOptions['lapse']): void {
  if (lapse === undefined) return;
  const [value, what] = 'fixed' in lapse ? [lapse.fixed, 'fixed'] : [lapse.max, 'max'];
  if (!(Number.isFinite(value) && value >= 0 && value < LAPSE_LIMIT)) {
    throw new StatsError('invalid-option', `The lapse ${what} must lie in [0, 0.5); got ${value}.`);
  }
}

/** Threshold/spread/λ of a fit completed with the slope, the 25–75 % spread and the deviance. */
export function completeFit(
  data: PsychometricData,
  link: FitOptions['link'],
  fit: FitterResult,
  saturated = saturatedLogLikelihood(data),
): PsychometricFit {
  const { densityAtZero, upperQuartile } = linkFunction(link);
  return {
    link,
    threshold: fit.threshold,
    spread: fit.spread,
    lapse: fit.lapse,
    slopeAtThreshold: ((1 - 2 * fit.lapse) * densityAtZero) / fit.spread,
    interquartileSpread: 2 * upperQuartile * fit.spread,
    logLikelihood: fit.logLikelihood,
    deviance: Math.max(0, 2 * (saturated - fit.logLikelihood)),
    bounds: { spreadAtBound: fit.spreadAtBound, lapseAtBound: fit.lapseAtBound },
  };
}

/**
 * Maximum-likelihood (binomial) fit of ψ(x) = λ + (1 − 2λ)F((x − threshold)/spread), the symmetric-lapse model of
 * two-category classification (γ = λ, so ψ(threshold) = 0.5), with F the logistic 1/(1 + e^(−z)) or the normal Φ.
 * λ is 0, fixed, or free on [0, max] (Wichmann & Hill 2001); the spread is bounded (`spreadBoundsFor`). Stages:
 * validate → spread bounds → threshold, spread and λ jointly by bounded Newton/Fisher scoring
 * (`createPsychometricFitter`) → slope, interquartile spread, deviance against the saturated model (`completeFit`).
 * Throws `StatsError`.
 */
export function fitPsychometric(data: PsychometricData, options: FitOptions): PsychometricFit {
  validatePsychometricData(data);
  checkLapseOption(options.lapse);
  const spreadBounds = spreadBoundsFor(data, options);
  const fitter = createPsychometricFitter(data.x, data.n, { link: options.link, spreadBounds, lapse: options.lapse });
  // The best of the local maxima reached from several starts (with λ not free, the one climb from a neutral start).
  return completeFit(data, options.link, fitter.findModes(data.k, 0)[0] as FitterResult);
}
