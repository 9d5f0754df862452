import { checkWholeNumber } from './check-whole-number';
import { truncatedExponentialRate } from './truncated-exponential-rate';
import type { ItiDistribution, SeededRandom } from './types';
import { validateTiming } from './validate-timing';

/**
 * ITIs are rounded to 1 ms: finer than any display frame (4.2 ms at 240 Hz), and the resolution at which
 * `events.tsv` prints times by default, so the file and the schedule agree exactly.
 */
const ITI_RESOLUTION_S = 0.001;

/** Rounds to the ITI resolution, staying inside [min, max]. */
function roundIti(value: number, min: number, max: number): number {
  const rounded = Math.round(value / ITI_RESOLUTION_S) * ITI_RESOLUTION_S;
  return Math.min(max, Math.max(min, Number(rounded.toFixed(3))));
}

/**
 * `count` inter-trial intervals in seconds (count ≥ 0), drawn from `iti` with a seeded stream and rounded to 1 ms:
 * fixed; uniform on [min, max] (inverse transform); or truncated exponential, min + X with X ~ Exp(λ) truncated
 * to [0, max − min] by inverse-transform sampling, X = −ln(1 − U(1 − e^{−λL}))/λ, with λ set so the mean is
 * `mean` (`truncatedExponentialRate`). Throws `invalid-iti` for inconsistent parameters.
 */
export function drawItis(count: number, iti: ItiDistribution, random: SeededRandom): number[] {
  checkWholeNumber('count', count, 0);
  // Validate the distribution alone, with placeholder trial timing.
  validateTiming({ trialDuration: 1, tr: 1, iti });
  switch (iti.kind) {
    case 'fixed':
      return new Array<number>(count).fill(roundIti(iti.duration, iti.duration, iti.duration));
    case 'uniform':
      return Array.from({ length: count }, () => roundIti(iti.min + random.next() * (iti.max - iti.min), iti.min, iti.max));
    case 'truncated-exponential': {
      const width = iti.max - iti.min;
      const rate = truncatedExponentialRate(iti.mean - iti.min, width);
      const mass = -Math.expm1(-rate * width); // 1 − e^{−λL}, the probability kept by the truncation
      return Array.from({ length: count }, () => {
        const excess = -Math.log1p(-random.next() * mass) / rate;
        return roundIti(iti.min + excess, iti.min, iti.max);
      });
    }
  }
}
