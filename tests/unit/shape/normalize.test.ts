import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  contourArea,
  contourCentroid,
  contourPerimeter,
  descriptorArea,
  descriptorMoments,
  descriptorPerimeter,
  fitEllipticHarmonics,
  normalizeContour,
  normalizeEllipticHarmonics,
  normalizeRadialHarmonics,
  reverseDescriptor,
  synthesizeContour,
  toComplexHarmonics,
  toEllipticHarmonics,
  transformComplexHarmonics,
  type EllipticDescriptor,
  type RadialDescriptor,
} from '@/lib/shape';
import { allFinite, ellipticArbitrary, maxAbsDifference, PROPERTY_SEED, rotateContour, shiftStart, smoothRadialArbitrary } from './support';

function ellipticDifference(p: EllipticDescriptor, q: EllipticDescriptor): number {
  let max = Math.max(Math.abs(p.center[0] - q.center[0]), Math.abs(p.center[1] - q.center[1]));
  const n = Math.max(p.terms.length, q.terms.length);
  for (let i = 0; i < n; i++) {
    const a = p.terms[i] ?? { a: 0, b: 0, c: 0, d: 0 };
    const b = q.terms[i] ?? { a: 0, b: 0, c: 0, d: 0 };
    max = Math.max(max, Math.abs(a.a - b.a), Math.abs(a.b - b.b), Math.abs(a.c - b.c), Math.abs(a.d - b.d));
  }
  return max;
}

function radialDifference(p: RadialDescriptor, q: RadialDescriptor): number {
  // Compare A_k e^{iφ_k}, which is continuous across the ±π phase seam.
  let max = Math.abs(p.baseRadius - q.baseRadius);
  p.terms.forEach((t, i) => {
    const u = q.terms[i];
    if (!u || u.k !== t.k) throw new Error('term lists differ');
    max = Math.max(max, Math.hypot(t.amplitude * Math.cos(t.phase) - u.amplitude * Math.cos(u.phase), t.amplitude * Math.sin(t.phase) - u.amplitude * Math.sin(u.phase)));
  });
  return max;
}

/** The same curve moved: z ↦ s·e^{iα}(z(t + τ) + w), exactly, in the coefficients. */
function moved(descriptor: EllipticDescriptor, rotation: number, scale: number, startShift: number, translation: [number, number]): EllipticDescriptor {
  return toEllipticHarmonics(transformComplexHarmonics(toComplexHarmonics(descriptor), { rotation, scale, startShift, translation }));
}

const rotateRadial = (d: RadialDescriptor, alpha: number, scale = 1): RadialDescriptor => ({
  ...d,
  baseRadius: d.baseRadius * scale,
  terms: d.terms.map((t) => ({ ...t, phase: t.phase - t.k * alpha })),
});

const asymmetric: EllipticDescriptor = {
  family: 'elliptic',
  center: [1, 2],
  terms: [
    { n: 1, a: 2, b: 0.3, c: 0.2, d: 1 },
    { n: 2, a: 0.1, b: 0.05, c: -0.02, d: 0.03 },
    { n: 3, a: 0.02, b: 0.01, c: 0.03, d: -0.01 },
  ],
};

