import { notFound } from '@/lib/errors';
import type { DbHandle } from '../client';
import type { PackRow, PackState } from '../database';
import { beforeCursor } from '../pagination';

export type PackListRow = Omit<PackRow, 'manifest' | 'sequences'> & {
  space_id: string;
  space_name: string;
  edition_number: number;
  edition_state: 'draft' | 'in_review' | 'approved' | 'returned';
  edition_hash: string;
  edition_created_at: Date;
  created_by_name: string | null;
};

function withJoins(db: DbHandle) {
  return db
    .selectFrom('packs')
    .innerJoin('editions', 'editions.id', 'packs.edition_id')
    .innerJoin('shape_spaces', 'shape_spaces.id', 'editions.space_id')
    .leftJoin('users', 'users.id', 'packs.created_by')
    .select([
      'packs.id',
      'packs.lab_id',
      'packs.edition_id',
      'packs.display_profile_id',
      'packs.profile',
      'packs.render_options',
      'packs.options_hash',
      'packs.state',
      'packs.progress',
      'packs.stage',
      'packs.error',
      'packs.attempts',
      'packs.cancel_requested',
      'packs.job_id',
      'packs.object_key',
      'packs.size_bytes',
      'packs.sha256',
      'packs.stimulus_count',
      'packs.created_by',
      'packs.created_at',
      'packs.started_at',
      'packs.finished_at',
      'packs.updated_at',
      'shape_spaces.id as space_id',
      'shape_spaces.name as space_name',
      'editions.number as edition_number',
      'editions.state as edition_state',
      'editions.content_hash as edition_hash',
      'editions.created_at as edition_created_at',
      'users.name as created_by_name',
    ]);
}

export function listPacks(db: DbHandle, labId: string, page: { cursor?: string | undefined; limit: number }): Promise<PackListRow[]> {
  let q = withJoins(db).where('packs.lab_id', '=', labId);
  if (page.cursor) q = q.where(beforeCursor(page.cursor, 'packs.created_at', 'packs.id'));
  return q.orderBy('packs.created_at', 'desc').orderBy('packs.id', 'desc').limit(page.limit + 1).execute();
}

/** A pack of the lab; `labId` null for the worker, which acts for every lab. */
export async function getPack(db: DbHandle, labId: string | null, id: string): Promise<PackListRow> {
  let q = withJoins(db).where('packs.id', '=', id);
  if (labId) q = q.where('packs.lab_id', '=', labId);
  const row = await q.executeTakeFirst();
  if (!row) throw notFound('pack', 'No such pack in this lab.');
  return row;
}

export function findPackByOptions(db: DbHandle, editionId: string, optionsHash: string): Promise<{ id: string; state: PackState } | undefined> {
  return db.selectFrom('packs').select(['id', 'state']).where('edition_id', '=', editionId).where('options_hash', '=', optionsHash).executeTakeFirst();
}

/** A pack's manifest (null until built) and the zip's SHA-256 that names its version. */
export async function getPackManifest(db: DbHandle, labId: string, id: string): Promise<{ manifest: unknown | null; sha256: string | null }> {
  const row = await db.selectFrom('packs').select(['manifest', 'sha256']).where('lab_id', '=', labId).where('id', '=', id).executeTakeFirst();
  if (!row) throw notFound('pack', 'No such pack in this lab.');
  return row;
}

/** The run order files attached to a pack (`{ name, text }[]`, names inside `sequences/`). */
export async function getPackSequences(db: DbHandle, id: string): Promise<{ name: string; text: string }[]> {
  const row = await db.selectFrom('packs').select('sequences').where('id', '=', id).executeTakeFirst();
  if (!row) throw notFound('pack', 'No such pack in this lab.');
  return row.sequences as { name: string; text: string }[];
}

export function insertPack(
  db: DbHandle,
  p: { labId: string; editionId: string; displayProfileId: string; profile: unknown; renderOptions: unknown; optionsHash: string; createdBy: string; sequences?: readonly { name: string; text: string }[] },
): Promise<{ id: string }> {
  return db
    .insertInto('packs')
    .values({
      lab_id: p.labId,
      edition_id: p.editionId,
      display_profile_id: p.displayProfileId,
      profile: JSON.stringify(p.profile),
      render_options: JSON.stringify(p.renderOptions),
      options_hash: p.optionsHash,
      sequences: JSON.stringify(p.sequences ?? []),
      created_by: p.createdBy,
    })
    .returning('id')
    .executeTakeFirstOrThrow();
}

export type PackPatch = Partial<{
  state: PackState;
  progress: number;
  stage: string;
  error: string | null;
  attempts: number;
  cancel_requested: boolean;
  job_id: string | null;
  object_key: string | null;
  size_bytes: number | null;
  sha256: string | null;
  stimulus_count: number | null;
  manifest: string | null;
  started_at: Date | null;
  finished_at: Date | null;
}>;

/** Updates a pack; with `onlyIn`, only while it is in one of those states. True when a row changed. */
export async function updatePack(db: DbHandle, id: string, patch: PackPatch, onlyIn?: readonly PackState[]): Promise<boolean> {
  let q = db.updateTable('packs').set({ ...patch, updated_at: new Date() }).where('id', '=', id);
  if (onlyIn) q = q.where('state', 'in', onlyIn);
  const r = await q.executeTakeFirst();
  return r.numUpdatedRows > 0n;
}

export async function isCancelRequested(db: DbHandle, id: string): Promise<boolean> {
  const row = await db.selectFrom('packs').select('cancel_requested').where('id', '=', id).executeTakeFirst();
  return row?.cancel_requested ?? true;
}
