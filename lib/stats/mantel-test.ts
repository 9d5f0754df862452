import { averageRanks } from '../space/average-ranks';
import { pearson } from './pearson';
import { seededRandom } from './seeded-random';
import { checkSquareMatrix, type SquareMatrix } from './square-matrix';
import { StatsError } from './stats-error';

/** Fewer permutations than this give p-values too coarse to report (the issue asks for at least 5,000). */
export const MIN_MANTEL_PERMUTATIONS = 5000;

export interface MantelOptions {
  /** Random relabellings of A's rows and columns (≥ 5,000). */
  readonly permutations: number;
  /** Seed of `seededRandom` (0…2³²−1). */
  readonly seed: number;
  readonly method: 'pearson' | 'spearman';
}

export interface MantelResult {
  /** The correlation of the upper triangles of A and B (over the pairs where both are finite). */
  readonly statistic: number;
  /** One-sided Monte-Carlo p of a positive association: (b + 1)/(m + 1), b permuted statistics ≥ the observed. */
  readonly p: number;
  readonly permutations: number;
  /** Pairs the statistic used. */
  readonly pairs: number;
}

/** Stage: the upper triangle of A read through the relabelling `order`, and B's, keeping pairs finite in both. */
function pairedTriangles(a: SquareMatrix, b: SquareMatrix, order: ArrayLike<number>): [Float64Array, Float64Array] {
  const n = a.size;
  const xs: number[] = [], ys: number[] = [];
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      const x = a.values[(order[i] as number) * n + (order[j] as number)] as number;
      const y = b.values[i * n + j] as number;
      if (Number.isFinite(x) && Number.isFinite(y)) {
        xs.push(x);
        ys.push(y);
      }
    }
  }
  return [Float64Array.from(xs), Float64Array.from(ys)];
}

/** Stage: a symmetric matrix whose upper triangle holds the average ranks of the input's upper triangle. */
function rankMatrix(m: SquareMatrix): SquareMatrix {
  const n = m.size;
  const triangle: number[] = [];
  for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) triangle.push(m.values[i * n + j] as number);
  const ranks = averageRanks(triangle);
  const values = new Float64Array(n * n);
  let o = 0;
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      values[i * n + j] = ranks[o] as number;
      values[j * n + i] = ranks[o++] as number;
    }
  }
  return { size: n, values };
}

/**
 * The Mantel test (Mantel 1967) of two dissimilarity matrices over the same items: the correlation (Pearson, or
 * Spearman on average ranks) of their upper triangles, against its distribution when A's items are relabelled at
 * random (rows and columns together, Fisher–Yates from `seededRandom(seed)`). p = (b + 1)/(m + 1) over m
 * permutations (North, Curtis & Sham 2002), one-sided for a positive association. Entries that are NaN (pairs
 * without data) are left out, pair by pair. Raises `StatsError`: `length-mismatch` for matrices of different or
 * too small size (≥ 3), `invalid-option` for fewer than 5,000 permutations, `not-finite` when the statistic is
 * undefined (a constant triangle).
 */
export function mantelTest(a: SquareMatrix, b: SquareMatrix, options: MantelOptions): MantelResult {
  checkSquareMatrix(a, 'A', 3);
  checkSquareMatrix(b, 'B', 3);
  if (a.size !== b.size) throw new StatsError('length-mismatch', `A and B must be over the same items; got ${a.size} and ${b.size}.`);
  if (!Number.isInteger(options.permutations) || options.permutations < MIN_MANTEL_PERMUTATIONS) {
    throw new StatsError('invalid-option', `A Mantel test needs at least ${MIN_MANTEL_PERMUTATIONS} permutations; got ${options.permutations}.`);
  }
  const random = seededRandom(options.seed);
  const n = a.size;
  const identity = Uint32Array.from({ length: n }, (_, i) => i);
  const [x0, y0] = pairedTriangles(a, b, identity);
  // Phase 1: with no missing pair, relabelling only reorders the ranks, so Spearman is Pearson on rank matrices
  // ranked once; with missing pairs the pairs kept change with the labels and are ranked each time.
  const complete = x0.length === (n * (n - 1)) / 2;
  const ranked = options.method === 'spearman' && complete;
  const [ma, mb] = ranked ? [rankMatrix(a), rankMatrix(b)] : [a, b];
  const correlate = (x: Float64Array, y: Float64Array): number => (options.method === 'spearman' && !ranked ? pearson(averageRanks(x), averageRanks(y)) : pearson(x, y));
  const [xs0, ys0] = ranked ? pairedTriangles(ma, mb, identity) : [x0, y0];
  if (x0.length < 3) throw new StatsError('not-finite', `A Mantel test needs at least 3 pairs with data in both matrices; got ${x0.length}.`);
  const statistic = correlate(xs0, ys0);
  if (!Number.isFinite(statistic)) throw new StatsError('not-finite', 'The correlation is undefined: one of the matrices is constant over the pairs with data.');
  // Phase 2: the permutation distribution (a small tolerance so rounding never splits ties with the observed).
  const order = Uint32Array.from(identity);
  const tolerance = 1e-12 * Math.max(1, Math.abs(statistic));
  let atLeast = 0;
  for (let m = 0; m < options.permutations; m++) {
    for (let i = n - 1; i > 0; i--) {
      const j = Math.floor(random() * (i + 1));
      const t = order[i] as number;
      order[i] = order[j] as number;
      order[j] = t;
    }
    const [x, y] = pairedTriangles(ma, mb, order);
    const r = x.length >= 3 ? correlate(x, y) : NaN;
    if (r >= statistic - tolerance) atLeast++;
  }
  return { statistic, p: (atLeast + 1) / (options.permutations + 1), permutations: options.permutations, pairs: x0.length };
}
