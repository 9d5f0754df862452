import 'server-only';
import { LabPathSchema, OkSchema } from '@/lib/schemas/account';
import { PageQuerySchema, pageOf } from '@/lib/schemas/common';
import { CreateStudySchema, OpenStudySchema, PlanQuerySchema, StudyPathSchema, StudySchema, TrialPlanSchema, UpdateStudySchema } from '@/lib/schemas/study';
import { getDb } from '../db';
import { defineRoute } from '../http';
import { closeStudy, createStudy, deleteStudy, getStudy, getStudyPlan, listStudies, openStudy, revokeStudyInvite, rotateStudyInvite, updateStudy } from '../services/studies';

const tags = ['studies'];

export const listStudiesRoute = defineRoute({
  id: 'listStudies',
  method: 'GET',
  path: '/api/v1/labs/{lab}/studies',
  summary: "The lab's norming studies, most recently changed first",
  tags,
  access: { kind: 'lab', action: 'study:read' },
  params: LabPathSchema,
  query: PageQuerySchema,
  response: pageOf(StudySchema),
  handler: ({ labActor, query }) => listStudies(getDb(), labActor(), query),
});

export const getStudyRoute = defineRoute({
  id: 'getStudy',
  method: 'GET',
  path: '/api/v1/labs/{lab}/studies/{studyId}',
  summary: 'One study, with its planned trials per participant, estimated duration, flash check and invite link',
  tags,
  access: { kind: 'lab', action: 'study:read' },
  params: StudyPathSchema,
  response: StudySchema,
  handler: ({ labActor, params }) => getStudy(getDb(), labActor(), params.studyId),
});

export const createStudyRoute = defineRoute({
  id: 'createStudy',
  method: 'POST',
  path: '/api/v1/labs/{lab}/studies',
  summary: 'Set up a study (Draft) on an edition of the lab: tasks, timing, texts and target',
  tags,
  access: { kind: 'lab', action: 'study:write' },
  params: LabPathSchema,
  body: CreateStudySchema,
  response: StudySchema,
  successStatus: 201,
  handler: ({ labActor, body }) => createStudy(getDb(), labActor(), body),
});

export const updateStudyRoute = defineRoute({
  id: 'updateStudy',
  method: 'PATCH',
  path: '/api/v1/labs/{lab}/studies/{studyId}',
  summary: 'Change a study; the edition and design only while it is a Draft; `version` must be the one the edit started from',
  tags,
  access: { kind: 'lab', action: 'study:write' },
  params: StudyPathSchema,
  body: UpdateStudySchema,
  response: StudySchema,
  handler: ({ labActor, params, body }) => updateStudy(getDb(), labActor(), params.studyId, body),
});

export const deleteStudyRoute = defineRoute({
  id: 'deleteStudy',
  method: 'DELETE',
  path: '/api/v1/labs/{lab}/studies/{studyId}',
  summary: 'Delete a Draft study',
  tags,
  access: { kind: 'lab', action: 'study:write' },
  params: StudyPathSchema,
  response: OkSchema,
  successStatus: 204,
  handler: async ({ labActor, params }) => {
    await deleteStudy(getDb(), labActor(), params.studyId);
    return { ok: true as const };
  },
});

export const openStudyRoute = defineRoute({
  id: 'openStudy',
  method: 'POST',
  path: '/api/v1/labs/{lab}/studies/{studyId}/open',
  summary: 'Open a Draft study (confirming ethics approval and consent): fixes its design and makes an invite link',
  tags,
  access: { kind: 'lab', action: 'study:write' },
  params: StudyPathSchema,
  body: OpenStudySchema,
  response: StudySchema,
  handler: ({ labActor, params }) => openStudy(getDb(), labActor(), params.studyId),
});

export const closeStudyRoute = defineRoute({
  id: 'closeStudy',
  method: 'POST',
  path: '/api/v1/labs/{lab}/studies/{studyId}/close',
  summary: 'Close an Open study: nobody new can join',
  tags,
  access: { kind: 'lab', action: 'study:write' },
  params: StudyPathSchema,
  response: StudySchema,
  handler: ({ labActor, params }) => closeStudy(getDb(), labActor(), params.studyId),
});

export const getStudyPlanRoute = defineRoute({
  id: 'getStudyPlan',
  method: 'GET',
  path: '/api/v1/labs/{lab}/studies/{studyId}/plan',
  summary: "A participant's trial plan (from the study seed and the participant index), with counts per direction and level",
  tags,
  access: { kind: 'lab', action: 'study:read' },
  params: StudyPathSchema,
  query: PlanQuerySchema,
  response: TrialPlanSchema,
  handler: ({ labActor, params, query }) => getStudyPlan(getDb(), labActor(), params.studyId, query.participant),
});

export const rotateStudyInviteRoute = defineRoute({
  id: 'rotateStudyInvite',
  method: 'POST',
  path: '/api/v1/labs/{lab}/studies/{studyId}/invite',
  summary: 'Make a new invite link for an Open study; the old one stops working',
  tags,
  access: { kind: 'lab', action: 'study:write' },
  params: StudyPathSchema,
  response: StudySchema,
  handler: ({ labActor, params }) => rotateStudyInvite(getDb(), labActor(), params.studyId),
});

export const revokeStudyInviteRoute = defineRoute({
  id: 'revokeStudyInvite',
  method: 'DELETE',
  path: '/api/v1/labs/{lab}/studies/{studyId}/invite',
  summary: 'Revoke the invite link',
  tags,
  access: { kind: 'lab', action: 'study:write' },
  params: StudyPathSchema,
  response: StudySchema,
  handler: ({ labActor, params }) => revokeStudyInvite(getDb(), labActor(), params.studyId),
});
