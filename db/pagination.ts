import { sql, type RawBuilder, type SqlBool } from 'kysely';
import { validationError } from '@/lib/errors';

/** Keyset position: the sort timestamp (ISO) and the id that breaks ties. */
export interface CursorPosition {
  at: string;
  id: string;
}

/** Encodes a keyset position as an opaque base64url cursor. */
export function encodeCursor(position: CursorPosition): string {
  return Buffer.from(JSON.stringify([position.at, position.id]), 'utf8').toString('base64url');
}

/** Decodes a cursor made by `encodeCursor`; anything else is a 400 naming the `cursor` field. */
export function decodeCursor(cursor: string): CursorPosition {
  try {
    const value: unknown = JSON.parse(Buffer.from(cursor, 'base64url').toString('utf8'));
    if (
      Array.isArray(value) &&
      value.length === 2 &&
      typeof value[0] === 'string' &&
      typeof value[1] === 'string' &&
      !Number.isNaN(Date.parse(value[0]))
    ) {
      return { at: value[0], id: value[1] };
    }
  } catch {
    // fall through to the validation error
  }
  throw validationError('pagination', 'The cursor is malformed.', { cursor: ['Malformed cursor'] });
}

/** Splits a fetched `limit + 1` rows into a page and the cursor for the next one. */
export function toPage<R extends { id: string }, T>(
  rows: R[],
  limit: number,
  sortKey: (row: R) => Date,
  map: (row: R) => T,
): { items: T[]; nextCursor: string | null } {
  const hasMore = rows.length > limit;
  const kept = hasMore ? rows.slice(0, limit) : rows;
  const last = kept.at(-1);
  return {
    items: kept.map(map),
    nextCursor: hasMore && last ? encodeCursor({ at: sortKey(last).toISOString(), id: last.id }) : null,
  };
}

/**
 * The keyset condition "after this cursor" for a list ordered by (`atColumn` desc, `idColumn` desc): a row-value
 * comparison, `(at, id) < (cursor at, cursor id)`, which PostgreSQL answers from an index on those columns.
 * `atColumn` must be `timestamptz(3)`: the cursor holds a JavaScript Date, and a column with microseconds would let
 * rows made within the cursor's millisecond slip between pages.
 */
export function beforeCursor(cursor: string, atColumn: string, idColumn: string): RawBuilder<SqlBool> {
  const { at, id } = decodeCursor(cursor);
  return sql<SqlBool>`(${sql.ref(atColumn)}, ${sql.ref(idColumn)}) < (${new Date(at)}, ${id})`;
}
