import { compileAxes } from './compile-axes';
import { normalizeStimulus } from './normalize-stimulus';
import type { NormalizedStimulus, SpaceDefinition } from './types';

/**
 * The shape at the centre (0, 0) of the space — the seed, normalised as the space asks — whether or not the
 * layout has a stimulus there (an even lattice does not). Equalisation leaves the centre alone (ρ′(0) = 0).
 */
export function centreStimulus(definition: SpaceDefinition): NormalizedStimulus {
  return normalizeStimulus(compileAxes(definition.seed, definition.axes)(0, 0), definition.normalization);
}
