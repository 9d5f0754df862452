import type { Contour, ShapeDescriptor } from '@/lib/shape';
import type { SpaceAxis, SpaceDefinition, SpaceLayout } from '@/lib/space';

/** Fixed seeds keep every property run reproducible. */
export const PROPERTY_SEED = 20_260_601;

export const TREFOIL: ShapeDescriptor = { family: 'radial', baseRadius: 1, terms: [{ k: 3, amplitude: 0.1, phase: 0 }] };

export const BEAN: ShapeDescriptor = {
  family: 'elliptic',
  center: [0, 0],
  terms: [
    { n: 1, a: 1.2, b: 0, c: 0, d: 0.8 },
    { n: 2, a: 0, b: 0.05, c: 0.22, d: 0 },
    { n: 3, a: 0.04, b: 0, c: 0, d: 0.03 },
  ],
};

export const COMMA: ShapeDescriptor = {
  family: 'complex',
  terms: [
    { k: 1, re: 1, im: 0 },
    { k: -1, re: 0.18, im: 0.05 },
    { k: 2, re: 0.1, im: -0.06 },
    { k: -2, re: 0.05, im: 0 },
  ],
};

export const amplitudeAxis = (harmonic: number, delta: number, label = `k = ${harmonic}`): SpaceAxis => ({ label, changes: [{ harmonic, field: 'amplitude', delta }] });

/** A radial space: Axis A adds amplitude to k = 2, Axis B to k = 4 (unequal rates, so it is anisotropic). */
export function radialSpace(layout: SpaceLayout, overrides: Partial<SpaceDefinition> = {}): SpaceDefinition {
  return {
    seed: TREFOIL,
    axes: [amplitudeAxis(2, 0.1), amplitudeAxis(4, 0.03)],
    extent: 1,
    layout,
    normalization: { scale: 'equal-area-radius', centroid: true },
    ...overrides,
  };
}

/** An elliptic space around the bean. */
export function ellipticSpace(layout: SpaceLayout, overrides: Partial<SpaceDefinition> = {}): SpaceDefinition {
  return {
    seed: BEAN,
    axes: [
      { label: 'a2', changes: [{ harmonic: 2, field: 'a', delta: 0.08 }] },
      { label: 'd3', changes: [{ harmonic: 3, field: 'd', delta: 0.04 }] },
    ],
    extent: 1,
    layout,
    normalization: { scale: 'equal-area-radius', centroid: true },
    ...overrides,
  };
}

export function rotateContour(contour: Contour, angle: number, dx = 0, dy = 0): Contour {
  const c = Math.cos(angle);
  const s = Math.sin(angle);
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

/** Freezes a value and everything in it, so a test fails if a function writes into its input. */
export function deepFreeze<T>(value: T): T {
  if (value && typeof value === 'object' && !ArrayBuffer.isView(value)) {
    for (const inner of Object.values(value)) deepFreeze(inner);
    Object.freeze(value);
  }
  return value;
}
