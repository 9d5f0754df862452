import { fitAtLapse, type LapseConditionalFit } from './fit-at-lapse';
import { goldenSectionMaximum } from './golden-section-maximum';
import type { BoundHit, Link, PsychometricData } from './types';

/** Result of `profileLapse`: the λ maximising the profile likelihood and the fit at it. */
export interface LapseProfileFit extends LapseConditionalFit {
  readonly lapse: number;
  readonly lapseAtBound: BoundHit;
}

/** Stop when the bracket on λ is narrower than 1e−6: λ is a probability, and its standard error is ~1e−2. */
const LAPSE_TOLERANCE = 1e-6;

/**
 * Maximum-likelihood fit with the symmetric lapse free on [0, λmax]: a golden-section search (Kiefer 1953,
 * `goldenSectionMaximum`) on the profile log-likelihood ℓ*(λ) = max over threshold and spread (`fitAtLapse`, each
 * warm-started from the previous one), with both ends compared, so an estimate on a bound is returned exactly on it
 * and reported.
 */
export function profileLapse(
  data: PsychometricData,
  link: Link,
  maxLapse: number,
  spreadBounds: { readonly min: number; readonly max: number },
): LapseProfileFit {
  let previous = fitAtLapse(data, link, 0, spreadBounds);
  const profile = (lapse: number) => {
    previous = fitAtLapse(data, link, lapse, spreadBounds, previous);
    return previous.logLikelihood;
  };
  const best = goldenSectionMaximum(profile, 0, maxLapse, LAPSE_TOLERANCE);
  const fit = fitAtLapse(data, link, best.x, spreadBounds, previous);
  const lapseAtBound: BoundHit = best.x === 0 ? 'lower' : best.x === maxLapse ? 'upper' : null;
  return { ...fit, lapse: best.x, lapseAtBound };
}
