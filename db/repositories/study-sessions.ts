import { sql } from 'kysely';
import type { DbHandle } from '../client';
import type { StudySessionRow, TrialResponseRow } from '../database';
import { beforeCursor } from '../pagination';

/** A session with its figures over the stored trials (practice trials left out of accuracy and RT). */
export type SessionListRow = StudySessionRow & {
  catch_trials: number;
  catch_correct: number;
  median_rt_ms: number | null;
  tab_hidden_trials: number;
  full_screen_left_trials: number;
};

/** The next participant index of a study, taken under the study's row lock (so two joins never share one). */
export async function claimParticipantIndex(db: DbHandle, studyId: string): Promise<number> {
  const row = await db
    .updateTable('studies')
    .set((eb) => ({ participants_started: eb('participants_started', '+', 1) }))
    .where('id', '=', studyId)
    .returning('participants_started')
    .executeTakeFirstOrThrow();
  return row.participants_started - 1;
}

export function insertSession(
  db: DbHandle,
  v: { studyId: string; participantIndex: number; codeHash: string; inviteTokenHash: string; plannedTrials: number; screen: unknown },
): Promise<StudySessionRow> {
  return db
    .insertInto('study_sessions')
    .values({ study_id: v.studyId, participant_index: v.participantIndex, code_hash: v.codeHash, invite_token_hash: v.inviteTokenHash, planned_trials: v.plannedTrials, screen: JSON.stringify(v.screen) })
    .returningAll()
    .executeTakeFirstOrThrow();
}

export function findSessionByCodeHash(db: DbHandle, codeHash: string, options: { lock?: boolean } = {}): Promise<StudySessionRow | undefined> {
  const q = db.selectFrom('study_sessions').selectAll().where('code_hash', '=', codeHash);
  return (options.lock ? q.forUpdate() : q).executeTakeFirst();
}

export async function findSessionOfStudy(db: DbHandle, studyId: string, sessionId: string, options: { lock?: boolean } = {}): Promise<StudySessionRow | undefined> {
  const q = db.selectFrom('study_sessions').selectAll().where('study_id', '=', studyId).where('id', '=', sessionId);
  return (options.lock ? q.forUpdate() : q).executeTakeFirst();
}

/**
 * Stores one answer and counts it in one statement (one round trip, no explicit transaction): it locks the session
 * row while the session is still taking answers, inserts unless this client id or trial index is already stored,
 * and adds what was inserted to the session's counter. `stored` is null when the session is withdrawn, complete or
 * gone; the caller reads the row again to say which.
 */
export async function storeResponse(db: DbHandle, row: Omit<TrialResponseRow, 'received_at'>): Promise<{ stored: number | null; isNew: boolean }> {
  const r = await sql<{ stored: number | null; added: number }>`
    WITH open_session AS (
      SELECT id FROM study_sessions WHERE id = ${row.session_id} AND withdrawn_at IS NULL AND completed_at IS NULL FOR UPDATE
    ), inserted AS (
      INSERT INTO trial_responses (session_id, client_trial_id, trial_index, task, is_practice, is_catch, response_key, rating, rt_ms, is_correct, achieved_ms, onset_ms, offset_ms, was_tab_hidden, left_full_screen)
      SELECT id, ${row.client_trial_id}, ${row.trial_index}, ${row.task}, ${row.is_practice}, ${row.is_catch}, ${row.response_key}, ${row.rating}, ${row.rt_ms}, ${row.is_correct}, ${row.achieved_ms}, ${row.onset_ms}, ${row.offset_ms}, ${row.was_tab_hidden}, ${row.left_full_screen}
      FROM open_session
      ON CONFLICT DO NOTHING
      RETURNING 1
    ), counted AS (
      UPDATE study_sessions SET stored_trials = stored_trials + (SELECT count(*) FROM inserted), last_seen_at = now()
      WHERE id IN (SELECT id FROM open_session)
      RETURNING stored_trials
    )
    SELECT (SELECT stored_trials FROM counted) AS stored, (SELECT count(*) FROM inserted)::int AS added`.execute(db);
  const out = r.rows[0]!;
  return { stored: out.stored, isNew: out.added > 0 };
}

export async function listAnsweredIndices(db: DbHandle, sessionId: string): Promise<number[]> {
  const rows = await db.selectFrom('trial_responses').select('trial_index').where('session_id', '=', sessionId).orderBy('trial_index').execute();
  return rows.map((r) => r.trial_index);
}

export async function countResponses(db: DbHandle, sessionId: string): Promise<number> {
  const r = await db.selectFrom('trial_responses').select((eb) => eb.fn.countAll<number>().as('n')).where('session_id', '=', sessionId).executeTakeFirstOrThrow();
  return Number(r.n);
}

