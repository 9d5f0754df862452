import { StatsError } from './stats-error';
import type { FitOptions, PsychometricData } from './types';

/**
 * Default spread bounds as fractions of the range of x. Lower 0.005: with levels a tenth of the range apart, a
 * spread of range/200 already makes F a step between neighbouring levels, so perfectly separable data (common in
 * bootstrap resamples) stop there instead of running to 0. Upper 10: a spread ten times the tested range changes ψ
 * by under 2.5 % across it, i.e. a flat function.
 */
export const DEFAULT_SPREAD_BOUNDS = { minFraction: 0.005, maxFraction: 10 } as const;

/** The spread range [min, max] (units of x) for a fit: the options' bounds if given, else the defaults above. */
export function spreadBoundsFor(data: PsychometricData, options: FitOptions): { min: number; max: number } {
  if (options.spreadBounds) {
    const { min, max } = options.spreadBounds;
    if (!(Number.isFinite(min) && Number.isFinite(max) && min > 0 && max > min)) {
      throw new StatsError('invalid-option', `Spread bounds need 0 < min < max, finite; got [${min}, ${max}].`);
    }
    return { min, max };
  }
  const range = Math.max(...data.x) - Math.min(...data.x);
  return { min: DEFAULT_SPREAD_BOUNDS.minFraction * range, max: DEFAULT_SPREAD_BOUNDS.maxFraction * range };
}
