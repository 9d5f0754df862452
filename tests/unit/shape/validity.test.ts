import { describe, expect, it } from 'vitest';
import {
  fitEllipticHarmonics,
  fitRadialHarmonics,
  normalizeEllipticHarmonics,
  parseCsvOutline,
  parseSvgOutline,
  ShapeError,
  synthesizeContour,
  validateDescriptor,
  type ShapeDescriptor,
  type ShapeErrorCode,
  type ShapeErrorDetails,
} from '@/lib/shape';
import { polygon } from './support';

/** Runs `action`, requires a ShapeError with `code`, and returns it for further checks. */
function expectShapeError(action: () => unknown, code: ShapeErrorCode, details: Partial<ShapeErrorDetails> = {}): ShapeError {
  let caught: unknown;
  try {
    action();
  } catch (error) {
    caught = error;
  }
  expect(caught).toBeInstanceOf(ShapeError);
  const error = caught as ShapeError;
  expect(error.code).toBe(code);
  expect(error.details).toMatchObject(details);
  return error;
}

const radial = (terms: { k: number; amplitude: number; phase: number }[], baseRadius = 1): ShapeDescriptor => ({ family: 'radial', baseRadius, terms });

describe('harmonics out of range', () => {
  it.each([
    ['radial k = 0', radial([{ k: 0, amplitude: 0.1, phase: 0 }]), 0],
    ['radial k = 129', radial([{ k: 129, amplitude: 0.1, phase: 0 }]), 129],
    ['radial k = −3', radial([{ k: -3, amplitude: 0.1, phase: 0 }]), -3],
    ['radial k = 2.5', radial([{ k: 2.5, amplitude: 0.1, phase: 0 }]), 2.5],
    ['elliptic n = 0', { family: 'elliptic', center: [0, 0], terms: [{ n: 0, a: 1, b: 0, c: 0, d: 1 }] } as ShapeDescriptor, 0],
    ['elliptic n = 200', { family: 'elliptic', center: [0, 0], terms: [{ n: 1, a: 1, b: 0, c: 0, d: 1 }, { n: 200, a: 0, b: 0, c: 0, d: 0.001 }] } as ShapeDescriptor, 200],
    ['complex k = −129', { family: 'complex', terms: [{ k: 1, re: 1, im: 0 }, { k: -129, re: 0.01, im: 0 }] } as ShapeDescriptor, -129],
  ])('%s is refused, naming the harmonic and its value', (_, descriptor, harmonic) => {
    const error = expectShapeError(() => synthesizeContour(descriptor, 1024), 'harmonic-out-of-range', { harmonic, value: harmonic });
    expect(error.message).toContain(String(harmonic));
    expectShapeError(() => validateDescriptor(descriptor), 'harmonic-out-of-range', { harmonic });
  });

  it('a repeated harmonic is refused', () => {
    expectShapeError(() => synthesizeContour(radial([{ k: 3, amplitude: 0.1, phase: 0 }, { k: 3, amplitude: 0.1, phase: 1 }]), 256), 'harmonic-duplicated', { harmonic: 3, termIndex: 1 });
  });

  it('fitting refuses harmonic counts outside 1…128', () => {
    const square = polygon([[0, 0], [1, 0], [1, 1], [0, 1]]);
    for (const count of [0, 129, 1.5, Number.NaN]) {
      expectShapeError(() => fitEllipticHarmonics(square, count), 'harmonic-out-of-range');
      expectShapeError(() => fitRadialHarmonics(square, count), 'harmonic-out-of-range');
    }
  });
});

