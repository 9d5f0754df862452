import { classicalMds } from './classical-mds';
import { checkSquareMatrix, type SquareMatrix } from './square-matrix';
import { StatsError } from './stats-error';
import { symmetricEigen } from './symmetric-eigen';

export interface SmacofMds {
  /** One point per item, `dims` coordinates each, centred on the origin. */
  readonly coordinates: readonly (readonly number[])[];
  /**
   * Normalised stress (Kruskal's stress-1 over the pairs with data): √(Σ w (δ − d)² / Σ w δ²), 0 for a perfect
   * fit. The share of the dissimilarities' size the map does not reproduce.
   */
  readonly stress: number;
  /** Stress after the start and after each Guttman transform; never rises (majorisation). */
  readonly stressHistory: readonly number[];
  readonly iterations: number;
  /** True when an iteration lowered the raw stress by at most `tolerance` · Σ w δ² before `maxIterations`. */
  readonly converged: boolean;
  /** Pairs with a dissimilarity (weight 1); the others (NaN) are left out of the stress. */
  readonly pairsUsed: number;
}

export interface SmacofOptions {
  readonly maxIterations?: number;
  /** The iteration stops when the raw stress falls by at most this fraction of Σ w δ² (default 1e-10). */
  readonly tolerance?: number;
}

const DEFAULT_MAX_ITERATIONS = 1000;
const DEFAULT_TOLERANCE = 1e-10;

/** Shortest paths over the pairs with data (Floyd–Warshall): a complete matrix to start from. */
function shortestPaths(d: SquareMatrix): Float64Array {
  const n = d.size;
  const out = new Float64Array(n * n).fill(Infinity);
  for (let i = 0; i < n; i++) {
    out[i * n + i] = 0;
    for (let j = i + 1; j < n; j++) {
      const v = d.values[i * n + j] as number;
      if (Number.isFinite(v)) {
        out[i * n + j] = v;
        out[j * n + i] = v;
      }
    }
  }
  for (let k = 0; k < n; k++) {
    for (let i = 0; i < n; i++) {
      const ik = out[i * n + k] as number;
      if (ik === Infinity) continue;
      for (let j = 0; j < n; j++) {
        const via = ik + (out[k * n + j] as number);
        if (via < (out[i * n + j] as number)) out[i * n + j] = via;
      }
    }
  }
  return out;
}

/**
 * The Moore–Penrose inverse of a symmetric positive-semidefinite matrix from its eigen-decomposition:
 * Σ u uᵀ / λ over the eigenvalues above rounding (those within 1e−12 of the largest count as zero).
 */
function pseudoInverse(a: Float64Array, n: number): Float64Array {
  const { values, vectors } = symmetricEigen({ size: n, values: a });
  const floor = 1e-12 * Math.max(Math.abs(values[0] as number), Math.abs(values[n - 1] as number));
  const out = new Float64Array(n * n);
  for (let k = 0; k < n; k++) {
    const lambda = values[k] as number;
    if (!(lambda > floor)) continue;
    for (let i = 0; i < n; i++) {
      const ui = (vectors[i * n + k] as number) / lambda;
      for (let j = 0; j < n; j++) out[i * n + j] = (out[i * n + j] as number) + ui * (vectors[j * n + k] as number);
    }
  }
  return out;
}

/**
 * Metric multidimensional scaling of a dissimilarity matrix with missing entries, by majorisation: weighted
 * SMACOF (de Leeuw 1977; de Leeuw & Mair 2009, J. Stat. Softw. 31(3), §2), weight 1 for a pair with a
 * dissimilarity and 0 for one without (NaN). It minimises the raw stress Σ w (δ − d(X))² by Guttman transforms
 * X ← V⁺ B(X) X, each of which lowers the stress or leaves it (V⁺ is the Moore–Penrose inverse of the weights'
 * Laplacian). It starts from the classical MDS (`classicalMds`) of the shortest paths
 * over the rated pairs, so with no entry missing it starts from the classical map and can only improve on it.
 * D symmetric (upper triangle read), n ≥ 3; the rated pairs must link every item (else `invalid-option`: the
 * map's parts could not be placed relative to each other). Raises `StatsError` (`length-mismatch`,
 * `invalid-option`, `not-finite` for a negative or infinite dissimilarity).
 */
