import fc from 'fast-check';
import type { Contour, EllipticDescriptor, RadialDescriptor } from '@/lib/shape';

/** Fixed seeds keep every property run reproducible. */
export const PROPERTY_SEED = 20_260_412;

export function maxAbsDifference(a: Float64Array, b: Float64Array): number {
  let max = 0;
  for (let i = 0; i < a.length; i++) max = Math.max(max, Math.abs((a[i] as number) - (b[i] as number)));
  return a.length === b.length ? max : Infinity;
}

export function polygon(points: readonly (readonly [number, number])[]): Contour {
  return { x: Float64Array.from(points, (p) => p[0]), y: Float64Array.from(points, (p) => p[1]) };
}

export function rotateContour(contour: Contour, angle: number, scale = 1, dx = 0, dy = 0): Contour {
  const c = Math.cos(angle) * scale;
  const s = Math.sin(angle) * scale;
  return {
    x: contour.x.map((x, i) => x * c - (contour.y[i] as number) * s + dx),
    y: contour.x.map((x, i) => x * s + (contour.y[i] as number) * c + dy),
  };
}

export function shiftStart(contour: Contour, by: number): Contour {
  const n = contour.x.length;
  return {
    x: Float64Array.from({ length: n }, (_, i) => contour.x[(i + by) % n] as number),
    y: Float64Array.from({ length: n }, (_, i) => contour.y[(i + by) % n] as number),
  };
}

export function allFinite(values: Iterable<number>): boolean {
  for (const v of values) if (!Number.isFinite(v)) return false;
  return true;
}

/** Smooth random radial shapes, Σ|A_k| ≤ 0.45 so r > 0 with room to spare, with no rotational symmetry (k = 2 and 3 present). */
export const smoothRadialArbitrary: fc.Arbitrary<RadialDescriptor> = fc
  .record({
    baseRadius: fc.double({ min: 0.5, max: 3, noNaN: true }),
    a2: fc.double({ min: 0.04, max: 0.12, noNaN: true }),
    a3: fc.double({ min: 0.04, max: 0.12, noNaN: true }),
    extra: fc.array(fc.record({ k: fc.integer({ min: 4, max: 8 }), amplitude: fc.double({ min: 0, max: 0.03, noNaN: true }), phase: fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }) }), { maxLength: 3 }),
    p2: fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }),
    p3: fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }),
  })
  .map(({ baseRadius, a2, a3, extra, p2, p3 }) => {
    const byK = new Map<number, { k: number; amplitude: number; phase: number }>();
    for (const t of extra) byK.set(t.k, t);
    return {
      family: 'radial' as const,
      baseRadius,
      terms: [{ k: 2, amplitude: a2, phase: p2 }, { k: 3, amplitude: a3, phase: p3 }, ...byK.values()],
    };
  });

/** Random elliptic descriptors near an eccentric ellipse (b/a ≤ 0.8), small higher harmonics: simple and asymmetric. */
export const ellipticArbitrary: fc.Arbitrary<EllipticDescriptor> = fc
  .record({
    a: fc.double({ min: 1, max: 2, noNaN: true }),
    ratio: fc.double({ min: 0.4, max: 0.8, noNaN: true }),
    tilt: fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }),
    start: fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }),
    cx: fc.double({ min: -5, max: 5, noNaN: true }),
    cy: fc.double({ min: -5, max: 5, noNaN: true }),
    higher: fc.array(fc.double({ min: -0.04, max: 0.04, noNaN: true }), { minLength: 12, maxLength: 12 }),
  })
  .map(({ a, ratio, tilt, start, cx, cy, higher }) => {
    const b = a * ratio;
    // First harmonic: an ellipse with semi-axes a, b, tilted and started anywhere.
    const ct = Math.cos(tilt), st = Math.sin(tilt), cs = Math.cos(start), ss = Math.sin(start);
    // x = a·cos(tilt)·cos(t+s) − b·sin(tilt)·sin(t+s), y = a·sin(tilt)·cos(t+s) + b·cos(tilt)·sin(t+s).
    const h = (i: number): number => higher[i] ?? 0;
    return {
      family: 'elliptic' as const,
      center: [cx, cy] as const,
      terms: [
        { n: 1, a: a * ct * cs - b * st * ss, b: -a * ct * ss - b * st * cs, c: a * st * cs + b * ct * ss, d: -a * st * ss + b * ct * cs },
        { n: 2, a: 0.1 + h(0), b: h(1), c: h(2), d: h(3) },
        { n: 3, a: h(4), b: h(5), c: h(6), d: h(7) },
        { n: 4, a: h(8), b: h(9), c: h(10), d: h(11) },
      ],
    };
  });
