import type { Rdm } from '../space/types';

/**
 * RDM values are rounded to this many decimal places (1e-7 in the matrix's unit: design and contour RDMs are of
 * order 1 in axis and shape units, silhouette RDMs lie in [0, 1]), far finer than any model distance is
 * meaningful, and half the text of full doubles (a 1,001-stimulus matrix is a million values).
 */
export const RDM_DECIMALS = 7;
const SCALE = 10 ** RDM_DECIMALS;

/** Past this many units of 1e-7 (1e8 in the matrix's unit) values are printed by `String` itself. */
const FAST_LIMIT = 1e15;
/** Below this many units of 1e-7 (1e-6), ECMAScript's Number-to-String writes an exponent (`5e-7`). */
const EXPONENT_BELOW = 10;

/**
 * One value rounded to `RDM_DECIMALS` places, printed in shortest round-trip form (`0.1234567`, `0`, `1.5`,
 * `5e-7`) — exactly `String(Math.round(value · 10⁷) / 10⁷ + 0)`, but built from the integer count of 1e-7
 * units: the quotient is the double nearest that decimal, and no shorter decimal is as near (a double holds
 * ~16 significant digits, these have at most 15), so its shortest form is the decimal itself.
 */
export function formatRdmValue(value: number): string {
  const units = Math.round(value * SCALE);
  if (!(Math.abs(units) < FAST_LIMIT)) return String(units / SCALE + 0);
  if (units === 0) return '0';
  const sign = units < 0 ? '-' : '';
  const magnitude = Math.abs(units);
  if (magnitude < EXPONENT_BELOW) return `${sign}${magnitude}e-${RDM_DECIMALS}`;
  const whole = Math.floor(magnitude / SCALE);
  let fraction = magnitude - whole * SCALE;
  if (fraction === 0) return `${sign}${whole}`;
  let digits = RDM_DECIMALS;
  while (fraction % 10 === 0) {
    fraction /= 10;
    digits--;
  }
  const text = String(fraction);
  return `${sign}${whole}.${'0000000'.slice(0, digits - text.length)}${text}`;
}

/**
 * Lines `from` … `to − 1` of `rdmTsv`'s table — preceded by its header line when `from` is 0 — each ending in LF,
 * from those rows of the matrix (`rows`: row-major, `ids.length` values a row, row `from` first). Joined in
 * order, the blocks of a split give exactly `rdmTsv`'s text.
 */
export function rdmTsvRows(rows: Float64Array, ids: readonly string[], from: number, to: number): string {
  const n = ids.length;
  if (rows.length !== (to - from) * n) throw new RangeError(`rows ${from} … ${to} of an RDM of size ${n} are ${(to - from) * n} values, got ${rows.length}`);
  const lines: string[] = from === 0 ? [['id', ...ids].join('\t')] : [];
  const row: string[] = new Array<string>(n + 1);
  for (let i = from; i < to; i++) {
    row[0] = ids[i] as string;
    const base = (i - from) * n;
    for (let j = 0; j < n; j++) row[j + 1] = formatRdmValue(rows[base + j] as number);
    lines.push(row.join('\t'));
  }
  return lines.length === 0 ? '' : lines.join('\n') + '\n';
}

/**
 * An RDM as tab-separated text: a header row `id` then the stimulus ids, then one row per stimulus, its id then
 * its n values (rounded to 7 decimals, `RDM_DECIMALS`), lines ending in LF. The same matrix always gives the same text.
 */
export function rdmTsv(rdm: Rdm, ids: readonly string[]): string {
  const n = rdm.size;
  if (ids.length !== n) throw new RangeError(`an RDM of size ${n} needs ${n} ids, got ${ids.length}`);
  return rdmTsvRows(rdm.values, ids, 0, n);
}
