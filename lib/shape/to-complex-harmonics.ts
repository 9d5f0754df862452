import type { ComplexDescriptor, ComplexTerm, ShapeDescriptor } from './types';

function addTo(map: Map<number, { re: number; im: number }>, k: number, re: number, im: number): void {
  const entry = map.get(k);
  if (entry) {
    entry.re += re;
    entry.im += im;
  } else {
    map.set(k, { re, im });
  }
}

/**
 * Rewrites any descriptor as complex harmonics z(t) = Σ c_k e^{ikt}, sorted by k, zero terms dropped.
 * - Elliptic (Kuhl & Giardina 1982): c_n = ((a + d) + i(c − b))/2, c_−n = ((a − d) + i(b + c))/2, c_0 = A0 + iC0.
 * - Radial: z(θ) = r(θ)e^{iθ}, so c_1 = r0 and each term gives c_{1+k} = (r0A_k/2)e^{iφ_k},
 *   c_{1−k} = (r0A_k/2)e^{−iφ_k}. The highest complex index is then k_max + 1.
 * Assumes a well-formed descriptor (see `checkDescriptorTerms`).
 */
export function toComplexHarmonics(descriptor: ShapeDescriptor): ComplexDescriptor {
  if (descriptor.family === 'complex') {
    const terms = descriptor.terms.filter((t) => t.re !== 0 || t.im !== 0).sort((p, q) => p.k - q.k);
    return { family: 'complex', terms };
  }
  const map = new Map<number, { re: number; im: number }>();
  if (descriptor.family === 'elliptic') {
    addTo(map, 0, descriptor.center[0], descriptor.center[1]);
    for (const { n, a, b, c, d } of descriptor.terms) {
      addTo(map, n, (a + d) / 2, (c - b) / 2);
      addTo(map, -n, (a - d) / 2, (b + c) / 2);
    }
  } else {
    const r0 = descriptor.baseRadius;
    addTo(map, 1, r0, 0);
    for (const { k, amplitude, phase } of descriptor.terms) {
      const half = (r0 * amplitude) / 2;
      const re = half * Math.cos(phase);
      const im = half * Math.sin(phase);
      addTo(map, 1 + k, re, im);
      addTo(map, 1 - k, re, -im);
    }
  }
  const terms: ComplexTerm[] = [];
  for (const [k, { re, im }] of map) if (re !== 0 || im !== 0) terms.push({ k, re, im });
  terms.sort((p, q) => p.k - q.k);
  return { family: 'complex', terms };
}
