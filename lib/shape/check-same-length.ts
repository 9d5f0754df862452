import { checkOutline } from './check-outline';
import { ShapeError } from './errors';
import type { Contour } from './types';

/** Point-correspondence metrics need two valid outlines with the same number of vertices. */
export function checkSameLength(a: Contour, b: Contour): void {
  checkOutline(a);
  checkOutline(b);
  if (a.x.length !== b.x.length) {
    throw new ShapeError('invalid-argument', `corresponding points need equal vertex counts, got ${a.x.length} and ${b.x.length}`, {
      value: b.x.length,
    });
  }
}
