import { polygonArea, polygonCentroid } from 'd3-polygon';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  contourArea,
  contourBoundingCircle,
  contourCentroid,
  contourCompactness,
  contourConvexHull,
  contourConvexity,
  contourEqualAreaDiameter,
  contourMoments,
  contourPerimeter,
  countCurvatureExtrema,
  descriptorMoments,
  isConvexContour,
  radialMinimumRadius,
  synthesizeContour,
  type RadialDescriptor,
} from '@/lib/shape';
import { polygon, PROPERTY_SEED } from './support';

const square = polygon([[0, 0], [1, 0], [1, 1], [0, 1]]);
const triangle = polygon([[0, 0], [4, 0], [0, 3]]);
const lShape = polygon([[0, 0], [2, 0], [2, 1], [1, 1], [1, 2], [0, 2]]);
const reversed = (c: ReturnType<typeof polygon>) => ({ x: c.x.slice().reverse(), y: c.y.slice().reverse() });

describe('shoelace area, centroid and perimeter', () => {
  it('unit square: A = 1 counter-clockwise, −1 clockwise, centroid (0.5, 0.5)', () => {
    // Shoelace (Gauss's area formula), signed: REFERENCES.md unit-square values.
    expect(contourArea(square)).toBe(1);
    expect(contourArea(reversed(square))).toBe(-1);
    expect(contourCentroid(square)).toEqual([0.5, 0.5]);
    expect(contourPerimeter(square)).toBe(4);
  });

  it('3-4-5 triangle: A = 6, centroid (4/3, 1), perimeter 12', () => {
    // REFERENCES.md: triangle (0,0),(4,0),(0,3) → A = 6, centroid (4/3, 1).
    expect(contourArea(triangle)).toBe(6);
    const [cx, cy] = contourCentroid(triangle);
    expect(cx).toBeCloseTo(4 / 3, 14);
    expect(cy).toBeCloseTo(1, 14);
    expect(contourPerimeter(triangle)).toBe(12);
  });

  it('L-shape: A = 3, centroid (5/6, 5/6), perimeter 8', () => {
    // REFERENCES.md L-shape values.
    expect(contourArea(lShape)).toBe(3);
    const [cx, cy] = contourCentroid(lShape);
    expect(cx).toBeCloseTo(5 / 6, 14);
    expect(cy).toBeCloseTo(5 / 6, 14);
    expect(contourPerimeter(lShape)).toBe(8);
    // The centroid does not depend on orientation.
    expect(contourCentroid(reversed(lShape))[0]).toBeCloseTo(5 / 6, 14);
  });

  it.each([3, 4, 6, 12, 100])('regular %d-gon in the unit circle: A = (N/2) sin(2π/N)', (n) => {
    // REFERENCES.md: (N/2)·sin(2π/N); N = 6 → 2.5980762114.
    const contour = synthesizeContour({ family: 'radial', baseRadius: 1, terms: [] }, n < 4 ? 3 : n);
    expect(contourArea(contour)).toBeCloseTo((n / 2) * Math.sin((2 * Math.PI) / n), 13);
    if (n === 6) expect(contourArea(contour)).toBeCloseTo(2.5980762114, 10);
  });

  it('agrees with d3-polygon on random simple polygons', () => {
    // Independent implementation: d3-polygon's polygonArea (positive for clockwise in y-up coordinates,
    // as its docs assume a y-down frame) and polygonCentroid.
    const starPolygon = fc
      .array(fc.record({ angle: fc.double({ min: 0, max: 1, noNaN: true }), radius: fc.double({ min: 0.2, max: 5, noNaN: true }) }), {
        minLength: 3,
        maxLength: 60,
      })
      .map((vertices) => {
        const sorted = [...vertices].sort((p, q) => p.angle - q.angle);
        return sorted.map((v, i): [number, number] => {
          const theta = 2 * Math.PI * (i + v.angle) / sorted.length;
          return [3 + v.radius * Math.cos(theta), -7 + v.radius * Math.sin(theta)];
        });
      });
    fc.assert(
      fc.property(starPolygon, (points) => {
        const contour = polygon(points);
        const area = contourArea(contour);
        expect(Math.abs(area - -polygonArea(points))).toBeLessThan(1e-9 * (1 + Math.abs(area)));
        if (Math.abs(area) > 1e-6) {
          const [cx, cy] = contourCentroid(contour);
          const [dx, dy] = polygonCentroid(points);
          expect(Math.abs(cx - dx)).toBeLessThan(1e-7);
          expect(Math.abs(cy - dy)).toBeLessThan(1e-7);
        }
      }),
      { seed: PROPERTY_SEED, numRuns: 300 },
    );
  });
});

