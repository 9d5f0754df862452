import fc from 'fast-check';
import { orient2d } from 'robust-predicates';
import { describe, expect, it } from 'vitest';
import { findSelfIntersection, isSimpleContour, synthesizeContour } from '@/lib/shape';
import { polygon, PROPERTY_SEED } from './support';

/** Brute-force O(N²) reference with the same exact predicate: any two non-adjacent edges that meet. */
function bruteForceSimple(points: readonly (readonly [number, number])[]): boolean {
  const n = points.length;
  const sign = (a: readonly [number, number], b: readonly [number, number], c: readonly [number, number]) => Math.sign(orient2d(a[0], a[1], b[0], b[1], c[0], c[1]));
  const on = (a: readonly [number, number], b: readonly [number, number], c: readonly [number, number]) =>
    Math.min(a[0], b[0]) <= c[0] && c[0] <= Math.max(a[0], b[0]) && Math.min(a[1], b[1]) <= c[1] && c[1] <= Math.max(a[1], b[1]);
  const meet = (a: readonly [number, number], b: readonly [number, number], c: readonly [number, number], d: readonly [number, number]) => {
    const o1 = sign(a, b, c), o2 = sign(a, b, d), o3 = sign(c, d, a), o4 = sign(c, d, b);
    if (o1 * o2 < 0 && o3 * o4 < 0) return true;
    return (o1 === 0 && on(a, b, c)) || (o2 === 0 && on(a, b, d)) || (o3 === 0 && on(c, d, a)) || (o4 === 0 && on(c, d, b));
  };
  const p = (i: number) => points[((i % n) + n) % n] as readonly [number, number];
  for (let i = 0; i < n; i++) {
    if (p(i)[0] === p(i + 1)[0] && p(i)[1] === p(i + 1)[1]) return false;
    // Adjacent edges may only share their common vertex: no fold-back.
    if (sign(p(i), p(i + 1), p(i + 2)) === 0) {
      const back = (p(i)[0] - p(i + 1)[0]) * (p(i + 2)[0] - p(i + 1)[0]) + (p(i)[1] - p(i + 1)[1]) * (p(i + 2)[1] - p(i + 1)[1]);
      if (back > 0) return false;
    }
    for (let j = i + 2; j < n; j++) {
      if (i === 0 && j === n - 1) continue;
      if (meet(p(i), p(i + 1), p(j), p(j + 1))) return false;
    }
  }
  return n >= 3;
}

describe('isSimpleContour (exact sweep)', () => {
  it('accepts simple polygons and rejects the classic failures', () => {
    expect(isSimpleContour(polygon([[0, 0], [1, 0], [1, 1], [0, 1]]))).toBe(true);
    expect(isSimpleContour(polygon([[0, 0], [2, 0], [2, 1], [1, 1], [1, 2], [0, 2]]))).toBe(true);
    // Bow-tie: edges 0 and 2 cross.
    expect(findSelfIntersection(polygon([[0, 0], [1, 1], [1, 0], [0, 1]]))).toEqual([0, 2]);
    // A vertex touching another edge's interior.
    expect(isSimpleContour(polygon([[0, 0], [4, 0], [4, 4], [2, 0], [0, 4]]))).toBe(false);
    // A vertex visited twice.
    expect(isSimpleContour(polygon([[0, 0], [2, 0], [1, 1], [2, 2], [0, 2], [1, 1]]))).toBe(false);
    // Collinear overlap of non-adjacent edges.
    expect(isSimpleContour(polygon([[0, 0], [3, 0], [3, 1], [2, 1], [2, 0], [1, 0], [1, 1], [0, 1]]))).toBe(false);
    // Zero-length edge and fold-back of adjacent edges.
    expect(findSelfIntersection(polygon([[0, 0], [1, 0], [1, 0], [0, 1]]))).toEqual([1, 1]);
    expect(isSimpleContour(polygon([[0, 0], [2, 0], [1, 0], [0, 1]]))).toBe(false);
    // Degenerate triangle, too few vertices, non-finite coordinates.
    expect(isSimpleContour(polygon([[0, 0], [1, 1], [2, 2]]))).toBe(false);
    expect(isSimpleContour(polygon([[0, 0], [1, 1]]))).toBe(false);
    expect(isSimpleContour(polygon([[0, 0], [1, Number.NaN], [0, 1]]))).toBe(false);
  });

  it('needs exact arithmetic: a vertex a hair off a long edge', () => {
    // 0.1 + 0.2 style rounding: the point (0.5, 0.5 + 2⁻⁵³·k) against the diagonal of the unit square.
    const eps = 2 ** -52;
    expect(isSimpleContour(polygon([[0, 0], [1, 1], [0.5, 0.5 + eps], [0, 1]]))).toBe(true);
    expect(isSimpleContour(polygon([[0, 0], [1, 1], [0.5, 0.5], [0, 1]]))).toBe(false);
    expect(isSimpleContour(polygon([[0, 0], [1, 1], [0.5, 0.5 - eps], [0, 1]]))).toBe(false);
  });

  it('a pentagram is not simple, a regular pentagon is', () => {
    const pentagon = synthesizeContour({ family: 'radial', baseRadius: 1, terms: [] }, 5);
    const pentagram = polygon(Array.from({ length: 5 }, (_, i): [number, number] => [Math.cos((4 * Math.PI * i) / 5), Math.sin((4 * Math.PI * i) / 5)]));
    expect(isSimpleContour(pentagon)).toBe(true);
    expect(isSimpleContour(pentagram)).toBe(false);
  });

  it('agrees with a brute-force exact check on random small polygons', () => {
    // Small integer grids make touching, collinear and repeated-vertex cases common.
    const points = fc.array(fc.tuple(fc.integer({ min: 0, max: 6 }), fc.integer({ min: 0, max: 6 })), { minLength: 3, maxLength: 9 });
    fc.assert(
      fc.property(points, (pts) => {
        expect(isSimpleContour(polygon(pts))).toBe(bruteForceSimple(pts));
      }),
      { seed: PROPERTY_SEED, numRuns: 3000 },
    );
  });

  it('agrees with the brute force on random star polygons with a crossing spliced in', () => {
    const star = fc.array(fc.double({ min: 0.3, max: 2, noNaN: true }), { minLength: 8, maxLength: 40 });
    fc.assert(
      fc.property(star, fc.nat(), fc.boolean(), (radii, swap, doSwap) => {
        const pts = radii.map((r, i): [number, number] => [r * Math.cos((2 * Math.PI * i) / radii.length), r * Math.sin((2 * Math.PI * i) / radii.length)]);
        if (doSwap) {
          const i = swap % pts.length;
          const j = (i + 3) % pts.length;
          [pts[i], pts[j]] = [pts[j] as [number, number], pts[i] as [number, number]];
        }
        expect(isSimpleContour(polygon(pts))).toBe(bruteForceSimple(pts));
      }),
      { seed: PROPERTY_SEED, numRuns: 500 },
    );
  });

  it('handles 8192-vertex synthesised contours', () => {
    const contour = synthesizeContour({ family: 'radial', baseRadius: 1, terms: [{ k: 7, amplitude: 0.2, phase: 0 }] }, 8192);
    expect(isSimpleContour(contour)).toBe(true);
    const looped = synthesizeContour({ family: 'complex', terms: [{ k: 1, re: 1, im: 0 }, { k: -3, re: 0.5, im: 0 }] }, 8192, { checkSimple: false });
    expect(isSimpleContour(looped)).toBe(false);
  });
});
