import { notFound } from '@/lib/errors';
import type { DbHandle } from '../client';
import type { EditionState, StudyRow, StudyState } from '../database';
import { beforeCursor } from '../pagination';

/** A study with its edition's identity and the names of the people on it. */
export type StudyListRow = StudyRow & {
  space_id: string;
  space_name: string;
  edition_number: number;
  edition_state: EditionState;
  stimulus_count: number;
  created_by_name: string | null;
  updated_by_name: string | null;
};

export interface StudyTexts {
  name: string;
  consentText: string;
  instructionsText: string;
  debriefText: string;
  finishCodePrefix: string;
  targetParticipants: number;
}

export interface StudyDesignWrite {
  editionId: string;
  design: unknown;
  editionWarning: string | null;
}

const textColumns = (t: StudyTexts) => ({
  name: t.name,
  consent_text: t.consentText,
  instructions_text: t.instructionsText,
  debrief_text: t.debriefText,
  finish_code_prefix: t.finishCodePrefix,
  target_participants: t.targetParticipants,
});

function withJoins(db: DbHandle) {
  return db
    .selectFrom('studies')
    .innerJoin('editions', 'editions.id', 'studies.edition_id')
    .innerJoin('shape_spaces', 'shape_spaces.id', 'editions.space_id')
    .leftJoin('users as creator', 'creator.id', 'studies.created_by')
    .leftJoin('users as updater', 'updater.id', 'studies.updated_by')
    .selectAll('studies')
    .select([
      'editions.space_id',
      'shape_spaces.name as space_name',
      'editions.number as edition_number',
      'editions.state as edition_state',
      'editions.stimulus_count',
      'creator.name as created_by_name',
      'updater.name as updated_by_name',
    ]);
}

/** The lab's studies, most recently changed first, keyset-paginated; fetches `limit + 1` rows. */
export function listStudies(db: DbHandle, labId: string, page: { cursor?: string | undefined; limit: number }): Promise<StudyListRow[]> {
  let q = withJoins(db).where('studies.lab_id', '=', labId);
  if (page.cursor) q = q.where(beforeCursor(page.cursor, 'studies.updated_at', 'studies.id'));
  return q.orderBy('studies.updated_at', 'desc').orderBy('studies.id', 'desc').limit(page.limit + 1).execute();
}

export async function getStudy(db: DbHandle, labId: string, id: string): Promise<StudyListRow> {
  const row = await withJoins(db).where('studies.lab_id', '=', labId).where('studies.id', '=', id).executeTakeFirst();
  if (!row) throw notFound('study', 'No such study in this lab.');
  return row;
}

/** The study whose invite link has this token hash (any state; the caller decides what a closed study shows). */
export function findStudyByInviteHash(db: DbHandle, tokenHash: string): Promise<StudyListRow | undefined> {
  return withJoins(db).where('studies.invite_token_hash', '=', tokenHash).executeTakeFirst();
}

/** Locks the study row for a change that reads it first (state checks, version checks). */
export async function lockStudy(db: DbHandle, labId: string, id: string): Promise<StudyListRow> {
  await db.selectFrom('studies').select('id').where('lab_id', '=', labId).where('id', '=', id).forUpdate().executeTakeFirst();
  return getStudy(db, labId, id);
}

export function insertStudy(db: DbHandle, labId: string, userId: string, texts: StudyTexts, d: StudyDesignWrite): Promise<{ id: string }> {
  return db
    .insertInto('studies')
    .values({ lab_id: labId, ...textColumns(texts), edition_id: d.editionId, design: JSON.stringify(d.design), edition_warning: d.editionWarning, created_by: userId, updated_by: userId })
    .returning('id')
    .executeTakeFirstOrThrow();
}

/** Saves texts (and, for Drafts, the design) when the stored version is `expectedVersion`; undefined otherwise. */
export function updateStudy(db: DbHandle, labId: string, id: string, expectedVersion: number, userId: string, texts: StudyTexts, d: StudyDesignWrite | null): Promise<{ version: number } | undefined> {
  return db
    .updateTable('studies')
    .set((eb) => ({
      ...textColumns(texts),
      ...(d ? { edition_id: d.editionId, design: JSON.stringify(d.design), edition_warning: d.editionWarning } : {}),
      version: eb('version', '+', 1),
      updated_by: userId,
      updated_at: new Date(),
    }))
    .where('lab_id', '=', labId)
    .where('id', '=', id)
    .where('version', '=', expectedVersion)
    .returning('version')
    .executeTakeFirst();
}

export async function setStudyState(db: DbHandle, id: string, state: StudyState, userId: string): Promise<void> {
  const now = new Date();
  await db
    .updateTable('studies')
    .set((eb) => ({ state, ...(state === 'open' ? { opened_at: now } : { closed_at: now }), version: eb('version', '+', 1), updated_by: userId, updated_at: now }))
    .where('id', '=', id)
    .execute();
}

/** Sets (or, with nulls, revokes) the invite link. */
export async function setStudyInvite(db: DbHandle, id: string, invite: { nonce: string; tokenHash: string } | null, userId: string): Promise<void> {
  const now = new Date();
  await db
    .updateTable('studies')
    .set((eb) => ({ invite_nonce: invite?.nonce ?? null, invite_token_hash: invite?.tokenHash ?? null, invite_rotated_at: now, version: eb('version', '+', 1), updated_by: userId, updated_at: now }))
    .where('id', '=', id)
    .execute();
}

export async function deleteStudy(db: DbHandle, labId: string, id: string): Promise<boolean> {
  const r = await db.deleteFrom('studies').where('lab_id', '=', labId).where('id', '=', id).executeTakeFirst();
  return r.numDeletedRows > 0n;
}
