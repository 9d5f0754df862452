import { StatsError } from './stats-error';

/**
 * A square matrix, row-major: `size` × `size` values (the shape of `lib/space`'s `Rdm`, so an RDM passes as is).
 * Dissimilarity matrices are symmetric with a zero diagonal; NaN marks an entry with no data.
 */
export interface SquareMatrix {
  readonly size: number;
  readonly values: ArrayLike<number>;
}

/** Throws `StatsError` (`length-mismatch`) unless `m` holds size² values, size ≥ `minSize`. */
export function checkSquareMatrix(m: SquareMatrix, what: string, minSize = 1): void {
  if (!Number.isInteger(m.size) || m.size < minSize || m.values.length !== m.size * m.size) {
    throw new StatsError('length-mismatch', `${what} must be a square matrix of at least ${minSize} × ${minSize}; got size ${m.size} with ${m.values.length} values.`);
  }
}
