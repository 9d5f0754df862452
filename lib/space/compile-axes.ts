import type { ComplexTerm, EllipticTerm, RadialTerm, ShapeDescriptor } from '../shape/types';
import { AXIS_FIELDS } from './axis-fields';
import { SpaceError } from './space-error';
import type { AxisMap, SpaceAxis } from './types';


function harmonicOf(term: RadialTerm | EllipticTerm | ComplexTerm): number {
  return 'n' in term ? term.n : term.k;
}

function zeroTerm(family: ShapeDescriptor['family'], harmonic: number): RadialTerm | EllipticTerm | ComplexTerm {
  if (family === 'radial') return { k: harmonic, amplitude: 0, phase: 0 };
  if (family === 'elliptic') return { n: harmonic, a: 0, b: 0, c: 0, d: 0 };
  return { k: harmonic, re: 0, im: 0 };
}

/**
 * Prepares the map (a, b) ↦ seed + a·axisA + b·axisB once, so each stimulus costs one pass over the terms.
 * Every change adds `delta` per unit of its axis coordinate to one entry (several changes to one entry add up);
 * a harmonic the seed lacks is appended, all zero, before the changes (in the order first named, after the
 * seed's own terms, which keep their order). Radial `baseRadius` changes ignore `harmonic`. The seed is not
 * mutated; each call returns a fresh descriptor.
 * Raises `SpaceError` (`invalid-definition`) for a field that does not belong to the seed's family; harmonic
 * ranges are the engine's to judge (`validateDescriptor`).
 */
export function compileAxes(seed: ShapeDescriptor, axes: readonly [SpaceAxis, SpaceAxis]): AxisMap {
  const family = seed.family;
  const fields = AXIS_FIELDS[family];
  const width = fields.length;
  // Phase 1: the term list, with the harmonics the axes name but the seed lacks.
  const terms: (RadialTerm | EllipticTerm | ComplexTerm)[] = [...seed.terms];
  const indexOf = new Map<number, number>();
  terms.forEach((t, i) => indexOf.set(harmonicOf(t), i));
  for (const axis of axes) {
    for (const change of axis.changes) {
      if (change.field === 'baseRadius' && family === 'radial') continue;
      if (!fields.includes(change.field)) {
        throw new SpaceError('invalid-definition', `field ${change.field} of axis "${axis.label}" does not apply to ${family} harmonics (use ${[...fields, ...(family === 'radial' ? ['baseRadius'] : [])].join(', ')})`);
      }
      if (!indexOf.has(change.harmonic)) {
        indexOf.set(change.harmonic, terms.length);
        terms.push(zeroTerm(family, change.harmonic));
      }
    }
  }
  // Phase 2: per-axis delta vectors over (term, field), plus the base radius.
  const base = new Float64Array(terms.length * width);
  terms.forEach((t, i) => fields.forEach((f, j) => (base[i * width + j] = (t as unknown as Record<string, number>)[f] ?? 0)));
  const deltas = axes.map((axis) => {
    const vector = new Float64Array(terms.length * width);
    let radius = 0;
    for (const change of axis.changes) {
      if (change.field === 'baseRadius') {
        radius += change.delta;
        continue;
      }
      const slot = (indexOf.get(change.harmonic) as number) * width + fields.indexOf(change.field);
      vector[slot] = (vector[slot] as number) + change.delta;
    }
    return { vector, radius };
  });
  const [da, db] = deltas as [(typeof deltas)[0], (typeof deltas)[0]];
  const entry = (slot: number, a: number, b: number): number => (base[slot] as number) + a * (da.vector[slot] as number) + b * (db.vector[slot] as number);
  const harmonics = terms.map(harmonicOf);
  // Phase 3: the map.
  switch (seed.family) {
    case 'radial': {
      const r0 = seed.baseRadius;
      return (a, b) => ({
        family: 'radial',
        baseRadius: r0 + a * da.radius + b * db.radius,
        terms: harmonics.map((k, i) => ({ k, amplitude: entry(2 * i, a, b), phase: entry(2 * i + 1, a, b) })),
      });
    }
    case 'elliptic': {
      const center = seed.center;
      return (a, b) => ({
        family: 'elliptic',
        center,
        terms: harmonics.map((n, i) => ({ n, a: entry(4 * i, a, b), b: entry(4 * i + 1, a, b), c: entry(4 * i + 2, a, b), d: entry(4 * i + 3, a, b) })),
      });
    }
    case 'complex':
      return (a, b) => ({
        family: 'complex',
        terms: harmonics.map((k, i) => ({ k, re: entry(2 * i, a, b), im: entry(2 * i + 1, a, b) })),
      });
  }
}
