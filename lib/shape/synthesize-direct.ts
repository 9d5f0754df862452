import { getTrigTable } from './trig-table';
import type { Contour, ElementOf, EllipticDescriptor, RadialDescriptor, ComplexDescriptor, ShapeDescriptor } from './types';

/*
 * Every cos/sin value is a table entry at index m = k·j mod N (exact to ~1 ulp; no recurrence drift). For
 * power-of-two N the index is (k·j) & (N − 1), which V8 compiles to a tight loop; other N step the index and
 * wrap it. Radial terms are summed two per pass over the output, which halves the loads and stores of the
 * accumulator (measured ~1.5× faster for 4 terms at N = 1024).
 */

type RadialTerm = ElementOf<RadialDescriptor['terms']>;

function addRadialPairMasked(acc: Float64Array, cos: Float64Array, sin: Float64Array, first: RadialTerm, second: RadialTerm): void {
  const mask = acc.length - 1;
  const p1 = first.amplitude * Math.cos(first.phase);
  const q1 = first.amplitude * Math.sin(first.phase);
  const p2 = second.amplitude * Math.cos(second.phase);
  const q2 = second.amplitude * Math.sin(second.phase);
  const k1 = first.k;
  const k2 = second.k;
  for (let j = 0; j < acc.length; j++) {
    const i1 = (j * k1) & mask;
    const i2 = (j * k2) & mask;
    acc[j] =
      (acc[j] as number) + p1 * (cos[i1] as number) - q1 * (sin[i1] as number) + p2 * (cos[i2] as number) - q2 * (sin[i2] as number);
  }
}

function addRadialTerm(acc: Float64Array, cos: Float64Array, sin: Float64Array, term: RadialTerm): void {
  const size = acc.length;
  const p = term.amplitude * Math.cos(term.phase);
  const q = term.amplitude * Math.sin(term.phase);
  const step = term.k % size;
  let index = 0;
  for (let j = 0; j < size; j++) {
    acc[j] = (acc[j] as number) + p * (cos[index] as number) - q * (sin[index] as number);
    index += step;
    if (index >= size) index -= size;
  }
}

function synthesizeRadial(descriptor: RadialDescriptor, size: number): Contour {
  const { cos, sin } = getTrigTable(size);
  const x = new Float64Array(size);
  const y = new Float64Array(size);
  // Phase 1: x accumulates Σ A_k cos(kθ + φ_k) = Σ (p cos kθ − q sin kθ).
  const active = descriptor.terms.filter((term) => term.amplitude !== 0);
  const isPowerOfTwo = (size & (size - 1)) === 0;
  let t = 0;
  if (isPowerOfTwo) {
    for (; t + 1 < active.length; t += 2) addRadialPairMasked(x, cos, sin, active[t] as RadialTerm, active[t + 1] as RadialTerm);
  }
  for (; t < active.length; t++) addRadialTerm(x, cos, sin, active[t] as RadialTerm);
  // Phase 2: r = r0(1 + sum); (x, y) = r(cos θ, sin θ).
  const r0 = descriptor.baseRadius;
  for (let j = 0; j < size; j++) {
    const r = r0 + r0 * (x[j] as number);
    x[j] = r * (cos[j] as number);
    y[j] = r * (sin[j] as number);
  }
  return { x, y };
}

/** Adds one harmonic pair: x += a cos(kt) + b sin(kt), y += c cos(kt) + d sin(kt). */
function addHarmonic(x: Float64Array, y: Float64Array, cos: Float64Array, sin: Float64Array, k: number, a: number, b: number, c: number, d: number): void {
  const size = x.length;
  const step = ((k % size) + size) % size;
  if ((size & (size - 1)) === 0) {
    const mask = size - 1;
    for (let j = 0; j < size; j++) {
      const index = (j * step) & mask;
      const cj = cos[index] as number;
      const sj = sin[index] as number;
      x[j] = (x[j] as number) + a * cj + b * sj;
      y[j] = (y[j] as number) + c * cj + d * sj;
    }
    return;
  }
  let index = 0;
  for (let j = 0; j < size; j++) {
    const cj = cos[index] as number;
    const sj = sin[index] as number;
    x[j] = (x[j] as number) + a * cj + b * sj;
    y[j] = (y[j] as number) + c * cj + d * sj;
    index += step;
    if (index >= size) index -= size;
  }
}

function synthesizeElliptic(descriptor: EllipticDescriptor, size: number): Contour {
  const { cos, sin } = getTrigTable(size);
  const x = new Float64Array(size).fill(descriptor.center[0]);
  const y = new Float64Array(size).fill(descriptor.center[1]);
  for (const { n, a, b, c, d } of descriptor.terms) {
    if (a !== 0 || b !== 0 || c !== 0 || d !== 0) addHarmonic(x, y, cos, sin, n, a, b, c, d);
  }
  return { x, y };
}

function synthesizeComplex(descriptor: ComplexDescriptor, size: number): Contour {
  const { cos, sin } = getTrigTable(size);
  const x = new Float64Array(size);
  const y = new Float64Array(size);
  // Re/Im of (re + i·im)(cos kt + i sin kt).
  for (const { k, re, im } of descriptor.terms) {
    if (re !== 0 || im !== 0) addHarmonic(x, y, cos, sin, k, re, -im, im, re);
  }
  return { x, y };
}

/**
 * Samples a descriptor at t_j = 2πj/N, j = 0…N−1, by a direct sum over its non-zero harmonics with
 * precomputed cos/sin tables: O(N · terms). Any N ≥ 1. No validation and no orientation change: callers use
 * `synthesizeContour`.
 */
export function synthesizeDirect(descriptor: ShapeDescriptor, size: number): Contour {
  switch (descriptor.family) {
    case 'radial':
      return synthesizeRadial(descriptor, size);
    case 'elliptic':
      return synthesizeElliptic(descriptor, size);
    case 'complex':
      return synthesizeComplex(descriptor, size);
  }
}
