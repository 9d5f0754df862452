import type { SpaceFailure } from './types';

/**
 * Failures that still leave a space to draw: a zero or repeated axis gives a degenerate but well-defined space,
 * and the live view must keep drawing while an axis is being edited; an empty layout draws nothing.
 */
const DRAWABLE_FAILURES: ReadonlySet<string> = new Set(['axis-zero', 'axes-identical', 'axes-parallel', 'no-stimuli']);

/** True when `generateSpace` can still run despite this failure (`checkSpace` reports it all the same). */
export function isDrawableFailure(failure: SpaceFailure): boolean {
  return DRAWABLE_FAILURES.has(failure.code);
}
