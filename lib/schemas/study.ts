import { z } from 'zod';
import { VersionSchema } from './common';
import { LabPathSchema } from './account';
import { EditionStateSchema } from './edition';

/** The same bounds as lib/study's STUDY_LIMITS (schemas stay client-safe and import no core module with logic). */
const MIN_STEPS = 7;
const MAX_STEPS = 21;
const MAX_SEED = 0xffff_ffff;
const MAX_MS = 60_000;

export const StudyStateSchema = z.enum(['draft', 'open', 'closed']);
export type StudyState = z.infer<typeof StudyStateSchema>;
export const STUDY_STATE_LABELS: Record<StudyState, string> = { draft: 'Draft', open: 'Open', closed: 'Closed' };

const ms = (label: string) =>
  z
    .number({ error: `${label} must be a number of milliseconds` })
    .refine(Number.isFinite, `${label} must be finite`)
    .refine((v) => v > 0, `${label} must be above 0 ms`)
    .refine((v) => v <= MAX_MS, `${label} must be at most ${MAX_MS} ms`);

const whole = (label: string, min: number, max: number) =>
  z.number({ error: `${label} must be a number` }).int(`${label} must be a whole number`).min(min, `${label} must be at least ${min}`).max(max, `${label} must be at most ${max}`);

const KeySchema = z.string().trim().min(1, 'Give a key').max(20);

export const CategorisationTaskSchema = z.object({
  directionsDeg: z
    .array(z.number().min(0, 'Angles start at 0°').lt(180, 'A diameter is given by an angle below 180°'))
    .min(1, 'Give at least one direction')
    .max(36, 'At most 36 directions'),
  steps: whole('Steps per direction', MIN_STEPS, MAX_STEPS).refine((v) => v % 2 === 1, 'Steps per direction must be odd, so one level sits at the centre'),
  extent: z.number({ error: 'The extent must be a number' }).gt(0, 'The extent must be above 0').max(1, 'The extent is at most 1 (ρmax)'),
  repetitions: whole('Repetitions per level', 1, 100),
  blocking: z.enum(['interleaved', 'blocked']),
  practiceTrials: whole('Practice trials', 0, 100),
  catchRate: z.number({ error: 'The catch-trial rate must be a number' }).min(0, 'The catch-trial rate must be 0 or more').max(0.5, 'The catch-trial rate is at most 0.5'),
  timing: z.object({
    fixationMs: ms('Fixation'),
    probeMs: ms('The probe'),
    blankMs: ms('The blank'),
    responseMs: ms('The response window'),
    itiMs: ms('The inter-trial interval'),
  }),
  keys: z.tuple([KeySchema, KeySchema]).refine(([a, b]) => a.toLowerCase() !== b.toLowerCase(), 'The two response keys must differ'),
});
export type CategorisationTaskValue = z.infer<typeof CategorisationTaskSchema>;

export const SimilarityTaskSchema = z
  .object({
    pairSet: z.enum(['all', 'balanced']),
    pairCount: whole('The number of pairs', 1, 100_000).nullable(),
    presentation: z.enum(['sequential', 'simultaneous']),
    scaleLow: z.string().trim().min(1, 'Label the low end of the scale').max(60),
    scaleHigh: z.string().trim().min(1, 'Label the high end of the scale').max(60),
    repetitions: whole('Repetitions', 1, 100),
    timing: z.object({
      fixationMs: ms('Fixation'),
      stimulusMs: ms('The stimulus time'),
      gapMs: ms('The gap'),
      responseMs: ms('The response window'),
      itiMs: ms('The inter-trial interval'),
    }),
  })
  .refine((s) => s.pairSet === 'all' || s.pairCount !== null, { message: 'Give the number of pairs for a balanced subset', path: ['pairCount'] });
export type SimilarityTaskValue = z.infer<typeof SimilarityTaskSchema>;

export const StudyDesignSchema = z
  .object({
    /** Chosen at random when the study is created, unless given. */
    seed: whole('The seed', 0, MAX_SEED).optional(),
    stimulusSizeDeg: z.number({ error: 'The stimulus size must be a number' }).gt(0, 'The stimulus size must be above 0°').max(60, 'At most 60°'),
    categorisation: CategorisationTaskSchema.nullable(),
    similarity: SimilarityTaskSchema.nullable(),
  })
  .refine((d) => d.categorisation !== null || d.similarity !== null, { message: 'Choose at least one task', path: ['tasks'] });
export type StudyDesignInput = z.input<typeof StudyDesignSchema>;

/** What stays editable after a study opens. */
const TextFields = {
  name: z.string().trim().min(1, 'Name the study').max(120),
  consentText: z.string().trim().min(1, 'Write the consent text participants agree to before they start').max(20_000),
  instructionsText: z.string().trim().max(20_000),
  debriefText: z.string().trim().max(20_000),
  /** Finish codes are this prefix and a random part, one per participant. */
  finishCodePrefix: z
    .string()
    .trim()
    .max(16)
    .regex(/^[A-Za-z0-9-]*$/, 'Letters, digits and hyphens only'),
  targetParticipants: whole('The target number of participants', 1, 100_000),
};

export const CreateStudySchema = z.object({
  ...TextFields,
  instructionsText: TextFields.instructionsText.default(''),
  debriefText: TextFields.debriefText.default(''),
  finishCodePrefix: TextFields.finishCodePrefix.default(''),
  editionId: z.uuid('Choose an edition'),
  design: StudyDesignSchema,
});
export type CreateStudyInput = z.input<typeof CreateStudySchema>;

