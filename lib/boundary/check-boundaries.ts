import { BoundaryError } from './boundary-error';
import { checkBoundary } from './check-boundary';
import type { Boundary } from './types';

/** Returns the boundaries unchanged if each is valid (`checkBoundary`) and no key repeats; throws `BoundaryError`. */
export function checkBoundaries(boundaries: readonly Boundary[]): readonly Boundary[] {
  const seen = new Set<string>();
  for (const boundary of boundaries) {
    checkBoundary(boundary);
    if (seen.has(boundary.key)) throw new BoundaryError('duplicate-key', `Two boundaries have the key "${boundary.key}".`);
    seen.add(boundary.key);
  }
  return boundaries;
}
