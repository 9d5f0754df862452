import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  BOUNDARY_LIMITS,
  BoundaryError,
  boundaryNormal,
  normalizeBoundaryAngle,
  sideOf,
  signedDistance,
  snapToSpokes,
  type BoundaryErrorCode,
} from '@/lib/boundary';

const PROPERTY_SEED = 20_261_202;
const TOLERANCE = 1e-12;

function expectBoundaryError(run: () => unknown, code: BoundaryErrorCode): void {
  try {
    run();
  } catch (error) {
    expect(error).toBeInstanceOf(BoundaryError);
    expect((error as BoundaryError).code).toBe(code);
    return;
  }
  throw new Error(`expected a BoundaryError '${code}'`);
}

const angle = fc.double({ min: 0, max: 179.999, noNaN: true });
const coordinate = fc.double({ min: -10, max: 10, noNaN: true });

describe('boundaryNormal', () => {
  it.each([
    [0, 0, 1],
    [90, -1, 0],
    [45, -Math.SQRT1_2, Math.SQRT1_2],
    [135, -Math.SQRT1_2, -Math.SQRT1_2],
  ])('θ = %s° → (%s, %s), the direction θ + 90°', (theta, a, b) => {
    const normal = boundaryNormal(theta);
    expect(normal.a).toBeCloseTo(a, 12);
    expect(normal.b).toBeCloseTo(b, 12);
  });

  it('θ = 0 is exactly (0, 1), without a negative zero', () => {
    expect(boundaryNormal(0)).toEqual({ a: 0, b: 1 });
    expect(Object.is(boundaryNormal(0).a, 0)).toBe(true);
  });

  it('is a unit vector perpendicular to the boundary direction (seeded)', () => {
    fc.assert(
      fc.property(angle, (theta) => {
        const n = boundaryNormal(theta);
        const along = { a: Math.cos((theta * Math.PI) / 180), b: Math.sin((theta * Math.PI) / 180) };
        return Math.abs(Math.hypot(n.a, n.b) - 1) < TOLERANCE && Math.abs(n.a * along.a + n.b * along.b) < TOLERANCE;
      }),
      { seed: PROPERTY_SEED, numRuns: 200 },
    );
  });

  it.each([-1, 180, 180.5, 360, Number.NaN, Number.POSITIVE_INFINITY, -0.000001])('refuses the angle %s', (theta) => {
    expectBoundaryError(() => boundaryNormal(theta), 'angle-out-of-range');
  });
});

describe('signedDistance and sideOf on known points', () => {
  it('θ = 0: the boundary is the a axis, the normal +b', () => {
    const boundary = { angleDeg: 0 };
    expect(signedDistance({ a: 0, b: 1 }, boundary)).toBe(1);
    expect(signedDistance({ a: 0, b: -2.5 }, boundary)).toBe(-2.5);
    expect(signedDistance({ a: 7, b: 0 }, boundary)).toBe(0);
    expect(sideOf({ a: 0, b: 1 }, boundary)).toBe('A');
    expect(sideOf({ a: 3, b: -0.1 }, boundary)).toBe('B');
    expect(sideOf({ a: -3, b: 0 }, boundary)).toBe('on');
  });

  it('θ = 90°: the boundary is the b axis, the normal −a', () => {
    const boundary = { angleDeg: 90 };
    expect(signedDistance({ a: -1, b: 0 }, boundary)).toBeCloseTo(1, 12);
    expect(signedDistance({ a: 2, b: 5 }, boundary)).toBeCloseTo(-2, 12);
    expect(sideOf({ a: -1, b: 0 }, boundary)).toBe('A');
    // cos 90° is 6e-17, not 0: the point (0, 1) still counts as on the boundary.
    expect(sideOf({ a: 0, b: 1 }, boundary)).toBe('on');
  });

  it('θ = 45°: (−1, 1) is √2 away on side A, (1, 1) on the boundary', () => {
    const boundary = { angleDeg: 45 };
    expect(signedDistance({ a: -1, b: 1 }, boundary)).toBeCloseTo(Math.SQRT2, 12);
    expect(sideOf({ a: 1, b: 1 }, boundary)).toBe('on');
    expect(sideOf({ a: 1, b: -1 }, boundary)).toBe('B');
  });

  it('flags points within the tolerance as on, and honours a custom tolerance', () => {
    const boundary = { angleDeg: 0 };
    expect(sideOf({ a: 0, b: BOUNDARY_LIMITS.onTolerance / 2 }, boundary)).toBe('on');
    expect(sideOf({ a: 0, b: BOUNDARY_LIMITS.onTolerance * 2 }, boundary)).toBe('A');
    expect(sideOf({ a: 0, b: 0.05 }, boundary, 0.1)).toBe('on');
    expect(sideOf({ a: 0, b: 1e-12 }, boundary, 0)).toBe('A');
    expectBoundaryError(() => sideOf({ a: 0, b: 0 }, boundary, -1), 'invalid-argument');
    expectBoundaryError(() => sideOf({ a: 0, b: 0 }, boundary, Number.NaN), 'invalid-argument');
  });

  it('refuses a bad angle', () => {
    expectBoundaryError(() => signedDistance({ a: 0, b: 0 }, { angleDeg: 180 }), 'angle-out-of-range');
    expectBoundaryError(() => sideOf({ a: 0, b: 0 }, { angleDeg: Number.NaN }), 'angle-out-of-range');
  });
});

