import { describe, expect, it } from 'vitest';
import {
  correspondingPointDistance,
  procrustesDistance,
  rasterizeContour,
  shapeDistance,
  silhouetteDistance,
  synthesizeContour,
} from '@/lib/shape';
import { polygon, rotateContour, shiftStart } from './support';

const blob = synthesizeContour({ family: 'radial', baseRadius: 1, terms: [{ k: 2, amplitude: 0.1, phase: 0.3 }, { k: 3, amplitude: 0.08, phase: 1 }] }, 256);
const circleOf = (r: number) => synthesizeContour({ family: 'radial', baseRadius: r, terms: [] }, 1024);

describe('corresponding-point distance', () => {
  it('is zero after a rigid motion', () => {
    expect(shapeDistance(blob, rotateContour(blob, 1.2, 1, 5, -3), 'corresponding-points')).toBeLessThan(1e-12);
  });

  it('measures a size change: circles of radius 1 and 2 are 1 apart on average', () => {
    // Derived: concentric circles with corresponding samples are r2 − r1 apart everywhere.
    expect(correspondingPointDistance(circleOf(1), circleOf(2))).toBeCloseTo(1, 12);
  });

  it('finds a shifted start point only when asked', () => {
    const shifted = shiftStart(blob, 40);
    expect(correspondingPointDistance(blob, shifted)).toBeGreaterThan(0.01);
    expect(correspondingPointDistance(blob, shifted, { matchStart: true })).toBeLessThan(1e-12);
  });
});

describe('Procrustes distance', () => {
  it('equilateral vs collinear triangle is 1/√2', () => {
    // Kendall 1984 shape sphere for triangles: equilateral triangles sit at the poles, collinear ones on the
    // equator, a quarter great circle away (ρ = π/4, full Procrustes distance sin ρ = 1/√2).
    const equilateral = polygon([[1, 0], [-0.5, Math.sqrt(3) / 2], [-0.5, -Math.sqrt(3) / 2]]);
    const collinear = polygon([[-1, 0], [0, 0], [1, 0]]);
    expect(procrustesDistance(equilateral, collinear)).toBeCloseTo(Math.SQRT1_2, 14);
  });

  it('is zero for similar shapes and invariant to similarity transforms of either', () => {
    expect(shapeDistance(blob, rotateContour(blob, -2, 3.5, 1, 1), 'procrustes')).toBeLessThan(1e-7);
    const d = procrustesDistance(blob, synthesizeContour({ family: 'radial', baseRadius: 1, terms: [] }, 256));
    expect(d).toBeGreaterThan(0.01);
    expect(procrustesDistance(rotateContour(blob, 0.5, 2), synthesizeContour({ family: 'radial', baseRadius: 3, terms: [] }, 256))).toBeCloseTo(d, 12);
  });
});

describe('silhouette distance (1 − IoU on bitmasks)', () => {
  it('two unit squares overlapping by half: IoU 1/3, distance 2/3', () => {
    // Derived: intersection 1·2 = 2, union 6 for 2 × 2 squares offset by 1.
    const a = polygon([[0, 0], [2, 0], [2, 2], [0, 2]]);
    const b = polygon([[1, 0], [3, 0], [3, 2], [1, 2]]);
    expect(shapeDistance(a, b, 'silhouette', { resolution: 300 })).toBeCloseTo(2 / 3, 3);
    expect(shapeDistance(a, a, 'silhouette')).toBe(0);
  });

  it('concentric circles: 1 − r1²/r2²', () => {
    // Derived: IoU of nested discs is the area ratio (1/2)² = 1/4.
    const extent = { minX: -2.1, minY: -2.1, size: 4.2 };
    const inner = rasterizeContour(circleOf(1), { resolution: 512, extent });
    const outer = rasterizeContour(circleOf(2), { resolution: 512, extent });
    expect(silhouetteDistance(inner, outer)).toBeCloseTo(0.75, 2);
  });

  it('disjoint shapes are at distance 1, and a raster holds the shape area', () => {
    const a = polygon([[0, 0], [1, 0], [1, 1], [0, 1]]);
    const b = polygon([[5, 5], [6, 5], [6, 6], [5, 6]]);
    expect(shapeDistance(a, b, 'silhouette')).toBe(1);
    // 4 × 4 square centred in an 8 × 8 extent at 64 pixels a side covers exactly 32² pixels.
    const mask = rasterizeContour(polygon([[-2, -2], [2, -2], [2, 2], [-2, 2]]), { resolution: 64, extent: { minX: -4, minY: -4, size: 8 } });
    let set = 0;
    for (const word of mask.bits) for (let bit = 0; bit < 32; bit++) set += (word >>> bit) & 1;
    expect(set).toBe(32 * 32);
    expect(mask.wordsPerRow).toBe(2);
  });
});
