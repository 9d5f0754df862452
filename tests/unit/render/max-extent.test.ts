import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { contourMaxExtent } from '@/lib/render';
import { synthesizeContour, type Contour } from '@/lib/shape';

/** The definition: the largest distance over every pair of vertices, O(N²). */
function allPairsMaxExtent({ x, y }: Contour): number {
  let best = 0;
  for (let i = 0; i < x.length; i++) {
    for (let j = i + 1; j < x.length; j++) {
      const dx = (x[j] as number) - (x[i] as number);
      const dy = (y[j] as number) - (y[i] as number);
      best = Math.max(best, dx * dx + dy * dy);
    }
  }
  return Math.sqrt(best);
}

const contour = (points: readonly (readonly [number, number])[]): Contour => ({ x: Float64Array.from(points, (p) => p[0]), y: Float64Array.from(points, (p) => p[1]) });

describe('contourMaxExtent (rotating calipers on the hull)', () => {
  it('equals the all-pairs maximum exactly on seeded random point sets', () => {
    // Lattice values give exact ties and collinear runs; subnormal magnitudes are left out (the hull's
    // orientation test underflows there, a limit of lib/shape's hull, not of the calipers).
    const coordinate = fc.oneof(fc.integer({ min: -50, max: 50 }).map((k) => k / 5), fc.double({ min: -10, max: 10, noNaN: true }).filter((v) => v === 0 || Math.abs(v) > 1e-6));
    fc.assert(
      fc.property(fc.array(fc.tuple(coordinate, coordinate), { minLength: 2, maxLength: 80 }), (points) => {
        const c = contour(points);
        expect(contourMaxExtent(c)).toBe(allPairsMaxExtent(c));
      }),
      { seed: 20_260_601, numRuns: 400 },
    );
  });

  it('equals it on smooth outlines, regular polygons (many near-ties) and grid points (exact ties, collinear runs)', () => {
    const shapes: Contour[] = [];
    for (const samples of [3, 4, 5, 64, 512, 1001]) shapes.push(synthesizeContour({ family: 'radial', baseRadius: 1, terms: [] }, samples));
    for (let k = 2; k <= 6; k++) shapes.push(synthesizeContour({ family: 'radial', baseRadius: 1, terms: [{ k, amplitude: 0.1, phase: k / 3 }] }, 512));
    const grid: [number, number][] = [];
    for (let i = 0; i < 7; i++) for (let j = 0; j < 5; j++) grid.push([i, j]);
    shapes.push(contour(grid), contour([[0, 0], [1, 0], [2, 0], [3, 0]]), contour([[1, 1], [1, 1], [1, 1]]));
    for (const c of shapes) expect(contourMaxExtent(c)).toBe(allPairsMaxExtent(c));
  });

  it('gives the known diameters: 2r for a circle sampled at an even count, 5 for a 3-4-5 triangle', () => {
    expect(contourMaxExtent(synthesizeContour({ family: 'radial', baseRadius: 1.5, terms: [] }, 256))).toBeCloseTo(3, 12);
    expect(contourMaxExtent(contour([[0, 0], [4, 0], [0, 3]]))).toBe(5);
  });
});
