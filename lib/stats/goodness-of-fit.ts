import { runParametricBootstrap, type BootstrapOptions } from './run-parametric-bootstrap';
import type { FitOptions, PsychometricData } from './types';

/** Result of `goodnessOfFit`: the data's deviance, its bootstrap p in (0, 1] and the number of resamples m. */
export interface GoodnessOfFit {
  readonly deviance: number;
  readonly p: number;
  readonly resamples: number;
}

/**
 * Goodness of fit of a psychometric function by the parametric bootstrap of its deviance (Wichmann & Hill 2001,
 * Perception & Psychophysics 63:1293, §"Goodness of fit"): the deviance D = 2(ℓ_saturated − ℓ) of the fit is compared
 * with the deviances of `resamples` data sets drawn from the fitted ψ and refitted with the same options (seeded),
 * rather than with χ², which small binomial counts do not follow. p = (b + 1)/(m + 1), b the number of resample
 * deviances ≥ D (North, Curtis & Sham 2002, AJHG 71:439). A small p says the model misses a systematic feature of
 * the data (e.g. a non-monotone run of responses); a large one is no proof that the model is right.
 */
export function goodnessOfFit(data: PsychometricData, options: FitOptions, bootstrap: BootstrapOptions): GoodnessOfFit {
  const deviances = new Float64Array(Math.max(0, Math.trunc(bootstrap.resamples)));
  let r = 0;
  const fit = runParametricBootstrap(data, options, bootstrap, (refit, _k, saturated) => {
    deviances[r++] = Math.max(0, 2 * (saturated - refit.logLikelihood));
  });
  let atLeast = 0;
  for (const d of deviances) if (d >= fit.deviance) atLeast++;
  return { deviance: fit.deviance, p: (atLeast + 1) / (bootstrap.resamples + 1), resamples: bootstrap.resamples };
}
