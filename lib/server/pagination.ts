import 'server-only';
import { validationError } from '@/lib/errors';
import type { Page, PageQuery } from '@/lib/schemas/common';

/**
 * Cursor pagination over a small list already loaded and ordered (members, invitations, a user's labs): the cursor
 * is the key of the last item seen. Large tables page in SQL with `db/pagination.ts` instead.
 */
export function paginate<T>(items: readonly T[], query: PageQuery, keyOf: (item: T) => string): Page<T> {
  let start = 0;
  if (query.cursor) {
    const key = Buffer.from(query.cursor, 'base64url').toString('utf8');
    const index = items.findIndex((item) => keyOf(item) === key);
    if (index < 0) throw validationError('pagination', 'The cursor is malformed or out of date.', { cursor: ['Malformed cursor'] });
    start = index + 1;
  }
  const page = items.slice(start, start + query.limit);
  const last = page.at(-1);
  const hasMore = start + query.limit < items.length;
  return { items: page, nextCursor: hasMore && last ? Buffer.from(keyOf(last), 'utf8').toString('base64url') : null };
}
