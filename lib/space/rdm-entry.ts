import { SpaceError } from './space-error';
import type { Rdm } from './types';

/** Entry (i, j) of an RDM (0-based row and column). Raises `SpaceError` for an index outside 0…size − 1. */
export function rdmEntry(rdm: Rdm, i: number, j: number): number {
  if (!Number.isInteger(i) || !Number.isInteger(j) || i < 0 || j < 0 || i >= rdm.size || j >= rdm.size) {
    throw new SpaceError('invalid-argument', `RDM index (${i}, ${j}) is outside a ${rdm.size} × ${rdm.size} matrix`);
  }
  return rdm.values[i * rdm.size + j] as number;
}
