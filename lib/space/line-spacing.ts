import { coefficientOfVariation } from './coefficient-of-variation';
import { spectrumDistance } from './spectrum-distance';
import type { ContourSpectrum, LayoutLine, LineSpacing, Stimulus } from './types';

/**
 * Spacing uniformity along one line of evenly designed stimuli: the contour distance (`spectrumDistance`)
 * between each pair of neighbours, and the coefficient of variation of those gaps (population SD / mean; 0 when
 * every step changes the outline equally; null with fewer than two gaps, or when no step changes it at all).
 */
export function lineSpacing(line: LayoutLine, stimuli: readonly Pick<Stimulus, 'id'>[], spectrumOf: (index: number) => ContourSpectrum): LineSpacing {
  const gaps: number[] = [];
  for (let i = 1; i < line.members.length; i++) {
    gaps.push(spectrumDistance(spectrumOf(line.members[i - 1] as number), spectrumOf(line.members[i] as number)));
  }
  return {
    label: line.label,
    ids: line.members.map((i) => (stimuli[i] as Pick<Stimulus, 'id'>).id),
    gaps,
    cv: gaps.length < 2 ? null : coefficientOfVariation(gaps).cv,
  };
}
