import { notFound } from '@/lib/errors';
import type { DbHandle } from '../client';
import type { RunOrderRow, RunOrderState } from '../database';
import { beforeCursor } from '../pagination';

export type RunOrderListRow = RunOrderRow & {
  space_id: string;
  space_name: string;
  edition_number: number;
  edition_state: 'draft' | 'in_review' | 'approved' | 'returned';
  edition_created_at: Date;
  created_by_name: string | null;
};

function withJoins(db: DbHandle) {
  return db
    .selectFrom('run_orders')
    .innerJoin('editions', 'editions.id', 'run_orders.edition_id')
    .innerJoin('shape_spaces', 'shape_spaces.id', 'editions.space_id')
    .leftJoin('users', 'users.id', 'run_orders.created_by')
    .selectAll('run_orders')
    .select([
      'shape_spaces.id as space_id',
      'shape_spaces.name as space_name',
      'editions.number as edition_number',
      'editions.state as edition_state',
      'editions.created_at as edition_created_at',
      'users.name as created_by_name',
    ]);
}

/** Run orders of one edition, newest first (keyset pagination on created_at, id). */
export function listRunOrders(db: DbHandle, labId: string, editionId: string, page: { cursor?: string | undefined; limit: number }): Promise<RunOrderListRow[]> {
  let q = withJoins(db).where('run_orders.lab_id', '=', labId).where('run_orders.edition_id', '=', editionId);
  if (page.cursor) q = q.where(beforeCursor(page.cursor, 'run_orders.created_at', 'run_orders.id'));
  return q.orderBy('run_orders.created_at', 'desc').orderBy('run_orders.id', 'desc').limit(page.limit + 1).execute();
}

/** A run order of the lab; `labId` null for the worker, which acts for every lab. */
export async function getRunOrder(db: DbHandle, labId: string | null, id: string): Promise<RunOrderListRow> {
  let q = withJoins(db).where('run_orders.id', '=', id);
  if (labId) q = q.where('run_orders.lab_id', '=', labId);
  const row = await q.executeTakeFirst();
  if (!row) throw notFound('run-order', 'No such run order in this lab.');
  return row;
}

export function insertRunOrder(
  db: DbHandle,
  r: { labId: string; editionId: string; name: string; definition: unknown; state: RunOrderState; result: unknown | null; createdBy: string },
): Promise<{ id: string }> {
  return db
    .insertInto('run_orders')
    .values({
      lab_id: r.labId,
      edition_id: r.editionId,
      name: r.name,
      definition: JSON.stringify(r.definition),
      state: r.state,
      result: r.result === null ? null : JSON.stringify(r.result),
      created_by: r.createdBy,
    })
    .returning('id')
    .executeTakeFirstOrThrow();
}

export type RunOrderPatch = Partial<{ name: string; definition: unknown; state: RunOrderState; error: string | null; job_id: string | null; result: unknown | null }>;

/**
 * Updates a run order. With `version`, only while the row still has that version (an edit since then wins);
 * `bump` increments the version (a new definition). True when a row changed.
 */
export async function updateRunOrder(db: DbHandle, id: string, patch: RunOrderPatch, opts: { version?: number; bump?: boolean; onlyIn?: readonly RunOrderState[] } = {}): Promise<boolean> {
  const { definition, result, ...rest } = patch;
  let q = db
    .updateTable('run_orders')
    .set((eb) => ({
      ...rest,
      ...(definition !== undefined ? { definition: JSON.stringify(definition) } : {}),
      ...(result !== undefined ? { result: result === null ? null : JSON.stringify(result) } : {}),
      ...(opts.bump ? { version: eb('version', '+', 1) } : {}),
      updated_at: new Date(),
    }))
    .where('id', '=', id);
  if (opts.version !== undefined) q = q.where('version', '=', opts.version);
  if (opts.onlyIn) q = q.where('state', 'in', opts.onlyIn);
  const r = await q.executeTakeFirst();
  return r.numUpdatedRows > 0n;
}

export async function deleteRunOrder(db: DbHandle, labId: string, id: string): Promise<boolean> {
  const r = await db.deleteFrom('run_orders').where('lab_id', '=', labId).where('id', '=', id).executeTakeFirst();
  return r.numDeletedRows > 0n;
}