describe('NaN and infinity', () => {
  it.each([
    ['amplitude', radial([{ k: 3, amplitude: Number.NaN, phase: 0 }]), 3, 'amplitude'],
    ['phase', radial([{ k: 4, amplitude: 0.1, phase: Number.POSITIVE_INFINITY }]), 4, 'phase'],
    ['elliptic d', { family: 'elliptic', center: [0, 0], terms: [{ n: 2, a: 1, b: 0, c: 0, d: Number.NEGATIVE_INFINITY }] } as ShapeDescriptor, 2, 'd'],
    ['complex im', { family: 'complex', terms: [{ k: 1, re: 1, im: Number.NaN }] } as ShapeDescriptor, 1, 'im'],
  ])('a non-finite %s is refused, naming the harmonic', (_, descriptor, harmonic, field) => {
    expectShapeError(() => synthesizeContour(descriptor, 256), 'not-finite', { harmonic, field });
  });

  it('non-finite base radius, centre and outline vertices are refused', () => {
    expectShapeError(() => synthesizeContour(radial([], Number.NaN), 256), 'not-finite', { field: 'baseRadius' });
    expectShapeError(() => synthesizeContour({ family: 'elliptic', center: [Number.NaN, 0], terms: [{ n: 1, a: 1, b: 0, c: 0, d: 1 }] }, 256), 'not-finite', { field: 'center[0]' });
    expectShapeError(() => fitEllipticHarmonics(polygon([[0, 0], [1, Number.POSITIVE_INFINITY], [0, 1]]), 4), 'not-finite', { vertex: 1 });
  });
});

describe('radius not positive (radial)', () => {
  it('r ≤ 0 somewhere raises an error naming the angle, the lowest radius and the harmonic', () => {
    // r = 1 + 1.2 cos 3θ is lowest at θ = π/3 (and every 2π/3), where r = −0.2 (derived).
    const error = expectShapeError(() => synthesizeContour(radial([{ k: 3, amplitude: 1.2, phase: 0 }]), 256), 'radius-not-positive', { harmonic: 3 });
    expect(error.details.value).toBeCloseTo(-0.2, 10);
    expect(Math.cos(3 * (error.details.angle ?? 0))).toBeCloseTo(-1, 10);
    expect(error.message).toMatch(/θ = /);
  });

  it('a zero or negative base radius is refused', () => {
    expectShapeError(() => synthesizeContour(radial([], 0), 64), 'radius-not-positive', { field: 'baseRadius', value: 0 });
    expectShapeError(() => synthesizeContour(radial([], -1), 64), 'radius-not-positive', { value: -1 });
  });

  it('a base radius whose area under- or overflows double precision is refused (found by the request fuzzer)', () => {
    expectShapeError(() => validateDescriptor(radial([], 5.8e-207)), 'degenerate-shape', { family: 'radial' });
    expectShapeError(() => validateDescriptor(radial([], 1e200)), 'degenerate-shape', { family: 'radial' });
    expect(() => validateDescriptor(radial([], 1e-6))).not.toThrow();
    expect(() => validateDescriptor(radial([], 1e6))).not.toThrow();
  });

  it('Σ|A_k| ≥ 1 with r > 0 everywhere is accepted (the dense-grid check decides)', () => {
    expect(() => validateDescriptor(radial([{ k: 3, amplitude: 0.6, phase: 0 }, { k: 6, amplitude: 0.45, phase: 0 }]))).not.toThrow();
  });

  it('a radius that only just touches zero is caught between grid points', () => {
    // r = 1 + cos(5θ + 0.1) reaches exactly 0 at 5θ + 0.1 = π, off every grid node.
    expectShapeError(() => validateDescriptor(radial([{ k: 5, amplitude: 1, phase: 0.1 }])), 'radius-not-positive', { harmonic: 5 });
  });
});

describe('self-intersecting elliptic and complex descriptors', () => {
  it('a looped epicycle is refused with the crossing parameters', () => {
    // z = e^{it} + 0.5 e^{−3it}: the retrograde term turns 3 × 0.5 > 1 times as fast, so the curve loops.
    const looped: ShapeDescriptor = { family: 'complex', terms: [{ k: 1, re: 1, im: 0 }, { k: -3, re: 0.5, im: 0 }] };
    const error = expectShapeError(() => synthesizeContour(looped, 1024), 'self-intersecting', { samples: 1024 });
    expect(error.details.edges).toHaveLength(2);
    expectShapeError(() => validateDescriptor(looped), 'self-intersecting');
    // The same check can be skipped when the caller has validated already.
    expect(() => synthesizeContour(looped, 1024, { checkSimple: false })).not.toThrow();
  });

  it('a figure-eight elliptic descriptor is refused', () => {
    // x = cos t, y = sin 2t / 2 crosses itself at the origin; a tiny first harmonic in y makes the area non-zero.
    const eight: ShapeDescriptor = { family: 'elliptic', center: [0, 0], terms: [{ n: 1, a: 1, b: 0, c: 0, d: 0.01 }, { n: 2, a: 0, b: 0, c: 0, d: 0.5 }] };
    expectShapeError(() => synthesizeContour(eight, 512), 'self-intersecting');
  });

  it('a descriptor with zero area is degenerate', () => {
    expectShapeError(() => synthesizeContour({ family: 'elliptic', center: [0, 0], terms: [{ n: 1, a: 1, b: 0, c: 1, d: 0 }] }, 256), 'degenerate-shape');
    expectShapeError(() => normalizeEllipticHarmonics({ family: 'elliptic', center: [0, 0], terms: [] }), 'degenerate-shape');
  });
});

