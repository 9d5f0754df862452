import { StatsError } from './stats-error';
import type { PsychometricData } from './types';

/**
 * Checks binomial psychometric data and throws a `StatsError` when it cannot be fitted: x, n and k of one length;
 * every value finite; n a positive integer; k an integer in 0…n; at least two distinct levels of x.
 * Returns the number of distinct levels.
 */
export function validatePsychometricData(data: PsychometricData): number {
  const { x, n, k } = data;
  if (x.length !== n.length || x.length !== k.length) {
    throw new StatsError('length-mismatch', `x, n and k must have one length; got ${x.length}, ${n.length}, ${k.length}.`);
  }
  for (let i = 0; i < x.length; i++) {
    const xi = x[i] as number;
    const ni = n[i] as number;
    const ki = k[i] as number;
    if (!Number.isFinite(xi) || !Number.isFinite(ni) || !Number.isFinite(ki)) {
      throw new StatsError('not-finite', `Entry ${i} is not finite: x ${xi}, n ${ni}, k ${ki}.`);
    }
    if (!Number.isInteger(ni) || ni < 1) throw new StatsError('invalid-count', `n[${i}] must be a positive integer; got ${ni}.`);
    if (!Number.isInteger(ki) || ki < 0 || ki > ni) {
      throw new StatsError('invalid-count', `k[${i}] must be an integer from 0 to n[${i}] = ${ni}; got ${ki}.`);
    }
  }
  const levels = new Set(x).size;
  if (levels < 2) throw new StatsError('too-few-levels', `At least two distinct stimulus levels are needed; got ${levels}.`);
  return levels;
}
