// A check for every CSV the product exports: no cell a spreadsheet would run as a formula. Use it on any new export
// (`expect(formulaCellsIn(csv)).toEqual([])`); the cells come from a small RFC 4180 reader, so quoting cannot hide one.
import { FORMULA_START } from '@/lib/csv';

const NUMBER = /^-?\d+(\.\d+)?(e[+-]?\d+)?$/i;

/** Rows of RFC 4180 CSV (quoted fields, doubled quotes, CRLF or LF line ends). */
export function parseCsv(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let cell = '';
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const ch = text[i]!;
    if (quoted) {
      if (ch === '"' && text[i + 1] === '"') {
        cell += '"';
        i++;
      } else if (ch === '"') quoted = false;
      else cell += ch;
    } else if (ch === '"' && cell === '') quoted = true;
    else if (ch === ',') {
      row.push(cell);
      cell = '';
    } else if (ch === '\n' || (ch === '\r' && text[i + 1] === '\n')) {
      if (ch === '\r') i++;
      row.push(cell);
      rows.push(row);
      row = [];
      cell = '';
    } else cell += ch;
  }
  if (cell !== '' || row.length > 0) rows.push([...row, cell]);
  return rows;
}

/** The cells a spreadsheet would read as a formula: starting with = + - @, a tab or CR, and not a plain number. */
export function formulaCellsIn(csv: string): string[] {
  return parseCsv(csv)
    .flat()
    .filter((cell) => FORMULA_START.test(cell) && !NUMBER.test(cell));
}
