import 'server-only';
import { randomInt } from 'node:crypto';
import { AppError, conflict, notFound, validationError } from '@/lib/errors';
import type { Db, DbHandle } from '@/db/client';
import type { StudySessionRow } from '@/db/database';
import { getEditionSnapshot } from '@/db/repositories/editions';
import { findStudyByInviteHash, type StudyListRow } from '@/db/repositories/studies';
import {
  claimParticipantIndex,
  completeSession,
  countResponses,
  countTrialsOfSessions,
  findSessionByCodeHash,
  insertSession,
  listAnsweredIndices,
  storeResponse,
  withdrawSession as withdrawRows,
} from '@/db/repositories/study-sessions';
import { buildTrialPlan, type StudyDesign, type TrialPlan } from '@/lib/study';
import { EditionSnapshotSchema } from '@/lib/schemas/edition';
import type { FinishValue, JoinStudyValue, ParticipantSessionValue, ResponseReceiptValue, ScreenCheckValue, TrialResponseInput } from '@/lib/schemas/participant-session';
import { hashToken } from '../auth/secrets';
import { inviteTokenHash } from '../study-invite';

/**
 * The participant's side of a norming study. Nobody signs in: the invite token finds the study, and the session
 * code (shown to the participant, stored only as a hash) finds their session. A session's requests must come under
 * the link it was started from or its study's current link, so a code works only on its own study's link (a
 * withdrawal, which needs the code alone, is the exception). A session in progress keeps working
 * when the lab closes the study or changes its link; only new sessions need an open study and a live link.
 */

/** Letters and digits without I, L, O and U, so a code read aloud or typed is not misread (5 bits each). */
const CODE_ALPHABET = '0123456789ABCDEFGHJKMNPQRSTVWXYZ';
/** 20 characters: 100 random bits, in 4 groups of 5. */
const SESSION_CODE_GROUPS = 4;
const GROUP_LENGTH = 5;
/** The random part of a finish code (after the study's prefix): 40 bits, enough that codes are not guessed. */
const FINISH_CODE_LENGTH = 8;
/** Plans kept in memory, keyed by study and participant, so each answer does not rebuild a plan. */
const PLAN_CACHE_SIZE = 256;

const randomChars = (n: number) => Array.from({ length: n }, () => CODE_ALPHABET[randomInt(0, CODE_ALPHABET.length)]).join('');
const newSessionCode = () => Array.from({ length: SESSION_CODE_GROUPS }, () => randomChars(GROUP_LENGTH)).join('-');
const codeHashOf = (code: string) => hashToken(`session:${code.trim().toUpperCase()}`);

/**
 * The caches live on globalThis: the production web server holds this module twice (in Next's bundle, and beside
 * it in the answer fast path, server/ingest.ts), and the plan built when a session starts is the one its answers need.
 */
const caches = globalThis as unknown as { __epicyclePlanCache?: Map<string, TrialPlan>; __epicycleAnswerTargets?: Map<string, AnswerTarget> };
const planCache = (caches.__epicyclePlanCache ??= new Map<string, TrialPlan>());

async function planOf(db: DbHandle, study: { id: string; design: unknown; edition_id: string }, participant: number): Promise<TrialPlan> {
  const key = `${study.id}:${participant}`;
  const cached = planCache.get(key);
  if (cached) return cached;
  const snapshot = EditionSnapshotSchema.pick({ stimuli: true }).parse(await getEditionSnapshot(db, study.edition_id));
  const plan = buildTrialPlan(study.design as StudyDesign, { stimulusIds: snapshot.stimuli.map((s) => s.id) }, participant);
  if (planCache.size >= PLAN_CACHE_SIZE) planCache.delete(planCache.keys().next().value!);
  planCache.set(key, plan);
  return plan;
}

async function studyOfToken(db: DbHandle, token: string): Promise<StudyListRow> {
  const study = await findStudyByInviteHash(db, inviteTokenHash(token));
  if (!study) throw notFound('invite', 'This invite link is not valid any more. The lab may have replaced it; ask them for the current link.');
  return study;
}

/** The study behind an invite link, for the participant page; a closed study answers with `isAccepting: false`. */
export async function getJoinStudy(db: Db, token: string): Promise<JoinStudyValue> {
  const study = await studyOfToken(db, token);
  const design = study.design as StudyDesign;
  const snapshot = EditionSnapshotSchema.parse(await getEditionSnapshot(db, study.edition_id));
  return {
    name: study.name,
    state: study.state,
    isAccepting: study.state === 'open',
    consentText: study.consent_text,
    instructionsText: study.instructions_text,
    debriefText: study.debrief_text,
    stimulusSizeDeg: design.stimulusSizeDeg,
    categorisation: design.categorisation ? { extent: design.categorisation.extent, keys: [...design.categorisation.keys] as [string, string], timing: { ...design.categorisation.timing } } : null,
    similarity: design.similarity
      ? { presentation: design.similarity.presentation, scaleLow: design.similarity.scaleLow, scaleHigh: design.similarity.scaleHigh, timing: { ...design.similarity.timing } }
      : null,
    edition: { seed: snapshot.seed, definition: snapshot.definition, stimuli: snapshot.stimuli },
  };
}

