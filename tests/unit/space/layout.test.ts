import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { cartesianToPolar, countStimuli, generateSpace, polarToCartesian, stimulusId, type SpaceLayout } from '@/lib/space';
import { PROPERTY_SEED, amplitudeAxis, ellipticSpace, radialSpace } from './support';

const RINGS: SpaceLayout = { kind: 'rings', rings: 5, spokes: 16 };
const LATTICE: SpaceLayout = { kind: 'lattice', size: 7 };
const DIAMETERS: SpaceLayout = { kind: 'diameters', directions: 4, steps: 7 };

describe('layouts and ids', () => {
  it('Rings: R × S + the centre, ids c and r{ring}-s{spoke}', () => {
    const { stimuli } = generateSpace(radialSpace(RINGS));
    expect(stimuli).toHaveLength(81);
    expect(stimuli.map((s) => s.id).slice(0, 3)).toEqual(['c', 'r01-s00', 'r01-s01']);
    expect(stimuli.find((s) => s.id === 'r03-s07')?.layoutPosition).toEqual({ kind: 'ring', ring: 3, spoke: 7 });
    expect(new Set(stimuli.map((s) => s.id)).size).toBe(81);
  });

  it('Rings: ring i at ρ = ρmax·i/R, spoke s at 2πs/S, position = polarToCartesian(polar)', () => {
    const { stimuli } = generateSpace(radialSpace(RINGS, { extent: 0.8 }));
    for (const s of stimuli) {
      if (s.layoutPosition.kind !== 'ring') continue;
      expect(s.polar.rho).toBeCloseTo((0.8 * s.layoutPosition.ring) / 5, 14);
      expect(s.polar.angle).toBeCloseTo((2 * Math.PI * s.layoutPosition.spoke) / 16, 14);
      const back = polarToCartesian(s.polar);
      expect(s.position.a).toBeCloseTo(back.a, 14);
      expect(s.position.b).toBeCloseTo(back.b, 14);
    }
  });

  it('Lattice: n × n over [−ρmax, ρmax]², row 0 at the top, column 0 at the left, ids l{row}-{column}', () => {
    const { stimuli } = generateSpace(radialSpace(LATTICE, { extent: 0.6 }));
    expect(stimuli).toHaveLength(49);
    const byId = new Map(stimuli.map((s) => [s.id, s]));
    expect(byId.get('l00-00')?.position).toEqual({ a: -0.6, b: 0.6 });
    expect(byId.get('l06-06')?.position).toEqual({ a: 0.6, b: -0.6 });
    expect(byId.get('l03-03')?.position).toEqual({ a: 0, b: 0 });
    expect(byId.get('l02-05')?.layoutPosition).toEqual({ kind: 'lattice', row: 2, column: 5 });
    expect(byId.get('l02-05')?.position.a).toBeCloseTo(0.4, 14);
    expect(byId.get('l02-05')?.position.b).toBeCloseTo(0.2, 14);
    // Mirror-image lattice points are exact negatives.
    for (const s of stimuli) {
      if (s.layoutPosition.kind !== 'lattice') continue;
      const mirror = byId.get(stimulusId({ kind: 'lattice', row: 6 - s.layoutPosition.row, column: 6 - s.layoutPosition.column }));
      expect((mirror?.position.a ?? NaN) + s.position.a).toBe(0);
      expect((mirror?.position.b ?? NaN) + s.position.b).toBe(0);
    }
  });

  it('Diameters pass through the centre: every point of a diameter lies on its line, halves mirror, the centre is shared once', () => {
    const { stimuli } = generateSpace(radialSpace(DIAMETERS, { extent: 0.9 }));
    // D·(m − 1) + 1 = 4·6 + 1.
    expect(stimuli).toHaveLength(25);
    expect(stimuli.filter((s) => s.layoutPosition.kind === 'centre')).toHaveLength(1);
    const byId = new Map(stimuli.map((s) => [s.id, s]));
    for (let direction = 0; direction < 4; direction++) {
      const angle = (Math.PI * direction) / 4;
      const [ux, uy] = [Math.cos(angle), Math.sin(angle)];
      for (let step = 1; step <= 3; step++) {
        const plus = byId.get(stimulusId({ kind: 'diameter', direction, step }));
        const minus = byId.get(stimulusId({ kind: 'diameter', direction, step: -step }));
        expect(plus && minus).toBeTruthy();
        for (const p of [plus!, minus!]) {
          // Collinear with the centre: the cross product with the direction vanishes.
          expect(Math.abs(p.position.a * uy - p.position.b * ux)).toBeLessThan(1e-15);
          expect(p.polar.rho).toBeCloseTo((0.9 * step) / 3, 14);
        }
        expect(minus!.position.a).toBeCloseTo(-plus!.position.a, 15);
        expect(minus!.position.b).toBeCloseTo(-plus!.position.b, 15);
        // The signed coordinate along the line is evenly spaced from −ρmax to ρmax.
        expect(plus!.position.a * ux + plus!.position.b * uy).toBeCloseTo((0.9 * step) / 3, 14);
      }
    }
    expect(byId.get('d01-m03')?.layoutPosition).toEqual({ kind: 'diameter', direction: 1, step: -3 });
    expect(byId.get('d01-m03')?.polar.angle).toBeCloseTo(Math.PI / 4 + Math.PI, 14);
  });

  it('countStimuli agrees with what generateSpace makes, for every layout', () => {
    const layout = fc.oneof(
      fc.record({ kind: fc.constant('rings' as const), rings: fc.integer({ min: 1, max: 6 }), spokes: fc.integer({ min: 1, max: 12 }) }),
      fc.record({ kind: fc.constant('lattice' as const), size: fc.integer({ min: 1, max: 9 }) }),
      fc.record({ kind: fc.constant('diameters' as const), directions: fc.integer({ min: 1, max: 6 }), steps: fc.integer({ min: 1, max: 5 }).map((h) => 2 * h + 1) }),
    );
    fc.assert(
      fc.property(layout, (l) => {
        const { stimuli } = generateSpace(radialSpace(l, { extent: 0.5 }));
        expect(stimuli).toHaveLength(countStimuli(l));
        expect(new Set(stimuli.map((s) => s.id)).size).toBe(stimuli.length);
        for (const s of stimuli) expect(stimulusId(s.layoutPosition)).toBe(s.id);
      }),
      { seed: PROPERTY_SEED, numRuns: 60 },
    );
  });
});

