import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  contourArea,
  descriptorArea,
  fitEllipticHarmonics,
  fitRadialHarmonics,
  measureReconstructionError,
  synthesizeContour,
  type EllipticDescriptor,
  type RadialDescriptor,
} from '@/lib/shape';
import { allFinite, polygon, PROPERTY_SEED, rotateContour, smoothRadialArbitrary } from './support';

const circle = (r: number): EllipticDescriptor => ({ family: 'elliptic', center: [0, 0], terms: [{ n: 1, a: r, b: 0, c: 0, d: r }] });

describe('elliptic fitting (Kuhl & Giardina closed-form sums)', () => {
  it('a circle traced counter-clockwise from (r, 0) analyses to a1 = d1 and nothing else', () => {
    // Kuhl & Giardina 1982: a circle of radius r analyses to a1 = d1 = r and nothing else. The sampled circle
    // is a regular N-gon traced at constant speed, whose first harmonic is r·sinc²(π/N) (derived: linear
    // interpolation of equally spaced samples multiplies harmonic n by sinc²(πn/N)); every other harmonic
    // below N − 1 vanishes.
    for (const [r, n] of [[1, 1024], [2.5, 4096], [0.3, 256]] as const) {
      const fit = fitEllipticHarmonics(synthesizeContour(circle(r), n), 20);
      const sinc = Math.sin(Math.PI / n) / (Math.PI / n);
      const first = fit.terms[0];
      expect(first?.a).toBeCloseTo(r * sinc * sinc, 12);
      expect(first?.d).toBeCloseTo(r * sinc * sinc, 12);
      expect(Math.abs(first?.b ?? 1)).toBeLessThan(1e-12);
      expect(Math.abs(first?.c ?? 1)).toBeLessThan(1e-12);
      for (const term of fit.terms.slice(1)) {
        expect(Math.max(Math.abs(term.a), Math.abs(term.b), Math.abs(term.c), Math.abs(term.d))).toBeLessThan(1e-12);
      }
      expect(Math.hypot(...fit.center)).toBeLessThan(1e-12);
      // Hence the round trip to r itself is off only by that factor, 1 − sinc² ≈ (π/N)²/3.
      expect(Math.abs((first?.a ?? 0) - r)).toBeLessThan(1.01 * r * (Math.PI / n) ** 2 / 3);
    }
  });

  it('a clockwise circle gives d1 = −r', () => {
    // Kuhl & Giardina 1982: traced clockwise, d1 = −r.
    const ccw = synthesizeContour(circle(1), 1024);
    const cw = { x: ccw.x, y: ccw.y.map((v) => -v) };
    const fit = fitEllipticHarmonics(cw, 3);
    expect(fit.terms[0]?.d).toBeLessThan(-0.99999);
    expect(fit.terms[0]?.a).toBeGreaterThan(0.99999);
  });

  it('area identity A = π Σ n(a_n d_n − b_n c_n) converges to the polygon area', () => {
    // Kuhl & Giardina 1982 area identity; for a polygon the truncated series approaches the shoelace area.
    const lShape = polygon([[0, 0], [2, 0], [2, 1], [1, 1], [1, 2], [0, 2]]);
    const errors = [8, 32, 128].map((h) => Math.abs(descriptorArea(fitEllipticHarmonics(lShape, h)) - 3));
    expect(errors[2]).toBeLessThan(0.01);
    expect(errors[2] as number).toBeLessThan(errors[0] as number);
    // For the descriptor itself the identity is exact against a dense shoelace area.
    const descriptor: EllipticDescriptor = {
      family: 'elliptic',
      center: [1, 1],
      terms: [{ n: 1, a: 1, b: 0.2, c: 0.1, d: 0.6 }, { n: 3, a: 0.05, b: 0.02, c: 0.01, d: 0.04 }],
    };
    expect(contourArea(synthesizeContour(descriptor, 8192))).toBeCloseTo(descriptorArea(descriptor), 6);
  });

  it('does not depend on the start vertex beyond a phase shift (same area, same amplitudes)', () => {
    const contour = synthesizeContour({ family: 'radial', baseRadius: 1, terms: [{ k: 3, amplitude: 0.1, phase: 0 }, { k: 2, amplitude: 0.05, phase: 1 }] }, 512);
    const shifted = { x: Float64Array.from({ length: 512 }, (_, i) => contour.x[(i + 77) % 512] as number), y: Float64Array.from({ length: 512 }, (_, i) => contour.y[(i + 77) % 512] as number) };
    const a = fitEllipticHarmonics(contour, 10);
    const b = fitEllipticHarmonics(shifted, 10);
    for (let i = 0; i < 10; i++) {
      const p = a.terms[i];
      const q = b.terms[i];
      if (!p || !q) throw new Error('missing term');
      expect(Math.hypot(p.a, p.b, p.c, p.d)).toBeCloseTo(Math.hypot(q.a, q.b, q.c, q.d), 12);
    }
  });
});

