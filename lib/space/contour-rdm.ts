import type { Contour } from '../shape/types';
import { contourSpectrum } from './contour-spectrum';
import { spectrumRdm } from './spectrum-rdm';
import type { Rdm } from './types';

/**
 * The contour-distance RDM of sampled outlines: entry (i, j) is the RMS distance between corresponding points
 * after the best translation, rotation and (continuous) start point — ordinary Procrustes alignment without
 * scaling, in the Fourier domain (`spectrumDistance`). In the contours' units; row-major, symmetric, zero
 * diagonal. Each contour's DFT is taken once (O(N²)); the pairs then cost only their shared harmonics.
 */
export function contourRdm(contours: readonly Contour[], options: { readonly onProgress?: (fraction: number) => void } = {}): Rdm {
  return spectrumRdm(contours.map(contourSpectrum), options);
}
