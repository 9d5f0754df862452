import { checkSameLength } from './check-same-length';
import { ShapeError } from './errors';
import type { Contour } from './types';

/**
 * Full Procrustes distance between two configurations of corresponding points (Kendall 1984; Dryden & Mardia,
 * Statistical Shape Analysis): centre each on its vertex mean, scale to unit centroid size, and take
 * d_F = √(1 − |⟨a, b⟩|²) with the complex inner product ⟨a, b⟩ = Σ conj(a_j) b_j — the residual after the best
 * translation, rotation and scaling. Dimensionless, in [0, 1]; 0 for similar shapes.
 */
export function procrustesDistance(a: Contour, b: Contour): number {
  checkSameLength(a, b);
  const n = a.x.length;
  let ax = 0, ay = 0, bx = 0, by = 0;
  for (let i = 0; i < n; i++) {
    ax += (a.x[i] as number) / n;
    ay += (a.y[i] as number) / n;
    bx += (b.x[i] as number) / n;
    by += (b.y[i] as number) / n;
  }
  let normA = 0, normB = 0, re = 0, im = 0;
  for (let i = 0; i < n; i++) {
    const pr = (a.x[i] as number) - ax, pi = (a.y[i] as number) - ay;
    const qr = (b.x[i] as number) - bx, qi = (b.y[i] as number) - by;
    normA += pr * pr + pi * pi;
    normB += qr * qr + qi * qi;
    re += pr * qr + pi * qi;
    im += pr * qi - pi * qr;
  }
  if (normA === 0 || normB === 0) throw new ShapeError('degenerate-shape', 'a configuration with all points equal has no shape');
  const overlap2 = (re * re + im * im) / (normA * normB);
  return Math.sqrt(Math.max(0, 1 - overlap2));
}
