import 'server-only';
import { stringify } from 'csv-stringify/sync';
import { neutralizeCsvCell } from '@/lib/csv';
import { z } from 'zod';
import { conflict, notFound } from '@/lib/errors';
import type { Db } from '@/db/client';
import { toPage } from '@/db/pagination';
import { insertAuditEvent } from '@/db/repositories/audit-events';
import { getEditionSnapshot } from '@/db/repositories/editions';
import { getStudy, type StudyListRow } from '@/db/repositories/studies';
import { deleteSession as deleteRow, findSessionOfStudy, getSessionWithFigures, listSessions, listStudyResponses, setSessionExclusion, type SessionListRow } from '@/db/repositories/study-sessions';
import { buildTrialPlan, type StudyDesign, type Trial } from '@/lib/study';
import type { Page } from '@/lib/schemas/common';
import { ScreenCheckSchema, TrialRecordSchema, type SetExclusionInput, type StudySessionValue, type TrialRecordValue } from '@/lib/schemas/participant-session';
import { authorize, type LabActor } from './access';

/** The lab's view of a study's participant sessions: the monitor, exclusions, deletion and the raw trials. */

function toValue(r: SessionListRow): StudySessionValue {
  const screen = ScreenCheckSchema.safeParse(r.screen);
  return {
    id: r.id,
    participant: r.participant_index,
    startedAt: r.started_at.toISOString(),
    lastSeenAt: r.last_seen_at.toISOString(),
    stored: r.stored_trials,
    planned: r.planned_trials,
    completedAt: r.completed_at?.toISOString() ?? null,
    finishCode: r.finish_code,
    withdrawnAt: r.withdrawn_at?.toISOString() ?? null,
    catchAccuracy: r.catch_trials > 0 ? r.catch_correct / r.catch_trials : null,
    medianRtMs: r.median_rt_ms === null ? null : Number(r.median_rt_ms),
    tabHiddenTrials: r.tab_hidden_trials,
    fullScreenLeftTrials: r.full_screen_left_trials,
    isExcluded: r.is_excluded,
    exclusionReason: r.exclusion_reason,
    screen: screen.success ? screen.data : null,
  };
}

export async function listStudySessions(db: Db, actor: LabActor, studyId: string, query: { cursor?: string | undefined; limit: number }): Promise<Page<StudySessionValue>> {
  authorize(actor, 'study:read');
  await getStudy(db, actor.labId, studyId);
  return toPage(await listSessions(db, studyId, query), query.limit, (r) => r.started_at, toValue);
}

/** Excludes a session from the analysis (with the reason kept), or includes it again. */
export async function setStudySessionExclusion(db: Db, actor: LabActor, studyId: string, sessionId: string, input: SetExclusionInput): Promise<StudySessionValue> {
  authorize(actor, 'session:manage');
  await db.transaction().execute(async (trx) => {
    await getStudy(trx, actor.labId, studyId);
    const row = await findSessionOfStudy(trx, studyId, sessionId, { lock: true });
    if (!row) throw notFound('session', 'No such session in this study.');
    await setSessionExclusion(trx, sessionId, { isExcluded: input.isExcluded, reason: input.isExcluded ? input.reason : input.reason || null, userId: actor.userId });
    await insertAuditEvent(trx, { labId: actor.labId, actorUserId: actor.userId, action: input.isExcluded ? 'session.exclude' : 'session.include', subjectType: 'study', subjectId: studyId, details: { participant: row.participant_index, reason: input.reason } });
  });
  return toValue((await getSessionWithFigures(db, sessionId))!);
}

/** Deletes what is left of a withdrawn session (its row); other sessions are records and stay. */
export async function deleteStudySession(db: Db, actor: LabActor, studyId: string, sessionId: string): Promise<void> {
  authorize(actor, 'session:manage');
  await db.transaction().execute(async (trx) => {
    await getStudy(trx, actor.labId, studyId);
    const row = await findSessionOfStudy(trx, studyId, sessionId, { lock: true });
    if (!row) throw notFound('session', 'No such session in this study.');
    if (!row.withdrawn_at) throw conflict('session', 'Only a withdrawn session can be deleted; exclude a session to leave it out of the analysis.');
    await deleteRow(trx, sessionId);
    await insertAuditEvent(trx, { labId: actor.labId, actorUserId: actor.userId, action: 'session.delete', subjectType: 'study', subjectId: studyId, details: { participant: row.participant_index } });
  });
}

const StimulusIds = z.object({ stimuli: z.array(z.object({ id: z.string() })) });

/** Every stored trial of the study, joined with its planned trial (regenerated from the seed and participant index). */
export async function listStudyTrials(db: Db, actor: LabActor, studyId: string): Promise<TrialRecordValue[]> {
  authorize(actor, 'study:read');
  return studyTrialRecords(db, await getStudy(db, actor.labId, studyId));
}

/** The trial records of a study already found and authorised (the results service and its job use them too). */
export async function studyTrialRecords(db: Db, study: Pick<StudyListRow, 'id' | 'edition_id' | 'design'>): Promise<TrialRecordValue[]> {
  const studyId = study.id;
  const stimulusIds = StimulusIds.parse(await getEditionSnapshot(db, study.edition_id)).stimuli.map((s) => s.id);
  const plans = new Map<number, readonly Trial[]>();
  const rows = await listStudyResponses(db, studyId);
  return rows.map((r) => {
    let trials = plans.get(r.participant_index);
    if (!trials) plans.set(r.participant_index, (trials = buildTrialPlan(study.design as StudyDesign, { stimulusIds }, r.participant_index).trials));
    const t = trials[r.trial_index]!;
    const cat = t.task === 'categorisation' ? t : null;
    const sim = t.task === 'similarity' ? t : null;
    return {
      sessionId: r.session_id,
      participant: r.participant_index,
      isExcluded: r.is_excluded,
      trialIndex: r.trial_index,
      block: t.block,
      task: t.task,
      isPractice: r.is_practice,
      isCatch: r.is_catch,
      directionDeg: cat?.directionDeg ?? null,
      level: cat?.level ?? null,
      position: cat?.position ?? null,
      leftAnchor: cat?.leftAnchor ?? null,
      correctKey: cat?.correctKey ?? null,
      first: sim?.first ?? null,
      second: sim?.second ?? null,
      responseKey: r.response_key,
      rating: r.rating,
      rtMs: r.rt_ms,
      isCorrect: r.is_correct,
      achievedMs: r.achieved_ms,
      onsetMs: r.onset_ms,
      offsetMs: r.offset_ms,
      wasTabHidden: r.was_tab_hidden,
      leftFullScreen: r.left_full_screen,
      receivedAt: r.received_at.toISOString(),
      clientTrialId: r.client_trial_id,
    };
  });
}

/** The raw trials as CSV, one row per stored trial, columns in the JSON export's order. */
export async function studyTrialsCsv(db: Db, actor: LabActor, studyId: string): Promise<string> {
  const records = await listStudyTrials(db, actor, studyId);
  const columns = Object.keys(TrialRecordSchema.shape) as (keyof TrialRecordValue)[];
  return stringify([columns, ...records.map((r) => columns.map((c) => neutralizeCsvCell(r[c])))]);
}
