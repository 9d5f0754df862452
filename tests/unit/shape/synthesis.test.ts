import { describe, expect, it } from 'vitest';
import {
  contourArea,
  contourPerimeter,
  descriptorArea,
  descriptorPerimeter,
  evaluateDescriptor,
  synthesizeContour,
  toComplexHarmonics,
  type ComplexDescriptor,
  type EllipticDescriptor,
  type RadialDescriptor,
  type ShapeDescriptor,
} from '@/lib/shape';
import { maxAbsDifference } from './support';

const rf = (terms: [number, number, number][], baseRadius = 1): RadialDescriptor => ({
  family: 'radial',
  baseRadius,
  terms: terms.map(([amplitude, k, phase]) => ({ k, amplitude, phase })),
});

describe('radial harmonics: area against the closed form', () => {
  // Wilkinson, Wilson & Habak 1998 radial-frequency patterns; area π r0²(1 + ½ΣA_k²), derived from ½∮r²dθ.
  it.each([
    ['A 0.1, ω 3', rf([[0.1, 3, 0]]), 3.15730062],
    ['A 0.2, ω 5, φ 0.7', rf([[0.2, 5, 0.7]]), 3.20442451],
    ['(0.1, 2) + (0.2, 3)', rf([[0.1, 2, 0], [0.2, 3, 0]]), 3.22013247],
  ])('%s → published area', (_, descriptor, published) => {
    expect(descriptorArea(descriptor)).toBeCloseTo(published, 7);
    // The shoelace area of the 8192-sample polygon approaches the curve's area from below by O(N⁻²).
    const polygonArea = contourArea(synthesizeContour(descriptor, 8192));
    expect(Math.abs(polygonArea - published) / published).toBeLessThan(1e-6);
    expect(polygonArea).toBeLessThan(published);
  });

  it('scales with r0² for other base radii', () => {
    const descriptor = rf([[0.1, 3, 0]], 2.5);
    // Same closed form with r0 = 2.5.
    expect(contourArea(synthesizeContour(descriptor, 8192))).toBeCloseTo(3.15730062 * 6.25, 4);
  });
});

describe('elliptic harmonics: the ellipse', () => {
  const ellipse: EllipticDescriptor = { family: 'elliptic', center: [0, 0], terms: [{ n: 1, a: 2, b: 0, c: 0, d: 1 }] };

  it('(a, 0, 0, b) traces x = a cos t, y = b sin t from t = 0', () => {
    // Kuhl & Giardina 1982: synthesis of (a1, b1, c1, d1) = (a, 0, 0, b) is the axis-aligned ellipse.
    const n = 1024;
    const contour = synthesizeContour(ellipse, n);
    for (const j of [0, 1, 100, 256, 511, 700, 1023]) {
      const t = (2 * Math.PI * j) / n;
      expect(contour.x[j]).toBeCloseTo(2 * Math.cos(t), 14);
      expect(contour.y[j]).toBeCloseTo(Math.sin(t), 14);
    }
  });

  it('has area πab and perimeter 4aE(e)', () => {
    // Area πab; perimeter 4a·E(e): (2, 1) → 9.6884482205 (complete elliptic integral of the 2nd kind).
    expect(descriptorArea(ellipse)).toBeCloseTo(2 * Math.PI, 12);
    expect(descriptorPerimeter(ellipse)).toBeCloseTo(9.6884482205, 9);
    const polygon = synthesizeContour(ellipse, 8192);
    expect(contourArea(polygon)).toBeCloseTo(2 * Math.PI, 5);
    expect(contourPerimeter(polygon)).toBeCloseTo(9.6884482205, 5);
  });

  it.each([
    [3, 1, 13.3648932206],
    [10, 1, 40.639741801],
  ])('perimeter of the (%d, %d) ellipse', (a, b, published) => {
    // 4a·E(e), values as tabulated in REFERENCES.md (complete elliptic integral of the 2nd kind).
    const descriptor: EllipticDescriptor = { family: 'elliptic', center: [0, 0], terms: [{ n: 1, a, b: 0, c: 0, d: b }] };
    expect(descriptorPerimeter(descriptor)).toBeCloseTo(published, 8);
  });
});

