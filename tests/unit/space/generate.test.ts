import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  contourArea,
  contourCentroid,
  descriptorArea,
  descriptorMoments,
  normalizeComplexHarmonics,
  normalizeEllipticHarmonics,
  normalizeRadialHarmonics,
  toComplexHarmonics,
  type ComplexDescriptor,
  type EllipticDescriptor,
  type RadialDescriptor,
} from '@/lib/shape';
import {
  compileAxes,
  descriptorCentroid,
  equalizationMap,
  generateSpace,
  normalizeStimulus,
  stimulusContour,
  stimulusMetrics,
  type SpaceDefinition,
  type Stimulus,
} from '@/lib/space';
import { ellipticArbitrary, smoothRadialArbitrary } from '../shape/support';
import { BEAN, COMMA, PROPERTY_SEED, TREFOIL, amplitudeAxis, deepFreeze, ellipticSpace, radialSpace } from './support';

const RINGS = { kind: 'rings', rings: 3, spokes: 8 } as const;
const RAW = { scale: 'none', centroid: false } as const;

describe('stimulus descriptors: seed + a·axisA + b·axisB', () => {
  it('adds each change per unit of axis coordinate, adding a missing harmonic as zero first', () => {
    const at = compileAxes(TREFOIL, [amplitudeAxis(2, 0.1), { label: 'mixed', changes: [{ harmonic: 3, field: 'phase', delta: 0.5 }, { harmonic: 0, field: 'baseRadius', delta: 0.2 }] }]);
    const d = at(0.5, -2) as RadialDescriptor;
    expect(d.baseRadius).toBeCloseTo(1 - 0.4, 15);
    expect(d.terms).toEqual([
      { k: 3, amplitude: 0.1, phase: -1 },
      { k: 2, amplitude: 0.05, phase: 0 },
    ]);
    expect(at(0, 0)).toEqual({ ...TREFOIL, terms: [...TREFOIL.terms, { k: 2, amplitude: 0, phase: 0 }] });
  });

  it('sums several changes to one entry, for elliptic and complex seeds too', () => {
    const elliptic = compileAxes(BEAN, [
      { label: 'A', changes: [{ harmonic: 2, field: 'c', delta: 0.1 }, { harmonic: 2, field: 'c', delta: 0.05 }] },
      { label: 'B', changes: [{ harmonic: 4, field: 'b', delta: 0.01 }] },
    ])(1, 2) as EllipticDescriptor;
    expect(elliptic.terms.find((t) => t.n === 2)?.c).toBeCloseTo(0.22 + 0.15, 15);
    expect(elliptic.terms.find((t) => t.n === 4)).toEqual({ n: 4, a: 0, b: 0.02, c: 0, d: 0 });
    expect(elliptic.center).toEqual(BEAN.family === 'elliptic' ? BEAN.center : null);
    const complex = compileAxes(COMMA, [
      { label: 'A', changes: [{ harmonic: -3, field: 'im', delta: 0.02 }] },
      { label: 'B', changes: [{ harmonic: 2, field: 're', delta: -0.1 }] },
    ])(0.5, 0.5) as ComplexDescriptor;
    expect(complex.terms.find((t) => t.k === -3)).toEqual({ k: -3, re: 0, im: 0.01 });
    expect(complex.terms.find((t) => t.k === 2)?.re).toBeCloseTo(0.05, 15);
  });

  it('generates exactly seed + a·A + b·B at each designed position when nothing is normalised', () => {
    const { stimuli } = generateSpace(radialSpace(RINGS, { normalization: RAW }));
    for (const s of stimuli) {
      const d = s.descriptor as RadialDescriptor;
      expect(d.baseRadius).toBe(1);
      expect(d.terms.find((t) => t.k === 2)?.amplitude).toBeCloseTo(0.1 * s.position.a, 15);
      expect(d.terms.find((t) => t.k === 4)?.amplitude).toBeCloseTo(0.03 * s.position.b, 15);
      expect(d.terms.find((t) => t.k === 3)).toEqual({ k: 3, amplitude: 0.1, phase: 0 });
    }
  });

  it('never mutates the definition', () => {
    for (const definition of [radialSpace(RINGS), ellipticSpace({ kind: 'lattice', size: 3 }), { ...radialSpace(RINGS), equalization: { directions: [{ angle: 0, knots: [[1, 0.5]] }] } } as SpaceDefinition]) {
      const copy = structuredClone(definition);
      deepFreeze(definition);
      generateSpace(definition);
      expect(definition).toEqual(copy);
    }
  });
});

