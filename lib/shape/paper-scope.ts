import paper from 'paper/dist/paper-core';

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
