import paper from 'paper/dist/paper-core';
import { ShapeError } from './errors';

type PaperCore = typeof paper;
let scope: PaperCore | undefined;

/** A private paper.js scope (paper keeps global state; items are made with `insert: false`). */
function paperScope(): PaperCore {
  if (!scope) {
    const created = new paper.PaperScope() as unknown as PaperCore;
    created.setup(new created.Size(1, 1));
    scope = created;
  }
  scope.activate();
  return scope;
}

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
