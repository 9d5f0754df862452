import { stringify } from 'csv-stringify/sync';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { neutralizeCsvCell } from '@/lib/csv';
import { stimuliCsv, trialListCsv } from '@/lib/pack';
import type { ManifestStimulus } from '@/lib/pack';
import { formulaCellsIn, parseCsv } from '../../support/csv-safety';

// The formula starts are OWASP's CSV-injection list (owasp.org/www-community/attacks/CSV_Injection).
const FORMULAS = ['=1+1', '+1+1', '-1+1', '@SUM(A1)', '\t=1', '\r=1', '=HYPERLINK("http://example.invalid","x")', "=cmd|' /C calc'!A0"];

describe('neutralizeCsvCell', () => {
  it('prefixes every formula start with an apostrophe and leaves numbers and plain text alone', () => {
    for (const f of FORMULAS) expect(neutralizeCsvCell(f)).toBe(`'${f}`);
    expect(neutralizeCsvCell(-0.4)).toBe('-0.4');
    expect(neutralizeCsvCell('-1.5e-7')).toBe('-1.5e-7');
    expect(neutralizeCsvCell('f')).toBe('f');
    expect(neutralizeCsvCell(null)).toBe('');
  });

  it('no string, once neutralised and written as CSV, reads back as a formula', () => {
    fc.assert(
      fc.property(fc.array(fc.oneof(fc.string(), fc.constantFrom(...FORMULAS), fc.double().map(String)), { minLength: 1, maxLength: 8 }), (cells) => {
        const csv = stringify([cells.map(neutralizeCsvCell)]);
        expect(formulaCellsIn(csv)).toEqual([]);
      }),
      { seed: 1612, numRuns: 300 },
    );
  });

  it('the checker itself finds a formula that was not neutralised (so it can fail)', () => {
    expect(formulaCellsIn(stringify([['ok', '=1+1', '"quoted"', '-3']]))).toEqual(['=1+1']);
    expect(parseCsv('a,"b,""c"""\r\n1,2\n')).toEqual([['a', 'b,"c"'], ['1', '2']]);
  });
});

describe('the pack CSVs', () => {
  const stimulus = (id: string): ManifestStimulus =>
    ({
      id,
      kind: 'grid',
      prototypeOf: null,
      position: { a: -0.5, b: 0.25 },
      polar: { rho: 0.56, angleDeg: -26.6 },
      metrics: { area: 1, perimeter: 4, compactness: 0.8, equalAreaDiameterDeg: 2, maxExtentDeg: 2.2 },
      files: { svg: { path: `stimuli/svg/${id}.svg`, sha256: 'a'.repeat(64) }, png: { path: `stimuli/png/${id}.png`, sha256: 'b'.repeat(64) } },
      boundaries: [],
      descriptor: { family: 'radial', baseRadius: 1, terms: [] },
    }) as unknown as ManifestStimulus;

  it('stimuli.csv and trial-list.csv write no formula cell, whatever an id holds, and keep negative numbers', () => {
    const stimuli = FORMULAS.map(stimulus);
    for (const csv of [stimuliCsv(stimuli, []), trialListCsv(stimuli, [])]) expect(formulaCellsIn(csv)).toEqual([]);
    expect(parseCsv(stimuliCsv(stimuli, []))[1]).toContain('-0.5');
  });
});
