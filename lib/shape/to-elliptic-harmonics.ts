import type { ComplexDescriptor, EllipticDescriptor, EllipticTerm } from './types';

/**
 * Rewrites complex harmonics as elliptic harmonics (Kuhl & Giardina 1982), the inverse of the elliptic case of
 * `toComplexHarmonics`: a = Re(c_n + c_−n), b = Im(c_−n − c_n), c = Im(c_n + c_−n), d = Re(c_n − c_−n),
 * [A0, C0] = c_0. Harmonics 1…max|k| are all present, in order.
 */
export function toEllipticHarmonics(descriptor: ComplexDescriptor): EllipticDescriptor {
  const byK = new Map<number, { re: number; im: number }>();
  let highest = 0;
  for (const t of descriptor.terms) {
    const entry = byK.get(t.k);
    byK.set(t.k, entry ? { re: entry.re + t.re, im: entry.im + t.im } : { re: t.re, im: t.im });
    highest = Math.max(highest, Math.abs(t.k));
  }
  const zero = { re: 0, im: 0 };
  const center = byK.get(0) ?? zero;
  const terms: EllipticTerm[] = [];
  for (let n = 1; n <= highest; n++) {
    const p = byK.get(n) ?? zero;
    const q = byK.get(-n) ?? zero;
    terms.push({ n, a: p.re + q.re, b: q.im - p.im, c: p.im + q.im, d: p.re - q.re });
  }
  return { family: 'elliptic', center: [center.re, center.im], terms };
}
