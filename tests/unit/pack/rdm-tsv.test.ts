import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { formatRdmValue, rdmTsv, rdmTsvRowBytes } from '@/lib/pack/rdm-tsv';

/** The plain definition of an RDM cell: rounded to 1e-7, then ECMAScript's own shortest round-trip form. */
const plain = (value: number): string => String(Math.round(value * 1e7) / 1e7 + 0);

describe('RDM tables', () => {
  it('format every value exactly as String(round(v · 1e7) / 1e7) does, exponents and negatives included', () => {
    for (const v of [0, -0, 1, 1e-7, 5e-8, 4.9e-8, 9.4e-7, 9.5e-7, 1e-6, 1.2e-6, 0.5, 2, 123.4567891, 1e8, 12345678.1234567, -0.3, -5e-7, 1e30]) expect(formatRdmValue(v)).toBe(plain(v));
    fc.assert(
      fc.property(
        fc.oneof(fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0, max: 2e-5, noNaN: true }), fc.double({ min: -1e9, max: 1e9, noNaN: true }), fc.integer({ min: 0, max: 10 ** 9 }).map((k) => k / 1e7)),
        (v) => {
          expect(formatRdmValue(v)).toBe(plain(v));
        },
      ),
      { seed: 20_260_601, numRuns: 20_000 },
    );
  });

  it('write a header of ids, then one row per stimulus with its id, tab-separated, LF line ends', () => {
    const text = rdmTsv({ size: 2, values: Float64Array.from([0, 0.123456789, 0.123456789, 0]) }, ['a', 'b']);
    expect(text).toBe('id\ta\tb\na\t0\t0.1234568\nb\t0.1234568\t0\n');
  });

  it('write blocks of rows as the UTF-8 bytes of the plain table, joined in order', () => {
    const ids = ['a', 'ß-2', 'c', 'δ'];
    const values = Float64Array.from([0, 0.1234567891, 5e-8, -0.3, 1e30, 12345678.1234567, 9.5e-7, 2, 1, 0, 1e-7, 0.5, 4.9e-8, -5e-7, 123.4567891, 0]);
    const lines = [['id', ...ids].join('\t'), ...ids.map((id, i) => [id, ...Array.from(values.subarray(i * 4, i * 4 + 4), plain)].join('\t'))];
    const expected = new TextEncoder().encode(lines.join('\n') + '\n');
    const blocks = [rdmTsvRowBytes(values.slice(0, 4), ids, 0, 1), rdmTsvRowBytes(values.slice(4, 16), ids, 1, 4)];
    expect(Buffer.concat(blocks).equals(Buffer.from(expected))).toBe(true);
  });
});