describe('normalisation: scale and centroid through lib/shape, never rotation', () => {
  const contourOf = (s: Stimulus) => stimulusContour(s, 512);

  it('equal-area radius makes every area π; area makes it 1 (exact area from the coefficients)', () => {
    for (const [scale, area] of [['equal-area-radius', Math.PI], ['area', 1]] as const) {
      for (const definition of [radialSpace(RINGS), ellipticSpace(RINGS)]) {
        for (const s of generateSpace({ ...definition, normalization: { scale, centroid: true } }).stimuli) {
          expect(Math.abs(descriptorArea(s.descriptor))).toBeCloseTo(area, 12);
          expect(stimulusMetrics(s).area).toBeCloseTo(area, 12);
        }
      }
    }
  });

  it('centroid normalisation puts every area centroid at the origin (radial ones through contourOffset)', () => {
    // A k = 1 term makes radial shapes lopsided: the area centroid leaves the polar origin.
    const lopsided = radialSpace(RINGS, { axes: [amplitudeAxis(1, 0.1), amplitudeAxis(2, 0.1)] });
    for (const definition of [lopsided, ellipticSpace(RINGS), ellipticSpace(RINGS, { seed: COMMA, axes: [{ label: 'A', changes: [{ harmonic: 2, field: 're', delta: 0.05 }] }, { label: 'B', changes: [{ harmonic: -2, field: 'im', delta: 0.05 }] }] })]) {
      const { stimuli } = generateSpace(definition);
      for (const s of stimuli) {
        const [cx, cy] = contourCentroid(contourOf(s));
        // The 512-gon's centroid differs from the curve's by O(1/N²).
        expect(Math.hypot(cx, cy)).toBeLessThan(1e-4);
      }
      expect(stimuli.some((s) => s.contourOffset[0] !== 0) || definition.seed.family !== 'radial').toBe(true);
    }
  });

  it('without centroid normalisation the shape is scaled about the frame origin', () => {
    const definition = radialSpace(RINGS, { axes: [amplitudeAxis(1, 0.1), amplitudeAxis(2, 0.1)] });
    const raw = generateSpace({ ...definition, normalization: RAW }).stimuli;
    const scaled = generateSpace({ ...definition, normalization: { scale: 'area', centroid: false } }).stimuli;
    raw.forEach((s, i) => {
      const factor = 1 / Math.sqrt(Math.abs(descriptorArea(s.descriptor)));
      const [rx, ry] = descriptorMoments(s.descriptor).centroid;
      const [sx, sy] = contourCentroid(contourOf(scaled[i] as Stimulus));
      expect(sx).toBeCloseTo(factor * rx, 5);
      expect(sy).toBeCloseTo(factor * ry, 5);
    });
  });

  it('keeps phases as generated: no rotation, so the space stays aligned with its axes', () => {
    const definition = radialSpace(RINGS, { axes: [{ label: 'phase', changes: [{ harmonic: 3, field: 'phase', delta: 0.7 }] }, amplitudeAxis(2, 0.1)] });
    for (const s of generateSpace(definition).stimuli) {
      expect((s.descriptor as RadialDescriptor).terms.find((t) => t.k === 3)?.phase).toBeCloseTo(0.7 * s.position.a, 14);
    }
  });

  it('agrees with lib/shape’s normalisers (orientation none) on the same shapes', () => {
    const scales = fc.constantFrom('equal-area-radius', 'area', 'max-radius', 'perimeter') as fc.Arbitrary<'equal-area-radius' | 'area' | 'max-radius' | 'perimeter'>;
    fc.assert(
      fc.property(smoothRadialArbitrary, scales, (d, scale) => {
        const ours = normalizeStimulus(d, { scale, centroid: false }).descriptor as RadialDescriptor;
        expect(ours.baseRadius).toBeCloseTo(normalizeRadialHarmonics(d, { scale, orientation: 'none' }).baseRadius, 9);
      }),
      { seed: PROPERTY_SEED, numRuns: 60 },
    );
    fc.assert(
      fc.property(ellipticArbitrary, scales, (d, scale) => {
        const ours = normalizeStimulus(d, { scale, centroid: true }).descriptor as EllipticDescriptor;
        const theirs = normalizeEllipticHarmonics(d, { scale, orientation: 'none' });
        expect(ours.center[0]).toBeCloseTo(theirs.center[0], 9);
        expect(ours.center[1]).toBeCloseTo(theirs.center[1], 9);
        for (const t of theirs.terms) {
          const mine = ours.terms.find((u) => u.n === t.n) ?? { a: 0, b: 0, c: 0, d: 0 };
          for (const f of ['a', 'b', 'c', 'd'] as const) expect(mine[f]).toBeCloseTo(t[f], 9);
        }
        const complex = toComplexHarmonics(d);
        const oursComplex = normalizeStimulus(complex, { scale, centroid: true }).descriptor as ComplexDescriptor;
        const theirsComplex = normalizeComplexHarmonics(complex, { scale, orientation: 'none' });
        for (const t of [...theirsComplex.terms, ...oursComplex.terms]) {
          const a = oursComplex.terms.find((u) => u.k === t.k) ?? { re: 0, im: 0 };
          const b = theirsComplex.terms.find((u) => u.k === t.k) ?? { re: 0, im: 0 };
          expect(a.re).toBeCloseTo(b.re, 9);
          expect(a.im).toBeCloseTo(b.im, 9);
        }
      }),
      { seed: PROPERTY_SEED, numRuns: 60 },
    );
  });

  it('the exact centroid equals lib/shape’s descriptorMoments centroid', () => {
    fc.assert(
      fc.property(fc.oneof(smoothRadialArbitrary, ellipticArbitrary), (d) => {
        const [x, y] = descriptorCentroid(d);
        const [mx, my] = descriptorMoments(d).centroid;
        expect(x).toBeCloseTo(mx, 11);
        expect(y).toBeCloseTo(my, 11);
      }),
      { seed: PROPERTY_SEED, numRuns: 100 },
    );
  });

  it('returns an invalid shape un-normalised instead of throwing (checkSpace reports it)', () => {
    const broken: RadialDescriptor = { family: 'radial', baseRadius: 1, terms: [{ k: 2, amplitude: 1.5, phase: 0 }] };
    expect(normalizeStimulus(broken, { scale: 'max-radius', centroid: true }).descriptor).toBeDefined();
  });
});