describe('signedDistance symmetries (seeded)', () => {
  it('is odd under point reflection through the centre: d(−p) = −d(p)', () => {
    fc.assert(
      fc.property(angle, coordinate, coordinate, (theta, a, b) => {
        const boundary = { angleDeg: theta };
        return Math.abs(signedDistance({ a: -a, b: -b }, boundary) + signedDistance({ a, b }, boundary)) < TOLERANCE;
      }),
      { seed: PROPERTY_SEED, numRuns: 300 },
    );
  });

  it('is linear: d(p + q) = d(p) + d(q), and d(k·p) = k·d(p)', () => {
    fc.assert(
      fc.property(angle, coordinate, coordinate, coordinate, coordinate, (theta, a1, b1, a2, b2) => {
        const boundary = { angleDeg: theta };
        const sum = signedDistance({ a: a1 + a2, b: b1 + b2 }, boundary);
        const parts = signedDistance({ a: a1, b: b1 }, boundary) + signedDistance({ a: a2, b: b2 }, boundary);
        const scaled = signedDistance({ a: 3 * a1, b: 3 * b1 }, boundary);
        return Math.abs(sum - parts) < 1e-9 && Math.abs(scaled - 3 * signedDistance({ a: a1, b: b1 }, boundary)) < 1e-9;
      }),
      { seed: PROPERTY_SEED, numRuns: 300 },
    );
  });

  it('is zero along the boundary direction and ±ρ along the normal', () => {
    fc.assert(
      fc.property(angle, fc.double({ min: -5, max: 5, noNaN: true }), (theta, rho) => {
        const radians = (theta * Math.PI) / 180;
        const boundary = { angleDeg: theta };
        const along = signedDistance({ a: rho * Math.cos(radians), b: rho * Math.sin(radians) }, boundary);
        const n = boundaryNormal(theta);
        const across = signedDistance({ a: rho * n.a, b: rho * n.b }, boundary);
        return Math.abs(along) < 1e-9 && Math.abs(across - rho) < 1e-9;
      }),
      { seed: PROPERTY_SEED, numRuns: 300 },
    );
  });

  it('is bounded by the distance from the centre: |d(p)| ≤ |p|', () => {
    fc.assert(
      fc.property(angle, coordinate, coordinate, (theta, a, b) => Math.abs(signedDistance({ a, b }, { angleDeg: theta })) <= Math.hypot(a, b) + TOLERANCE),
      { seed: PROPERTY_SEED, numRuns: 300 },
    );
  });

  it('reflecting the point across the boundary swaps sides A and B', () => {
    fc.assert(
      fc.property(angle, coordinate, coordinate, (theta, a, b) => {
        const boundary = { angleDeg: theta };
        const n = boundaryNormal(theta);
        const d = signedDistance({ a, b }, boundary);
        const mirrored = { a: a - 2 * d * n.a, b: b - 2 * d * n.b };
        const side = sideOf({ a, b }, boundary, 1e-6);
        const other = sideOf(mirrored, boundary, 1e-6);
        return side === 'on' ? other === 'on' : other === (side === 'A' ? 'B' : 'A');
      }),
      { seed: PROPERTY_SEED, numRuns: 300 },
    );
  });
});

