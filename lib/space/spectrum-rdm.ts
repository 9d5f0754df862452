import { shiftGrid } from './shift-grid';
import { spectrumDistance } from './spectrum-distance';
import type { ContourSpectrum, Rdm } from './types';

/** Progress is reported about this many times over a matrix, whatever its size. */
const PROGRESS_REPORTS = 50;

/**
 * The contour-distance RDM of precomputed spectra (`contourSpectrum` or `descriptorSpectrum`): entry (i, j) is
 * `spectrumDistance` (RMS corresponding-point distance after the best translation, rotation and start point),
 * with one start-shift grid shared by every pair. Row-major, symmetric, zero diagonal. `onProgress(fraction)`,
 * fraction in [0, 1], is called as rows complete (weighted by their pairs) and once with 1 at the end.
 */
export function spectrumRdm(spectra: readonly ContourSpectrum[], options: { readonly onProgress?: (fraction: number) => void } = {}): Rdm {
  const n = spectra.length;
  const values = new Float64Array(n * n);
  const grid = shiftGrid(spectra);
  const totalPairs = (n * (n - 1)) / 2;
  const every = Math.max(1, Math.ceil(totalPairs / PROGRESS_REPORTS));
  let done = 0;
  let nextReport = every;
  for (let i = 0; i < n; i++) {
    const p = spectra[i] as ContourSpectrum;
    for (let j = i + 1; j < n; j++) {
      const d = spectrumDistance(p, spectra[j] as ContourSpectrum, grid);
      values[i * n + j] = d;
      values[j * n + i] = d;
    }
    done += n - 1 - i;
    if (options.onProgress && done >= nextReport) {
      options.onProgress(done / totalPairs);
      nextReport = done + every;
    }
  }
  options.onProgress?.(1);
  return { size: n, values };
}