describe('metrics and contours', () => {
  it('a circle has area πr², perimeter 2πr and compactness 1', () => {
    const circle: Stimulus = { id: 'c', position: { a: 0, b: 0 }, polar: { rho: 0, angle: 0 }, layoutPosition: { kind: 'centre' }, descriptor: { family: 'radial', baseRadius: 2, terms: [] }, contourOffset: [0, 0] };
    const m = stimulusMetrics(circle);
    expect(m.area).toBeCloseTo(4 * Math.PI, 12);
    expect(m.perimeter).toBeCloseTo(4 * Math.PI, 10);
    expect(m.compactness).toBeCloseTo(1, 10);
  });

  it('radial-frequency area π r0²(1 + ½ΣA²) (Wilkinson, Wilson & Habak 1998; REFERENCES.md (0.1, 3) → 3.15730062)', () => {
    const { stimuli } = generateSpace({ ...radialSpace(RINGS), normalization: RAW });
    expect(stimulusMetrics(stimuli[0] as Stimulus).area).toBeCloseTo(3.15730062, 8);
    // The sampled contour agrees (shoelace on 4096 samples).
    expect(contourArea(stimulusContour(stimuli[0] as Stimulus, 4096))).toBeCloseTo(3.15730062, 5);
  });
});

describe('equalisation map', () => {
  it('is the identity without an equalisation, and piecewise linear through (0, 0) and the knots along a direction', () => {
    expect(equalizationMap(null)(0.7, 1)).toBe(0.7);
    const map = equalizationMap({ directions: [{ angle: 0, knots: [[0.5, 0.25], [1, 1]] }, { angle: Math.PI, knots: [[1, 0.5]] }] });
    expect(map(0.25, 0)).toBeCloseTo(0.125, 15);
    expect(map(0.75, 0)).toBeCloseTo(0.625, 15);
    // Past the last knot: the last segment continued.
    expect(map(1.5, 0)).toBeCloseTo(1.75, 15);
    expect(map(1, Math.PI)).toBeCloseTo(0.5, 15);
    // Half-way in angle between the two directions (both neighbours, cyclically): the mean of the two curves.
    expect(map(1, Math.PI / 2)).toBeCloseTo(0.75, 15);
    expect(map(1, (3 * Math.PI) / 2)).toBeCloseTo(0.75, 15);
  });

  it('stays monotone in ρ at every angle when every direction is', () => {
    const knots = fc.array(fc.tuple(fc.double({ min: 0.01, max: 1, noNaN: true }), fc.double({ min: 0.01, max: 1, noNaN: true })), { minLength: 1, maxLength: 5 }).map((pairs) => {
      const xs = [...new Set(pairs.map(([x]) => x))].sort((p, q) => p - q);
      const ys = pairs.map(([, y]) => y).sort((p, q) => p - q);
      return xs.map((x, i) => [x, ys[i] ?? 1] as [number, number]);
    });
    fc.assert(
      fc.property(fc.array(knots, { minLength: 1, maxLength: 4 }), fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }), (curves, angle) => {
        const map = equalizationMap({ directions: curves.map((k, i) => ({ angle: (2 * Math.PI * i) / curves.length, knots: k })) });
        let previous = -Infinity;
        for (let rho = 0; rho <= 1.2; rho += 0.01) {
          const value = map(rho, angle);
          expect(value).toBeGreaterThanOrEqual(previous - 1e-12);
          previous = value;
        }
      }),
      { seed: PROPERTY_SEED, numRuns: 100 },
    );
  });

  it('moves the descriptor, not the designed coordinates', () => {
    const definition = radialSpace(RINGS, { normalization: RAW, equalization: { directions: [{ angle: 0, knots: [[1, 0.5]] }] } });
    for (const s of generateSpace(definition).stimuli) {
      expect(s.position).toEqual(generateSpace({ ...definition, equalization: null }).stimuli.find((t) => t.id === s.id)?.position);
      expect((s.descriptor as RadialDescriptor).terms.find((t) => t.k === 2)?.amplitude).toBeCloseTo(0.05 * s.position.a, 15);
    }
  });
});