function countOf(row: Pick<StudySessionRow, 'stored_trials' | 'planned_trials' | 'completed_at'>) {
  return { stored: row.stored_trials, planned: row.planned_trials, isComplete: row.completed_at !== null };
}

async function sessionValue(db: DbHandle, row: StudySessionRow, study: { id: string; design: unknown; edition_id: string }, code: string): Promise<ParticipantSessionValue> {
  const plan = await planOf(db, study, row.participant_index);
  const answered = await listAnsweredIndices(db, row.id);
  const done = new Set(answered);
  const next = plan.trials.find((t) => !done.has(t.index));
  return {
    ...countOf(row),
    sessionCode: code,
    participant: row.participant_index,
    keys: plan.keys,
    trials: [...plan.trials],
    answered,
    nextTrialIndex: next ? next.index : null,
    finishCode: row.finish_code,
  };
}

/**
 * Starts a session: the next participant index of the study (in one transaction with the session row, so no two
 * sessions share an index), the screen check, and a session code for resuming and withdrawing.
 */
export async function startSession(db: Db, token: string, screen: ScreenCheckValue): Promise<ParticipantSessionValue> {
  const code = newSessionCode();
  return db.transaction().execute(async (trx) => {
    const study = await studyOfToken(trx, token);
    await trx.selectFrom('studies').select('id').where('id', '=', study.id).forUpdate().executeTakeFirst();
    const state = (await trx.selectFrom('studies').select('state').where('id', '=', study.id).executeTakeFirstOrThrow()).state;
    if (state !== 'open') throw conflict('study-closed', 'This study is closed and takes no new participants. Thank you for your interest.');
    const participant = await claimParticipantIndex(trx, study.id);
    const plan = await planOf(trx, study, participant);
    const row = await insertSession(trx, { studyId: study.id, participantIndex: participant, codeHash: codeHashOf(code), inviteTokenHash: inviteTokenHash(token), plannedTrials: plan.trials.length, screen });
    return sessionValue(trx, row, study, code);
  });
}

const noSuchSession = () => notFound('session', 'No session has this code. Check it, or start again from the invite link.');

/**
 * Whether a request's invite token admits its session: the link the session was started from, or the study's
 * current link (a participant who got the lab's new link can resume with their code). Sessions older than the
 * binding have no link of their own, and their code alone admits them.
 */
const admits = (token: string, sessionTokenHash: string | null, studyTokenHash: string | null) => {
  if (sessionTokenHash === null) return true;
  const hash = inviteTokenHash(token);
  return hash === sessionTokenHash || hash === studyTokenHash;
};

/**
 * The session of a code; with `token` (every request but a withdrawal), only under a link that admits it. A
 * token that does not answers exactly as an unknown code does, so neither can be told apart from outside.
 */
async function sessionOfCode(
  db: DbHandle,
  code: string,
  options: { token?: string; lock?: boolean } = {},
): Promise<{ row: StudySessionRow; study: { id: string; design: unknown; edition_id: string } }> {
  const row = await findSessionByCodeHash(db, codeHashOf(code), { lock: options.lock ?? false });
  if (!row) throw noSuchSession();
  const { invite_token_hash: studyTokenHash, ...study } = await db
    .selectFrom('studies')
    .select(['id', 'design', 'edition_id', 'invite_token_hash'])
    .where('id', '=', row.study_id)
    .executeTakeFirstOrThrow();
  if (options.token !== undefined && !admits(options.token, row.invite_token_hash, studyTokenHash)) throw noSuchSession();
  return { row, study };
}

/** The session again (after a reload): its plan, what the server holds and the next trial to take. */
export async function resumeSession(db: Db, token: string, code: string): Promise<ParticipantSessionValue> {
  const { row, study } = await sessionOfCode(db, code, { token });
  if (row.withdrawn_at) throw conflict('session-withdrawn', 'This session was withdrawn and its answers deleted.');
  return sessionValue(db, row, study, code);
}

/** What an answer needs of its session and study that never changes once the session exists (a study opened has its design fixed). */
interface AnswerTarget {
  sessionId: string;
  inviteTokenHash: string | null;
  participant: number;
  plannedTrials: number;
  study: { id: string; design: unknown; edition_id: string };
}

/** Sessions recently answered, by code hash, so that an answer costs one statement (see `storeResponse`). */
const answerTargets = (caches.__epicycleAnswerTargets ??= new Map<string, AnswerTarget>());
const ANSWER_TARGET_CACHE_SIZE = 4096;

async function answerTargetOf(db: Db, token: string, code: string): Promise<AnswerTarget> {
  const hash = codeHashOf(code);
  const cached = answerTargets.get(hash);
  // The cache answers for the session's own link; any other token is checked against the study as it is now.
  if (cached && (cached.inviteTokenHash === null || cached.inviteTokenHash === inviteTokenHash(token))) return cached;
  const { row, study } = await sessionOfCode(db, code, { token });
  const target = { sessionId: row.id, inviteTokenHash: row.invite_token_hash, participant: row.participant_index, plannedTrials: row.planned_trials, study };
  if (answerTargets.size >= ANSWER_TARGET_CACHE_SIZE) answerTargets.delete(answerTargets.keys().next().value!);
  answerTargets.set(hash, target);
  return target;
}

