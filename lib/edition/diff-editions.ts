import { EditionError } from './edition-error';
import { numericDifference } from './numeric-difference';
import type { ChangedStimulus, EditionDiff, EditionStimulus, StimulusChangeField } from './types';

/**
 * Default tolerance of `diffEditions`: 1e-9 in axis units (positions) and descriptor units (coefficients).
 * Re-generating the same definition reproduces stimuli bit for bit, so anything above rounding is a real change;
 * 1e-9 is far above the ~1e-15 that a different but equivalent evaluation order could leave.
 */
export const EDITION_DIFF_TOLERANCE = 1e-9;

function indexById<S extends EditionStimulus>(stimuli: readonly S[], edition: string): Map<string, S> {
  const byId = new Map<string, S>();
  for (const stimulus of stimuli) {
    if (byId.has(stimulus.id)) throw new EditionError('invalid-argument', `The ${edition} edition has two stimuli with the id "${stimulus.id}".`);
    byId.set(stimulus.id, stimulus);
  }
  return byId;
}

/**
 * The stimuli of two editions of a space, matched by their layout-position ids (`lib/space`'s `stimulusId`, and
 * `p-…` prototype ids): `added` (only in the new, new order), `removed` (only in the old, old order), `changed`
 * (in both, with the position or any descriptor number moved by more than `tolerance`, or the descriptor's
 * structure different — a term added, another family) and `unchanged`, both in the new edition's order.
 * `tolerance` ≥ 0, default `EDITION_DIFF_TOLERANCE`. Throws `EditionError` 'invalid-argument' for a repeated id
 * or a bad tolerance. Never mutates; the result holds the given stimulus objects.
 */
export function diffEditions<S extends EditionStimulus>(
  oldStimuli: readonly S[],
  newStimuli: readonly S[],
  tolerance: number = EDITION_DIFF_TOLERANCE,
): EditionDiff<S> {
  if (!(Number.isFinite(tolerance) && tolerance >= 0)) {
    throw new EditionError('invalid-argument', `The tolerance must be a number of at least 0; got ${String(tolerance)}.`);
  }
  const before = indexById(oldStimuli, 'old');
  const after = indexById(newStimuli, 'new');
  const added: S[] = [];
  const changed: ChangedStimulus<S>[] = [];
  const unchanged: S[] = [];
  for (const stimulus of newStimuli) {
    const previous = before.get(stimulus.id);
    if (previous === undefined) {
      added.push(stimulus);
      continue;
    }
    const fields: StimulusChangeField[] = [];
    if (numericDifference(previous.position, stimulus.position) > tolerance) fields.push('position');
    if (numericDifference(previous.descriptor, stimulus.descriptor) > tolerance) fields.push('descriptor');
    if (fields.length === 0) unchanged.push(stimulus);
    else changed.push({ id: stimulus.id, before: previous, after: stimulus, fields });
  }
  const removed = oldStimuli.filter((stimulus) => !after.has(stimulus.id));
  return { added, removed, changed, unchanged };
}
