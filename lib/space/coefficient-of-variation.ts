import type { Spread } from './types';

/**
 * Coefficient of variation CV = σ / |mean| with the population SD σ = √(Σ(x − mean)²/n): the stimuli of a space
 * are the whole population being described, not a sample of one. Two-pass for accuracy. Dimensionless.
 */
export function coefficientOfVariation(values: ArrayLike<number>): Spread {
  const n = values.length;
  if (n === 0) return { mean: NaN, sd: NaN, cv: null };
  let sum = 0;
  for (let i = 0; i < n; i++) sum += values[i] as number;
  const mean = sum / n;
  let squares = 0;
  for (let i = 0; i < n; i++) squares += ((values[i] as number) - mean) ** 2;
  const sd = Math.sqrt(squares / n);
  return { mean, sd, cv: mean === 0 ? null : sd / Math.abs(mean) };
}
