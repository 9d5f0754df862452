import type { Rdm } from './types';

/**
 * The upper triangle of an RDM without the diagonal, row by row: (0,1), (0,2), …, (0,n−1), (1,2), …, the
 * n(n − 1)/2 values that correlations between RDMs use (the same order as SciPy's `squareform`).
 */
export function condenseRdm(rdm: Rdm): Float64Array {
  const n = rdm.size;
  const out = new Float64Array((n * (n - 1)) / 2);
  let o = 0;
  for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) out[o++] = rdm.values[i * n + j] as number;
  return out;
}
