import type { Rdm } from './types';

/** Progress is reported about this many times over a matrix, whatever its size. */
const PROGRESS_REPORTS = 50;

/**
 * An n × n RDM from a pairwise distance: `distance(i, j)` is called once per pair i < j and mirrored; the diagonal
 * stays 0. `onProgress(fraction)`, fraction in [0, 1], is called as rows complete (weighted by their pairs) and
 * once with 1 at the end.
 */
export function fillPairwiseRdm(n: number, distance: (i: number, j: number) => number, onProgress?: (fraction: number) => void): Rdm {
  const values = new Float64Array(n * n);
  const totalPairs = (n * (n - 1)) / 2;
  const every = Math.max(1, Math.ceil(totalPairs / PROGRESS_REPORTS));
  let done = 0;
  let nextReport = every;
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      const d = distance(i, j);
      values[i * n + j] = d;
      values[j * n + i] = d;
    }
    done += n - 1 - i;
    if (onProgress && done >= nextReport) {
      onProgress(done / totalPairs);
      nextReport = done + every;
    }
  }
  onProgress?.(1);
  return { size: n, values };
}
