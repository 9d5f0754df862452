import type { PsychometricParameters } from './binomial-log-likelihood';
import { linkFunction } from './link-function';
import type { Link } from './types';

/** ψ(x) = λ + (1 − 2λ)F((x − threshold)/spread), a probability in [λ, 1 − λ]; x in the units of the threshold. */
export function evaluatePsychometric(link: Link, p: PsychometricParameters, x: number): number {
  return p.lapse + (1 - 2 * p.lapse) * linkFunction(link).cdf((x - p.threshold) / p.spread);
}
