import { fillPairwiseRdm } from './fill-pairwise-rdm';
import { shiftGrid } from './shift-grid';
import { spectrumDistance } from './spectrum-distance';
import type { ContourSpectrum, Rdm } from './types';

/**
 * The contour-distance RDM of precomputed spectra (`contourSpectrum` or `descriptorSpectrum`): entry (i, j) is
 * `spectrumDistance` (RMS corresponding-point distance after the best translation, rotation and start point),
 * with one start-shift grid shared by every pair. Row-major, symmetric, zero diagonal. `onProgress(fraction)`,
 * fraction in [0, 1], is called as rows complete (weighted by their pairs) and once with 1 at the end.
 */
export function spectrumRdm(spectra: readonly ContourSpectrum[], options: { readonly onProgress?: (fraction: number) => void } = {}): Rdm {
  const grid = shiftGrid(spectra);
  return fillPairwiseRdm(spectra.length, (i, j) => spectrumDistance(spectra[i] as ContourSpectrum, spectra[j] as ContourSpectrum, grid), options.onProgress);
}
