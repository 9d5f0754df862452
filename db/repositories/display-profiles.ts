import { notFound } from '@/lib/errors';
import type { DbHandle } from '../client';
import type { DisplayProfileRow } from '../database';
import { beforeCursor } from '../pagination';

export type DisplayProfileListRow = DisplayProfileRow & { updated_by_name: string | null };

export interface DisplayProfileWrite {
  name: string;
  widthPx: number;
  heightPx: number;
  widthCm: number | null;
  pixelsPerCm: number | null;
  viewingDistanceCm: number;
  notes: string;
}

const columns = (p: DisplayProfileWrite) => ({
  name: p.name,
  width_px: p.widthPx,
  height_px: p.heightPx,
  width_cm: p.widthCm,
  pixels_per_cm: p.pixelsPerCm,
  viewing_distance_cm: p.viewingDistanceCm,
  notes: p.notes,
});

function withJoins(db: DbHandle) {
  return db.selectFrom('display_profiles').leftJoin('users', 'users.id', 'display_profiles.updated_by').selectAll('display_profiles').select('users.name as updated_by_name');
}

export function listDisplayProfiles(db: DbHandle, labId: string, page: { cursor?: string | undefined; limit: number }): Promise<DisplayProfileListRow[]> {
  let q = withJoins(db).where('display_profiles.lab_id', '=', labId);
  if (page.cursor) q = q.where(beforeCursor(page.cursor, 'display_profiles.updated_at', 'display_profiles.id'));
  return q.orderBy('display_profiles.updated_at', 'desc').orderBy('display_profiles.id', 'desc').limit(page.limit + 1).execute();
}

export async function getDisplayProfile(db: DbHandle, labId: string, id: string): Promise<DisplayProfileListRow> {
  const row = await withJoins(db).where('display_profiles.lab_id', '=', labId).where('display_profiles.id', '=', id).executeTakeFirst();
  if (!row) throw notFound('profile', 'No such display profile in this lab.');
  return row;
}

export function insertDisplayProfile(db: DbHandle, labId: string, userId: string, p: DisplayProfileWrite): Promise<{ id: string }> {
  return db
    .insertInto('display_profiles')
    .values({ lab_id: labId, ...columns(p), created_by: userId, updated_by: userId })
    .returning('id')
    .executeTakeFirstOrThrow();
}

/** Replaces a profile when its stored version is `expectedVersion`; undefined if someone saved in between. */
export function updateDisplayProfile(db: DbHandle, labId: string, id: string, expectedVersion: number, userId: string, p: DisplayProfileWrite): Promise<{ version: number } | undefined> {
  return db
    .updateTable('display_profiles')
    .set((eb) => ({ ...columns(p), version: eb('version', '+', 1), updated_by: userId, updated_at: new Date() }))
    .where('lab_id', '=', labId)
    .where('id', '=', id)
    .where('version', '=', expectedVersion)
    .returning('version')
    .executeTakeFirst();
}

export async function deleteDisplayProfile(db: DbHandle, labId: string, id: string): Promise<boolean> {
  const r = await db.deleteFrom('display_profiles').where('lab_id', '=', labId).where('id', '=', id).executeTakeFirst();
  return r.numDeletedRows > 0n;
}