describe('normalizeEllipticHarmonics: Kuhl & Giardina first-harmonic rule', () => {
  it('puts the first harmonic on the axes: b1 = c1 = 0, a1 ≥ d1 > 0, centroid at the origin, unit equal-area radius', () => {
    // Kuhl & Giardina 1982: after normalisation the first harmonic ellipse is axis-aligned, started at its major axis.
    const normalized = normalizeEllipticHarmonics(asymmetric);
    const first = normalized.terms[0];
    expect(Math.abs(first?.b ?? 1)).toBeLessThan(1e-12);
    expect(Math.abs(first?.c ?? 1)).toBeLessThan(1e-12);
    expect(first?.a).toBeGreaterThan(first?.d ?? Infinity);
    expect(first?.d).toBeGreaterThan(0);
    const moments = descriptorMoments(normalized);
    expect(Math.hypot(...moments.centroid)).toBeLessThan(1e-12);
    expect(descriptorArea(normalized)).toBeCloseTo(Math.PI, 12);
  });

  it('an ellipse tilted and started anywhere normalises to (a, 0, 0, b) in unit area', () => {
    // Kuhl & Giardina 1982 (derived): the normalised ellipse is x = a cos t, y = b sin t; here scaled to area 1.
    const ellipse: EllipticDescriptor = { family: 'elliptic', center: [0, 0], terms: [{ n: 1, a: 2, b: 0, c: 0, d: 1 }] };
    const normalized = normalizeEllipticHarmonics(moved(ellipse, 0.7, 3, 1.9, [4, 5]), { scale: 'area' });
    const s = 1 / Math.sqrt(2 * Math.PI);
    expect(normalized.terms[0]?.a).toBeCloseTo(2 * s, 12);
    expect(normalized.terms[0]?.d).toBeCloseTo(1 * s, 12);
  });

  it('start convention: the end of the major axis where the outline lies farther from the centroid', () => {
    // The two candidate starts differ in the sign of every even harmonic (REFERENCES.md, Kuhl & Giardina).
    const normalized = normalizeEllipticHarmonics(asymmetric);
    const flipped = toEllipticHarmonics(transformComplexHarmonics(toComplexHarmonics(normalized), { rotation: Math.PI, startShift: Math.PI }));
    for (const [p, q] of normalized.terms.map((t, i) => [t, flipped.terms[i]] as const)) {
      const sign = p.n % 2 === 0 ? -1 : 1;
      expect(q?.a).toBeCloseTo(sign * p.a, 12);
      expect(q?.d).toBeCloseTo(sign * p.d, 12);
    }
    const startX = (d: EllipticDescriptor) => d.center[0] + d.terms.reduce((s, t) => s + t.a, 0);
    expect(startX(normalized)).toBeGreaterThan(startX(flipped));
    // Normalising the flipped copy lands on the same convention.
    expect(ellipticDifference(normalizeEllipticHarmonics(flipped), normalized)).toBeLessThan(1e-12);
  });

  it('reverses clockwise descriptors', () => {
    const normalized = normalizeEllipticHarmonics(reverseDescriptor(asymmetric));
    expect(descriptorArea(normalized)).toBeGreaterThan(0);
    expect(ellipticDifference(normalized, normalizeEllipticHarmonics(asymmetric))).toBeLessThan(1e-11);
  });

  it.each(['area', 'equal-area-radius', 'max-radius', 'perimeter'] as const)('scale %s gives a unit measure', (scale) => {
    const normalized = normalizeEllipticHarmonics(asymmetric, { scale });
    const contour = synthesizeContour(normalized, 8192);
    if (scale === 'area') expect(descriptorArea(normalized)).toBeCloseTo(1, 12);
    if (scale === 'equal-area-radius') expect(Math.sqrt(descriptorArea(normalized) / Math.PI)).toBeCloseTo(1, 12);
    if (scale === 'perimeter') expect(descriptorPerimeter(normalized)).toBeCloseTo(1, 10);
    if (scale === 'max-radius') {
      const [cx, cy] = contourCentroid(contour);
      let max = 0;
      for (let j = 0; j < 8192; j++) max = Math.max(max, Math.hypot((contour.x[j] as number) - cx, (contour.y[j] as number) - cy));
      expect(max).toBeLessThanOrEqual(1 + 1e-9);
      expect(max).toBeGreaterThan(1 - 1e-6);
    }
  });

  it('is invariant to rotation, scale, translation and start point (property, asymmetric shapes)', () => {
    fc.assert(
      fc.property(
        ellipticArbitrary,
        fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }),
        fc.double({ min: 0.2, max: 5, noNaN: true }),
        fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }),
        fc.tuple(fc.double({ min: -10, max: 10, noNaN: true }), fc.double({ min: -10, max: 10, noNaN: true })),
        fc.constantFrom('first-harmonic' as const, 'principal-axis' as const, 'dominant-harmonic' as const),
        (descriptor, rotation, scale, startShift, translation, orientation) => {
          const a = normalizeEllipticHarmonics(descriptor, { orientation });
          const b = normalizeEllipticHarmonics(moved(descriptor, rotation, scale, startShift, translation), { orientation });
          expect(ellipticDifference(a, b)).toBeLessThan(1e-9);
          expect(allFinite(a.terms.flatMap((t) => [t.a, t.b, t.c, t.d]))).toBe(true);
        },
      ),
      { seed: PROPERTY_SEED, numRuns: 200 },
    );
  });

  it('outline level: rotating, scaling or re-starting a polygon leaves its normalised fit unchanged', () => {
    // Fits of the same polygon moved rigidly or started at another vertex are exact phase/rotation changes.
    fc.assert(
      fc.property(
        smoothRadialArbitrary,
        fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }),
        fc.double({ min: 0.2, max: 5, noNaN: true }),
        fc.integer({ min: 1, max: 511 }),
        (descriptor, angle, scale, start) => {
          const outline = synthesizeContour(descriptor, 512);
          const other = shiftStart(rotateContour(outline, angle, scale, 3, -2), start);
          const a = normalizeEllipticHarmonics(fitEllipticHarmonics(outline, 16));
          const b = normalizeEllipticHarmonics(fitEllipticHarmonics(other, 16));
          expect(ellipticDifference(a, b)).toBeLessThan(1e-9);
        },
      ),
      { seed: PROPERTY_SEED, numRuns: 40 },
    );
  });
});