describe('compactness, equal-area diameter, bounding circle, convexity', () => {
  it('compactness 4πA/P²: π/4 for a square, → 1 for a fine circle', () => {
    // Isoperimetric quotient; square → π/4 (derived).
    expect(contourCompactness(square)).toBeCloseTo(Math.PI / 4, 14);
    const circle = synthesizeContour({ family: 'radial', baseRadius: 1, terms: [] }, 4096);
    expect(contourCompactness(circle)).toBeGreaterThan(0.999999);
    expect(contourCompactness(circle)).toBeLessThan(1);
  });

  it('equal-area diameter 2√(A/π)', () => {
    // Derived: a unit-area shape has equal-area diameter 2/√π.
    expect(contourEqualAreaDiameter(square)).toBeCloseTo(2 / Math.sqrt(Math.PI), 14);
  });

  it('smallest enclosing circle', () => {
    // Thales: a right triangle's smallest enclosing circle has the hypotenuse as diameter (2, 1.5), r = 2.5.
    const circle = contourBoundingCircle(triangle);
    expect(circle.center[0]).toBeCloseTo(2, 12);
    expect(circle.center[1]).toBeCloseTo(1.5, 12);
    expect(circle.radius).toBeCloseTo(2.5, 12);
    // Unit square: centre (0.5, 0.5), radius √2/2.
    expect(contourBoundingCircle(square).radius).toBeCloseTo(Math.SQRT1_2, 12);
    // An acute triangle: the circumcircle; equilateral of side 1 → R = 1/√3.
    const equilateral = polygon([[0, 0], [1, 0], [0.5, Math.sqrt(3) / 2]]);
    expect(contourBoundingCircle(equilateral).radius).toBeCloseTo(1 / Math.sqrt(3), 12);
  });

  it('convex hull, convexity and the convexity test', () => {
    expect(isConvexContour(square)).toBe(true);
    expect(isConvexContour(reversed(square))).toBe(true);
    expect(isConvexContour(lShape)).toBe(false);
    // L-shape hull is the unit... (0,0),(2,0),(2,1),(1,2),(0,2): area 3.5 (derived), so solidity 3/3.5.
    expect(contourArea(contourConvexHull(lShape))).toBeCloseTo(3.5, 14);
    expect(contourConvexity(lShape)).toBeCloseTo(3 / 3.5, 14);
    // A pentagram turns the same way at every vertex but winds twice: not convex.
    const pentagram = polygon(Array.from({ length: 5 }, (_, i): [number, number] => [Math.cos((4 * Math.PI * i) / 5), Math.sin((4 * Math.PI * i) / 5)]));
    expect(isConvexContour(pentagram)).toBe(false);
  });

  it('a radial-frequency component is convex iff A ≤ 1/(1 + ω²)', () => {
    // REFERENCES.md (derived from the curvature sign): ω = 3 → threshold 0.1.
    const rfShape = (amplitude: number): RadialDescriptor => ({ family: 'radial', baseRadius: 1, terms: [{ k: 3, amplitude, phase: 0 }] });
    expect(isConvexContour(synthesizeContour(rfShape(0.095), 2048))).toBe(true);
    expect(isConvexContour(synthesizeContour(rfShape(0.105), 2048))).toBe(false);
  });
});

