import { notFound } from '@/lib/errors';
import type { DbHandle } from '../client';
import type { SeedShapeRow } from '../database';
import { beforeCursor } from '../pagination';

export type SeedShapeListRow = SeedShapeRow & { updated_by_name: string | null; created_by_name: string | null };

function withNames(db: DbHandle) {
  return db
    .selectFrom('seed_shapes')
    .leftJoin('users as updater', 'updater.id', 'seed_shapes.updated_by')
    .leftJoin('users as creator', 'creator.id', 'seed_shapes.created_by')
    .selectAll('seed_shapes')
    .select(['updater.name as updated_by_name', 'creator.name as created_by_name']);
}

/** A lab's seed shapes, most recently changed first, keyset-paginated; fetches `limit + 1` rows. */
export async function listSeedShapes(db: DbHandle, labId: string, page: { cursor?: string | undefined; limit: number }): Promise<SeedShapeListRow[]> {
  let q = withNames(db).where('seed_shapes.lab_id', '=', labId);
  if (page.cursor) q = q.where(beforeCursor(page.cursor, 'seed_shapes.updated_at', 'seed_shapes.id'));
  return q.orderBy('seed_shapes.updated_at', 'desc').orderBy('seed_shapes.id', 'desc').limit(page.limit + 1).execute();
}

export function findSeedShape(db: DbHandle, labId: string, id: string): Promise<SeedShapeListRow | undefined> {
  return withNames(db).where('seed_shapes.lab_id', '=', labId).where('seed_shapes.id', '=', id).executeTakeFirst();
}

export async function getSeedShape(db: DbHandle, labId: string, id: string): Promise<SeedShapeListRow> {
  const row = await findSeedShape(db, labId, id);
  if (!row) throw notFound('seed-shape', 'No such seed shape in this lab.');
  return row;
}

export interface SeedShapeWrite {
  name: string;
  family: SeedShapeRow['family'];
  harmonicCount: number;
  descriptor: unknown;
  origin: Record<string, unknown>;
}

export function insertSeedShape(db: DbHandle, labId: string, userId: string, s: SeedShapeWrite): Promise<SeedShapeRow> {
  return db
    .insertInto('seed_shapes')
    .values({
      lab_id: labId,
      name: s.name,
      family: s.family,
      harmonic_count: s.harmonicCount,
      descriptor: JSON.stringify(s.descriptor),
      origin: JSON.stringify(s.origin),
      created_by: userId,
      updated_by: userId,
    })
    .returningAll()
    .executeTakeFirstOrThrow();
}

/** Updates only when the stored version is `expectedVersion`; returns undefined when someone saved in between. */
export function updateSeedShape(
  db: DbHandle,
  labId: string,
  id: string,
  expectedVersion: number,
  userId: string,
  patch: Partial<Pick<SeedShapeWrite, 'name' | 'family' | 'harmonicCount' | 'descriptor'>>,
): Promise<SeedShapeRow | undefined> {
  return db
    .updateTable('seed_shapes')
    .set((eb) => ({
      ...(patch.name !== undefined ? { name: patch.name } : {}),
      ...(patch.family !== undefined ? { family: patch.family } : {}),
      ...(patch.harmonicCount !== undefined ? { harmonic_count: patch.harmonicCount } : {}),
      ...(patch.descriptor !== undefined ? { descriptor: JSON.stringify(patch.descriptor) } : {}),
      version: eb('version', '+', 1),
      updated_by: userId,
      updated_at: new Date(),
    }))
    .where('lab_id', '=', labId)
    .where('id', '=', id)
    .where('version', '=', expectedVersion)
    .returningAll()
    .executeTakeFirst();
}

export async function deleteSeedShape(db: DbHandle, labId: string, id: string): Promise<boolean> {
  const r = await db.deleteFrom('seed_shapes').where('lab_id', '=', labId).where('id', '=', id).executeTakeFirst();
  return r.numDeletedRows > 0n;
}
