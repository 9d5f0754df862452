import { StatsError } from './stats-error';
import { symmetricEigen } from './symmetric-eigen';

/** Singular values below this fraction of the largest are treated as zero (their vectors are completed). */
const RANK_TOLERANCE = 1e-12;

export interface ProcrustesFit {
  /** k × k orthogonal matrix R (a reflection allowed): a row point y maps to scale·y·R + translation. */
  readonly rotation: readonly (readonly number[])[];
  readonly scale: number;
  readonly translation: readonly number[];
  /** Σᵢ |xᵢ − (scale·yᵢR + translation)|², in the squared units of X. */
  readonly residual: number;
  /** The residual over Σ|xᵢ − x̄|²: 0 for a perfect fit, 1 when Y explains nothing (Gower's m², 1975). */
  readonly standardizedResidual: number;
  /** Y aligned onto X. */
  readonly aligned: readonly (readonly number[])[];
}

/** Stage: mean of the rows and the centred rows. */
function centre(points: readonly (readonly number[])[], k: number): { mean: number[]; centred: number[][] } {
  const mean = Array.from({ length: k }, (_, c) => points.reduce((s, p) => s + (p[c] as number), 0) / points.length);
  return { mean, centred: points.map((p) => p.map((v, c) => v - (mean[c] as number))) };
}

/**
 * Orthogonal Procrustes analysis with scaling (Schönemann 1966; Gower 1975): the rotation (or reflection) R, the
 * scale s > 0 and the translation t that carry the configuration Y onto X with the least squared residual.
 * M = Ycᵀ Xc = U Σ Vᵀ (from the Jacobi eigen-decomposition of MᵀM), R = U Vᵀ, s = tr Σ / |Yc|², t = x̄ − s ȳ R.
 * X and Y: the same number (≥ 2) of points, k ≥ 1 coordinates each, finite. Raises `StatsError`
 * (`length-mismatch`, `not-finite`) and `invalid-option` when Y has all its points at one place.
 */
export function procrustes(x: readonly (readonly number[])[], y: readonly (readonly number[])[]): ProcrustesFit {
  const n = x.length;
  const k = x[0]?.length ?? 0;
  if (n < 2 || y.length !== n || k < 1 || [...x, ...y].some((p) => p.length !== k)) {
    throw new StatsError('length-mismatch', `X and Y must hold the same number (≥ 2) of points with the same number of coordinates; got ${n} and ${y.length}.`);
  }
  if ([...x, ...y].some((p) => p.some((v) => !Number.isFinite(v)))) throw new StatsError('not-finite', 'Every coordinate must be a finite number.');
  const { mean: xMean, centred: xc } = centre(x, k);
  const { mean: yMean, centred: yc } = centre(y, k);
  const yNorm = yc.reduce((s, p) => s + p.reduce((t, v) => t + v * v, 0), 0);
  const xNorm = xc.reduce((s, p) => s + p.reduce((t, v) => t + v * v, 0), 0);
  if (yNorm === 0) throw new StatsError('invalid-option', 'Y has every point at the same place; there is nothing to rotate.');
  // Phase 1: M = Ycᵀ Xc (k × k) and its singular value decomposition through MᵀM = V Σ² Vᵀ.
  const m = Array.from({ length: k }, (_, r) => Array.from({ length: k }, (_, c) => yc.reduce((s, p, i) => s + (p[r] as number) * ((xc[i] as number[])[c] as number), 0)));
  const mtm = new Float64Array(k * k);
  for (let r = 0; r < k; r++) for (let c = 0; c < k; c++) mtm[r * k + c] = m.reduce((s, row) => s + (row[r] as number) * (row[c] as number), 0);
  const { values, vectors } = symmetricEigen({ size: k, values: mtm });
  const sigma = Array.from(values, (l) => Math.sqrt(Math.max(0, l)));
  const top = sigma[0] ?? 0;
  const vCol = (j: number) => Array.from({ length: k }, (_, r) => vectors[r * k + j] as number);
  // U's columns: M v / σ; columns of zero singular values completed by Gram–Schmidt against the unit vectors.
  const u: number[][] = [];
  for (let j = 0; j < k; j++) {
    const s = sigma[j] as number;
    let col: number[];
    if (s > RANK_TOLERANCE * top && top > 0) {
      const v = vCol(j);
      col = m.map((row) => row.reduce((acc, val, c) => acc + val * (v[c] as number), 0) / s);
    } else {
      col = [];
      for (let e = 0; e < k && col.length === 0; e++) {
        const cand: number[] = Array.from({ length: k }, (_, r) => (r === e ? 1 : 0));
        for (const q of u) {
          const dot = cand.reduce((acc, val, r) => acc + val * (q[r] as number), 0);
          for (let r = 0; r < k; r++) cand[r] = (cand[r] as number) - dot * (q[r] as number);
        }
        const len = Math.hypot(...cand);
        if (len > 1e-8) col = cand.map((c) => c / len);
      }
    }
    u.push(col);
  }
  // Phase 2: R = U Vᵀ, then scale, translation and the residual.
  const rotation = Array.from({ length: k }, (_, r) => Array.from({ length: k }, (_, c) => u.reduce((acc, col, j) => acc + (col[r] as number) * (vectors[c * k + j] as number), 0)));
  const traceSigma = sigma.reduce((s, v) => s + v, 0);
  const scale = traceSigma / yNorm;
  const yMeanR = Array.from({ length: k }, (_, c) => yMean.reduce((s, v, r) => s + v * ((rotation[r] as number[])[c] as number), 0));
  const translation = xMean.map((v, c) => v - scale * (yMeanR[c] as number));
  const aligned = y.map((p) => Array.from({ length: k }, (_, c) => scale * p.reduce((s, v, r) => s + v * ((rotation[r] as number[])[c] as number), 0) + (translation[c] as number)));
  const residual = aligned.reduce((s, p, i) => s + p.reduce((t, v, c) => t + (v - ((x[i] as readonly number[])[c] as number)) ** 2, 0), 0);
  return { rotation, scale, translation, residual, standardizedResidual: xNorm > 0 ? residual / xNorm : 0, aligned };
}
