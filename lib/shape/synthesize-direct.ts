import { getTrigTable } from './trig-table';
import type { Contour, ElementOf, EllipticDescriptor, RadialDescriptor, ComplexDescriptor, ShapeDescriptor } from './types';

/*
 * Every cos/sin value is a table entry at index m = k·j mod N (exact to ~1 ulp; no recurrence drift). For
 * power-of-two N the index is (k·j) & (N − 1), which V8 compiles to a tight loop; other N step the index and
 * wrap it. Radial terms are summed four per pass, and the last pass writes the points, so a shape with up
 * to four terms is one pass over the samples (measured ~1.5–2× faster than one pass per term at N = 1024).
 */

type RadialTerm = ElementOf<RadialDescriptor['terms']>;

/** Terms summed per pass over the samples: four keep every coefficient in a register on x64. */
const TERMS_PER_PASS = 4;
const NO_TERM: RadialTerm = { k: 0, amplitude: 0, phase: 0 };

/**
 * One pass over the samples adding up to four terms (missing ones padded with A = 0) to `sum`, which starts
 * at 1. On the last pass (`finish`) the sum is turned into the point r0·sum·(cos θ, sin θ) in place, so a
 * shape with ≤ 4 terms costs a single pass. Power-of-two N only.
 */
function addRadialQuad(
  x: Float64Array,
  y: Float64Array,
  cos: Float64Array,
  sin: Float64Array,
  group: readonly RadialTerm[],
  isFirst: boolean,
  finish: number,
): void {
  const mask = x.length - 1;
  const [t1 = NO_TERM, t2 = NO_TERM, t3 = NO_TERM, t4 = NO_TERM] = group;
  const p1 = t1.amplitude * Math.cos(t1.phase), q1 = t1.amplitude * Math.sin(t1.phase), k1 = t1.k;
  const p2 = t2.amplitude * Math.cos(t2.phase), q2 = t2.amplitude * Math.sin(t2.phase), k2 = t2.k;
  const p3 = t3.amplitude * Math.cos(t3.phase), q3 = t3.amplitude * Math.sin(t3.phase), k3 = t3.k;
  const p4 = t4.amplitude * Math.cos(t4.phase), q4 = t4.amplitude * Math.sin(t4.phase), k4 = t4.k;
  for (let j = 0; j < x.length; j++) {
    const i1 = (j * k1) & mask;
    const i2 = (j * k2) & mask;
    const i3 = (j * k3) & mask;
    const i4 = (j * k4) & mask;
    const sum =
      (isFirst ? 1 : (x[j] as number)) +
      p1 * (cos[i1] as number) - q1 * (sin[i1] as number) +
      p2 * (cos[i2] as number) - q2 * (sin[i2] as number) +
      p3 * (cos[i3] as number) - q3 * (sin[i3] as number) +
      p4 * (cos[i4] as number) - q4 * (sin[i4] as number);
    if (finish > 0) {
      const r = finish * sum;
      x[j] = r * (cos[j] as number);
      y[j] = r * (sin[j] as number);
    } else {
      x[j] = sum;
    }
  }
}

/**
 * The common case, at most four terms at power-of-two N, as one branch-free pass straight to the points:
 * r = r0 + Σ (r0·p) cos kθ − (r0·q) sin kθ. Measured ~15 % faster than the general pass.
 */