describe('the symmetric-shape rule (threefold and higher symmetry)', () => {
  const rf3: RadialDescriptor = { family: 'radial', baseRadius: 1, terms: [{ k: 3, amplitude: 0.15, phase: 1.234 }] };

  it('radial: puts the phase of the dominant harmonic at 0', () => {
    const normalized = normalizeRadialHarmonics(rf3, { scale: 'none' });
    expect(normalized.terms[0]?.phase).toBeCloseTo(0, 14);
    expect(normalized.terms[0]?.amplitude).toBeCloseTo(0.15, 14);
    // A lobe now points along +x: r(0) is the maximum radius r0(1 + A).
    expect(synthesizeContour(normalized, 256).x[0]).toBeCloseTo(1.15, 14);
  });

  it('radial: ties in amplitude go to the lower k; the tie-break uses the next harmonics', () => {
    const tie: RadialDescriptor = { family: 'radial', baseRadius: 1, terms: [{ k: 5, amplitude: 0.1, phase: 0.4 }, { k: 3, amplitude: 0.1, phase: 2 }] };
    const normalized = normalizeRadialHarmonics(tie, { scale: 'none' });
    expect(normalized.terms.find((t) => t.k === 3)?.phase).toBeCloseTo(0, 12);
    // Of the three rotations that zero φ3, the chosen one gives k = 5 the largest cos φ5.
    const cos5 = Math.cos(normalized.terms.find((t) => t.k === 5)?.phase ?? 0);
    for (let j = 1; j < 3; j++) {
      const alternative = rotateRadial(normalized, (2 * Math.PI * j) / 3);
      expect(cos5).toBeGreaterThan(Math.cos(alternative.terms.find((t) => t.k === 5)?.phase ?? 0));
    }
  });

  it('radial: a rotation by a symmetry angle or any angle gives the same normalised descriptor', () => {
    const base = normalizeRadialHarmonics(rf3);
    for (const alpha of [(2 * Math.PI) / 3, 0.3, -2.2]) expect(radialDifference(normalizeRadialHarmonics(rotateRadial(rf3, alpha, 1.7)), base)).toBeLessThan(1e-12);
  });

  it('principal-axis falls back to the symmetric rule when the second moments are equal', () => {
    const viaAxis = normalizeRadialHarmonics(rf3, { orientation: 'principal-axis' });
    expect(radialDifference(viaAxis, normalizeRadialHarmonics(rf3))).toBeLessThan(1e-12);
  });

  it('elliptic: an outline with threefold symmetry has a circular first harmonic and uses the fallback', () => {
    // 768 = 3 · 256 samples keep the polygon exactly threefold symmetric.
    const outline = synthesizeContour({ family: 'radial', baseRadius: 1, terms: [{ k: 3, amplitude: 0.12, phase: 0.5 }, { k: 6, amplitude: 0.03, phase: 1.5 }] }, 768);
    const fit = fitEllipticHarmonics(outline, 20);
    const c = toComplexHarmonics(fit).terms;
    const cMinus1 = c.find((t) => t.k === -1);
    expect(Math.hypot(cMinus1?.re ?? 0, cMinus1?.im ?? 0)).toBeLessThan(1e-12);
    const normalized = normalizeEllipticHarmonics(fit);
    expect(allFinite(normalized.terms.flatMap((t) => [t.a, t.b, t.c, t.d]))).toBe(true);
    // c_1 and the dominant other harmonic (k = −2 for threefold symmetry) are real and positive.
    const terms = toComplexHarmonics(normalized).terms;
    const c1 = terms.find((t) => t.k === 1);
    const cm2 = terms.find((t) => t.k === -2);
    expect(Math.abs(c1?.im ?? 1)).toBeLessThan(1e-12);
    expect(c1?.re).toBeGreaterThan(0);
    expect(Math.abs(cm2?.im ?? 1)).toBeLessThan(1e-12);
    expect(cm2?.re).toBeGreaterThan(0);
    // Invariant under rotation, start shift by whole vertices, and scale.
    for (const [angle, start, scale] of [[0.4, 100, 2], [2.1, 256, 0.5], [-1, 5, 1]] as const) {
      const other = normalizeEllipticHarmonics(fitEllipticHarmonics(shiftStart(rotateContour(outline, angle, scale, 1, 1), start), 20));
      expect(ellipticDifference(other, normalized)).toBeLessThan(1e-9);
    }
  });

  it('property: symmetric radial shapes normalise identically under any rotation', () => {
    const symmetric = fc
      .record({
        m: fc.integer({ min: 3, max: 7 }),
        a1: fc.double({ min: 0.05, max: 0.2, noNaN: true }),
        a2: fc.double({ min: 0, max: 0.04, noNaN: true }),
        p1: fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }),
        p2: fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }),
      })
      .map(({ m, a1, a2, p1, p2 }): RadialDescriptor => ({ family: 'radial', baseRadius: 1, terms: [{ k: m, amplitude: a1, phase: p1 }, { k: 2 * m, amplitude: a2, phase: p2 }] }));
    fc.assert(
      fc.property(symmetric, fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }), (descriptor, alpha) => {
        const a = normalizeRadialHarmonics(descriptor);
        const b = normalizeRadialHarmonics(rotateRadial(descriptor, alpha, 2));
        expect(radialDifference(a, b)).toBeLessThan(1e-11);
        expect(a.terms[0]?.phase).toBeCloseTo(0, 12);
      }),
      { seed: PROPERTY_SEED, numRuns: 200 },
    );
  });
});