/**
 * Stores one answer. The first write of a (session, client trial id) — and of a trial index — wins; a retry gets
 * the same count back and `isNew: false`. Every answer names a trial of the participant's regenerated plan. The
 * write is one statement that takes the session's row lock, so it is atomic against a concurrent withdrawal or
 * finish without an explicit transaction.
 */
export async function submitResponse(db: Db, token: string, code: string, input: TrialResponseInput): Promise<ResponseReceiptValue> {
  const target = await answerTargetOf(db, token, code);
  const plan = await planOf(db, target.study, target.participant);
  const trial = plan.trials[input.trialIndex];
  if (!trial || trial.index !== input.trialIndex) {
    throw validationError('response', `There is no trial ${input.trialIndex} in this session: its trials are numbered 0 to ${plan.trials.length - 1}.`, { trialIndex: ['Unknown trial'] });
  }
  const design = target.study.design as StudyDesign;
  if (trial.task === 'categorisation') {
    const keys = design.categorisation?.keys ?? [];
    if (input.rating !== null) throw validationError('response', 'A categorisation trial takes a key, not a rating.', { rating: ['Not used by this trial'] });
    if (input.responseKey !== null && !keys.some((k) => k.toLowerCase() === input.responseKey!.toLowerCase())) {
      throw validationError('response', `This trial takes the key ${keys.join(' or ')}.`, { responseKey: ['Not a response key of this study'] });
    }
  } else if (input.responseKey !== null) {
    throw validationError('response', 'A pair-similarity trial takes a rating, not a key.', { responseKey: ['Not used by this trial'] });
  }
  const isCorrect =
    trial.task === 'categorisation' && trial.correctKey !== null && input.responseKey !== null ? trial.correctKey.toLowerCase() === input.responseKey.toLowerCase() : null;
  const { stored, isNew } = await storeResponse(db, {
    session_id: target.sessionId,
    client_trial_id: input.clientTrialId,
    trial_index: trial.index,
    task: trial.task,
    is_practice: trial.task === 'categorisation' && trial.isPractice,
    is_catch: trial.task === 'categorisation' && trial.isCatch,
    response_key: input.responseKey,
    rating: input.rating,
    rt_ms: input.rtMs,
    is_correct: isCorrect,
    achieved_ms: input.achievedMs,
    onset_ms: input.onsetMs,
    offset_ms: input.offsetMs,
    was_tab_hidden: input.wasTabHidden,
    left_full_screen: input.leftFullScreen,
  });
  if (stored === null) {
    // The session stopped taking answers (or was deleted): say why.
    answerTargets.delete(codeHashOf(code));
    const { row } = await sessionOfCode(db, code, { token });
    if (row.withdrawn_at) throw conflict('session-withdrawn', 'This session was withdrawn; its answers were deleted and no new ones are taken.');
    throw conflict('session-complete', `This session is complete: all ${row.planned_trials} trials are stored, and no further answers are taken.`);
  }
  return { stored, planned: target.plannedTrials, isComplete: false, isNew };
}

/** Completes the session once the server holds every planned trial, and gives the finish code (the same on a retry). */
export async function finishSession(db: Db, token: string, code: string): Promise<FinishValue> {
  return db.transaction().execute(async (trx) => {
    const { row } = await sessionOfCode(trx, code, { token, lock: true });
    if (row.withdrawn_at) throw conflict('session-withdrawn', 'This session was withdrawn and its answers deleted.');
    if (row.finish_code) return { ...countOf(row), finishCode: row.finish_code };
    const stored = await countResponses(trx, row.id);
    if (stored < row.planned_trials) {
      throw new AppError('conflict:session-incomplete', `The server holds ${stored} of ${row.planned_trials} trials; the rest must arrive before the session can finish.`);
    }
    const prefix = (await trx.selectFrom('studies').select('finish_code_prefix').where('id', '=', row.study_id).executeTakeFirstOrThrow()).finish_code_prefix;
    const finishCode = `${prefix}${randomChars(FINISH_CODE_LENGTH)}`;
    await completeSession(trx, row.id, finishCode);
    return { stored, planned: row.planned_trials, isComplete: true, finishCode };
  });
}

/** Withdraws a session by its code, during it or afterwards: its answers and screen figures are deleted. */
export async function withdrawSession(db: Db, code: string): Promise<{ ok: true; deletedTrials: number }> {
  return db.transaction().execute(async (trx) => {
    const { row } = await sessionOfCode(trx, code, { lock: true });
    return { ok: true as const, deletedTrials: await withdrawRows(trx, row.id) };
  });
}

/** What the database holds for these sessions (the session code is the credential): rows, distinct trials, counters. */
export function countSessionTrials(db: Db, codes: readonly string[]): Promise<{ rows: number; distinctTrials: number; sessionCounters: number }> {
  return countTrialsOfSessions(db, codes.map(codeHashOf));
}