function synthesizeRadialSinglePass(x: Float64Array, y: Float64Array, cos: Float64Array, sin: Float64Array, group: readonly RadialTerm[], r0: number): void {
  const mask = x.length - 1;
  const [t1 = NO_TERM, t2 = NO_TERM, t3 = NO_TERM, t4 = NO_TERM] = group;
  const p1 = r0 * t1.amplitude * Math.cos(t1.phase), q1 = r0 * t1.amplitude * Math.sin(t1.phase), k1 = t1.k;
  const p2 = r0 * t2.amplitude * Math.cos(t2.phase), q2 = r0 * t2.amplitude * Math.sin(t2.phase), k2 = t2.k;
  const p3 = r0 * t3.amplitude * Math.cos(t3.phase), q3 = r0 * t3.amplitude * Math.sin(t3.phase), k3 = t3.k;
  const p4 = r0 * t4.amplitude * Math.cos(t4.phase), q4 = r0 * t4.amplitude * Math.sin(t4.phase), k4 = t4.k;
  let i1 = 0, i2 = 0, i3 = 0, i4 = 0;
  for (let j = 0; j < x.length; j++) {
    const r =
      r0 +
      p1 * (cos[i1] as number) - q1 * (sin[i1] as number) +
      p2 * (cos[i2] as number) - q2 * (sin[i2] as number) +
      p3 * (cos[i3] as number) - q3 * (sin[i3] as number) +
      p4 * (cos[i4] as number) - q4 * (sin[i4] as number);
    x[j] = r * (cos[j] as number);
    y[j] = r * (sin[j] as number);
    i1 = (i1 + k1) & mask;
    i2 = (i2 + k2) & mask;
    i3 = (i3 + k3) & mask;
    i4 = (i4 + k4) & mask;
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

function synthesizeRadial(descriptor: RadialDescriptor, size: number, output?: Contour): Contour {
  const { cos, sin } = getTrigTable(size);
  const { x, y } = outputArrays(size, output, 0, 0);
  const r0 = descriptor.baseRadius;
  const active = descriptor.terms.filter((term) => term.amplitude !== 0);
  if ((size & (size - 1)) === 0) {
    // Power-of-two N: passes of four terms, the last one producing the points.
    const passes = Math.max(1, Math.ceil(active.length / TERMS_PER_PASS));
    if (passes === 1) {
      synthesizeRadialSinglePass(x, y, cos, sin, active, r0);
      return { x, y };
    }
    for (let pass = 0; pass < passes; pass++) {
      const group = active.slice(pass * TERMS_PER_PASS, (pass + 1) * TERMS_PER_PASS);
      addRadialQuad(x, y, cos, sin, group, pass === 0, pass === passes - 1 ? r0 : 0);
    }
    return { x, y };
  }
  // Other N: x accumulates Σ A_k cos(kθ + φ_k) = Σ (p cos kθ − q sin kθ), then r = r0(1 + sum).
  for (const term of active) addRadialTerm(x, cos, sin, term);
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

function synthesizeElliptic(descriptor: EllipticDescriptor, size: number, output?: Contour): Contour {
  const { cos, sin } = getTrigTable(size);
  const { x, y } = outputArrays(size, output, descriptor.center[0], descriptor.center[1]);
  for (const { n, a, b, c, d } of descriptor.terms) {
    if (a !== 0 || b !== 0 || c !== 0 || d !== 0) addHarmonic(x, y, cos, sin, n, a, b, c, d);
  }
  return { x, y };
}

function synthesizeComplex(descriptor: ComplexDescriptor, size: number, output?: Contour): Contour {
  const { cos, sin } = getTrigTable(size);
  const { x, y } = outputArrays(size, output, 0, 0);
  // Re/Im of (re + i·im)(cos kt + i sin kt).
  for (const { k, re, im } of descriptor.terms) {
    if (re !== 0 || im !== 0) addHarmonic(x, y, cos, sin, k, re, -im, im, re);
  }
  return { x, y };
}

/**
 * Samples a descriptor at t_j = 2πj/N, j = 0…N−1, by a direct sum over its non-zero harmonics with
 * precomputed cos/sin tables: O(N · terms). Any N ≥ 1. No validation and no orientation change: callers use
 * `synthesizeContour`. With `output`, the samples are written into its arrays (length N) instead of new ones.
 */
export function synthesizeDirect(descriptor: ShapeDescriptor, size: number, output?: Contour): Contour {
  switch (descriptor.family) {
    case 'radial':
      return synthesizeRadial(descriptor, size, output);
    case 'elliptic':
      return synthesizeElliptic(descriptor, size, output);
    case 'complex':
      return synthesizeComplex(descriptor, size, output);
  }
}

/** The arrays to write into: the caller's (filled with the start values) or fresh ones. */
function outputArrays(size: number, output: Contour | undefined, x0: number, y0: number): { x: Float64Array; y: Float64Array } {
  if (output) return { x: output.x.fill(x0), y: output.y.fill(y0) };
  const x = new Float64Array(size);
  const y = new Float64Array(size);
  if (x0 !== 0) x.fill(x0);
  if (y0 !== 0) y.fill(y0);
  return { x, y };
}
