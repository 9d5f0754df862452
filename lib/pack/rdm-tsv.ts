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
/** The most bytes one value takes on the fast path: sign, 8 whole digits, point, 7 decimals. */
const FAST_MAX_BYTES = 17;

const ZERO = 0x30;
const MINUS = 0x2d;
const POINT = 0x2e;
const TAB = 0x09;
const LF = 0x0a;
const encoder = new TextEncoder();

/** A growing byte buffer the table is written into (ASCII digits; ids as UTF-8). */
class ByteWriter {
  bytes: Uint8Array;
  length = 0;

  constructor(capacity: number) {
    this.bytes = new Uint8Array(Math.max(64, capacity));
  }

  reserve(more: number): void {
    if (this.length + more <= this.bytes.length) return;
    const grown = new Uint8Array(Math.max(this.length + more, this.bytes.length * 2));
    grown.set(this.bytes.subarray(0, this.length));
    this.bytes = grown;
  }

  put(bytes: Uint8Array): void {
    this.reserve(bytes.length);
    this.bytes.set(bytes, this.length);
    this.length += bytes.length;
  }

  /** One value rounded to `RDM_DECIMALS` places, in shortest round-trip form (see `formatRdmValue`). */
  value(value: number): void {
    const units = Math.round(value * SCALE);
    if (!(Math.abs(units) < FAST_LIMIT)) return this.put(encoder.encode(String(units / SCALE + 0)));
    this.reserve(FAST_MAX_BYTES);
    const out = this.bytes;
    let at = this.length;
    if (units === 0) {
      out[at] = ZERO;
      this.length = at + 1;
      return;
    }
    if (units < 0) out[at++] = MINUS;
    const magnitude = Math.abs(units);
    if (magnitude < EXPONENT_BELOW) {
      out[at] = ZERO + magnitude;
      out[at + 1] = 0x65; // e
      out[at + 2] = MINUS;
      out[at + 3] = ZERO + RDM_DECIMALS;
      this.length = at + 4;
      return;
    }
    let whole = Math.floor(magnitude / SCALE);
    let fraction = magnitude - whole * SCALE;
    let wholeDigits = 1;
    for (let w = whole; w >= 10; w = Math.floor(w / 10)) wholeDigits++;
    for (let d = wholeDigits - 1; d >= 0; d--) {
      out[at + d] = ZERO + (whole % 10);
      whole = Math.floor(whole / 10);
    }
    at += wholeDigits;
    if (fraction !== 0) {
      let digits = RDM_DECIMALS;
      while (fraction % 10 === 0) {
        fraction /= 10;
        digits--;
      }
      out[at++] = POINT;
      // The remaining digits, zero-padded on the left to `digits` places.
      for (let d = digits - 1; d >= 0; d--) {
        out[at + d] = ZERO + (fraction % 10);
        fraction = Math.floor(fraction / 10);
      }
      at += digits;
    }
    this.length = at;
  }

  byte(b: number): void {
    this.reserve(1);
    this.bytes[this.length++] = b;
  }

  result(): Uint8Array {
    return this.bytes.slice(0, this.length);
  }
}

/**
 * One value rounded to `RDM_DECIMALS` places, printed in shortest round-trip form (`0.1234567`, `0`, `1.5`,
 * `5e-7`) — exactly `String(Math.round(value · 10⁷) / 10⁷ + 0)`, but built from the integer count of 1e-7
 * units: the quotient is the double nearest that decimal, and no shorter decimal is as near (a double holds
 * ~16 significant digits, these have at most 15), so its shortest form is the decimal itself. The tables are
 * written by the same code, straight into bytes.
 */
export function formatRdmValue(value: number): string {
  const writer = new ByteWriter(FAST_MAX_BYTES);
  writer.value(value);
  return String.fromCharCode(...writer.bytes.subarray(0, writer.length));
}

/**
 * Lines `from` … `to − 1` of `rdmTsv`'s table as UTF-8 bytes — preceded by its header line when `from` is 0 —
 * each ending in LF, from those rows of the matrix (`rows`: row-major, `ids.length` values a row, row `from`
 * first). Joined in order, the blocks of a split give exactly the bytes of `rdmTsv`'s text.
 */
export function rdmTsvRowBytes(rows: Float64Array, ids: readonly string[], from: number, to: number): Uint8Array {
  const n = ids.length;
  if (rows.length !== (to - from) * n) throw new RangeError(`rows ${from} … ${to} of an RDM of size ${n} are ${(to - from) * n} values, got ${rows.length}`);
  const idBytes = ids.map((id) => encoder.encode(id));
  // Most values take 9 bytes with their tab (0.1234567); the writer grows if they take more.
  const writer = new ByteWriter((to - from + 1) * (n * 10 + 16));
  if (from === 0) {
    writer.put(encoder.encode('id'));
    for (const id of idBytes) {
      writer.byte(TAB);
      writer.put(id);
    }
    writer.byte(LF);
  }
  for (let i = from; i < to; i++) {
    writer.put(idBytes[i] as Uint8Array);
    const base = (i - from) * n;
    for (let j = 0; j < n; j++) {
      writer.byte(TAB);
      writer.value(rows[base + j] as number);
    }
    writer.byte(LF);
  }
  return writer.result();
}

/** `rdmTsvRowBytes` as text. */
export function rdmTsvRows(rows: Float64Array, ids: readonly string[], from: number, to: number): string {
  return new TextDecoder().decode(rdmTsvRowBytes(rows, ids, from, to));
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
