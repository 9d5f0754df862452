import { linkFunction } from './link-function';
import type { Link, PsychometricData } from './types';

/** Parameters of ψ(x) = λ + (1 − 2λ)F((x − threshold)/spread); spread > 0 in units of x, λ in [0, 0.5). */
export interface PsychometricParameters {
  readonly threshold: number;
  readonly spread: number;
  readonly lapse: number;
}

/**
 * The binomial log-likelihood kernel Σ k ln ψ + (n − k) ln(1 − ψ) (natural log, binomial coefficients left out) of
 * a symmetric-lapse psychometric function. 1 − ψ is computed as λ + (1 − 2λ)F(−z), exact by the symmetry of both
 * links, so the upper tail keeps its precision. Zero counts contribute nothing, so ψ = 0 or 1 is allowed there.
 */
export function binomialLogLikelihood(data: PsychometricData, link: Link, p: PsychometricParameters): number {
  const { cdf } = linkFunction(link);
  const scale = 1 - 2 * p.lapse;
  let sum = 0;
  for (let i = 0; i < data.x.length; i++) {
    const z = ((data.x[i] as number) - p.threshold) / p.spread;
    const k = data.k[i] as number;
    const miss = (data.n[i] as number) - k;
    if (k > 0) sum += k * Math.log(p.lapse + scale * cdf(z));
    if (miss > 0) sum += miss * Math.log(p.lapse + scale * cdf(-z));
  }
  return sum;
}
