import { getFftPlan } from './fft-plan';
import type { Contour, ShapeDescriptor } from './types';

interface Scratch {
  readonly spectrum: Float64Array;
  readonly signal: Float64Array;
}

const scratchBySize = new Map<number, Scratch>();

function getScratch(size: number): Scratch {
  let scratch = scratchBySize.get(size);
  if (!scratch) {
    scratch = { spectrum: new Float64Array(2 * size), signal: new Float64Array(2 * size) };
    scratchBySize.set(size, scratch);
  }
  return scratch;
}

/**
 * Adds the conjugate of c to bin k mod N of an interleaved spectrum. The synthesis sum Σ c_k e^{+2πijk/N} is
 * computed as the conjugate of a forward transform of the conjugated coefficients, which skips the 1/N pass
 * of fft.js's inverse transform.
 */
function addBin(spectrum: Float64Array, size: number, k: number, re: number, im: number): void {
  const bin = ((k % size) + size) % size;
  spectrum[2 * bin] = (spectrum[2 * bin] as number) + re;
  spectrum[2 * bin + 1] = (spectrum[2 * bin + 1] as number) - im;
}

/** Fills the spectrum of z(t) = x + iy, using the same coefficient rules as `toComplexHarmonics`. */
function fillSpectrum(descriptor: ShapeDescriptor, spectrum: Float64Array, size: number): void {
  if (descriptor.family === 'complex') {
    for (const { k, re, im } of descriptor.terms) addBin(spectrum, size, k, re, im);
  } else if (descriptor.family === 'elliptic') {
    addBin(spectrum, size, 0, descriptor.center[0], descriptor.center[1]);
    for (const { n, a, b, c, d } of descriptor.terms) {
      addBin(spectrum, size, n, (a + d) / 2, (c - b) / 2);
      addBin(spectrum, size, -n, (a - d) / 2, (b + c) / 2);
    }
  } else {
    const r0 = descriptor.baseRadius;
    addBin(spectrum, size, 1, r0, 0);
    for (const { k, amplitude, phase } of descriptor.terms) {
      const half = (r0 * amplitude) / 2;
      const re = half * Math.cos(phase);
      const im = half * Math.sin(phase);
      addBin(spectrum, size, 1 + k, re, im);
      addBin(spectrum, size, 1 - k, re, -im);
    }
  }
}

/**
 * Samples a descriptor at t_j = 2πj/N with one complex FFT (fft.js, radix-4): the harmonics are placed in
 * bins k mod N of the spectrum of z = x + iy, so x_j + iy_j = Σ c_k e^{2πijk/N} (an inverse DFT without the
 * 1/N, done as conj(FFT(conj c))). N must be a power of two ≥ 4. No validation and no orientation change: callers use `synthesizeContour`.
 */
export function synthesizeFft(descriptor: ShapeDescriptor, size: number, output?: Contour): Contour {
  const { spectrum, signal } = getScratch(size);
  spectrum.fill(0);
  fillSpectrum(descriptor, spectrum, size);
  getFftPlan(size).transform(signal, spectrum);
  const x = output?.x ?? new Float64Array(size);
  const y = output?.y ?? new Float64Array(size);
  for (let j = 0; j < size; j++) {
    x[j] = signal[2 * j] as number;
    y[j] = -(signal[2 * j + 1] as number);
  }
  return { x, y };
}