describe('radial fitting about the area centroid', () => {
  it('recovers a symmetric radial-frequency pattern', () => {
    // RF3 is centred by symmetry, so its fit about the centroid returns its own A and φ (Wilkinson et al. 1998).
    const descriptor: RadialDescriptor = { family: 'radial', baseRadius: 2, terms: [{ k: 3, amplitude: 0.15, phase: 0.8 }, { k: 6, amplitude: 0.05, phase: -1.2 }] };
    const fit = fitRadialHarmonics(synthesizeContour(descriptor, 2048), 12);
    expect(fit.baseRadius).toBeCloseTo(2, 4);
    const byK = new Map(fit.terms.map((t) => [t.k, t]));
    expect(byK.get(3)?.amplitude).toBeCloseTo(0.15, 4);
    expect(byK.get(3)?.phase).toBeCloseTo(0.8, 4);
    expect(byK.get(6)?.amplitude).toBeCloseTo(0.05, 4);
    expect(byK.get(6)?.phase).toBeCloseTo(-1.2, 3);
    for (const k of [1, 2, 4, 5, 7, 8]) expect(byK.get(k)?.amplitude ?? 1).toBeLessThan(1e-5);
  });

  it('samples every angle once when a vertex lies exactly on the +x ray from the centroid', () => {
    // Regression: a mirror-symmetric shape puts vertex 0 at θ = +1e-17 about the centroid; rounding once left
    // the ray θ = 0 unsampled (r = 0 there). The fit must match the shape as well as at any other rotation.
    const descriptor: RadialDescriptor = { family: 'radial', baseRadius: 2.6, terms: [{ k: 2, amplitude: 0.1, phase: 0 }, { k: 3, amplitude: 0.04, phase: 0 }, { k: 6, amplitude: 0.03, phase: 0 }] };
    const outline = synthesizeContour(descriptor, 1024);
    expect(measureReconstructionError(outline, fitRadialHarmonics(outline, 32)).max).toBeLessThan(1e-4);
  });

  it('accepts either orientation and any translation', () => {
    const contour = rotateContour(synthesizeContour({ family: 'radial', baseRadius: 1, terms: [{ k: 4, amplitude: 0.1, phase: 0 }] }, 1024), 0, 1, 5, -3);
    const reversed = { x: contour.x.slice().reverse(), y: contour.y.slice().reverse() };
    const a = fitRadialHarmonics(contour, 6);
    const b = fitRadialHarmonics(reversed, 6);
    expect(a.baseRadius).toBeCloseTo(b.baseRadius, 10);
    expect(a.terms[3]?.amplitude).toBeCloseTo(0.1, 4);
    expect(b.terms[3]?.amplitude).toBeCloseTo(0.1, 4);
  });

  it('reports the reconstruction error in equal-area radii', () => {
    const square = polygon([[-1, -1], [1, -1], [1, 1], [-1, 1]]);
    const error = measureReconstructionError(square, fitRadialHarmonics(square, 32));
    // Truncating the square's r(θ) at 32 harmonics leaves a visible ripple at the corners, but well under 5 %.
    expect(error.max).toBeGreaterThan(1e-4);
    expect(error.max).toBeLessThan(0.05);
    expect(error.mean).toBeLessThan(error.max);
    // A perfect fit has zero error: the circle against its own radial descriptor.
    const round = synthesizeContour({ family: 'radial', baseRadius: 1, terms: [] }, 1024);
    expect(measureReconstructionError(round, { family: 'radial', baseRadius: 1, terms: [] }).max).toBeLessThan(1e-12);
  });
});

describe('fitted-then-synthesised smooth random outlines', () => {
  it('stay within 1e-4 equal-area radii (radial, 12 harmonics; elliptic, 32 harmonics)', () => {
    // Stated bound: the outlines are 1,024-sample polygons of smooth radial shapes with harmonics ≤ 8. Both
    // fits then miss only the polygon's corners (chord sag r(π/N)²/2 ≈ 5e-6 r, a few times that where r
    // varies) and the small tail of the re-centred or re-parametrised curve; seen worst 3.5e-5.
    fc.assert(
      fc.property(smoothRadialArbitrary, fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }), (descriptor, angle) => {
        const outline = rotateContour(synthesizeContour(descriptor, 1024), angle, 1, 0.5, -0.25);
        const radial = fitRadialHarmonics(outline, 12);
        const elliptic = fitEllipticHarmonics(outline, 32);
        const radialError = measureReconstructionError(outline, radial);
        const ellipticError = measureReconstructionError(outline, elliptic);
        expect(radialError.max).toBeLessThan(1e-4);
        expect(ellipticError.max).toBeLessThan(1e-4);
        expect(allFinite([radial.baseRadius, ...radial.terms.flatMap((t) => [t.amplitude, t.phase])])).toBe(true);
        expect(allFinite(elliptic.terms.flatMap((t) => [t.a, t.b, t.c, t.d]))).toBe(true);
      }),
      { seed: PROPERTY_SEED, numRuns: 25 },
    );
  });
});