export async function completeSession(db: DbHandle, sessionId: string, finishCode: string): Promise<void> {
  await db.updateTable('study_sessions').set({ completed_at: new Date(), finish_code: finishCode, last_seen_at: new Date() }).where('id', '=', sessionId).execute();
}

/** Deletes a session's answers and screen figures and marks it withdrawn; returns how many answers went. */
export async function withdrawSession(db: DbHandle, sessionId: string): Promise<number> {
  const r = await db.deleteFrom('trial_responses').where('session_id', '=', sessionId).executeTakeFirst();
  await db.updateTable('study_sessions').set({ withdrawn_at: sql`coalesce(withdrawn_at, now())`, stored_trials: 0, screen: null }).where('id', '=', sessionId).execute();
  return Number(r.numDeletedRows);
}

export async function setSessionExclusion(db: DbHandle, sessionId: string, v: { isExcluded: boolean; reason: string | null; userId: string }): Promise<void> {
  await db.updateTable('study_sessions').set({ is_excluded: v.isExcluded, exclusion_reason: v.reason, excluded_by: v.userId }).where('id', '=', sessionId).execute();
}

export async function deleteSession(db: DbHandle, sessionId: string): Promise<void> {
  await db.deleteFrom('study_sessions').where('id', '=', sessionId).execute();
}

function withFigures(db: DbHandle) {
  return db
    .selectFrom('study_sessions as s')
    .leftJoin('trial_responses as r', 'r.session_id', 's.id')
    .selectAll('s')
    .select([
      sql<number>`count(r.trial_index) FILTER (WHERE r.is_catch AND NOT r.is_practice)::int`.as('catch_trials'),
      sql<number>`count(r.trial_index) FILTER (WHERE r.is_catch AND NOT r.is_practice AND r.is_correct)::int`.as('catch_correct'),
      sql<number | null>`percentile_cont(0.5) WITHIN GROUP (ORDER BY r.rt_ms) FILTER (WHERE NOT r.is_practice AND r.rt_ms IS NOT NULL)`.as('median_rt_ms'),
      sql<number>`count(r.trial_index) FILTER (WHERE r.was_tab_hidden)::int`.as('tab_hidden_trials'),
      sql<number>`count(r.trial_index) FILTER (WHERE r.left_full_screen)::int`.as('full_screen_left_trials'),
    ])
    .groupBy('s.id');
}

/** A study's sessions, most recently started first, keyset-paginated; fetches `limit + 1` rows. */
export function listSessions(db: DbHandle, studyId: string, page: { cursor?: string | undefined; limit: number }): Promise<SessionListRow[]> {
  let q = withFigures(db).where('s.study_id', '=', studyId);
  if (page.cursor) q = q.where(beforeCursor(page.cursor, 's.started_at', 's.id'));
  return q.orderBy('s.started_at', 'desc').orderBy('s.id', 'desc').limit(page.limit + 1).execute();
}

export async function getSessionWithFigures(db: DbHandle, sessionId: string): Promise<SessionListRow | undefined> {
  return withFigures(db).where('s.id', '=', sessionId).executeTakeFirst();
}

export type ResponseExportRow = TrialResponseRow & { participant_index: number; is_excluded: boolean };

/** Every stored answer of a study, by participant and trial. */
export function listStudyResponses(db: DbHandle, studyId: string): Promise<ResponseExportRow[]> {
  return db
    .selectFrom('trial_responses as r')
    .innerJoin('study_sessions as s', 's.id', 'r.session_id')
    .selectAll('r')
    .select(['s.participant_index', 's.is_excluded'])
    .where('s.study_id', '=', studyId)
    .orderBy('s.participant_index')
    .orderBy('r.trial_index')
    .execute();
}

/**
 * What the database holds for these sessions (by code hash): answer rows, distinct (session, trial) pairs, and the
 * sum of the sessions' own stored counters. The load test expects the three to agree.
 */
export async function countTrialsOfSessions(db: DbHandle, codeHashes: readonly string[]): Promise<{ rows: number; distinctTrials: number; sessionCounters: number }> {
  const r = await sql<{ rows: number; distinct_trials: number; counters: number }>`
    SELECT count(r.trial_index)::int AS rows,
           count(DISTINCT (r.session_id, r.trial_index))::int AS distinct_trials,
           (SELECT coalesce(sum(stored_trials), 0) FROM study_sessions WHERE code_hash = ANY(${[...codeHashes]}))::int AS counters
    FROM study_sessions s LEFT JOIN trial_responses r ON r.session_id = s.id
    WHERE s.code_hash = ANY(${[...codeHashes]})`.execute(db);
  const row = r.rows[0]!;
  return { rows: row.rows, distinctTrials: row.distinct_trials, sessionCounters: row.counters };
}
