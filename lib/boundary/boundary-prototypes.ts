import { BOUNDARY_LIMITS } from './boundary-limits';
import { boundaryNormal } from './boundary-normal';
import { checkBoundary } from './check-boundary';
import { checkExtent } from './check-extent';
import type { Boundary, BoundaryPrototype } from './types';

/**
 * The two category prototypes of a boundary: at +d·normal (side 'A', id `p-<key>-a`) and −d·normal (side 'B',
 * id `p-<key>-b`), d in axis units taken from `boundary.prototypeDistance`, else 0.75·ρmax
 * (`BOUNDARY_LIMITS.defaultPrototypeFraction`). The `p-` prefix is not used by layout ids (`c`, `r…`, `l…`,
 * `d…`), so prototype ids never collide with stimulus ids. `extent` ρmax > 0. Throws `BoundaryError`.
 */
export function boundaryPrototypes(boundary: Boundary, extent: number): readonly [BoundaryPrototype, BoundaryPrototype] {
  checkBoundary(boundary);
  checkExtent(extent);
  const d = boundary.prototypeDistance ?? BOUNDARY_LIMITS.defaultPrototypeFraction * extent;
  const normal = boundaryNormal(boundary.angleDeg);
  // + 0 normalises −0 to 0 in the coordinates.
  return [
    { id: `p-${boundary.key}-a`, boundaryKey: boundary.key, side: 'A', position: { a: d * normal.a + 0, b: d * normal.b + 0 }, distance: d },
    { id: `p-${boundary.key}-b`, boundaryKey: boundary.key, side: 'B', position: { a: -d * normal.a + 0, b: -d * normal.b + 0 }, distance: d },
  ];
}