describe('FFT, direct and exact synthesis agree', () => {
  const radial = rf([[0.1, 3, 0.3], [0.05, 5, 1], [0.03, 7, 2], [0.02, 11, -0.4], [0.01, 16, 2.2]]);
  const elliptic: EllipticDescriptor = {
    family: 'elliptic',
    center: [0.3, -0.2],
    terms: [
      { n: 1, a: 1, b: 0.1, c: -0.05, d: 0.7 },
      { n: 2, a: 0.05, b: 0.02, c: 0.01, d: -0.03 },
      { n: 9, a: 0.004, b: -0.003, c: 0.002, d: 0.001 },
    ],
  };
  const complex: ComplexDescriptor = {
    family: 'complex',
    terms: [
      { k: 0, re: 1, im: 2 },
      { k: 1, re: 1, im: 0.2 },
      { k: -2, re: 0.08, im: -0.03 },
      { k: 4, re: 0.02, im: 0.01 },
    ],
  };
  const many: RadialDescriptor = rf(Array.from({ length: 128 }, (_, i): [number, number, number] => [0.003 / (1 + i / 20), i + 1, i * 0.37]));

  it.each<[string, number, ShapeDescriptor]>([
    ['radial', 64, radial],
    ['radial, 3 terms, r0 = 2.5 (single pass)', 256, rf([[0.1, 3, 0.3], [0.05, 5, 1], [0.03, 7, 2]], 2.5)],
    ['radial, 9 terms (three passes)', 512, rf(Array.from({ length: 9 }, (_, i): [number, number, number] => [0.02, i + 2, i]), 0.7)],
    ['radial', 1024, radial],
    ['elliptic', 256, elliptic],
    ['complex', 128, complex],
    ['128 radial harmonics', 8192, many],
  ])('%s at N = %d: FFT and direct within 1e-12 of the exact evaluation', (_, n, descriptor) => {
    const exact = synthesizeContour(descriptor, n, { method: 'exact' });
    for (const method of ['fft', 'direct', 'auto'] as const) {
      const contour = synthesizeContour(descriptor, n, { method });
      // Derived: all paths compute the same finite Fourier sum.
      expect(maxAbsDifference(contour.x, exact.x)).toBeLessThan(1e-12);
      expect(maxAbsDifference(contour.y, exact.y)).toBeLessThan(1e-12);
    }
  });

  it('direct synthesis works for N that is not a power of two', () => {
    for (const n of [100, 333, 1000]) {
      const exact = synthesizeContour(radial, n, { method: 'exact' });
      const direct = synthesizeContour(radial, n, { method: 'direct' });
      expect(maxAbsDifference(direct.x, exact.x)).toBeLessThan(1e-12);
      expect(maxAbsDifference(direct.y, exact.y)).toBeLessThan(1e-12);
    }
  });

  it('every sample matches evaluateDescriptor at t_j = 2πj/N', () => {
    const contour = synthesizeContour(elliptic, 512, { method: 'fft' });
    for (const j of [0, 17, 255, 511]) {
      const [x, y] = evaluateDescriptor(elliptic, (2 * Math.PI * j) / 512);
      expect(Math.abs((contour.x[j] as number) - x)).toBeLessThan(1e-13);
      expect(Math.abs((contour.y[j] as number) - y)).toBeLessThan(1e-13);
    }
  });

  it('Parseval: the mean of |z_j|² equals Σ|c_k|²', () => {
    // Parseval's theorem for the DFT, exact when N exceeds twice the highest complex harmonic.
    for (const descriptor of [radial, elliptic, complex]) {
      const n = 1024;
      const { x, y } = synthesizeContour(descriptor, n, { method: 'fft' });
      let power = 0;
      for (let j = 0; j < n; j++) power += ((x[j] as number) ** 2 + (y[j] as number) ** 2) / n;
      const coefficients = toComplexHarmonics(descriptor).terms.reduce((s, t) => s + t.re * t.re + t.im * t.im, 0);
      expect(Math.abs(power - coefficients) / coefficients).toBeLessThan(1e-13);
    }
  });
});

describe('direction and start', () => {
  it('returns counter-clockwise contours starting at t = 0, even for a clockwise descriptor', () => {
    // Kuhl & Giardina 1982: a circle traced clockwise has d1 = −r.
    const clockwise: EllipticDescriptor = { family: 'elliptic', center: [0, 0], terms: [{ n: 1, a: 1, b: 0, c: 0, d: -1 }] };
    expect(descriptorArea(clockwise)).toBeCloseTo(-Math.PI, 12);
    const contour = synthesizeContour(clockwise, 256);
    expect(contourArea(contour)).toBeGreaterThan(0);
    expect(contour.x[0]).toBeCloseTo(1, 15);
    expect(contour.y[0]).toBeCloseTo(0, 15);
    // The second sample is the curve at t = −2π/N, i.e. (cos, +sin) of the original clockwise trace reversed.
    expect(contour.y[1]).toBeCloseTo(Math.sin((2 * Math.PI) / 256), 14);
  });

  it('radial contours run counter-clockwise from θ = 0', () => {
    const contour = synthesizeContour(rf([[0.2, 4, 0]]), 128);
    expect(contourArea(contour)).toBeGreaterThan(0);
    expect(contour.x[0]).toBeCloseTo(1.2, 14);
    expect(contour.y[0]).toBe(0);
  });

  it('does not mutate its input and returns fresh arrays', () => {
    const descriptor = rf([[0.1, 3, 0.5]]);
    const snapshot = JSON.stringify(descriptor);
    const a = synthesizeContour(descriptor, 256);
    const b = synthesizeContour(descriptor, 256);
    expect(JSON.stringify(descriptor)).toBe(snapshot);
    expect(a.x).not.toBe(b.x);
    a.x[0] = 99;
    expect(b.x[0]).toBeCloseTo(1 + 0.1 * Math.cos(0.5), 14);
  });
});