describe('snapToSpokes', () => {
  it.each([
    [10, 8, 0],
    [30, 8, 45],
    [22.5, 8, 45],
    [170, 8, 0],
    [100, 4, 90],
    [40, 4, 0],
    [50, 4, 90],
    [70, 3, 60],
    [170, 3, 0],
    [100, 3, 120],
    [89, 1, 0],
    [91, 1, 0],
    [179.9, 2, 0],
    [50, 12, 60],
  ])('%s° with %s spokes → %s°', (theta, spokes, snapped) => {
    expect(snapToSpokes(theta, spokes)).toBeCloseTo(snapped, 12);
  });

  it('lands on a diameter through a spoke, always in [0, 180) (seeded)', () => {
    fc.assert(
      fc.property(angle, fc.integer({ min: 1, max: 36 }), (theta, spokes) => {
        const snapped = snapToSpokes(theta, spokes);
        const throughSpoke = Array.from({ length: spokes }, (_, s) => (360 * s) / spokes).some((spoke) => {
          const gap = Math.abs(((spoke - snapped) % 180) + 180) % 180;
          return gap < 1e-9 || 180 - gap < 1e-9;
        });
        return snapped >= 0 && snapped < 180 && throughSpoke;
      }),
      { seed: PROPERTY_SEED, numRuns: 300 },
    );
  });

  it('refuses a bad angle or spoke count', () => {
    expectBoundaryError(() => snapToSpokes(180, 8), 'angle-out-of-range');
    expectBoundaryError(() => snapToSpokes(10, 0), 'invalid-argument');
    expectBoundaryError(() => snapToSpokes(10, 2.5), 'invalid-argument');
  });
});

describe('normalizeBoundaryAngle', () => {
  it.each([
    [0, 0],
    [180, 0],
    [190, 10],
    [-10, 170],
    [359, 179],
    [-0, 0],
    [540, 0],
    [-5e-324, 0],
    [-1e-15, 0],
  ])('%s° → %s°', (input, output) => {
    expect(normalizeBoundaryAngle(input)).toBeCloseTo(output, 12);
    expect(normalizeBoundaryAngle(input)).toBeGreaterThanOrEqual(0);
    expect(normalizeBoundaryAngle(input)).toBeLessThan(180);
  });

  it('gives the same line: the normal turns by 0° or 180°, never another angle (seeded)', () => {
    fc.assert(
      fc.property(fc.double({ min: -1000, max: 1000, noNaN: true }), (theta) => {
        const wrapped = normalizeBoundaryAngle(theta);
        const n = boundaryNormal(wrapped);
        const radians = ((theta + 90) * Math.PI) / 180;
        const cross = n.a * Math.sin(radians) - n.b * Math.cos(radians);
        return wrapped >= 0 && wrapped < 180 && Math.abs(cross) < 1e-9;
      }),
      { seed: PROPERTY_SEED, numRuns: 300 },
    );
  });

  it('refuses NaN and Infinity', () => {
    expectBoundaryError(() => normalizeBoundaryAngle(Number.NaN), 'angle-out-of-range');
    expectBoundaryError(() => normalizeBoundaryAngle(Number.NEGATIVE_INFINITY), 'angle-out-of-range');
  });
});