describe('ids and coordinates stay stable', () => {
  const ids = (d: Parameters<typeof generateSpace>[0]) => generateSpace(d).stimuli.map((s) => s.id);

  it('re-generating gives the same stimuli, bit for bit', () => {
    for (const layout of [RINGS, LATTICE, DIAMETERS]) {
      expect(generateSpace(radialSpace(layout))).toEqual(generateSpace(radialSpace(layout)));
      expect(generateSpace(ellipticSpace(layout))).toEqual(generateSpace(ellipticSpace(layout)));
    }
  });

  it('a change of extent keeps every id and scales every position', () => {
    for (const layout of [RINGS, LATTICE, DIAMETERS]) {
      const small = generateSpace(radialSpace(layout, { extent: 0.5 })).stimuli;
      const large = generateSpace(radialSpace(layout, { extent: 1.5 })).stimuli;
      expect(large.map((s) => s.id)).toEqual(small.map((s) => s.id));
      small.forEach((s, i) => {
        expect(large[i]?.position.a).toBeCloseTo(3 * s.position.a, 13);
        expect(large[i]?.position.b).toBeCloseTo(3 * s.position.b, 13);
        expect(large[i]?.polar.angle).toBeCloseTo(s.polar.angle, 13);
      });
    }
  });

  it('a change of axes, seed or normalisation keeps ids and designed coordinates; the shapes change', () => {
    for (const layout of [RINGS, LATTICE, DIAMETERS]) {
      const before = generateSpace(radialSpace(layout)).stimuli;
      const after = generateSpace(
        radialSpace(layout, { axes: [amplitudeAxis(5, 0.05), amplitudeAxis(6, 0.02)], normalization: { scale: 'area', centroid: false } }),
      ).stimuli;
      const elliptic = generateSpace(ellipticSpace(layout)).stimuli;
      expect(ids(radialSpace(layout))).toEqual(after.map((s) => s.id));
      expect(elliptic.map((s) => s.id)).toEqual(before.map((s) => s.id));
      expect(after.map((s) => s.position)).toEqual(before.map((s) => s.position));
      expect(after.map((s) => s.polar)).toEqual(before.map((s) => s.polar));
      expect(after[1]?.descriptor).not.toEqual(before[1]?.descriptor);
    }
  });

  it('more rings keep the ids of the rings already there', () => {
    const five = ids(radialSpace(RINGS));
    const seven = ids(radialSpace({ kind: 'rings', rings: 7, spokes: 16 }));
    expect(seven.slice(0, five.length)).toEqual(five);
  });
});

