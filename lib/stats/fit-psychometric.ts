import { fitAtLapse } from './fit-at-lapse';
import { linkFunction } from './link-function';
import { profileLapse } from './profile-lapse';
import { saturatedLogLikelihood } from './saturated-log-likelihood';
import { spreadBoundsFor } from './spread-bounds-for';
import { StatsError } from './stats-error';
import type { FitOptions, PsychometricData, PsychometricFit } from './types';
import { validatePsychometricData } from './validate-psychometric-data';

/** λ must stay below 0.5: at 0.5 ψ is flat and the threshold and spread are undefined. */
const LAPSE_LIMIT = 0.5;

function checkLapse(value: number, what: string): void {
  if (!(Number.isFinite(value) && value >= 0 && value < LAPSE_LIMIT)) {
    throw new StatsError('invalid-option', `The lapse ${what} must lie in [0, 0.5); got ${value}.`);
  }
}

/**
 * Maximum-likelihood (binomial) fit of ψ(x) = λ + (1 − 2λ)F((x − threshold)/spread), the symmetric-lapse model of
 * two-category classification (γ = λ, so ψ(threshold) = 0.5), with F the logistic 1/(1 + e^(−z)) or the normal Φ.
 * λ is 0, fixed, or free on [0, max] (Wichmann & Hill 2001); the spread is bounded (`spreadBoundsFor`). Stages:
 * validate → spread bounds → threshold/spread by Fisher scoring (`fitAtLapse`) or with λ profiled
 * (`profileLapse`) → slope, interquartile spread, deviance against the saturated model. Throws `StatsError`.
 */
export function fitPsychometric(data: PsychometricData, options: FitOptions): PsychometricFit {
  validatePsychometricData(data);
  const spreadBounds = spreadBoundsFor(data, options);
  const lapseOption = options.lapse;

  let fit;
  if (lapseOption === undefined) {
    fit = { ...fitAtLapse(data, options.link, 0, spreadBounds), lapse: 0, lapseAtBound: null };
  } else if ('fixed' in lapseOption) {
    checkLapse(lapseOption.fixed, 'fixed');
    fit = { ...fitAtLapse(data, options.link, lapseOption.fixed, spreadBounds), lapse: lapseOption.fixed, lapseAtBound: null };
  } else {
    checkLapse(lapseOption.max, 'max');
    fit = profileLapse(data, options.link, lapseOption.max, spreadBounds);
  }

  const { densityAtZero, upperQuartile } = linkFunction(options.link);
  const deviance = Math.max(0, 2 * (saturatedLogLikelihood(data) - fit.logLikelihood));
  return {
    link: options.link,
    threshold: fit.threshold,
    spread: fit.spread,
    lapse: fit.lapse,
    slopeAtThreshold: ((1 - 2 * fit.lapse) * densityAtZero) / fit.spread,
    interquartileSpread: 2 * upperQuartile * fit.spread,
    logLikelihood: fit.logLikelihood,
    deviance,
    bounds: { spreadAtBound: fit.spreadAtBound, lapseAtBound: fit.lapseAtBound },
  };
}
