import 'server-only';
import { PageQuerySchema } from '@/lib/schemas/common';
import { OkSchema } from '@/lib/schemas/account';
import {
  FinishSchema,
  JoinPathSchema,
  JoinSessionPathSchema,
  JoinStudySchema,
  MAX_RESPONSE_BYTES,
  ParticipantSessionSchema,
  ResponseReceiptSchema,
  SessionPathSchema,
  SessionsQuerySchema,
  SetExclusionSchema,
  StartSessionSchema,
  StudySessionSchema,
  TrialRecordsSchema,
  TrialResponseSchema,
  WithdrawalSchema,
  WithdrawSchema,
} from '@/lib/schemas/participant-session';
import { pageOf } from '@/lib/schemas/common';
import { StudyPathSchema } from '@/lib/schemas/study';
import { z } from 'zod';
import { getDb } from '../db';
import { paginate } from '../pagination';
import { defineRoute } from '../http';
import { finishSession, getJoinStudy, resumeSession, startSession, submitResponse, withdrawSession } from '../services/participant-sessions';
import { deleteStudySession, listStudySessions, listStudyTrials, setStudySessionExclusion, studyTrialsCsv } from '../services/study-sessions';

const tags = ['participant sessions'];
const SMALL_BODY = 8 * 1024;

export const getJoinStudyRoute = defineRoute({
  id: 'getJoinStudy',
  method: 'GET',
  path: '/api/v1/join/{token}',
  summary: 'The study behind an invite link: texts, design and edition for the participant page (no sign-in)',
  tags,
  access: { kind: 'public' },
  errors: [404],
  params: JoinPathSchema,
  response: JoinStudySchema,
  handler: ({ params }) => getJoinStudy(getDb(), params.token),
});

export const startSessionRoute = defineRoute({
  id: 'startParticipantSession',
  method: 'POST',
  path: '/api/v1/join/{token}/sessions',
  summary: 'Start a participant session: a participant index, the regenerated trial plan and a session code',
  tags,
  access: { kind: 'public' },
  errors: [404, 409, 413],
  maxBodyBytes: SMALL_BODY,
  params: JoinPathSchema,
  body: StartSessionSchema,
  response: ParticipantSessionSchema,
  successStatus: 201,
  handler: ({ params, body }) => startSession(getDb(), params.token, body.screen),
});

export const resumeSessionRoute = defineRoute({
  id: 'resumeParticipantSession',
  method: 'GET',
  path: '/api/v1/join/{token}/sessions/{code}',
  summary: 'Resume a session by its code: the plan, the trials the server holds and the next one to take',
  tags,
  access: { kind: 'public' },
  errors: [404, 409],
  params: JoinSessionPathSchema,
  response: ParticipantSessionSchema,
  handler: ({ params }) => resumeSession(getDb(), params.token, params.code),
});

export const submitResponseRoute = defineRoute({
  id: 'submitTrialResponse',
  method: 'POST',
  path: '/api/v1/join/{token}/sessions/{code}/responses',
  summary: 'Store one answered trial; a repeat of the same client trial id is stored once. Answers with the count stored',
  tags,
  access: { kind: 'public' },
  errors: [404, 409, 413],
  maxBodyBytes: MAX_RESPONSE_BYTES,
  params: JoinSessionPathSchema,
  body: TrialResponseSchema,
  response: ResponseReceiptSchema,
  handler: ({ params, body }) => submitResponse(getDb(), params.token, params.code, body),
});

export const finishSessionRoute = defineRoute({
  id: 'finishParticipantSession',
  method: 'POST',
  path: '/api/v1/join/{token}/sessions/{code}/finish',
  summary: 'Complete the session once every planned trial is stored; answers with the finish code',
  tags,
  access: { kind: 'public' },
  errors: [404, 409],
  params: JoinSessionPathSchema,
  response: FinishSchema,
  handler: ({ params }) => finishSession(getDb(), params.token, params.code),
});

