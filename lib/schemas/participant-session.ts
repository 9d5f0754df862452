import { z } from 'zod';
import { LabPathSchema } from './account';
import { CursorSchema } from './common';
import { EditionSnapshotSchema } from './edition';
import { CategorisationTrialSchema, SimilarityTrialSchema, StudyStateSchema } from './study';

/** An invite token as the link carries it (base64url HMAC). */
export const InviteTokenSchema = z.string().regex(/^[A-Za-z0-9_-]{20,100}$/, 'This is not an invite link');
/** A session code as the participant is shown it: 4 groups of 5 letters or digits. */
export const SessionCodeSchema = z
  .string()
  .trim()
  .toUpperCase()
  .regex(/^[A-Z0-9]{5}(-[A-Z0-9]{5}){3}$/, 'A session code looks like ABCDE-FGHIJ-KLMNO-PQRST');

export const JoinPathSchema = z.object({ token: InviteTokenSchema });
export const JoinSessionPathSchema = JoinPathSchema.extend({ code: SessionCodeSchema });

/** The largest response body accepted: one trial's answer is well under 1 KiB. */
export const MAX_RESPONSE_BYTES = 4 * 1024;

export const ScreenCheckSchema = z.object({
  pxPerMm: z.number({ error: 'Size the card first' }).min(1, 'At least 1 px per mm').max(40, 'At most 40 px per mm'),
  viewingDistanceCm: z.number({ error: 'Give the viewing distance' }).min(20, 'At least 20 cm').max(200, 'At most 200 cm'),
  distanceMethod: z.enum(['typed', 'blind-spot']),
  refreshHz: z.number().min(20, 'A refresh rate of at least 20 Hz').max(500, 'At most 500 Hz'),
  isFullScreen: z.boolean(),
});
export type ScreenCheckValue = z.infer<typeof ScreenCheckSchema>;

export const StartSessionSchema = z.object({ screen: ScreenCheckSchema });

const ms = z.number().finite().min(0).max(86_400_000);

/** One answered trial, sent as soon as it is given. `clientTrialId` makes a retry harmless. */
export const TrialResponseSchema = z
  .object({
    clientTrialId: z.uuid('Give the trial a UUID'),
    trialIndex: z.number().int('A whole trial index').min(0, 'Trial indices start at 0'),
    /** The key pressed (categorisation; touches send the key they stand for), or null for a miss. */
    responseKey: z.string().min(1).max(20).nullable(),
    /** The 1–7 rating (pair similarity), or null. */
    rating: z.number().int().min(1).max(7).nullable(),
    rtMs: ms.nullable(),
    /** The probe's (or pair's) measured time on screen, from its onset and offset frames. */
    achievedMs: ms,
    onsetMs: ms,
    offsetMs: ms,
    wasTabHidden: z.boolean(),
    leftFullScreen: z.boolean(),
  })
  .refine((r) => r.offsetMs >= r.onsetMs, { message: 'The offset comes after the onset', path: ['offsetMs'] });
export type TrialResponseInput = z.infer<typeof TrialResponseSchema>;

export const WithdrawSchema = z.object({ sessionCode: SessionCodeSchema });

const EditionForSession = EditionSnapshotSchema.pick({ seed: true, definition: true, stimuli: true });

/** What the participant page needs before a session: the texts, the design and the edition to draw from. */
export const JoinStudySchema = z.object({
  name: z.string(),
  state: StudyStateSchema,
  /** False when the study is closed or its target is reached: the page says so, and nobody new can start. */
  isAccepting: z.boolean(),
  consentText: z.string(),
  instructionsText: z.string(),
  debriefText: z.string(),
  stimulusSizeDeg: z.number(),
  categorisation: z.object({ extent: z.number(), keys: z.tuple([z.string(), z.string()]), timing: z.record(z.string(), z.number()) }).nullable(),
  similarity: z.object({ presentation: z.enum(['sequential', 'simultaneous']), scaleLow: z.string(), scaleHigh: z.string(), timing: z.record(z.string(), z.number()) }).nullable(),
  edition: EditionForSession,
});
export type JoinStudyValue = z.infer<typeof JoinStudySchema>;

