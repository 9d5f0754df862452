import { cartesianToPolar } from './cartesian-to-polar';
import { countStimuli } from './count-stimuli';
import { wrapAngle } from './wrap-angle';
import type { LayoutPoint, LayoutPosition, SpaceLayout } from './types';

const CENTRE: LayoutPoint = { layoutPosition: { kind: 'centre' }, position: { a: 0, b: 0 }, polar: { rho: 0, angle: 0 } };

/** A point at signed distance `signedRho` along the line at `angle` (the polar angle is exact, not re-derived). */
function pointOnLine(layoutPosition: LayoutPosition, signedRho: number, angle: number): LayoutPoint {
  const polarAngle = signedRho < 0 ? wrapAngle(angle + Math.PI) : wrapAngle(angle);
  const rho = Math.abs(signedRho);
  return { layoutPosition, position: { a: rho * Math.cos(polarAngle), b: rho * Math.sin(polarAngle) }, polar: { rho, angle: polarAngle } };
}

function ringsPoints(rings: number, spokes: number, extent: number): LayoutPoint[] {
  const points: LayoutPoint[] = [CENTRE];
  for (let ring = 1; ring <= rings; ring++) {
    const rho = (extent * ring) / rings;
    for (let spoke = 0; spoke < spokes; spoke++) {
      points.push(pointOnLine({ kind: 'ring', ring, spoke }, rho, (2 * Math.PI * spoke) / spokes));
    }
  }
  return points;
}

/** Lattice coordinate of index i of n over [−ρmax, ρmax], written so that index i and n − 1 − i are exact negatives. */
function latticeCoordinate(index: number, size: number, extent: number): number {
  return size === 1 ? 0 : (extent * (2 * index - (size - 1))) / (size - 1);
}

function latticePoints(size: number, extent: number): LayoutPoint[] {
  const points: LayoutPoint[] = [];
  for (let row = 0; row < size; row++) {
    for (let column = 0; column < size; column++) {
      // Row i sits at the coordinate of index n − 1 − i: b falls from +ρmax at the top (and the centre is +0, not −0).
      const position = { a: latticeCoordinate(column, size, extent), b: latticeCoordinate(size - 1 - row, size, extent) };
      points.push({ layoutPosition: { kind: 'lattice', row, column }, position, polar: cartesianToPolar(position) });
    }
  }
  return points;
}

function diametersPoints(directions: number, steps: number, extent: number): LayoutPoint[] {
  const half = (steps - 1) / 2;
  const points: LayoutPoint[] = [CENTRE];
  for (let direction = 0; direction < directions; direction++) {
    const angle = (Math.PI * direction) / directions;
    for (let step = -half; step <= half; step++) {
      if (step !== 0) points.push(pointOnLine({ kind: 'diameter', direction, step }, (extent * step) / half, angle));
    }
  }
  return points;
}

/**
 * Stage of `generateSpace`: the layout's points in order, with designed (a, b) and polar coordinates.
 * - Rings: the centre, then ring 1 spokes 0…S−1, ring 2, …; ring i at ρ = ρmax·i/R, spoke s at 2πs/S.
 * - Lattice: row-major from the top-left; column j at a = ρmax(2j − (n − 1))/(n − 1), row i at
 *   b = −ρmax(2i − (n − 1))/(n − 1); a 1 × 1 lattice is the centre alone.
 * - Diameters: the centre, then direction 0 steps −h…−1, 1…h, direction 1, …; h = (m − 1)/2, direction d at
 *   angle πd/D, step j at signed distance ρmax·j/h (j < 0 lies at angle πd/D + π).
 * Polar angles of ring and diameter points are the layout's exact angles, not atan2 of rounded coordinates.
 * Assumes a layout `checkSpace` accepts.
 */
export function layoutPoints(layout: SpaceLayout, extent: number): LayoutPoint[] {
  if (countStimuli(layout) === 0) return [];
  switch (layout.kind) {
    case 'rings':
      return ringsPoints(layout.rings, layout.spokes, extent);
    case 'lattice':
      return latticePoints(layout.size, extent);
    case 'diameters':
      return diametersPoints(layout.directions, layout.steps, extent);
  }
}
