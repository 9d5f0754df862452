import type { ShapeDescriptor } from './types';

/**
 * Exact signed area enclosed by a descriptor's curve, positive when it runs counter-clockwise, from the
 * coefficients alone (Green's theorem on the Fourier series; no sampling):
 * elliptic A = π Σ n(a_n d_n − b_n c_n) (Kuhl & Giardina 1982); complex A = π Σ k|c_k|²;
 * radial A = π r0²(1 + ½ Σ A_k²) for distinct k (Wilkinson, Wilson & Habak 1998; derived from ½∮r²dθ).
 */
export function descriptorArea(descriptor: ShapeDescriptor): number {
  switch (descriptor.family) {
    case 'radial': {
      let sum = 0;
      for (const { amplitude } of descriptor.terms) sum += amplitude * amplitude;
      return Math.PI * descriptor.baseRadius * descriptor.baseRadius * (1 + sum / 2);
    }
    case 'elliptic': {
      let sum = 0;
      for (const { n, a, b, c, d } of descriptor.terms) sum += n * (a * d - b * c);
      return Math.PI * sum;
    }
    case 'complex': {
      let sum = 0;
      for (const { k, re, im } of descriptor.terms) sum += k * (re * re + im * im);
      return Math.PI * sum;
    }
  }
}
