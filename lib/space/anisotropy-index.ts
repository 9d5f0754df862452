import { anisotropyFromRates } from './anisotropy-from-rates';
import { centreStimulus } from './centre-stimulus';
import { descriptorSpectrum } from './descriptor-spectrum';
import { generateSpace } from './generate-space';
import { layoutRays } from './layout-rays';
import { rayGrowth } from './ray-growth';
import type { ContourSpectrum, SpaceDefinition, Stimulus } from './types';

/**
 * The anisotropy index of a space: the largest over the smallest rate at which contour distance from the centre
 * grows across the layout's rays (`layoutRays`: spokes, diameter halves, or a lattice's compass directions),
 * each rate the least-squares slope through the origin of contour distance (`spectrumDistance`, exact from the
 * descriptors) on designed ρ. 1 is isotropic. +∞ when some direction does not change the outline at all (a
 * phase change that only rotates the shape); NaN when the layout has no rays or no direction changes it.
 * Includes the definition's equalisation, so calling it before and after `equalizeSpace` shows the gain.
 * Raises `SpaceError` for definitions `generateSpace` refuses.
 */
export function anisotropyIndex(definition: SpaceDefinition): number {
  const { stimuli } = generateSpace(definition);
  const { rays } = layoutRays(definition.layout, stimuli);
  const centre = descriptorSpectrum(centreStimulus(definition).descriptor);
  const spectra = new Map<number, ContourSpectrum>();
  const spectrumOf = (i: number): ContourSpectrum => {
    let s = spectra.get(i);
    if (!s) {
      s = descriptorSpectrum((stimuli[i] as Stimulus).descriptor);
      spectra.set(i, s);
    }
    return s;
  };
  const rates = rays.filter((ray) => ray.members.length > 0).map((ray) => rayGrowth(ray, stimuli, spectrumOf, centre).rate);
  return anisotropyFromRates(rates);
}
