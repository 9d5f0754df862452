import { fitAtLapse, type LapseConditionalFit } from './fit-at-lapse';
import type { BoundHit, Link, PsychometricData } from './types';

/** Result of `profileLapse`: the λ maximising the profile likelihood and the fit at it. */
export interface LapseProfileFit extends LapseConditionalFit {
  readonly lapse: number;
  readonly lapseAtBound: BoundHit;
}

/** (√5 − 1)/2, the golden-section ratio. */
const GOLDEN = 0.6180339887498949;
/** Stop when the bracket on λ is narrower than this (λ is a probability; 1e−7 is far below any standard error). */
const LAPSE_TOLERANCE = 1e-7;

/**
 * Maximum-likelihood fit with the symmetric lapse free on [0, λmax]: a golden-section search (Kiefer 1953) on the
 * profile log-likelihood ℓ*(λ) = max over threshold and spread (`fitAtLapse`, warm-started), then the two ends of
 * the interval compared too, so an estimate on a bound is returned exactly on it and reported.
 */
export function profileLapse(
  data: PsychometricData,
  link: Link,
  maxLapse: number,
  spreadBounds: { readonly min: number; readonly max: number },
): LapseProfileFit {
  const atZero = fitAtLapse(data, link, 0, spreadBounds);
  if (maxLapse === 0) return { ...atZero, lapse: 0, lapseAtBound: 'upper' };
  const profile = (lapse: number) => fitAtLapse(data, link, lapse, spreadBounds, atZero);

  let lo = 0;
  let hi = maxLapse;
  let x1 = hi - GOLDEN * (hi - lo);
  let x2 = lo + GOLDEN * (hi - lo);
  let f1 = profile(x1);
  let f2 = profile(x2);
  while (hi - lo > LAPSE_TOLERANCE) {
    if (f1.logLikelihood >= f2.logLikelihood) {
      hi = x2;
      x2 = x1;
      f2 = f1;
      x1 = hi - GOLDEN * (hi - lo);
      f1 = profile(x1);
    } else {
      lo = x1;
      x1 = x2;
      f1 = f2;
      x2 = lo + GOLDEN * (hi - lo);
      f2 = profile(x2);
    }
  }
  const interior = f1.logLikelihood >= f2.logLikelihood ? { fit: f1, lapse: x1 } : { fit: f2, lapse: x2 };
  const atMax = profile(maxLapse);
  const candidates: { fit: LapseConditionalFit; lapse: number; bound: BoundHit }[] = [
    { fit: atZero, lapse: 0, bound: 'lower' },
    { ...interior, bound: null },
    { fit: atMax, lapse: maxLapse, bound: 'upper' },
  ];
  let best = candidates[0] as (typeof candidates)[number];
  for (const c of candidates) if (c.fit.logLikelihood > best.fit.logLikelihood) best = c;
  return { ...best.fit, lapse: best.lapse, lapseAtBound: best.bound };
}
