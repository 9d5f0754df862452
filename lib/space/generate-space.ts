import { checkDefinition } from './check-definition';
import { compileAxes } from './compile-axes';
import { equalizationMap } from './equalization-map';
import { isDrawableFailure } from './is-drawable-failure';
import { layoutPoints } from './layout-points';
import { normalizeStimulus } from './normalize-stimulus';
import { SpaceError } from './space-error';
import { stimulusId } from './stimulus-id';
import type { SpaceDefinition, SpaceFailure, Stimulus } from './types';

/** Stage: refuse definitions that cannot be generated at all. */
function assertGenerable(definition: SpaceDefinition): void {
  const fatal: SpaceFailure[] = checkDefinition(definition).filter((f) => !isDrawableFailure(f));
  if (fatal.length > 0) throw new SpaceError('invalid-definition', fatal.map((f) => f.reason).join('; '), fatal);
}

/**
 * Generates the stimuli of a shape space, in layout order (see `layoutPoints`). For each layout point at
 * designed (a, b) = ρ(cos θ, sin θ): ρ′ = equalisation(ρ, θ) (identity without one), (a′, b′) = (a, b)·ρ′/ρ, descriptor =
 * seed + a′·axisA + b′·axisB (`compileAxes`), normalised for scale and centroid through `lib/shape`, never
 * rotated (`normalizeStimulus`). `position` and `polar` are the designed coordinates; the id is the layout
 * position (`stimulusId`), so it survives any change of extent, axes, seed, normalisation or equalisation.
 *
 * Cheap enough for the live view (measured in `scripts/bench-space.ts`): no shape is validated here. A stimulus the engine refuses is returned as generated
 * (un-normalised), and `checkSpace` lists it with the reason. Raises `SpaceError` (`invalid-definition`) only
 * for definitions that cannot be generated: a malformed layout or extent, more than 2,000 stimuli, an axis
 * field the seed's family lacks, a malformed equalisation. Deterministic; the definition is not mutated.
 */
export function generateSpace(definition: SpaceDefinition): { stimuli: Stimulus[] } {
  assertGenerable(definition);
  const descriptorAt = compileAxes(definition.seed, definition.axes);
  const mapRadius = equalizationMap(definition.equalization);
  const stimuli = layoutPoints(definition.layout, definition.extent).map((point): Stimulus => {
    const { rho, angle } = point.polar;
    // a′ = a·ρ′/ρ keeps the designed coordinates bit for bit when there is no equalisation.
    const stretch = rho === 0 || !definition.equalization ? 1 : mapRadius(rho, angle) / rho;
    const raw = descriptorAt(point.position.a * stretch, point.position.b * stretch);
    const { descriptor, contourOffset } = normalizeStimulus(raw, definition.normalization);
    return { id: stimulusId(point.layoutPosition), position: point.position, polar: point.polar, layoutPosition: point.layoutPosition, descriptor, contourOffset };
  });
  return { stimuli };
}
