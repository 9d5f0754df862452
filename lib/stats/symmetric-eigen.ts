import { checkSquareMatrix, type SquareMatrix } from './square-matrix';
import { StatsError } from './stats-error';

/** Sweeps of the cyclic Jacobi method at most: it converges quadratically, in well under 20 for any size here. */
const MAX_SWEEPS = 100;
/** Off-diagonal mass below this fraction of the matrix's Frobenius norm counts as zero (double rounding). */
const OFF_DIAGONAL_TOLERANCE = 1e-15;

export interface SymmetricEigen {
  /** Every eigenvalue, in descending order (negative ones included). */
  readonly values: Float64Array;
  /** The unit eigenvectors, row-major n × n: column k (entries k, n + k, 2n + k, …) belongs to `values[k]`. */
  readonly vectors: Float64Array;
}

/**
 * Eigenvalues and eigenvectors of a real symmetric matrix by the cyclic Jacobi method (Jacobi 1846; the
 * rotation formulas of Rutishauser 1971, Handbook for Automatic Computation II/1): plane rotations annihilate
 * each off-diagonal entry in turn until the off-diagonal mass is below 1e−15 of the norm. Accurate to rounding
 * for small eigenvalues too, and orthogonal eigenvectors by construction. Only the upper triangle is read.
 * Raises `StatsError`: `length-mismatch` for a non-square input, `not-finite` for NaN or infinite entries.
 */
export function symmetricEigen(matrix: SquareMatrix): SymmetricEigen {
  checkSquareMatrix(matrix, 'The matrix');
  const n = matrix.size;
  const a = new Float64Array(n * n);
  let norm = 0;
  for (let i = 0; i < n; i++) {
    for (let j = i; j < n; j++) {
      const v = matrix.values[i * n + j] as number;
      if (!Number.isFinite(v)) throw new StatsError('not-finite', `Entry (${i}, ${j}) is not a finite number.`);
      a[i * n + j] = v;
      a[j * n + i] = v;
      norm += (i === j ? 1 : 2) * v * v;
    }
  }
  const v = new Float64Array(n * n);
  for (let i = 0; i < n; i++) v[i * n + i] = 1;
  const threshold = OFF_DIAGONAL_TOLERANCE * OFF_DIAGONAL_TOLERANCE * norm;
  // Phase 1: sweeps of rotations over every (p, q), p < q.
  for (let sweep = 0; sweep < MAX_SWEEPS; sweep++) {
    let off = 0;
    for (let p = 0; p < n; p++) for (let q = p + 1; q < n; q++) off += 2 * (a[p * n + q] as number) ** 2;
    if (off <= threshold) break;
    for (let p = 0; p < n; p++) {
      for (let q = p + 1; q < n; q++) {
        const apq = a[p * n + q] as number;
        if (apq === 0) continue;
        const app = a[p * n + p] as number;
        const aqq = a[q * n + q] as number;
        // tan of the rotation angle, the smaller root of t² + 2θt − 1 = 0 (stable for any θ).
        const theta = (aqq - app) / (2 * apq);
        const t = Math.sign(theta || 1) / (Math.abs(theta) + Math.sqrt(theta * theta + 1));
        const c = 1 / Math.sqrt(t * t + 1);
        const s = t * c;
        for (let k = 0; k < n; k++) {
          const akp = a[k * n + p] as number;
          const akq = a[k * n + q] as number;
          a[k * n + p] = c * akp - s * akq;
          a[k * n + q] = s * akp + c * akq;
        }
        for (let k = 0; k < n; k++) {
          const apk = a[p * n + k] as number;
          const aqk = a[q * n + k] as number;
          a[p * n + k] = c * apk - s * aqk;
          a[q * n + k] = s * apk + c * aqk;
        }
        a[p * n + q] = 0;
        a[q * n + p] = 0;
        for (let k = 0; k < n; k++) {
          const vkp = v[k * n + p] as number;
          const vkq = v[k * n + q] as number;
          v[k * n + p] = c * vkp - s * vkq;
          v[k * n + q] = s * vkp + c * vkq;
        }
      }
    }
  }
  // Phase 2: sort descending, columns with their values.
  const order = Array.from({ length: n }, (_, i) => i).sort((i, j) => (a[j * n + j] as number) - (a[i * n + i] as number));
  const values = Float64Array.from(order, (i) => a[i * n + i] as number);
  const vectors = new Float64Array(n * n);
  order.forEach((from, to) => {
    for (let k = 0; k < n; k++) vectors[k * n + to] = v[k * n + from] as number;
  });
  return { values, vectors };
}
