import type paper from 'paper/dist/paper-core';
import { paperScope } from './paper-scope';
import { ShapeError } from './errors';

/**
 * Splits SVG path data with several subpaths (`M … Z m … z`, relative moves included) into one absolute path
 * string per subpath, using paper.js's `CompoundPath` parser. Each part can go to `parseSvgOutline`.
 */
export function splitPathData(d: string): string[] {
  if (!/^[\s,MmLlHhVvCcSsQqTtAaZz0-9.eE+-]*$/.test(d)) {
    throw new ShapeError('svg-parse', 'the path data contains characters that are not SVG path commands or numbers');
  }
  const core = paperScope();
  let compound: paper.CompoundPath;
  try {
    compound = new core.CompoundPath({ pathData: d, insert: false });
  } catch (cause) {
    throw new ShapeError('svg-parse', 'paper.js could not read the path data', {}, { cause });
  }
  return compound.children
    .filter((child): child is paper.Path => child instanceof core.Path && child.segments.length > 0)
    .map((child) => child.pathData);
}
