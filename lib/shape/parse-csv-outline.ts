import { ShapeError } from './errors';
import type { Contour } from './types';

/**
 * Reads an outline from CSV text with one `x,y` vertex per line (comma, semicolon, tab or spaces between the
 * two numbers). Blank lines and `#` comments are skipped, as is a first line that is not numeric (a header).
 * A last vertex repeating the first is dropped, since contours close implicitly. Raises `csv-parse` naming
 * the line, `not-finite`, and `too-few-points`.
 */
export function parseCsvOutline(csvText: string): Contour {
  const xs: number[] = [];
  const ys: number[] = [];
  const lines = csvText.split(/\r\n|\n|\r/);
  let seenData = false;
  lines.forEach((raw, index) => {
    const line = raw.trim();
    if (line === '' || line.startsWith('#')) return;
    const fields = line.split(/\s*[,;\t]\s*|\s+/).filter((f) => f !== '');
    const numeric = fields.length === 2 && fields.every((f) => /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(f));
    if (!numeric) {
      if (!seenData && xs.length === 0 && fields.some((f) => /[A-Za-z_]/.test(f))) {
        seenData = true;
        return;
      }
      throw new ShapeError('csv-parse', `line ${index + 1} is not an x,y pair of numbers: "${line.slice(0, 40)}"`, { line: index + 1 });
    }
    seenData = true;
    const px = Number(fields[0]);
    const py = Number(fields[1]);
    if (!Number.isFinite(px) || !Number.isFinite(py)) {
      throw new ShapeError('not-finite', `line ${index + 1} has a coordinate outside the double range`, { line: index + 1 });
    }
    xs.push(px);
    ys.push(py);
  });
  if (xs.length > 1 && xs[0] === xs[xs.length - 1] && ys[0] === ys[ys.length - 1]) {
    xs.pop();
    ys.pop();
  }
  if (xs.length < 3) throw new ShapeError('too-few-points', `an outline needs at least 3 vertices, got ${xs.length}`, { value: xs.length, minimum: 3 });
  return { x: Float64Array.from(xs), y: Float64Array.from(ys) };
}
