import type { Point, ShapeDescriptor } from './types';

/**
 * The point of a descriptor at parameter t (radians), straight from the family's defining formula with
 * Math.cos/Math.sin for every term — the reference the fast paths are checked against.
 * Radial: r(t)(cos t, sin t) with r = r0(1 + Σ A_k cos(kt + φ_k)) (Wilkinson, Wilson & Habak 1998).
 * Elliptic: (A0 + Σ a cos nt + b sin nt, C0 + Σ c cos nt + d sin nt) (Kuhl & Giardina 1982).
 * Complex: Σ c_k e^{ikt}.
 */
export function evaluateDescriptor(descriptor: ShapeDescriptor, t: number): Point {
  if (descriptor.family === 'radial') {
    let sum = 1;
    for (const { k, amplitude, phase } of descriptor.terms) sum += amplitude * Math.cos(k * t + phase);
    const r = descriptor.baseRadius * sum;
    return [r * Math.cos(t), r * Math.sin(t)];
  }
  if (descriptor.family === 'elliptic') {
    let x = descriptor.center[0];
    let y = descriptor.center[1];
    for (const { n, a, b, c, d } of descriptor.terms) {
      const cn = Math.cos(n * t);
      const sn = Math.sin(n * t);
      x += a * cn + b * sn;
      y += c * cn + d * sn;
    }
    return [x, y];
  }
  let x = 0;
  let y = 0;
  for (const { k, re, im } of descriptor.terms) {
    const ck = Math.cos(k * t);
    const sk = Math.sin(k * t);
    x += re * ck - im * sk;
    y += re * sk + im * ck;
  }
  return [x, y];
}
