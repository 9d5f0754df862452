import type { PsychometricData } from './types';

/**
 * The binomial log-likelihood kernel of the saturated model (ψ_i = k_i/n_i at every level), natural log; the
 * reference for the deviance D = 2(ℓ_saturated − ℓ) (Dobson, An Introduction to Generalized Linear Models, §5.6).
 */
export function saturatedLogLikelihood(data: PsychometricData): number {
  let sum = 0;
  for (let i = 0; i < data.x.length; i++) {
    const n = data.n[i] as number;
    const k = data.k[i] as number;
    if (k > 0) sum += k * Math.log(k / n);
    if (n - k > 0) sum += (n - k) * Math.log((n - k) / n);
  }
  return sum;
}
