import { fillPairwiseRows } from './fill-pairwise-rows';
import { shiftGrid } from './shift-grid';
import { spectrumDistance } from './spectrum-distance';
import type { ContourSpectrum, RdmRows } from './types';

/**
 * Rows `from` … `to − 1` of the contour-distance RDM of `spectra` (`RdmRows`): the same values as
 * `spectrumRdm`, with the start-shift grid of all the spectra (so pass all of them, whatever the block).
 */
export function spectrumRdmRows(spectra: readonly ContourSpectrum[], from: number, to: number): RdmRows {
  const grid = shiftGrid(spectra);
  return fillPairwiseRows(spectra.length, from, to, (i, j) => spectrumDistance(spectra[i] as ContourSpectrum, spectra[j] as ContourSpectrum, grid));
}
