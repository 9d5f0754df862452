import { descriptorArea } from '../shape/descriptor-area';
import { reverseDescriptor } from '../shape/reverse-descriptor';
import { toComplexHarmonics } from '../shape/to-complex-harmonics';
import type { ShapeDescriptor } from '../shape/types';
import { SPECTRUM_NOISE } from './spectrum-noise';
import type { ContourSpectrum } from './types';

/**
 * The spectrum of the curve `synthesizeContour` draws for a descriptor, exactly and without sampling: its
 * complex harmonics (`lib/shape`'s `toComplexHarmonics`; radial c_1 = r0, c_{1±k} = (r0A_k/2)e^{±iφ_k}),
 * re-traced counter-clockwise when the descriptor runs clockwise (as synthesis does), without c_0 and without
 * rounding noise. Equals `contourSpectrum` of the synthesised contour whenever N > 2·(highest complex harmonic),
 * at a cost of O(terms) instead of O(N²). Assumes a well-formed descriptor.
 */
export function descriptorSpectrum(descriptor: ShapeDescriptor): ContourSpectrum {
  const complex = toComplexHarmonics(descriptor.family !== 'radial' && descriptorArea(descriptor) < 0 ? reverseDescriptor(descriptor) : descriptor);
  const terms = complex.terms.filter((t) => t.k !== 0);
  let total = 0;
  for (const t of terms) total += t.re * t.re + t.im * t.im;
  const floor = SPECTRUM_NOISE * SPECTRUM_NOISE * total;
  const kept = terms.filter((t) => t.re * t.re + t.im * t.im > floor).sort((p, q) => p.k - q.k);
  let energy = 0;
  for (const t of kept) energy += t.re * t.re + t.im * t.im;
  return {
    k: Int32Array.from(kept, (t) => t.k),
    re: Float64Array.from(kept, (t) => t.re),
    im: Float64Array.from(kept, (t) => t.im),
    energy,
  };
}
