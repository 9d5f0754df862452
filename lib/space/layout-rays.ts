import { SpaceError } from './space-error';
import { stimulusId } from './stimulus-id';
import { wrapAngle } from './wrap-angle';
import type { LayoutLine, LayoutPosition, LayoutRay, SpaceLayout, Stimulus } from './types';

/** The eight compass directions of a lattice as (row, column) steps; row 0 is the top, so north is −1 row. */
const COMPASS: readonly { label: string; row: number; column: number }[] = [
  { label: 'E', row: 0, column: 1 },
  { label: 'NE', row: -1, column: 1 },
  { label: 'N', row: -1, column: 0 },
  { label: 'NW', row: -1, column: -1 },
  { label: 'W', row: 0, column: -1 },
  { label: 'SW', row: 1, column: -1 },
  { label: 'S', row: 1, column: 0 },
  { label: 'SE', row: 1, column: 1 },
];

function degrees(angle: number): string {
  return `${((angle * 180) / Math.PI).toFixed(1).replace(/\.0$/, '')}°`;
}

function ringsGeometry(rings: number, spokes: number, find: (p: LayoutPosition) => number): { rays: LayoutRay[]; lines: LayoutLine[] } {
  const centre = find({ kind: 'centre' });
  const rays: LayoutRay[] = [];
  const lines: LayoutLine[] = [];
  for (let spoke = 0; spoke < spokes; spoke++) {
    const angle = wrapAngle((2 * Math.PI * spoke) / spokes);
    const members = Array.from({ length: rings }, (_, i) => find({ kind: 'ring', ring: i + 1, spoke }));
    const label = `spoke ${spoke} (${degrees(angle)})`;
    rays.push({ label, angle, centre, members });
    lines.push({ label, members: [centre, ...members] });
  }
  return { rays, lines };
}

function diametersGeometry(directions: number, steps: number, find: (p: LayoutPosition) => number): { rays: LayoutRay[]; lines: LayoutLine[] } {
  const centre = find({ kind: 'centre' });
  const half = (steps - 1) / 2;
  const rays: LayoutRay[] = [];
  const lines: LayoutLine[] = [];
  for (let direction = 0; direction < directions; direction++) {
    const angle = wrapAngle((Math.PI * direction) / directions);
    const side = (sign: 1 | -1) => Array.from({ length: half }, (_, i) => find({ kind: 'diameter', direction, step: sign * (i + 1) }));
    const plus = side(1);
    const minus = side(-1);
    rays.push({ label: `direction ${direction}, + side (${degrees(angle)})`, angle, centre, members: plus });
    rays.push({ label: `direction ${direction}, − side (${degrees(wrapAngle(angle + Math.PI))})`, angle: wrapAngle(angle + Math.PI), centre, members: minus });
    lines.push({ label: `direction ${direction} (${degrees(angle)})`, members: [...[...minus].reverse(), centre, ...plus] });
  }
  return { rays, lines };
}

function latticeGeometry(size: number, find: (p: LayoutPosition) => number): { rays: LayoutRay[]; lines: LayoutLine[] } {
  const at = (row: number, column: number) => find({ kind: 'lattice', row, column });
  const rays: LayoutRay[] = [];
  const lines: LayoutLine[] = [];
  if (size % 2 === 1) {
    // Odd n: the middle point is the centre; eight compass rays and the four lines through it.
    const h = (size - 1) / 2;
    const centre = at(h, h);
    if (h === 0) return { rays, lines };
    for (const [index, { label, row, column }] of COMPASS.entries()) {
      const members = Array.from({ length: h }, (_, i) => at(h + (i + 1) * row, h + (i + 1) * column));
      rays.push({ label, angle: (index * Math.PI) / 4, centre, members });
    }
    for (const [index, { label, row, column }] of COMPASS.slice(0, 4).entries()) {
      // From the opposite end (W, SW, S, SE) through the centre to this one.
      const members = Array.from({ length: size }, (_, i) => at(h + (i - h) * row, h + (i - h) * column));
      lines.push({ label: `${COMPASS[index + 4]?.label}–${label} line`, members });
    }
    return { rays, lines };
  }
  // Even n: no lattice point at the centre and none on the axes; the four diagonal rays start from the centre
  // shape (the descriptor at (0, 0), not a stimulus), and the two full diagonals are the lines.
  const m = size / 2;
  for (const [index, { label, row, column }] of COMPASS.entries()) {
    if (row === 0 || column === 0) continue;
    const members = Array.from({ length: m }, (_, i) => at(row < 0 ? m - 1 - i : m + i, column < 0 ? m - 1 - i : m + i));
    rays.push({ label, angle: (index * Math.PI) / 4, centre: null, members });
  }
  lines.push({ label: 'SW–NE diagonal', members: Array.from({ length: size }, (_, i) => at(size - 1 - i, i)) });
  lines.push({ label: 'SE–NW diagonal', members: Array.from({ length: size }, (_, i) => at(size - 1 - i, size - 1 - i)) });
  return { rays, lines };
}

/**
 * The directions the audit and equalisation follow through a layout, as indices into `stimuli` (the output
 * of `generateSpace` for this layout):
 * - rays from the centre, ordered outward: Rings — one per spoke; Diameters — two per diameter (the + and −
 *   halves); Lattice — the eight compass directions E, NE, N, … SE through the middle point for odd n, and the
 *   four diagonal directions for even n, where no lattice point lies on the axes (their centre is `null`: the
 *   descriptor at (0, 0), which is not a stimulus);
 * - lines of evenly spaced stimuli for spacing uniformity: each spoke with the centre; each whole diameter;
 *   the middle row, middle column and both diagonals of an odd lattice; both diagonals of an even one.
 * A 1 × 1 lattice has neither.
 */
export function layoutRays(layout: SpaceLayout, stimuli: readonly Pick<Stimulus, 'id'>[]): { rays: LayoutRay[]; lines: LayoutLine[] } {
  const indexById = new Map(stimuli.map((s, i) => [s.id, i]));
  const find = (position: LayoutPosition): number => {
    const index = indexById.get(stimulusId(position));
    if (index === undefined) throw new SpaceError('invalid-argument', `layout position ${stimulusId(position)} is missing: pass the stimuli generateSpace made for this layout`);
    return index;
  };
  if (stimuli.length === 0) return { rays: [], lines: [] };
  switch (layout.kind) {
    case 'rings':
      return ringsGeometry(layout.rings, layout.spokes, find);
    case 'diameters':
      return diametersGeometry(layout.directions, layout.steps, find);
    case 'lattice':
      return latticeGeometry(layout.size, find);
  }
}