export const SessionCountSchema = z.object({
  /** Trials the server has stored for this session. */
  stored: z.number().int(),
  planned: z.number().int(),
  isComplete: z.boolean(),
});

/** A session as its participant sees it (start and resume). */
export const ParticipantSessionSchema = SessionCountSchema.extend({
  sessionCode: z.string(),
  participant: z.number().int(),
  keys: z.object({ left: z.string(), right: z.string() }).nullable(),
  trials: z.array(z.discriminatedUnion('task', [CategorisationTrialSchema, SimilarityTrialSchema])),
  /** Indices of the trials already stored. */
  answered: z.array(z.number().int()),
  /** The first planned trial not stored yet, or null when all are. */
  nextTrialIndex: z.number().int().nullable(),
  finishCode: z.string().nullable(),
});
export type ParticipantSessionValue = z.infer<typeof ParticipantSessionSchema>;

export const ResponseReceiptSchema = SessionCountSchema.extend({
  /** False when this trial had been stored before (a retry): the first answer stands. */
  isNew: z.boolean(),
});
export type ResponseReceiptValue = z.infer<typeof ResponseReceiptSchema>;

export const FinishSchema = SessionCountSchema.extend({ finishCode: z.string() });
export type FinishValue = z.infer<typeof FinishSchema>;

export const WithdrawalSchema = z.object({ ok: z.literal(true), deletedTrials: z.number().int() });

// —— Lab side ——

export const SessionPathSchema = LabPathSchema.extend({ studyId: z.uuid(), sessionId: z.uuid() });
export const SessionsQuerySchema = z.object({ cursor: CursorSchema.optional(), limit: z.coerce.number().int().min(1).max(200).default(100) });

export const StudySessionSchema = z.object({
  id: z.uuid(),
  participant: z.number().int(),
  startedAt: z.string(),
  lastSeenAt: z.string(),
  stored: z.number().int(),
  planned: z.number().int(),
  completedAt: z.string().nullable(),
  finishCode: z.string().nullable(),
  withdrawnAt: z.string().nullable(),
  /** Correct answers on catch trials (practice left out), as a fraction; null without any. */
  catchAccuracy: z.number().nullable(),
  medianRtMs: z.number().nullable(),
  tabHiddenTrials: z.number().int(),
  fullScreenLeftTrials: z.number().int(),
  isExcluded: z.boolean(),
  exclusionReason: z.string().nullable(),
  screen: ScreenCheckSchema.nullable(),
});
export type StudySessionValue = z.infer<typeof StudySessionSchema>;

export const SetExclusionSchema = z
  .object({ isExcluded: z.boolean(), reason: z.string().trim().max(500, 'At most 500 characters') })
  .refine((v) => !v.isExcluded || v.reason.length > 0, { message: 'Say why the session is excluded', path: ['reason'] });
export type SetExclusionInput = z.infer<typeof SetExclusionSchema>;

export const TrialRecordSchema = z.object({
  sessionId: z.uuid(),
  participant: z.number().int(),
  isExcluded: z.boolean(),
  trialIndex: z.number().int(),
  block: z.number().int(),
  task: z.enum(['categorisation', 'similarity']),
  isPractice: z.boolean(),
  isCatch: z.boolean(),
  directionDeg: z.number().nullable(),
  level: z.number().int().nullable(),
  position: z.number().nullable(),
  leftAnchor: z.enum(['A', 'B']).nullable(),
  correctKey: z.string().nullable(),
  first: z.string().nullable(),
  second: z.string().nullable(),
  responseKey: z.string().nullable(),
  rating: z.number().int().nullable(),
  rtMs: z.number().nullable(),
  isCorrect: z.boolean().nullable(),
  achievedMs: z.number(),
  onsetMs: z.number(),
  offsetMs: z.number(),
  wasTabHidden: z.boolean(),
  leftFullScreen: z.boolean(),
  receivedAt: z.string(),
  clientTrialId: z.uuid(),
});
export type TrialRecordValue = z.infer<typeof TrialRecordSchema>;
/** Stored trials as JSON, a page at a time (the CSV holds them all at once). */
export const TrialRecordsSchema = z.object({ items: z.array(TrialRecordSchema), nextCursor: z.string().nullable() });
