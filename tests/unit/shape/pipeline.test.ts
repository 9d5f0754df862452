import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  contourArea,
  contourBoundingCircle,
  contourCentroid,
  contourCompactness,
  contourConvexity,
  contourPerimeter,
  contourToSvgPath,
  countCurvatureExtrema,
  fitEllipticHarmonics,
  fitRadialHarmonics,
  normalizeContour,
  normalizeEllipticHarmonics,
  normalizeRadialHarmonics,
  parseSvgOutline,
  shapeDistance,
  synthesizeContour,
  type EllipticDescriptor,
} from '@/lib/shape';
import { allFinite, PROPERTY_SEED, smoothRadialArbitrary } from './support';

describe('the whole pipeline', () => {
  it('circle → polygon → elliptic fit → normalise is exactly the unit circle (1, 0, 0, 1)', () => {
    // Kuhl & Giardina 1982: a circle analyses to a1 = d1 and nothing else; scaled to unit equal-area radius
    // (area π a1 d1 = π) that is a1 = d1 = 1 exactly, whatever the polygon factor sinc²(π/N).
    for (const n of [64, 1000, 4096]) {
      const circle: EllipticDescriptor = { family: 'elliptic', center: [3, -2], terms: [{ n: 1, a: 2, b: 0, c: 0, d: 2 }] };
      const normalized = normalizeEllipticHarmonics(fitEllipticHarmonics(synthesizeContour(circle, n), 8));
      const [first, ...rest] = normalized.terms;
      expect(first?.a).toBeCloseTo(1, 12);
      expect(first?.d).toBeCloseTo(1, 12);
      expect(Math.abs(first?.b ?? 1) + Math.abs(first?.c ?? 1)).toBeLessThan(1e-12);
      for (const t of rest) expect(Math.hypot(t.a, t.b, t.c, t.d)).toBeLessThan(1e-12);
      expect(Math.hypot(...normalized.center)).toBeLessThan(1e-12);
    }
  });

  it('produces no NaN or infinity anywhere on random valid shapes (property)', () => {
    fc.assert(
      fc.property(
        smoothRadialArbitrary,
        fc.constantFrom('area' as const, 'equal-area-radius' as const, 'max-radius' as const, 'perimeter' as const),
        fc.constantFrom(64, 256, 1000),
        (descriptor, scale, samples) => {
          const outline = synthesizeContour(descriptor, samples);
          const elliptic = normalizeEllipticHarmonics(fitEllipticHarmonics(outline, 12), { scale });
          const radial = normalizeRadialHarmonics(fitRadialHarmonics(outline, 12), { scale });
          const again = synthesizeContour(elliptic, 256);
          const radialAgain = synthesizeContour(radial, 256);
          const normalizedOutline = normalizeContour(outline, { scale });
          const numbers = [
            ...elliptic.terms.flatMap((t) => [t.a, t.b, t.c, t.d]),
            ...elliptic.center,
            radial.baseRadius,
            ...radial.terms.flatMap((t) => [t.amplitude, t.phase]),
            ...again.x,
            ...again.y,
            ...radialAgain.x,
            ...normalizedOutline.x,
            ...normalizedOutline.y,
            contourArea(again),
            contourPerimeter(again),
            ...contourCentroid(again),
            contourCompactness(again),
            contourConvexity(again),
            contourBoundingCircle(again).radius,
            countCurvatureExtrema(elliptic),
            shapeDistance(again, radialAgain, 'procrustes'),
            shapeDistance(again, radialAgain, 'corresponding-points'),
            shapeDistance(again, radialAgain, 'silhouette', { resolution: 64 }),
          ];
          expect(allFinite(numbers)).toBe(true);
          expect(contourToSvgPath(again, { curve: 'smooth' })).not.toMatch(/NaN|Infinity/);
          // SVG out and back in keeps the area within the printed precision and flattening.
          const back = parseSvgOutline(contourToSvgPath(again, { decimals: 6 }));
          expect(contourArea(back)).toBeCloseTo(contourArea(again), 5);
        },
      ),
      { seed: PROPERTY_SEED, numRuns: 30 },
    );
  });
});