export function smacof(d: SquareMatrix, dims: number, options: SmacofOptions = {}): SmacofMds {
  checkSquareMatrix(d, 'D', 3);
  const n = d.size;
  if (!Number.isInteger(dims) || dims < 1 || dims >= n) throw new StatsError('invalid-option', `dims must be a whole number from 1 to ${n - 1}; got ${dims}.`);
  const maxIterations = options.maxIterations ?? DEFAULT_MAX_ITERATIONS;
  const tolerance = options.tolerance ?? DEFAULT_TOLERANCE;
  if (!Number.isInteger(maxIterations) || maxIterations < 1) throw new StatsError('invalid-option', `maxIterations must be a whole number ≥ 1; got ${maxIterations}.`);
  if (!(tolerance > 0)) throw new StatsError('invalid-option', `tolerance must be > 0; got ${tolerance}.`);

  // Phase 1: the rated pairs, their weights' Laplacian V and its pseudo-inverse.
  const delta = new Float64Array(n * n).fill(NaN);
  const v = new Float64Array(n * n);
  let pairsUsed = 0;
  let scale = 0;
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      const value = d.values[i * n + j] as number;
      if (Number.isNaN(value)) continue;
      if (!(value >= 0 && Number.isFinite(value))) throw new StatsError('not-finite', `D(${i}, ${j}) = ${value}: dissimilarities must be finite and ≥ 0.`);
      delta[i * n + j] = value;
      delta[j * n + i] = value;
      v[i * n + j] = -1;
      v[j * n + i] = -1;
      v[i * n + i] = (v[i * n + i] as number) + 1;
      v[j * n + j] = (v[j * n + j] as number) + 1;
      pairsUsed++;
      scale += value * value;
    }
  }
  const paths = shortestPaths(d);
  if (paths.some((p) => p === Infinity)) throw new StatsError('invalid-option', 'The rated pairs do not link every stimulus to every other, so their places in one map are not determined.');
  if (!(scale > 0)) throw new StatsError('invalid-option', 'Every rated dissimilarity is 0: there is nothing to map.');
  const vPlus = pseudoInverse(v, n);

  // Phase 2: the start, and its stress.
  let x: Float64Array = new Float64Array(n * dims);
  const start = classicalMds({ size: n, values: paths }, dims).coordinates;
  for (let i = 0; i < n; i++) for (let k = 0; k < dims; k++) x[i * dims + k] = start[i]?.[k] ?? 0;
  const distance = (config: Float64Array, i: number, j: number): number => {
    let s = 0;
    for (let k = 0; k < dims; k++) {
      const diff = (config[i * dims + k] as number) - (config[j * dims + k] as number);
      s += diff * diff;
    }
    return Math.sqrt(s);
  };
  const rawStress = (config: Float64Array): number => {
    let s = 0;
    for (let i = 0; i < n; i++) {
      for (let j = i + 1; j < n; j++) {
        const target = delta[i * n + j] as number;
        if (Number.isNaN(target)) continue;
        const r = target - distance(config, i, j);
        s += r * r;
      }
    }
    return s;
  };
  let stress = rawStress(x);
  const history = [Math.sqrt(stress / scale)];

  // Phase 3: Guttman transforms until the stress stops falling.
  const b = new Float64Array(n * n);
  let iterations = 0;
  let converged = false;
  while (iterations < maxIterations) {
    b.fill(0);
    for (let i = 0; i < n; i++) {
      for (let j = i + 1; j < n; j++) {
        const target = delta[i * n + j] as number;
        if (Number.isNaN(target)) continue;
        const dist = distance(x, i, j);
        const value = dist > 0 ? -target / dist : 0;
        b[i * n + j] = value;
        b[j * n + i] = value;
        b[i * n + i] = (b[i * n + i] as number) - value;
        b[j * n + j] = (b[j * n + j] as number) - value;
      }
    }
    // X⁺ = V⁺ (B X)
    const bx = new Float64Array(n * dims);
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
      const w = b[i * n + j] as number;
      if (w === 0) continue;
      for (let k = 0; k < dims; k++) bx[i * dims + k] = (bx[i * dims + k] as number) + w * (x[j * dims + k] as number);
    }
    const next = new Float64Array(n * dims);
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
      const w = vPlus[i * n + j] as number;
      for (let k = 0; k < dims; k++) next[i * dims + k] = (next[i * dims + k] as number) + w * (bx[j * dims + k] as number);
    }
    iterations++;
    const nextStress = rawStress(next);
    // Majorisation never raises the stress; a rise is rounding at the minimum, so the old map is kept.
    if (nextStress > stress) {
      converged = true;
      break;
    }
    const gain = stress - nextStress;
    x = next;
    stress = nextStress;
    history.push(Math.sqrt(stress / scale));
    if (gain <= tolerance * scale) {
      converged = true;
      break;
    }
  }
  const coordinates = Array.from({ length: n }, (_, i) => Array.from({ length: dims }, (_, k) => x[i * dims + k] as number));
  return { coordinates, stress: Math.sqrt(stress / scale), stressHistory: history, iterations, converged, pairsUsed };
}
