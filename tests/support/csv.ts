/**
 * A strict RFC 4180 reader for the tests (quoted fields, doubled quotes, CRLF or LF): throws on a stray quote or on
 * rows of unequal length, so a malformed export fails the test. Returns the rows as objects keyed by the header.
 */
export function parseCsv(text: string): Record<string, string>[] {
  const rows: string[][] = [];
  let row: string[] = [];
  let field = '';
  let quoted = false;
  let i = 0;
  while (i < text.length) {
    const c = text[i]!;
    if (quoted) {
      if (c === '"' && text[i + 1] === '"') {
        field += '"';
        i += 2;
        continue;
      }
      if (c === '"') {
        quoted = false;
        i++;
        if (i < text.length && !',\r\n'.includes(text[i]!)) throw new Error(`CSV: text after a closing quote at ${i}`);
        continue;
      }
      field += c;
      i++;
      continue;
    }
    if (c === '"') {
      if (field !== '') throw new Error(`CSV: a quote inside an unquoted field at ${i}`);
      quoted = true;
    } else if (c === ',') {
      row.push(field);
      field = '';
    } else if (c === '\n' || c === '\r') {
      row.push(field);
      rows.push(row);
      row = [];
      field = '';
      if (c === '\r' && text[i + 1] === '\n') i++;
    } else field += c;
    i++;
  }
  if (quoted) throw new Error('CSV: an unterminated quoted field');
  if (field !== '' || row.length > 0) rows.push([...row, field]);
  const [header, ...body] = rows;
  if (!header) throw new Error('CSV: no header');
  return body.map((r, n) => {
    if (r.length !== header.length) throw new Error(`CSV: row ${n + 2} has ${r.length} fields, the header ${header.length}`);
    return Object.fromEntries(header.map((h, j) => [h, r[j]!]));
  });
}
