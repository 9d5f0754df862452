import type { ShapeError } from './shape/errors';
import type { ShapeDescriptor } from './shape/types';

/**
 * The harmonic-table field a shape-engine error is about, as `terms.<i>[.<field>]`: from the term index when the
 * engine gives it, else from the harmonic it names (e.g. the one that pulls the radius below zero).
 */
export function shapeErrorField(error: ShapeError, descriptor?: ShapeDescriptor): string | undefined {
  const { termIndex, field, harmonic } = error.details;
  let index = termIndex;
  if (index === undefined && harmonic !== undefined && descriptor) {
    const found = (descriptor.terms as readonly { k?: number; n?: number }[]).findIndex((t) => (t.k ?? t.n) === harmonic);
    if (found >= 0) index = found;
  }
  if (index === undefined) return undefined;
  const f = field ?? (error.code === 'radius-not-positive' && descriptor?.family === 'radial' ? 'amplitude' : undefined);
  return `terms.${index}${f ? `.${f}` : ''}`;
}
