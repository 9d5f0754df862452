import type paper from 'paper/dist/paper-core';
import { readSubpaths } from './paper-scope';
import { ShapeError } from './errors';
import type { Contour } from './types';

export interface ParseSvgOptions {
  /** Largest distance between a curve and its flattened polygon, as a fraction of the bounding box's larger side (default 1e-4). */
  readonly flatness?: number;
  /** Negate y, turning SVG's y-down frame into the y-up frame of `lib/shape` (default true). */
  readonly flipY?: boolean;
}

/** Default flattening tolerance relative to the outline's size: 1e-4 is 0.05 px on a 512-px stimulus. */
const DEFAULT_RELATIVE_FLATNESS = 1e-4;
/** An open subpath whose end lies within this fraction of the size from its start counts as closed. */
const CLOSURE_TOLERANCE = 1e-9;

function attribute(tag: string, name: string): string | undefined {
  const match = new RegExp(`(?:^|\\s)${name}\\s*=\\s*("([^"]*)"|'([^']*)')`).exec(tag);
  return match ? (match[2] ?? match[3]) : undefined;
}

function lineOf(text: string, index: number): number {
  return text.slice(0, index).split('\n').length;
}

/** Stage: the one outline's path data, from an SVG document or bare path data. */
function extractPathData(svgText: string): string {
  const text = svgText.trim();
  if (!text.startsWith('<')) return text;
  const shapes: { d: string; line: number }[] = [];
  const tagPattern = /<\s*(path|polygon|polyline|rect|circle|ellipse|line)\b([^>]*)>/gi;
  for (let match = tagPattern.exec(text); match; match = tagPattern.exec(text)) {
    const name = (match[1] ?? '').toLowerCase();
    const tag = match[2] ?? '';
    const line = lineOf(text, match.index);
    if (name === 'path') {
      const d = attribute(tag, 'd');
      if (d) shapes.push({ d, line });
    } else if (name === 'polygon') {
      const points = attribute(tag, 'points');
      if (points) shapes.push({ d: `M${points.trim()}Z`, line });
    } else {
      throw new ShapeError('svg-parse', `<${name}> on line ${line} is not supported; convert the outline to a <path>`, { line });
    }
  }
  const transform = /\stransform\s*=/i.exec(text);
  if (transform) {
    throw new ShapeError(
      'svg-parse',
      `the SVG uses a transform (line ${lineOf(text, transform.index)}); apply transforms to the path before uploading`,
      { line: lineOf(text, transform.index) },
    );
  }
  if (shapes.length !== 1) {
    throw new ShapeError('svg-parse', `the SVG must contain exactly one <path> or <polygon>, found ${shapes.length}`, { value: shapes.length });
  }
  return (shapes[0] as { d: string }).d;
}

/**
 * Reads one closed outline from SVG text — a whole document with a single `<path>` (or `<polygon>`), or bare
 * path data — by parsing the `d` attribute with paper.js (`CompoundPath`) and flattening its curves to a
 * polygon within `flatness`. The repeated closing vertex is dropped; y is negated by default (see
 * `contourToSvgPath`). Raises `svg-parse` (unsupported elements, transforms, several subpaths, bad data),
 * `outline-not-closed`, and `too-few-points`.
 */
export function parseSvgOutline(svgText: string, options: ParseSvgOptions = {}): Contour {
  const d = extractPathData(svgText);
  const { subpaths } = readSubpaths(d);
  if (subpaths.length !== 1) {
    throw new ShapeError('svg-parse', `an outline must be one subpath, found ${subpaths.length}`, { value: subpaths.length });
  }
  const path = (subpaths[0] as paper.Path).clone({ insert: false });
  const size = Math.max(path.bounds.width, path.bounds.height);
  if (!(size > 0) || !Number.isFinite(size)) throw new ShapeError('svg-parse', 'the path has no extent');
  const first = path.firstSegment.point;
  const last = path.lastSegment.point;
  if (!path.closed) {
    if (first.getDistance(last) > CLOSURE_TOLERANCE * size) {
      throw new ShapeError('outline-not-closed', `the path ends ${first.getDistance(last).toPrecision(4)} units from where it starts; close it with Z`, {
        value: first.getDistance(last),
      });
    }
    path.closed = true;
  }
  path.flatten((options.flatness ?? DEFAULT_RELATIVE_FLATNESS) * size);
  const sign = options.flipY === false ? 1 : -1;
  const xs: number[] = [];
  const ys: number[] = [];
  for (const segment of path.segments) {
    const px = segment.point.x;
    const py = sign * segment.point.y + 0; // + 0 turns −0 into 0
    const n = xs.length;
    if (n > 0 && xs[n - 1] === px && ys[n - 1] === py) continue;
    xs.push(px);
    ys.push(py);
  }
  while (xs.length > 1 && xs[0] === xs[xs.length - 1] && ys[0] === ys[ys.length - 1]) {
    xs.pop();
    ys.pop();
  }
  if (xs.length < 3) throw new ShapeError('too-few-points', `the outline flattens to ${xs.length} points`, { value: xs.length, minimum: 3 });
  return { x: Float64Array.from(xs), y: Float64Array.from(ys) };
}