describe('sample counts', () => {
  it('N below 4 × the highest harmonic aliases and is refused', () => {
    expectShapeError(() => synthesizeContour(radial([{ k: 20, amplitude: 0.01, phase: 0 }]), 64), 'too-few-samples', { harmonic: 20, samples: 64, minimum: 80 });
    expect(() => synthesizeContour(radial([{ k: 16, amplitude: 0.01, phase: 0 }]), 64)).not.toThrow();
  });

  it.each([2, 70_000, 100.5, Number.NaN])('N = %d is out of range', (samples) => {
    expectShapeError(() => synthesizeContour(radial([]), samples), 'samples-out-of-range');
  });

  it('the FFT path needs a power of two from 64 to 8192', () => {
    for (const samples of [32, 1000, 16_384]) expectShapeError(() => synthesizeContour(radial([]), samples, { method: 'fft' }), 'samples-out-of-range', { samples });
  });
});

describe('outlines', () => {
  it('too few points', () => {
    expectShapeError(() => fitEllipticHarmonics(polygon([[0, 0], [1, 1]]), 4), 'too-few-points');
    expectShapeError(() => parseCsvOutline('0,0\n1,1\n0,0'), 'too-few-points');
  });

  it('not star-shaped from the centroid: an error naming the edge and angle', () => {
    // A C-shape: rays from its centroid meet the outline more than once.
    const cShape = polygon([[0, 0], [3, 0], [3, 1], [1, 1], [1, 2], [3, 2], [3, 3], [0, 3]]);
    const error = expectShapeError(() => fitRadialHarmonics(cShape, 8), 'not-star-shaped');
    expect(error.details.vertex).toBeTypeOf('number');
    expect(error.details.angle).toBeTypeOf('number');
    // Elliptic fitting has no such limit.
    expect(() => fitEllipticHarmonics(cShape, 8)).not.toThrow();
  });

  it('an open SVG path is refused', () => {
    expectShapeError(() => parseSvgOutline('M0 0 L10 0 L10 10'), 'outline-not-closed');
  });

  it.each([
    ['two paths', '<svg><path d="M0 0L1 0L1 1Z"/><path d="M5 5L6 5L6 6Z"/></svg>'],
    ['no path', '<svg><g></g></svg>'],
    ['a transform', '<svg><g transform="scale(2)"><path d="M0 0L1 0L1 1Z"/></g></svg>'],
    ['a rect', '<svg><rect width="10" height="5"/></svg>'],
    ['two subpaths', 'M0 0L1 0L1 1Z M5 5L6 5L6 6Z'],
    ['script in the path data', 'M0 0L1 0<script>'],
  ])('SVG with %s is refused', (_, text) => {
    expectShapeError(() => parseSvgOutline(text), 'svg-parse');
  });

  it('CSV with a bad line names the line', () => {
    expectShapeError(() => parseCsvOutline('x,y\n0,0\n1,zero\n1,1\n'), 'csv-parse', { line: 3 });
    expectShapeError(() => parseCsvOutline('0,0\n1,0,5\n1,1\n'), 'csv-parse', { line: 2 });
    expectShapeError(() => parseCsvOutline('0,0\n1e999,0\n1,1\n'), 'not-finite', { line: 2 });
  });
});

describe('ShapeError', () => {
  it('is an Error with a stable code and plain-data details', () => {
    const error = new ShapeError('svg-parse', 'bad', { line: 3 });
    expect(error).toBeInstanceOf(Error);
    expect(error.name).toBe('ShapeError');
    expect(JSON.parse(JSON.stringify(error.details))).toEqual({ line: 3 });
  });
});
