import { SPACE_LIMITS } from './space-limits';
import type { LayoutPosition } from './types';

function pad(index: number): string {
  return String(index).padStart(SPACE_LIMITS.idDigits, '0');
}

/**
 * The id of a layout position, stable across re-generation and across any definition change that keeps the
 * position (extent, axes, seed, normalisation, equalisation). Ids name indices, not coordinates: with more rings,
 * `r03-s07` is still ring 3, spoke 7, though ring 3 then sits at a different ρ.
 * - centre: `c`;
 * - Rings: `r{ring}-s{spoke}`, ring 1…R from the centre out, spoke 0…S−1 counter-clockwise from Axis A: `r03-s07`;
 * - Lattice: `l{row}-{column}`, row 0 at the top (b = +ρmax), column 0 at the left (a = −ρmax): `l02-05`;
 * - Diameters: `d{direction}-{p|m}{step}`, direction 0…D−1, `p` for the half at the direction's angle and `m` for
 *   the opposite half, step 1… counted from the centre: `d01-m03`.
 * Indices have at least two digits (a fixed width, so ids do not change with the layout's size).
 */
export function stimulusId(position: LayoutPosition): string {
  switch (position.kind) {
    case 'centre':
      return 'c';
    case 'ring':
      return `r${pad(position.ring)}-s${pad(position.spoke)}`;
    case 'lattice':
      return `l${pad(position.row)}-${pad(position.column)}`;
    case 'diameter':
      return `d${pad(position.direction)}-${position.step < 0 ? 'm' : 'p'}${pad(Math.abs(position.step))}`;
  }
}