describe('polar ↔ Cartesian', () => {
  it('follows the documented convention: angle counter-clockwise from +a towards +b, in [0, 2π)', () => {
    expect(cartesianToPolar({ a: 1, b: 0 })).toEqual({ rho: 1, angle: 0 });
    expect(cartesianToPolar({ a: 0, b: 2 })).toEqual({ rho: 2, angle: Math.PI / 2 });
    expect(cartesianToPolar({ a: -3, b: 0 })).toEqual({ rho: 3, angle: Math.PI });
    expect(cartesianToPolar({ a: 0, b: -1 }).angle).toBeCloseTo((3 * Math.PI) / 2, 15);
    expect(cartesianToPolar({ a: 0, b: 0 })).toEqual({ rho: 0, angle: 0 });
    const p = polarToCartesian({ rho: 2, angle: Math.PI / 6 });
    expect(p.a).toBeCloseTo(Math.sqrt(3), 15);
    expect(p.b).toBeCloseTo(1, 15);
    // A negative ρ points the opposite way (a diameter's far half).
    expect(polarToCartesian({ rho: -1, angle: 0 }).a).toBe(-1);
  });

  it('round-trips: Cartesian → polar → Cartesian and polar → Cartesian → polar', () => {
    const coordinate = fc.double({ min: -1e3, max: 1e3, noNaN: true });
    fc.assert(
      fc.property(coordinate, coordinate, (a, b) => {
        const polar = cartesianToPolar({ a, b });
        expect(polar.rho).toBeGreaterThanOrEqual(0);
        expect(polar.angle).toBeGreaterThanOrEqual(0);
        expect(polar.angle).toBeLessThan(2 * Math.PI);
        const back = polarToCartesian(polar);
        expect(Math.abs(back.a - a)).toBeLessThanOrEqual(1e-12 * Math.max(1, polar.rho));
        expect(Math.abs(back.b - b)).toBeLessThanOrEqual(1e-12 * Math.max(1, polar.rho));
      }),
      { seed: PROPERTY_SEED, numRuns: 500 },
    );
    fc.assert(
      fc.property(fc.double({ min: 1e-6, max: 1e3, noNaN: true }), fc.double({ min: 0, max: 2 * Math.PI, maxExcluded: true, noNaN: true }), (rho, angle) => {
        const polar = cartesianToPolar(polarToCartesian({ rho, angle }));
        expect(polar.rho).toBeCloseTo(rho, 9);
        // Angles compare on the circle (2π − ε and 0 are neighbours).
        const difference = Math.abs(polar.angle - angle);
        expect(Math.min(difference, 2 * Math.PI - difference)).toBeLessThan(1e-9);
      }),
      { seed: PROPERTY_SEED, numRuns: 500 },
    );
  });
});
