import type { Contour } from '../shape/types';
import { contourSpectrum } from './contour-spectrum';
import { spectrumDistance } from './spectrum-distance';

/**
 * Contour distance between two sampled outlines (same vertex count not required): the RMS distance between
 * corresponding points after the best translation, rotation and continuous start point, read from their
 * discrete Fourier series (see `spectrumDistance`). In the contours' units. For many pairs, compute each
 * `contourSpectrum` once and use `spectrumDistance` or `contourRdm`.
 */
export function contourDistance(a: Contour, b: Contour): number {
  return spectrumDistance(contourSpectrum(a), contourSpectrum(b));
}
