import paper from 'paper/dist/paper-core';
import { ShapeError } from './errors';

export type PaperCore = typeof paper;
let scope: PaperCore | undefined;

/**
 * The one private paper.js scope of lib/shape, with a 1 × 1 project. paper.js keeps global state; items are
 * created with `insert: false`, so nothing accumulates in the project. `importSVG` is not used: it needs a DOM.
 */
export function paperScope(): PaperCore {
  if (!scope) {
    const created = new paper.PaperScope() as unknown as PaperCore;
    created.setup(new created.Size(1, 1));
    scope = created;
  }
  scope.activate();
  return scope;
}

/** Only SVG path commands, numbers and separators may appear in path data. */
const PATH_DATA = /^[\s,MmLlHhVvCcSsQqTtAaZz0-9.eE+-]*$/;

/**
 * The non-empty subpaths of SVG path data, read by paper.js's `CompoundPath` parser in the shared scope.
 * Raises `svg-parse` for characters that are not path data, or data paper.js cannot read.
 */
export function readSubpaths(d: string): { core: PaperCore; subpaths: paper.Path[] } {
  if (!PATH_DATA.test(d)) {
    throw new ShapeError('svg-parse', 'the path data contains characters that are not SVG path commands or numbers');
  }
  const core = paperScope();
  let compound: paper.CompoundPath;
  try {
    compound = new core.CompoundPath({ pathData: d, insert: false });
  } catch (cause) {
    throw new ShapeError('svg-parse', 'paper.js could not read the path data', {}, { cause });
  }
  const subpaths = compound.children.filter((child): child is paper.Path => child instanceof core.Path && child.segments.length > 0);
  return { core, subpaths };
}
