import { checkSquareMatrix, type SquareMatrix } from './square-matrix';
import { StatsError } from './stats-error';
import { symmetricEigen } from './symmetric-eigen';

export interface ClassicalMds {
  /** One point per item, `dims` coordinates each (a dimension whose eigenvalue is ≤ 0 is all zeros). */
  readonly coordinates: readonly (readonly number[])[];
  /**
   * Every eigenvalue of B = −½ J D⁽²⁾ J, in descending order, negative ones included. Negative eigenvalues mean
   * the dissimilarities are not Euclidean distances (no point configuration reproduces them exactly); their size
   * relative to the positive ones says how far from Euclidean the data are.
   */
  readonly eigenvalues: readonly number[];
  /** Share of Σ|λ| carried by the dimensions kept (Mardia's fit measure, 1979). */
  readonly explained: number;
}

/**
 * Classical (Torgerson) multidimensional scaling (Torgerson 1952; Gower 1966): double-centre the squared
 * dissimilarities, B = −½ J D⁽²⁾ J with J = I − 11ᵀ/n, take its eigen-decomposition (`symmetricEigen`, Jacobi),
 * and place item i at (√λ₁ v₁ᵢ, …, √λ_dims v_dims,ᵢ). For Euclidean distances the map reproduces them exactly, up
 * to rotation, reflection and translation (centred on the origin). D symmetric (only the upper triangle is
 * read), finite, n ≥ 2; dims 1…n. Raises `StatsError` (`length-mismatch`, `not-finite`, `invalid-option`).
 */
export function classicalMds(d: SquareMatrix, dims: number): ClassicalMds {
  checkSquareMatrix(d, 'D', 2);
  const n = d.size;
  if (!Number.isInteger(dims) || dims < 1 || dims > n) throw new StatsError('invalid-option', `dims must be a whole number from 1 to ${n}; got ${dims}.`);
  // Phase 1: squared dissimilarities, then double centring (row, column and grand means of D⁽²⁾).
  const sq = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      const v = d.values[i * n + j] as number;
      if (!Number.isFinite(v)) throw new StatsError('not-finite', `D(${i}, ${j}) is not a finite number; classical MDS needs every dissimilarity.`);
      sq[i * n + j] = v * v;
      sq[j * n + i] = v * v;
    }
  }
  const rowMean = new Float64Array(n);
  let grand = 0;
  for (let i = 0; i < n; i++) {
    let s = 0;
    for (let j = 0; j < n; j++) s += sq[i * n + j] as number;
    rowMean[i] = s / n;
    grand += s;
  }
  grand /= n * n;
  const b = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) b[i * n + j] = -0.5 * ((sq[i * n + j] as number) - (rowMean[i] as number) - (rowMean[j] as number) + grand);
  // Phase 2: eigen-decomposition and the scaled leading eigenvectors.
  const { values, vectors } = symmetricEigen({ size: n, values: b });
  const coordinates = Array.from({ length: n }, (_, i) =>
    Array.from({ length: dims }, (_, k) => {
      const lambda = values[k] as number;
      return lambda > 0 ? Math.sqrt(lambda) * (vectors[i * n + k] as number) : 0;
    }),
  );
  let total = 0, kept = 0;
  values.forEach((l, k) => {
    total += Math.abs(l);
    if (k < dims && l > 0) kept += l;
  });
  return { coordinates, eigenvalues: Array.from(values), explained: total > 0 ? kept / total : 0 };
}
