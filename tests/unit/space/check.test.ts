import { describe, expect, it } from 'vitest';
import { validateDescriptor, ShapeError, type EllipticDescriptor } from '@/lib/shape';
import { SpaceError, checkSpace, generateSpace, type SpaceDefinition } from '@/lib/space';
import { BEAN, amplitudeAxis, ellipticSpace, radialSpace } from './support';

const RINGS = { kind: 'rings', rings: 5, spokes: 16 } as const;
const codes = (d: SpaceDefinition) => checkSpace(d).failures.map((f) => f.code);

describe('checkSpace: a good space passes', () => {
  it('passes the demo-sized Rings space (5 × 16 + centre) and counts its stimuli', () => {
    expect(checkSpace(radialSpace(RINGS))).toEqual({ ok: true, failures: [], count: 81 });
    expect(checkSpace(ellipticSpace({ kind: 'diameters', directions: 4, steps: 9 }))).toEqual({ ok: true, failures: [], count: 33 });
  });
});

describe('checkSpace: bad input, each with a reason', () => {
  it('0 stimuli', () => {
    for (const layout of [{ kind: 'lattice', size: 0 }, { kind: 'rings', rings: 0, spokes: 8 }, { kind: 'diameters', directions: 3, steps: 1 }] as const) {
      const check = checkSpace(radialSpace(layout));
      expect(check.ok).toBe(false);
      expect(check.count).toBe(0);
      expect(check.failures).toEqual([expect.objectContaining({ id: 'layout', code: 'no-stimuli' })]);
    }
  });

  it('more than 2,000 stimuli (and exactly 2,000 is allowed)', () => {
    const check = checkSpace(radialSpace({ kind: 'lattice', size: 45 }));
    expect(check.count).toBe(2025);
    expect(check.failures).toEqual([expect.objectContaining({ id: 'layout', code: 'too-many-stimuli', reason: expect.stringMatching(/2025 .*at most 2000/) })]);
    expect(() => generateSpace(radialSpace({ kind: 'lattice', size: 45 }))).toThrow(SpaceError);
    const atLimit = checkSpace(radialSpace({ kind: 'rings', rings: 1, spokes: 1999 }, { extent: 0.5 }));
    expect(atLimit.count).toBe(2000);
    expect(atLimit.failures.map((f) => f.code)).not.toContain('too-many-stimuli');
  });

  it('identical axes, parallel axes and zero axes', () => {
    expect(codes(radialSpace(RINGS, { axes: [amplitudeAxis(2, 0.1, 'A'), amplitudeAxis(2, 0.1, 'B')] }))).toEqual(['axes-identical']);
    expect(codes(radialSpace(RINGS, { axes: [amplitudeAxis(2, 0.1), amplitudeAxis(2, -0.05)] }))).toEqual(['axes-parallel']);
    const twoEntries = { label: 'two', changes: [{ harmonic: 2, field: 'amplitude' as const, delta: 0.1 }, { harmonic: 5, field: 'amplitude' as const, delta: 0.02 }] };
    const doubled = { label: 'double', changes: twoEntries.changes.map((c) => ({ ...c, delta: 2 * c.delta })) };
    expect(codes(radialSpace(RINGS, { axes: [twoEntries, doubled] }))).toEqual(['axes-parallel']);
    expect(codes(radialSpace(RINGS, { axes: [amplitudeAxis(2, 0), amplitudeAxis(4, 0.03)] }))).toEqual(['axis-zero']);
    // Changes that cancel are zero too.
    const cancelling = { label: 'none', changes: [{ harmonic: 2, field: 'amplitude' as const, delta: 0.1 }, { harmonic: 2, field: 'amplitude' as const, delta: -0.1 }] };
    expect(codes(radialSpace(RINGS, { axes: [amplitudeAxis(4, 0.03), cancelling] }))).toEqual(['axis-zero']);
    expect(codes(radialSpace(RINGS, { axes: [{ label: 'empty', changes: [] }, { label: 'empty too', changes: [] }] }))).toEqual(['axis-zero', 'axis-zero']);
    // A degenerate space can still be drawn while an axis is being edited.
    expect(generateSpace(radialSpace(RINGS, { axes: [amplitudeAxis(2, 0), amplitudeAxis(4, 0.03)] })).stimuli).toHaveLength(81);
  });

  it('a ρmax that makes stimuli invalid: r ≤ 0, listed by stimulus with the engine’s reason', () => {
    // Seed A3 = 0.1 and Axis A adds 0.5 to A2 per unit: with ρmax = 2 the outer rings reach Σ|A| > 1 and r < 0.
    const definition = radialSpace(RINGS, { axes: [amplitudeAxis(2, 0.5), amplitudeAxis(4, 0.03)], extent: 2 });
    const check = checkSpace(definition);
    expect(check.ok).toBe(false);
    expect(check.count).toBe(81);
    expect(check.failures.length).toBeGreaterThan(0);
    for (const f of check.failures) {
      expect(f.code).toBe('radius-not-positive');
      expect(f.reason).toMatch(/radius falls to -?\d/);
      expect(f.id).toMatch(/^r0[45]-s\d\d$/);
    }
    // Spoke 0 of the outer ring (a = 2, A2 = 1) fails; the centre and the first rings do not.
    expect(check.failures.map((f) => f.id)).toContain('r05-s00');
    expect(check.failures.map((f) => f.id)).not.toContain('c');
    // The reason is the engine's own message for that stimulus.
    const r5 = generateSpace(definition).stimuli.find((s) => s.id === 'r05-s00');
    expect(() => validateDescriptor(r5!.descriptor)).toThrow(check.failures.find((f) => f.id === 'r05-s00')!.reason);
    // A smaller ρmax fixes it.
    expect(checkSpace({ ...definition, extent: 1 }).ok).toBe(true);
  });

  it('a ρmax that makes elliptic stimuli cross themselves', () => {
    // A strong third harmonic on a thin ellipse folds the outline over itself.
    const thin: EllipticDescriptor = { family: 'elliptic', center: [0, 0], terms: [{ n: 1, a: 1, b: 0, c: 0, d: 0.3 }] };
    const definition = ellipticSpace({ kind: 'diameters', directions: 2, steps: 5 }, {
      seed: thin,
      axes: [{ label: 'a3', changes: [{ harmonic: 3, field: 'a', delta: 0.6 }] }, { label: 'd3', changes: [{ harmonic: 3, field: 'd', delta: 0.6 }] }],
    });
    const check = checkSpace(definition);
    expect(check.ok).toBe(false);
    expect(new Set(check.failures.map((f) => f.code))).toEqual(new Set(['self-intersecting']));
    expect(check.failures.every((f) => /crosses itself/.test(f.reason))).toBe(true);
    expect(checkSpace({ ...definition, extent: 0.05 }).ok).toBe(true);
  });

  it('fields the seed’s family lacks, harmonics out of range, non-finite changes', () => {
    const bad = (changes: SpaceDefinition['axes'][0]['changes']) => radialSpace(RINGS, { axes: [{ label: 'bad', changes }, amplitudeAxis(4, 0.03)] });
    expect(checkSpace(bad([{ harmonic: 2, field: 'a', delta: 0.1 }])).failures).toEqual([expect.objectContaining({ id: 'axes', code: 'axis-invalid', reason: expect.stringMatching(/radial harmonics do not have/) })]);
    expect(codes(bad([{ harmonic: 0, field: 'amplitude', delta: 0.1 }]))).toEqual(['axis-invalid']);
    expect(codes(bad([{ harmonic: 129, field: 'amplitude', delta: 0.1 }]))).toEqual(['axis-invalid']);
    expect(codes(bad([{ harmonic: 2.5, field: 'amplitude', delta: 0.1 }]))).toEqual(['axis-invalid']);
    expect(codes(bad([{ harmonic: 2, field: 'amplitude', delta: Number.NaN }]))).toEqual(['axis-invalid']);
    // baseRadius ignores the harmonic.
    expect(checkSpace(bad([{ harmonic: 999, field: 'baseRadius', delta: 0.1 }])).ok).toBe(true);
    expect(() => generateSpace(bad([{ harmonic: 2, field: 'a', delta: 0.1 }]))).toThrow(/radial harmonics do not have/);
    expect(codes(ellipticSpace(RINGS, { axes: [{ label: 'x', changes: [{ harmonic: 2, field: 'amplitude', delta: 0.1 }] }, { label: 'y', changes: [{ harmonic: 2, field: 'b', delta: 0.1 }] }] }))).toEqual(['axis-invalid']);
    expect(BEAN.family).toBe('elliptic');
  });

  it('a malformed extent, layout, normalisation or equalisation', () => {
    expect(codes(radialSpace(RINGS, { extent: 0 }))).toEqual(['extent-invalid']);
    expect(codes(radialSpace(RINGS, { extent: Number.POSITIVE_INFINITY }))).toEqual(['extent-invalid']);
    expect(codes(radialSpace({ kind: 'rings', rings: 2.5, spokes: 8 }))).toEqual(['layout-invalid']);
    expect(codes(radialSpace({ kind: 'diameters', directions: 3, steps: 6 }))).toEqual(['layout-invalid']);
    expect(codes(radialSpace(RINGS, { normalization: { scale: 'huge' as never, centroid: true } }))).toEqual(['normalization-invalid']);
    const knots = (k: [number, number][]) => radialSpace(RINGS, { equalization: { directions: [{ angle: 0, knots: k }] } });
    expect(codes(knots([[0.5, 0.6], [1, 0.4]]))).toEqual(['equalization-invalid']);
    expect(codes(knots([[1, 0.6], [0.5, 0.8]]))).toEqual(['equalization-invalid']);
    expect(codes(knots([[0.5, Number.NaN]]))).toEqual(['equalization-invalid']);
    expect(checkSpace(knots([[0, 0], [1, 0.8]])).ok).toBe(true);
    expect(codes(radialSpace(RINGS, { equalization: { directions: [{ angle: 0, knots: [[1, 1]] }, { angle: 2 * Math.PI, knots: [[1, 1]] }] } }))).toEqual(['equalization-invalid']);
    expect(() => generateSpace(knots([[0.5, 0.6], [1, 0.4]]))).toThrow(SpaceError);
  });

  it('an invalid seed is named as such', () => {
    const check = checkSpace(radialSpace(RINGS, { seed: { family: 'radial', baseRadius: 1, terms: [{ k: 3, amplitude: 1.2, phase: 0 }] } }));
    expect(check.failures[0]).toEqual(expect.objectContaining({ id: 'seed', code: 'radius-not-positive' }));
    let caught: unknown;
    try {
      validateDescriptor({ family: 'radial', baseRadius: 1, terms: [{ k: 3, amplitude: 1.2, phase: 0 }] });
    } catch (error) {
      caught = error;
    }
    expect(caught).toBeInstanceOf(ShapeError);
    expect(check.failures[0]?.reason).toBe((caught as ShapeError).message);
  });
});