export const withdrawSessionRoute = defineRoute({
  id: 'withdrawParticipantSession',
  method: 'POST',
  path: '/api/v1/withdrawals',
  summary: 'Withdraw from a study by session code, during the session or afterwards: its answers are deleted',
  tags,
  access: { kind: 'public' },
  errors: [404, 413],
  maxBodyBytes: SMALL_BODY,
  body: WithdrawSchema,
  response: WithdrawalSchema,
  handler: ({ body }) => withdrawSession(getDb(), body.sessionCode),
});

export const listStudySessionsRoute = defineRoute({
  id: 'listStudySessions',
  method: 'GET',
  path: '/api/v1/labs/{lab}/studies/{studyId}/sessions',
  summary: "A study's participant sessions, newest first, with trials stored, catch accuracy, median RT and flags",
  tags: ['studies'],
  access: { kind: 'lab', action: 'study:read' },
  params: StudyPathSchema,
  query: SessionsQuerySchema,
  response: pageOf(StudySessionSchema),
  handler: ({ labActor, params, query }) => listStudySessions(getDb(), labActor(), params.studyId, query),
});

export const setSessionExclusionRoute = defineRoute({
  id: 'setStudySessionExclusion',
  method: 'PATCH',
  path: '/api/v1/labs/{lab}/studies/{studyId}/sessions/{sessionId}',
  summary: 'Exclude a session from the analysis with a reason, or include it again',
  tags: ['studies'],
  access: { kind: 'lab', action: 'session:manage' },
  params: SessionPathSchema,
  body: SetExclusionSchema,
  response: StudySessionSchema,
  handler: ({ labActor, params, body }) => setStudySessionExclusion(getDb(), labActor(), params.studyId, params.sessionId, body),
});

export const deleteStudySessionRoute = defineRoute({
  id: 'deleteStudySession',
  method: 'DELETE',
  path: '/api/v1/labs/{lab}/studies/{studyId}/sessions/{sessionId}',
  summary: "Delete what is left of a withdrawn session",
  tags: ['studies'],
  access: { kind: 'lab', action: 'session:manage' },
  errors: [409],
  params: SessionPathSchema,
  response: OkSchema,
  successStatus: 204,
  handler: async ({ labActor, params }) => {
    await deleteStudySession(getDb(), labActor(), params.studyId, params.sessionId);
    return { ok: true as const };
  },
});

export const listStudyTrialsRoute = defineRoute({
  id: 'listStudyTrials',
  method: 'GET',
  path: '/api/v1/labs/{lab}/studies/{studyId}/trials',
  summary: 'Every stored trial of the study with its planned trial, as JSON',
  tags: ['studies'],
  access: { kind: 'lab', action: 'study:read' },
  params: StudyPathSchema,
  query: PageQuerySchema,
  response: TrialRecordsSchema,
  handler: async ({ labActor, params, query }) => paginate(await listStudyTrials(getDb(), labActor(), params.studyId), query, (t) => `${t.sessionId}:${t.trialIndex}`),
});

export const studyTrialsCsvRoute = defineRoute({
  id: 'downloadStudyTrialsCsv',
  method: 'GET',
  path: '/api/v1/labs/{lab}/studies/{studyId}/trials/csv',
  summary: 'Every stored trial of the study as CSV (cells that a spreadsheet would read as formulas are neutralised)',
  tags: ['studies'],
  access: { kind: 'lab', action: 'study:read' },
  produces: 'text/csv',
  params: StudyPathSchema,
  response: z.string(),
  handler: async ({ labActor, params }) =>
    new Response(await studyTrialsCsv(getDb(), labActor(), params.studyId), {
      headers: { 'content-type': 'text/csv; charset=utf-8', 'content-disposition': `attachment; filename="study-${params.studyId}-trials.csv"`, 'cache-control': 'no-store' },
    }),
});
