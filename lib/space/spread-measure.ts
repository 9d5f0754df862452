import { coefficientOfVariation } from './coefficient-of-variation';
import type { SpreadMeasure } from './types';

const percent = (v: number) => `${(100 * v).toFixed(1)} %`;

/** What a spread of each metric lets observers do, for the flag's message. */
const CONSEQUENCE: Readonly<Record<'area' | 'perimeter' | 'compactness', string>> = {
  area: 'observers could tell stimuli apart by size alone; normalise by area or equal-area radius',
  perimeter: 'outline length is a cue besides shape',
  compactness: 'how round or spiky a stimulus is varies on its own, a cue besides the designed shape change',
};

const LABEL: Readonly<Record<keyof typeof CONSEQUENCE, string>> = { area: 'Area', perimeter: 'Perimeter', compactness: 'Compactness' };

/**
 * The spread of one metric across the stimuli as an audit measure: coefficient of variation (population SD /
 * mean), flagged above `threshold`, with a plain-language message.
 */
export function spreadMeasure(metric: keyof typeof CONSEQUENCE, values: ArrayLike<number>, threshold: number): SpreadMeasure {
  const { mean, sd, cv } = coefficientOfVariation(values);
  const label = LABEL[metric];
  if (cv === null) return { value: null, threshold, flagged: false, mean, sd, message: `${label}: no stimuli to compare.` };
  const flagged = cv > threshold;
  const message = flagged
    ? `${label} varies across the space (CV ${percent(cv)}, above ${percent(threshold)}): ${CONSEQUENCE[metric]}.`
    : `${label} is even across the space (CV ${percent(cv)}, at most ${percent(threshold)}).`;
  return { value: cv, threshold, flagged, mean, sd, message };
}
