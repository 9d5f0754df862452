import { notFound } from '@/lib/errors';
import type { DbHandle as Handle } from '../client';
import type { LabRow, NewLabRow } from '../database';
import { beforeCursor } from '../pagination';

export function findLabBySlug(db: Handle, slug: string): Promise<LabRow | undefined> {
  return db.selectFrom('labs').selectAll().where('slug', '=', slug).executeTakeFirst();
}

export async function getLabBySlug(db: Handle, slug: string): Promise<LabRow> {
  const lab = await findLabBySlug(db, slug);
  if (!lab) throw notFound('lab', 'No such lab.');
  return lab;
}

export function insertLab(db: Handle, lab: NewLabRow): Promise<LabRow> {
  return db.insertInto('labs').values(lab).returningAll().executeTakeFirstOrThrow();
}

/** Labs with the given ids, newest first, keyset-paginated; fetches `limit + 1` rows. */
export async function listLabsByIds(
  db: Handle,
  ids: readonly string[],
  page: { cursor?: string | undefined; limit: number },
): Promise<LabRow[]> {
  if (ids.length === 0) return [];
  let q = db.selectFrom('labs').selectAll().where('id', 'in', ids);
  if (page.cursor) q = q.where(beforeCursor(page.cursor, 'created_at', 'id'));
  return q.orderBy('created_at', 'desc').orderBy('id', 'desc').limit(page.limit + 1).execute();
}

export async function getLabById(db: Handle, id: string): Promise<LabRow> {
  const lab = await db.selectFrom('labs').selectAll().where('id', '=', id).executeTakeFirst();
  if (!lab) throw notFound('lab', 'No such lab.');
  return lab;
}
