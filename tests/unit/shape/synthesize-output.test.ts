import { describe, expect, it } from 'vitest';
import { synthesizeContour, type ShapeDescriptor } from '@/lib/shape';

const DESCRIPTORS: ShapeDescriptor[] = [
  { family: 'radial', baseRadius: 1, terms: [{ k: 3, amplitude: 0.1, phase: 0.2 }] },
  { family: 'radial', baseRadius: 1.2, terms: [1, 2, 3, 4, 5, 6].map((k) => ({ k, amplitude: 0.02, phase: k })) },
  { family: 'elliptic', center: [0.3, -0.2], terms: [{ n: 1, a: 1, b: 0, c: 0, d: 0.7 }, { n: 3, a: 0.05, b: 0, c: 0.02, d: 0.04 }] },
  { family: 'complex', terms: [{ k: 1, re: 1, im: 0 }, { k: -2, re: 0.1, im: 0.05 }] },
];

describe('synthesis into caller-owned arrays', () => {
  for (const method of ['direct', 'fft', 'exact', 'auto'] as const) {
    it(`writes the same samples as a fresh synthesis (${method})`, () => {
      for (const d of DESCRIPTORS) {
        const fresh = synthesizeContour(d, 256, { method, checkSimple: false });
        // Stale values in the buffer must not leak into the result.
        const output = { x: new Float64Array(256).fill(9), y: new Float64Array(256).fill(-9) };
        const written = synthesizeContour(d, 256, { method, checkSimple: false, output });
        expect(written.x).toBe(output.x);
        expect(Array.from(written.x)).toEqual(Array.from(fresh.x));
        expect(Array.from(written.y)).toEqual(Array.from(fresh.y));
      }
    });
  }

  it('refuses arrays of the wrong length', () => {
    expect(() => synthesizeContour(DESCRIPTORS[0]!, 256, { output: { x: new Float64Array(128), y: new Float64Array(128) } })).toThrow(/256 samples/);
  });
});