describe('normalizeRadialHarmonics on asymmetric shapes', () => {
  it('property: invariant under rotation and scale, for both orientation rules', () => {
    fc.assert(
      fc.property(
        smoothRadialArbitrary,
        fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }),
        fc.double({ min: 0.2, max: 5, noNaN: true }),
        fc.constantFrom('dominant-harmonic' as const, 'principal-axis' as const),
        (descriptor, alpha, scale, orientation) => {
          const a = normalizeRadialHarmonics(descriptor, { orientation });
          const b = normalizeRadialHarmonics(rotateRadial(descriptor, alpha, scale), { orientation });
          expect(radialDifference(a, b)).toBeLessThan(1e-9);
          expect(Math.sqrt(descriptorArea(a) / Math.PI)).toBeCloseTo(1, 12);
        },
      ),
      { seed: PROPERTY_SEED, numRuns: 200 },
    );
  });

  it('makes amplitudes non-negative and phases fall in (−π, π]', () => {
    const normalized = normalizeRadialHarmonics({ family: 'radial', baseRadius: 1, terms: [{ k: 4, amplitude: -0.1, phase: 9 }, { k: 2, amplitude: 0.05, phase: -7 }] }, { orientation: 'none', scale: 'none' });
    expect(normalized.terms.map((t) => t.k)).toEqual([2, 4]);
    for (const t of normalized.terms) {
      expect(t.amplitude).toBeGreaterThanOrEqual(0);
      expect(t.phase).toBeGreaterThan(-Math.PI);
      expect(t.phase).toBeLessThanOrEqual(Math.PI);
    }
    // Same curve: −0.1 cos(4θ + 9) = 0.1 cos(4θ + 9 − π).
    const before = synthesizeContour({ family: 'radial', baseRadius: 1, terms: [{ k: 4, amplitude: -0.1, phase: 9 }, { k: 2, amplitude: 0.05, phase: -7 }] }, 256);
    const after = synthesizeContour(normalized, 256);
    expect(maxAbsDifference(before.x, after.x)).toBeLessThan(1e-14);
  });
});

describe('normalizeContour', () => {
  it('centres, scales, orients counter-clockwise, and is invariant to rigid motion and start vertex', () => {
    const outline = synthesizeContour({ family: 'radial', baseRadius: 1, terms: [{ k: 2, amplitude: 0.1, phase: 0.4 }, { k: 3, amplitude: 0.07, phase: 1 }] }, 512);
    const a = normalizeContour(outline);
    expect(contourArea(a)).toBeCloseTo(Math.PI, 12);
    expect(Math.hypot(...contourCentroid(a))).toBeLessThan(1e-12);
    const clockwise = { x: outline.x.slice().reverse(), y: outline.y.slice().reverse() };
    const b = normalizeContour(shiftStart(rotateContour(clockwise, 1.3, 2.5, 4, 4), 200));
    expect(maxAbsDifference(a.x, b.x)).toBeLessThan(1e-9);
    expect(maxAbsDifference(a.y, b.y)).toBeLessThan(1e-9);
    expect(contourPerimeter(normalizeContour(outline, { scale: 'perimeter' }))).toBeCloseTo(1, 12);
  });
});
