import type { RdmRows } from './types';

/**
 * Rows `from` … `to − 1` of an n × n RDM's upper triangle (`RdmRows`): `distance(i, j)` once per pair i < j with
 * from ≤ i < to, row by row. `fillPairwiseRdm` over the same function gives the same values.
 */
export function fillPairwiseRows(n: number, from: number, to: number, distance: (i: number, j: number) => number): RdmRows {
  if (!(Number.isInteger(from) && Number.isInteger(to) && 0 <= from && from <= to && to <= n)) throw new RangeError(`rows ${from} … ${to} are not within 0 … ${n}`);
  // Σ_{i=from}^{to−1} (n − 1 − i)
  const length = ((to - from) * (2 * n - 1 - from - to)) / 2;
  const values = new Float64Array(length);
  let k = 0;
  for (let i = from; i < to; i++) for (let j = i + 1; j < n; j++) values[k++] = distance(i, j);
  return { size: n, from, to, values };
}