describe('curvature extrema and minimum radius', () => {
  it('a single radial-frequency component of frequency k has 2k curvature extrema', () => {
    // Derived: κ(θ) ≈ (1 + (k² − 1)A cos kθ)/r0 to first order in A.
    for (const k of [2, 3, 5, 8]) {
      const descriptor: RadialDescriptor = { family: 'radial', baseRadius: 1, terms: [{ k, amplitude: 0.04, phase: 0.3 }] };
      expect(countCurvatureExtrema(descriptor)).toBe(2 * k);
      expect(countCurvatureExtrema(synthesizeContour(descriptor, 1024))).toBe(2 * k);
    }
  });

  it('an ellipse has 4 curvature extrema and a circle none', () => {
    // Four-vertex theorem: the ellipse's vertices are its only curvature extrema.
    expect(countCurvatureExtrema({ family: 'elliptic', center: [0, 0], terms: [{ n: 1, a: 2, b: 0, c: 0, d: 1 }] })).toBe(4);
    expect(countCurvatureExtrema({ family: 'elliptic', center: [0, 0], terms: [{ n: 1, a: 1, b: 0, c: 0, d: 1 }] })).toBe(0);
  });

  it('minimum radius of a radial descriptor, even when Σ|A_k| ≥ 1', () => {
    // Derived: r = 1 + 0.6c + 0.45(2c² − 1) with c = cos 3θ is lowest at c = −1/3, where r = 0.45.
    const descriptor: RadialDescriptor = {
      family: 'radial',
      baseRadius: 1,
      terms: [{ k: 3, amplitude: 0.6, phase: 0 }, { k: 6, amplitude: 0.45, phase: 0 }],
    };
    const minimum = radialMinimumRadius(descriptor);
    expect(minimum.radius).toBeCloseTo(0.45, 12);
    expect(Math.cos(3 * minimum.angle)).toBeCloseTo(-1 / 3, 6);
    expect(minimum.lowerBound).toBeLessThanOrEqual(minimum.radius);
    // A single component: r_min = r0(1 − A) at the troughs.
    expect(radialMinimumRadius({ family: 'radial', baseRadius: 2, terms: [{ k: 4, amplitude: 0.3, phase: 0 }] }).radius).toBeCloseTo(1.4, 12);
  });
});

describe('area moments', () => {
  it('unit square: central second moments 1/12, third moments 0', () => {
    // ∫∫ (x − ½)² dA over the unit square = 1/12 (derived).
    const m = contourMoments(square);
    expect(m.xx).toBeCloseTo(1 / 12, 14);
    expect(m.yy).toBeCloseTo(1 / 12, 14);
    expect(m.xy).toBeCloseTo(0, 14);
    expect(m.xxx).toBeCloseTo(0, 14);
  });

  it('descriptor moments of an ellipse: πa³b/4 and πab³/4', () => {
    // Second moments of an ellipse about its centre (derived): ∫∫x² dA = πa³b/4.
    const m = descriptorMoments({ family: 'elliptic', center: [3, -1], terms: [{ n: 1, a: 2, b: 0, c: 0, d: 1 }] });
    expect(m.area).toBeCloseTo(2 * Math.PI, 12);
    expect(m.centroid[0]).toBeCloseTo(3, 12);
    expect(m.centroid[1]).toBeCloseTo(-1, 12);
    expect(m.xx).toBeCloseTo((Math.PI * 8) / 4, 12);
    expect(m.yy).toBeCloseTo((Math.PI * 2) / 4, 12);
  });

  it('polygon moments of a dense synthesis approach the descriptor moments', () => {
    const descriptor: RadialDescriptor = { family: 'radial', baseRadius: 1, terms: [{ k: 2, amplitude: 0.1, phase: 0.4 }, { k: 3, amplitude: 0.08, phase: 1 }] };
    const exact = descriptorMoments(descriptor);
    const sampled = contourMoments(synthesizeContour(descriptor, 8192));
    for (const key of ['area', 'xx', 'xy', 'yy', 'xxx', 'xxy', 'xyy', 'yyy'] as const) {
      expect(Math.abs(sampled[key] - exact[key])).toBeLessThan(1e-6);
    }
  });
});
