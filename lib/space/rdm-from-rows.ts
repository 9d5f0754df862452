import { SpaceError } from './space-error';
import type { Rdm, RdmRows } from './types';

/**
 * Joins blocks of upper-triangle rows (`RdmRows`, in any order) into the full symmetric RDM, zero diagonal.
 * Raises `SpaceError` (`invalid-argument`) unless the blocks are of one size and cover every row exactly once.
 */
export function rdmFromRows(size: number, blocks: readonly RdmRows[]): Rdm {
  const covered = new Uint8Array(size);
  const values = new Float64Array(size * size);
  for (const block of blocks) {
    if (block.size !== size) throw new SpaceError('invalid-argument', `a block of size ${block.size} in an RDM of size ${size}`);
    let k = 0;
    for (let i = block.from; i < block.to; i++) {
      if (covered[i] === 1) throw new SpaceError('invalid-argument', `row ${i} is in two blocks`);
      covered[i] = 1;
      for (let j = i + 1; j < size; j++) {
        const d = block.values[k++] as number;
        values[i * size + j] = d;
        values[j * size + i] = d;
      }
    }
    if (k !== block.values.length) throw new SpaceError('invalid-argument', `block ${block.from} … ${block.to} holds ${block.values.length} values, not ${k}`);
  }
  const missing = covered.indexOf(0);
  if (missing >= 0) throw new SpaceError('invalid-argument', `row ${missing} is in no block`);
  return { size, values };
}