export const UpdateStudySchema = z.object({
  name: TextFields.name.optional(),
  consentText: TextFields.consentText.optional(),
  instructionsText: TextFields.instructionsText.optional(),
  debriefText: TextFields.debriefText.optional(),
  finishCodePrefix: TextFields.finishCodePrefix.optional(),
  targetParticipants: TextFields.targetParticipants.optional(),
  /** Only while the study is a Draft. */
  editionId: z.uuid('Choose an edition').optional(),
  design: StudyDesignSchema.optional(),
  version: VersionSchema,
});
export type UpdateStudyInput = z.input<typeof UpdateStudySchema>;

export const StudyPathSchema = LabPathSchema.extend({ studyId: z.uuid() });
export const PlanQuerySchema = z.object({ participant: z.coerce.number().int('A whole number').min(0, 'Participant indices start at 0').max(100_000).default(0) });
export const OpenStudySchema = z.object({
  /** The user confirms that the lab's ethics board approved the study and consent will be taken. */
  confirmEthics: z.literal(true, 'Confirm the ethics approval and consent before opening'),
});

const StoredDesign = z.object({
  seed: z.number().int(),
  stimulusSizeDeg: z.number(),
  categorisation: CategorisationTaskSchema.nullable(),
  similarity: SimilarityTaskSchema.nullable(),
});
export type StudyDesignValue = z.infer<typeof StoredDesign>;

export const StudySchema = z.object({
  id: z.uuid(),
  name: z.string(),
  state: StudyStateSchema,
  edition: z.object({ id: z.uuid(), spaceId: z.uuid(), spaceName: z.string(), number: z.number().int(), state: EditionStateSchema, stimulusCount: z.number().int() }),
  /** Stored when the study was set up on an edition that was not Approved. */
  editionWarning: z.string().nullable(),
  design: StoredDesign,
  consentText: z.string(),
  instructionsText: z.string(),
  debriefText: z.string(),
  finishCodePrefix: z.string(),
  targetParticipants: z.number().int(),
  plannedTrials: z.object({ categorisation: z.number().int(), similarity: z.number().int(), total: z.number().int() }),
  estimatedSeconds: z.number(),
  flash: z.object({ peakPerSecond: z.number(), isAboveLimit: z.boolean() }),
  /** The participant link while one is active (Open studies), else null. */
  inviteUrl: z.string().nullable(),
  inviteRotatedAt: z.string().nullable(),
  version: z.number().int(),
  createdBy: z.string().nullable(),
  updatedBy: z.string().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
  openedAt: z.string().nullable(),
  closedAt: z.string().nullable(),
});
export type StudyValue = z.infer<typeof StudySchema>;

export const CategorisationTrialSchema = z.object({
  task: z.literal('categorisation'),
  index: z.number().int(),
  block: z.number().int(),
  isPractice: z.boolean(),
  isCatch: z.boolean(),
  directionIndex: z.number().int(),
  directionDeg: z.number(),
  level: z.number().int(),
  position: z.number(),
  probe: z.object({ rho: z.number(), angleDeg: z.number() }),
  leftAnchor: z.enum(['A', 'B']),
  correctKey: z.string().nullable(),
});
export const SimilarityTrialSchema = z.object({ task: z.literal('similarity'), index: z.number().int(), block: z.number().int(), first: z.string(), second: z.string(), pairIndex: z.number().int() });

export const TrialPlanSchema = z.object({
  participant: z.number().int(),
  keys: z.object({ left: z.string(), right: z.string() }).nullable(),
  trials: z.array(z.discriminatedUnion('task', [CategorisationTrialSchema, SimilarityTrialSchema])),
  summary: z.object({
    totalTrials: z.number().int(),
    categorisationTrials: z.number().int(),
    similarityTrials: z.number().int(),
    cells: z.array(
      z.object({ directionDeg: z.number(), level: z.number().int(), position: z.number(), trials: z.number().int(), catchTrials: z.number().int(), practiceTrials: z.number().int(), leftA: z.number().int() }),
    ),
    stimulusUse: z.record(z.string(), z.number().int()),
  }),
});
export type TrialPlanValue = z.infer<typeof TrialPlanSchema>;

/** A starting point for the form: eight diameters 22.5° apart, nine levels, four repetitions (about 20 minutes). */
export const DEFAULT_CATEGORISATION: CategorisationTaskValue = {
  directionsDeg: [0, 22.5, 45, 67.5, 90, 112.5, 135, 157.5],
  steps: 9,
  extent: 1,
  repetitions: 4,
  blocking: 'interleaved',
  practiceTrials: 8,
  catchRate: 0.1,
  timing: { fixationMs: 500, probeMs: 400, blankMs: 200, responseMs: 2500, itiMs: 700 },
  keys: ['f', 'j'],
};

export const DEFAULT_SIMILARITY: SimilarityTaskValue = {
  pairSet: 'all',
  pairCount: null,
  presentation: 'sequential',
  scaleLow: 'Very different',
  scaleHigh: 'Very similar',
  repetitions: 1,
  timing: { fixationMs: 500, stimulusMs: 800, gapMs: 400, responseMs: 5000, itiMs: 700 },
};
