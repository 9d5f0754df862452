import { notFound } from '@/lib/errors';
import type { DbHandle } from '../client';
import type { ShapeSpaceRow } from '../database';
import { beforeCursor } from '../pagination';

export type ShapeSpaceListRow = ShapeSpaceRow & {
  seed_name: string;
  seed_family: 'radial' | 'elliptic' | 'complex';
  seed_descriptor: unknown;
  updated_by_name: string | null;
  created_by_name: string | null;
  edition_count: number | null;
};

function withJoins(db: DbHandle) {
  return db
    .selectFrom('shape_spaces')
    .innerJoin('seed_shapes', 'seed_shapes.id', 'shape_spaces.seed_shape_id')
    .leftJoin('users as updater', 'updater.id', 'shape_spaces.updated_by')
    .leftJoin('users as creator', 'creator.id', 'shape_spaces.created_by')
    .selectAll('shape_spaces')
    .select((eb) => [
      eb.selectFrom('editions').whereRef('editions.space_id', '=', 'shape_spaces.id').select((e) => e.fn.countAll<number>().as('n')).as('edition_count'),
      'seed_shapes.name as seed_name',
      'seed_shapes.family as seed_family',
      'seed_shapes.descriptor as seed_descriptor',
      'updater.name as updated_by_name',
      'creator.name as created_by_name',
    ]);
}

export async function listShapeSpaces(db: DbHandle, labId: string, page: { cursor?: string | undefined; limit: number }): Promise<ShapeSpaceListRow[]> {
  let q = withJoins(db).where('shape_spaces.lab_id', '=', labId);
  if (page.cursor) q = q.where(beforeCursor(page.cursor, 'shape_spaces.updated_at', 'shape_spaces.id'));
  return q.orderBy('shape_spaces.updated_at', 'desc').orderBy('shape_spaces.id', 'desc').limit(page.limit + 1).execute();
}

export async function getShapeSpace(db: DbHandle, labId: string, id: string): Promise<ShapeSpaceListRow> {
  const row = await withJoins(db).where('shape_spaces.lab_id', '=', labId).where('shape_spaces.id', '=', id).executeTakeFirst();
  if (!row) throw notFound('space', 'No such shape space in this lab.');
  return row;
}

export interface ShapeSpaceWrite {
  name: string;
  seedShapeId: string;
  settings: unknown;
  equalization: unknown | null;
  anisotropy: { designed: number | null; equalized: number | null };
  stimulusCount: number;
}

export function insertShapeSpace(db: DbHandle, labId: string, userId: string, s: ShapeSpaceWrite): Promise<ShapeSpaceRow> {
  return db
    .insertInto('shape_spaces')
    .values({
      lab_id: labId,
      name: s.name,
      seed_shape_id: s.seedShapeId,
      settings: JSON.stringify(s.settings),
      equalization: s.equalization === null ? null : JSON.stringify(s.equalization),
      anisotropy: JSON.stringify(s.anisotropy),
      stimulus_count: s.stimulusCount,
      created_by: userId,
      updated_by: userId,
    })
    .returningAll()
    .executeTakeFirstOrThrow();
}

/** Replaces a space's definition when the stored version is `expectedVersion`; undefined if someone saved in between. */
export function updateShapeSpace(db: DbHandle, labId: string, id: string, expectedVersion: number, userId: string, s: ShapeSpaceWrite): Promise<ShapeSpaceRow | undefined> {
  return db
    .updateTable('shape_spaces')
    .set((eb) => ({
      name: s.name,
      seed_shape_id: s.seedShapeId,
      settings: JSON.stringify(s.settings),
      equalization: s.equalization === null ? null : JSON.stringify(s.equalization),
      anisotropy: JSON.stringify(s.anisotropy),
      stimulus_count: s.stimulusCount,
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

/** Replaces a space's boundaries when their stored version is `expectedVersion`; undefined if someone saved in between. */
export function updateSpaceBoundaries(db: DbHandle, labId: string, id: string, expectedVersion: number, userId: string, boundaries: unknown): Promise<{ boundaries_version: number } | undefined> {
  return db
    .updateTable('shape_spaces')
    .set((eb) => ({ boundaries: JSON.stringify(boundaries), boundaries_version: eb('boundaries_version', '+', 1), updated_by: userId, updated_at: new Date() }))
    .where('lab_id', '=', labId)
    .where('id', '=', id)
    .where('boundaries_version', '=', expectedVersion)
    .returning('boundaries_version')
    .executeTakeFirst();
}

export async function deleteShapeSpace(db: DbHandle, labId: string, id: string): Promise<boolean> {
  const r = await db.deleteFrom('shape_spaces').where('lab_id', '=', labId).where('id', '=', id).executeTakeFirst();
  return r.numDeletedRows > 0n;
}

/** How many spaces each of the given seed shapes carries. */
export async function countSpacesBySeed(db: DbHandle, seedShapeIds: readonly string[]): Promise<Map<string, number>> {
  if (seedShapeIds.length === 0) return new Map();
  const rows = await db
    .selectFrom('shape_spaces')
    .select(['seed_shape_id', (eb) => eb.fn.countAll<number>().as('n')])
    .where('seed_shape_id', 'in', seedShapeIds)
    .groupBy('seed_shape_id')
    .execute();
  return new Map(rows.map((r) => [r.seed_shape_id, Number(r.n)]));
}
