import { sql } from 'kysely';
import { notFound } from '@/lib/errors';
import type { DbHandle } from '../client';
import type { StudyExclusionRow, StudyResultRow, StudyResultState } from '../database';

/** The content hash of a study's edition (the stamp on every export). */
export async function getEditionHashOfStudy(db: DbHandle, studyId: string): Promise<string> {
  const row = await db.selectFrom('studies').innerJoin('editions', 'editions.id', 'studies.edition_id').select('editions.content_hash').where('studies.id', '=', studyId).executeTakeFirst();
  if (!row) throw notFound('study', 'No such study.');
  return row.content_hash;
}

export async function findResultSettings(db: DbHandle, studyId: string): Promise<unknown> {
  const row = await db.selectFrom('study_result_settings').select('settings').where('study_id', '=', studyId).executeTakeFirst();
  return row?.settings;
}

export async function upsertResultSettings(db: DbHandle, studyId: string, settings: unknown, userId: string): Promise<void> {
  const json = JSON.stringify(settings);
  await db
    .insertInto('study_result_settings')
    .values({ study_id: studyId, settings: json, updated_by: userId })
    .onConflict((oc) => oc.column('study_id').doUpdateSet({ settings: json, updated_by: userId, updated_at: sql`now()` }))
    .execute();
}

export type ExclusionListRow = StudyExclusionRow & { participant_index: number; created_by_name: string | null; removed_by_name: string | null };

/** Every manual exclusion decision of a study (removed ones too), oldest first. */
export function listExclusions(db: DbHandle, studyId: string): Promise<ExclusionListRow[]> {
  return db
    .selectFrom('study_exclusions as e')
    .innerJoin('study_sessions as s', 's.id', 'e.session_id')
    .leftJoin('users as creator', 'creator.id', 'e.created_by')
    .leftJoin('users as remover', 'remover.id', 'e.removed_by')
    .selectAll('e')
    .select(['s.participant_index', 'creator.name as created_by_name', 'remover.name as removed_by_name'])
    .where('e.study_id', '=', studyId)
    .orderBy('e.created_at')
    .orderBy('e.id')
    .execute();
}

export async function insertExclusion(
  db: DbHandle,
  v: { studyId: string; sessionId: string; trialIndex: number | null; action: 'exclude' | 'keep'; reason: string; userId: string },
): Promise<string> {
  const row = await db
    .insertInto('study_exclusions')
    .values({ study_id: v.studyId, session_id: v.sessionId, trial_index: v.trialIndex, action: v.action, reason: v.reason, created_by: v.userId })
    .returning('id')
    .executeTakeFirstOrThrow();
  return row.id;
}

/** Marks a decision removed (the row stays as the record); false when there is no such active decision. */
export async function removeExclusion(db: DbHandle, studyId: string, id: string, userId: string): Promise<boolean> {
  const r = await db
    .updateTable('study_exclusions')
    .set({ removed_at: sql`now()`, removed_by: userId })
    .where('study_id', '=', studyId)
    .where('id', '=', id)
    .where('removed_at', 'is', null)
    .executeTakeFirst();
  return r.numUpdatedRows > 0n;
}

export function findResult(db: DbHandle, studyId: string, dataHash: string): Promise<StudyResultRow | undefined> {
  return db.selectFrom('study_results').selectAll().where('study_id', '=', studyId).where('data_hash', '=', dataHash).executeTakeFirst();
}

export function findResultById(db: DbHandle, id: string): Promise<StudyResultRow | undefined> {
  return db.selectFrom('study_results').selectAll().where('id', '=', id).executeTakeFirst();
}

/** Inserts a result row unless one with the same hash exists (a concurrent request made it); returns the row. */
export async function insertResultOnce(
  db: DbHandle,
  v: { studyId: string; dataHash: string; state: StudyResultState; input: unknown; result: unknown | null; computeMs: number | null },
): Promise<{ row: StudyResultRow; isNew: boolean }> {
  const inserted = await db
    .insertInto('study_results')
    .values({
      study_id: v.studyId,
      data_hash: v.dataHash,
      state: v.state,
      progress: v.state === 'ready' ? 1 : 0,
      input: JSON.stringify(v.input),
      result: v.result === null ? null : JSON.stringify(v.result),
      compute_ms: v.computeMs,
    })
    .onConflict((oc) => oc.columns(['study_id', 'data_hash']).doNothing())
    .returningAll()
    .executeTakeFirst();
  if (inserted) return { row: inserted, isNew: true };
  return { row: (await findResult(db, v.studyId, v.dataHash))!, isNew: false };
}

export async function updateResult(
  db: DbHandle,
  id: string,
  v: { state?: StudyResultState; progress?: number; result?: unknown; error?: string | null; jobId?: string; computeMs?: number },
): Promise<void> {
  await db
    .updateTable('study_results')
    .set({
      ...(v.state !== undefined ? { state: v.state } : {}),
      ...(v.progress !== undefined ? { progress: v.progress } : {}),
      ...(v.result !== undefined ? { result: JSON.stringify(v.result) } : {}),
      ...(v.error !== undefined ? { error: v.error } : {}),
      ...(v.jobId !== undefined ? { job_id: v.jobId } : {}),
      ...(v.computeMs !== undefined ? { compute_ms: v.computeMs } : {}),
      updated_at: sql`now()`,
    })
    .where('id', '=', id)
    .execute();
}

export async function deleteResult(db: DbHandle, id: string): Promise<void> {
  await db.deleteFrom('study_results').where('id', '=', id).execute();
}

/** Keeps a study's `keep` most recent finished results (other settings stay cached), deleting older ones. */
export async function pruneResults(db: DbHandle, studyId: string, keep: number): Promise<void> {
  await db
    .deleteFrom('study_results')
    .where('study_id', '=', studyId)
    .where('state', 'in', ['ready', 'failed'])
    .where('id', 'not in', (qb) => qb.selectFrom('study_results').select('id').where('study_id', '=', studyId).orderBy('updated_at', 'desc').limit(keep))
    .execute();
}

/** Each session of a study with its monitor exclusion (a session excluded there is left out of the results too). */
export function listSessionsForResults(db: DbHandle, studyId: string): Promise<{ id: string; participant_index: number; is_excluded: boolean; exclusion_reason: string | null }[]> {
  return db.selectFrom('study_sessions').select(['id', 'participant_index', 'is_excluded', 'exclusion_reason']).where('study_id', '=', studyId).orderBy('participant_index').execute();
}
