import { createPsychometricFitter, type FitterResult } from './create-psychometric-fitter';
import { drawBinomial } from './draw-binomial';
import { evaluatePsychometric } from './evaluate-psychometric';
import { fitPsychometric } from './fit-psychometric';
import { seededRandom } from './seeded-random';
import { spreadBoundsFor } from './spread-bounds-for';
import { StatsError } from './stats-error';
import type { FitOptions, PsychometricData, PsychometricFit } from './types';

/** Options of a parametric bootstrap: number of resamples (integer ≥ 1; 1,000 or more for 95 % intervals), seed. */
export interface BootstrapOptions {
  readonly resamples: number;
  readonly seed: number;
}

/**
 * Local maxima of the data's likelihood within this many natural-log units of the best are kept as extra starts
 * for every resample: resamples move ℓ differences by a few units, so a basin further down than this is not
 * reached by a resample's best fit in practice, and each extra start costs a whole climb per resample.
 */
const MODE_MARGIN = 10;
/** Newton decrement ending a resample's climb: ℓ within ~1e−8 of its maximum, parameters within ~1e−4 SE. */
const RESAMPLE_NEWTON_TOLERANCE = 1e-4;

/**
 * The parametric bootstrap loop (Efron & Tibshirani 1993, §6.5; Wichmann & Hill 2001, Perception &
 * Psychophysics 63:1314): fit the data, then `resamples` times draw binomial counts from the fitted ψ at the
 * observed levels and trial counts (seeded, `seededRandom`, level by level in order) and refit them with the same
 * options, climbing from the data's local maxima within `MODE_MARGIN`. `visit(refit, k, saturated)` sees each
 * refit, its counts (a buffer reused between resamples: copy what you keep) and their saturated ℓ kernel. Returns
 * the fit to the data. Throws `StatsError`.
 */
export function runParametricBootstrap(
  data: PsychometricData,
  options: FitOptions,
  bootstrap: BootstrapOptions,
  visit: (refit: FitterResult, k: Float64Array, saturated: number) => void,
): PsychometricFit {
  if (!Number.isInteger(bootstrap.resamples) || bootstrap.resamples < 1) {
    throw new StatsError('invalid-option', `resamples must be a positive integer; got ${bootstrap.resamples}.`);
  }
  const fit = fitPsychometric(data, options);
  const random = seededRandom(bootstrap.seed);
  const fitter = createPsychometricFitter(data.x, data.n, { link: options.link, spreadBounds: spreadBoundsFor(data, options), lapse: options.lapse, newtonTolerance: RESAMPLE_NEWTON_TOLERANCE });
  const modes = createPsychometricFitter(data.x, data.n, { link: options.link, spreadBounds: spreadBoundsFor(data, options), lapse: options.lapse }).findModes(data.k, MODE_MARGIN);
  // Generating probabilities: the fitted ψ at each level.
  const psi = Float64Array.from(data.x, (x) => evaluatePsychometric(options.link, fit, x));
  const m = data.x.length;
  const k = new Float64Array(m);
  for (let r = 0; r < bootstrap.resamples; r++) {
    let saturated = 0;
    for (let i = 0; i < m; i++) {
      const n = data.n[i] as number;
      const ki = drawBinomial(n, psi[i] as number, random);
      k[i] = ki;
      if (ki > 0 && ki < n) saturated += ki * Math.log(ki / n) + (n - ki) * Math.log((n - ki) / n);
    }
    visit(fitter.fit(k, modes), k, saturated);
  }
  return fit;
}
