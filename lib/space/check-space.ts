import { ShapeError } from '../shape/errors';
import { validateDescriptor } from '../shape/validate-descriptor';
import type { ShapeDescriptor } from '../shape/types';
import { checkDefinition } from './check-definition';
import { countStimuli } from './count-stimuli';
import { generateSpace } from './generate-space';
import { isDrawableFailure } from './is-drawable-failure';
import type { SpaceCheck, SpaceDefinition, SpaceFailure } from './types';

/** Stage: the engine's verdict on one descriptor, as a failure or null. */
function shapeFailure(id: string, descriptor: ShapeDescriptor): SpaceFailure | null {
  try {
    validateDescriptor(descriptor);
    return null;
  } catch (error) {
    if (error instanceof ShapeError) return { id, code: error.code, reason: error.message };
    throw error;
  }
}

/** Stage: the layout's stimulus count, or 0 when its counts are not whole numbers. */
function layoutCount(definition: SpaceDefinition): number {
  const count = definition.layout ? countStimuli(definition.layout) : 0;
  return Number.isSafeInteger(count) && count >= 0 ? count : 0;
}

/**
 * Whether a definition makes a usable space, with every reason it does not:
 * - the definition itself (`checkDefinition`): 0 stimuli or more than 2,000, zero, identical or parallel axes,
 *   a malformed extent, layout, axis, normalisation or equalisation;
 * - the seed, validated by `lib/shape` (id `seed`);
 * - every stimulus, validated by `lib/shape`'s `validateDescriptor` (r ≤ 0 anywhere for radial harmonics, zero
 *   area or a self-intersecting curve for elliptic and complex ones), listed by stimulus id with the engine's
 *   code and message — e.g. the stimuli a too-large ρmax pushes past r = 0.
 * Stimuli are checked only when the definition can be generated. `count` is the layout's stimulus count.
 */
export function checkSpace(definition: SpaceDefinition): SpaceCheck {
  const failures = checkDefinition(definition);
  const count = layoutCount(definition);
  const generable = failures.every(isDrawableFailure);
  if (generable) {
    const seedFailure = shapeFailure('seed', definition.seed);
    if (seedFailure) failures.push(seedFailure);
    for (const stimulus of generateSpace(definition).stimuli) {
      const found = shapeFailure(stimulus.id, stimulus.descriptor);
      if (found) failures.push(found);
    }
  }
  return { ok: failures.length === 0, failures, count };
}
