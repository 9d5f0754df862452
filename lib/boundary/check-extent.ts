import { BoundaryError } from './boundary-error';

/** Returns ρmax unchanged if it is a finite number > 0 (axis units); throws `BoundaryError` 'invalid-argument' otherwise. */
export function checkExtent(extent: number): number {
  if (!(Number.isFinite(extent) && extent > 0)) {
    throw new BoundaryError('invalid-argument', `The extent ρmax must be a number above 0; got ${String(extent)}.`);
  }
  return extent;
}
