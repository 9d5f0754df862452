import type { Rdm } from '../space/types';

/**
 * RDM values are rounded to this many decimal places (1e-7 in the matrix's unit: design and contour RDMs are of
 * order 1 in axis and shape units, silhouette RDMs lie in [0, 1]), far finer than any model distance is
 * meaningful, and half the text of full doubles (a 1,001-stimulus matrix is a million values).
 */
export const RDM_DECIMALS = 7;
const SCALE = 10 ** RDM_DECIMALS;

/** One value rounded to `RDM_DECIMALS` places, printed in shortest round-trip form (`0.1234567`, `0`, `1.5`). */
function formatValue(value: number): string {
  return String(Math.round(value * SCALE) / SCALE + 0);
}

/**
 * An RDM as tab-separated text: a header row `id` then the stimulus ids, then one row per stimulus, its id then
 * its n values (rounded to 7 decimals, `RDM_DECIMALS`), lines ending in LF. The same matrix always gives the same text.
 */
export function rdmTsv(rdm: Rdm, ids: readonly string[]): string {
  const n = rdm.size;
  if (ids.length !== n) throw new RangeError(`an RDM of size ${n} needs ${n} ids, got ${ids.length}`);
  const lines: string[] = [['id', ...ids].join('\t')];
  const row: string[] = new Array<string>(n + 1);
  for (let i = 0; i < n; i++) {
    row[0] = ids[i] as string;
    const base = i * n;
    for (let j = 0; j < n; j++) row[j + 1] = formatValue(rdm.values[base + j] as number);
    lines.push(row.join('\t'));
  }
  return lines.join('\n') + '\n';
}
