import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { correspondingPointDistance, synthesizeContour, type Contour, type ShapeDescriptor } from '@/lib/shape';
import { contourDistance, contourSpectrum, descriptorSpectrum, spectrumDistance } from '@/lib/space';
import { ellipticArbitrary, smoothRadialArbitrary } from '../shape/support';
import { BEAN, COMMA, PROPERTY_SEED, rotateContour, shiftStart } from './support';

const BLOB: ShapeDescriptor = { family: 'radial', baseRadius: 1, terms: [{ k: 2, amplitude: 0.1, phase: 0.3 }, { k: 3, amplitude: 0.08, phase: 1 }] };
const circle = (r: number, n = 256) => synthesizeContour({ family: 'radial', baseRadius: r, terms: [] }, n);

/** RMS corresponding-point distance minimised over whole-sample start shifts and rotations, by brute force. */
function bruteForceDistance(a: Contour, b: Contour): number {
  const n = a.x.length;
  const mean = (v: Float64Array) => v.reduce((s, x) => s + x, 0) / n;
  const [ax, ay, bx, by] = [mean(a.x), mean(a.y), mean(b.x), mean(b.y)];
  let energy = 0;
  for (let j = 0; j < n; j++) energy += ((a.x[j] as number) - ax) ** 2 + ((a.y[j] as number) - ay) ** 2 + ((b.x[j] as number) - bx) ** 2 + ((b.y[j] as number) - by) ** 2;
  let best = Infinity;
  for (let s = 0; s < n; s++) {
    let re = 0;
    let im = 0;
    for (let j = 0; j < n; j++) {
      const pr = (a.x[j] as number) - ax, pi = (a.y[j] as number) - ay;
      const qr = (b.x[(j + s) % n] as number) - bx, qi = (b.y[(j + s) % n] as number) - by;
      re += pr * qr + pi * qi;
      im += pr * qi - pi * qr;
    }
    best = Math.min(best, energy - 2 * Math.hypot(re, im));
  }
  return Math.sqrt(Math.max(0, best) / n);
}

describe('contour distance: RMS corresponding-point distance after the best translation, rotation and start point', () => {
  const blob = synthesizeContour(BLOB, 256);

  it('is zero after a rigid motion and a shift of the start point, whole-sample or not', () => {
    expect(contourDistance(blob, rotateContour(blob, 1.2, 5, -3))).toBe(0);
    expect(contourDistance(blob, shiftStart(blob, 37))).toBe(0);
    // Rotating a radial shape by α changes every phase φ_k by −kα: a start shift of α/(2π/N) = 3.3 samples here.
    const alpha = (3.3 * 2 * Math.PI) / 256;
    const rotated: ShapeDescriptor = { ...BLOB, terms: BLOB.family === 'radial' ? BLOB.terms.map((t) => ({ ...t, phase: t.phase - t.k * alpha })) : [] };
    expect(contourDistance(blob, synthesizeContour(rotated, 256))).toBe(0);
    // lib/shape's corresponding-point distance, which only shifts by whole samples, cannot see that.
    expect(correspondingPointDistance(blob, synthesizeContour(rotated, 256), { matchStart: true })).toBeGreaterThan(1e-3);
  });

  it('concentric circles of radius 1 and 2 are 1 apart', () => {
    // Derived: corresponding points of concentric circles are r2 − r1 apart everywhere.
    expect(contourDistance(circle(1), circle(2))).toBeCloseTo(1, 12);
  });

  it('matches a brute-force search over start points and rotations on densely sampled outlines', () => {
    fc.assert(
      fc.property(fc.oneof(smoothRadialArbitrary, ellipticArbitrary), fc.oneof(smoothRadialArbitrary, ellipticArbitrary), (p, q) => {
        const dense = bruteForceDistance(synthesizeContour(p, 1024, { checkSimple: false }), synthesizeContour(q, 1024, { checkSimple: false }));
        const ours = contourDistance(synthesizeContour(p, 128, { checkSimple: false }), synthesizeContour(q, 128, { checkSimple: false }));
        // Whole-sample shifts on 1024 points are within O(h²) of the continuous optimum, never below it.
        expect(ours).toBeLessThanOrEqual(dense + 1e-12);
        expect(dense - ours).toBeLessThan(1e-3 * Math.max(dense, 1e-3));
      }),
      { seed: PROPERTY_SEED, numRuns: 25 },
    );
  });

  it('is never below lib/shape’s mean corresponding-point distance at its best whole-sample start (RMS ≥ mean)', () => {
    for (const [p, q] of [[BLOB, BEAN], [BEAN, COMMA], [COMMA, BLOB]] as const) {
      const a = synthesizeContour(p, 512);
      const b = synthesizeContour(q, 512);
      expect(correspondingPointDistance(a, b, { matchStart: true })).toBeLessThanOrEqual(contourDistance(a, b) * (1 + 1e-6));
    }
  });

  it('is symmetric and satisfies the triangle inequality', () => {
    fc.assert(
      fc.property(smoothRadialArbitrary, ellipticArbitrary, smoothRadialArbitrary, (p, q, r) => {
        const [a, b, c] = [p, q, r].map(descriptorSpectrum) as [ReturnType<typeof descriptorSpectrum>, ReturnType<typeof descriptorSpectrum>, ReturnType<typeof descriptorSpectrum>];
        expect(spectrumDistance(a, b)).toBeCloseTo(spectrumDistance(b, a), 12);
        expect(spectrumDistance(a, c)).toBeLessThanOrEqual(spectrumDistance(a, b) + spectrumDistance(b, c) + 1e-12);
      }),
      { seed: PROPERTY_SEED, numRuns: 50 },
    );
  });

  it('reads the same from a sampled contour and from its descriptor', () => {
    for (const d of [BLOB, BEAN, COMMA]) {
      const fromContour = contourSpectrum(synthesizeContour(d, 256));
      const fromDescriptor = descriptorSpectrum(d);
      expect(Array.from(fromContour.k)).toEqual(Array.from(fromDescriptor.k));
      fromDescriptor.re.forEach((v, i) => expect(fromContour.re[i]).toBeCloseTo(v, 13));
      fromDescriptor.im.forEach((v, i) => expect(fromContour.im[i]).toBeCloseTo(v, 13));
      expect(fromContour.energy).toBeCloseTo(fromDescriptor.energy, 13);
    }
    // Parseval: the energy of a circle of radius r is r².
    expect(contourSpectrum(circle(3)).energy).toBeCloseTo(9, 12);
  });
});
