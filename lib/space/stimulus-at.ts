import { cartesianToPolar } from './cartesian-to-polar';
import { compileAxes } from './compile-axes';
import { equalizationMap } from './equalization-map';
import { normalizeStimulus } from './normalize-stimulus';
import type { NormalizedStimulus, SpaceDefinition, SpacePosition } from './types';

/**
 * The normalised stimulus at any designed position (a, b) of a space, on its layout or not (category
 * prototypes, norming steps along a diameter): the same recipe as `generateSpace` — ρ re-mapped by the
 * equalisation (if any), seed + a′·axisA + b′·axisB, normalised through `lib/shape`.
 */
export function stimulusAt(definition: SpaceDefinition, position: SpacePosition): NormalizedStimulus {
  const { rho, angle } = cartesianToPolar(position);
  const stretch = rho === 0 || !definition.equalization ? 1 : equalizationMap(definition.equalization)(rho, angle) / rho;
  const raw = compileAxes(definition.seed, definition.axes)(position.a * stretch, position.b * stretch);
  return normalizeStimulus(raw, definition.normalization);
}
