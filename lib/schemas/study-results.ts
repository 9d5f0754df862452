import { z } from 'zod';
import { LabPathSchema } from './account';
import { StudySimilaritySchema } from './similarity';

/** Resamples allowed: at least 1,000 for reportable percentile intervals, at most 10,000 (minutes of work). */
export const MIN_RESAMPLES = 1000;
export const MAX_RESAMPLES = 10_000;
const MAX_SEED = 0xffff_ffff;

/** How a study's categorisation results are computed: the model, the bootstrap and the exclusion rules. */
export const ResultSettingsSchema = z.object({
  link: z.enum(['logit', 'probit']),
  /** `free`: λ fitted on [0, lapseValue]; `fixed`: λ = lapseValue. */
  lapseMode: z.enum(['free', 'fixed']),
  lapseValue: z.number({ error: 'The lapse rate must be a number' }).min(0, 'The lapse rate cannot be negative').max(0.2, 'The lapse rate must be at most 0.2'),
  resamples: z.number({ error: 'Resamples must be a whole number' }).int('Resamples must be a whole number').min(MIN_RESAMPLES, `At least ${MIN_RESAMPLES} resamples`).max(MAX_RESAMPLES, `At most ${MAX_RESAMPLES} resamples`),
  seed: z.number({ error: 'The seed must be a whole number' }).int('The seed must be a whole number').min(0, 'The seed cannot be negative').max(MAX_SEED, `The seed must be at most ${MAX_SEED}`),
  alpha: z.number({ error: 'α must be a number' }).gt(0, 'α must be above 0').max(0.2, 'α must be at most 0.2'),
  /** Participants with a lower catch-trial accuracy (0…1) are left out; 0 turns the rule off. */
  catchAccuracyMin: z.number({ error: 'The catch accuracy must be a number' }).min(0, 'At least 0').max(1, 'At most 1'),
  /** Trials more than k scaled MADs from the participant's median RT are left out; null turns the rule off. */
  rtMadK: z.number({ error: 'k must be a number' }).min(1, 'k must be at least 1').max(20, 'k must be at most 20').nullable(),
});
export type ResultSettings = z.infer<typeof ResultSettingsSchema>;

/** The defaults: logistic, λ free on [0, 0.06], 1,000 resamples, α = 0.05, 75 % catch accuracy, 3 MADs. */
export const DEFAULT_RESULT_SETTINGS: ResultSettings = { link: 'logit', lapseMode: 'free', lapseValue: 0.06, resamples: 1000, seed: 1, alpha: 0.05, catchAccuracyMin: 0.75, rtMadK: 3 };

export const ExclusionActionSchema = z.enum(['exclude', 'keep']);

/** A manual decision: leave out a session (trialIndex null) or one trial, or keep one an automatic rule left out. */
export const CreateExclusionSchema = z.object({
  sessionId: z.uuid('Choose a session'),
  trialIndex: z.number().int('A trial index is a whole number').min(0, 'Trial indices start at 0').nullable(),
  action: ExclusionActionSchema,
  reason: z.string().trim().min(1, 'Give a reason').max(500, 'At most 500 characters'),
});
export type CreateExclusionInput = z.infer<typeof CreateExclusionSchema>;

export const ManualExclusionSchema = z.object({
  id: z.uuid(),
  sessionId: z.uuid(),
  participant: z.number().int(),
  trialIndex: z.number().int().nullable(),
  action: ExclusionActionSchema,
  reason: z.string(),
  createdBy: z.string().nullable(),
  createdAt: z.string(),
  removedAt: z.string().nullable(),
  removedBy: z.string().nullable(),
});
export type ManualExclusionValue = z.infer<typeof ManualExclusionSchema>;

export const ResultsPathSchema = LabPathSchema.extend({ studyId: z.uuid() });
export const ExclusionPathSchema = ResultsPathSchema.extend({ exclusionId: z.uuid() });
export const PlotKindSchema = z.enum(['curves', 'slopes', 'pse']);
export type PlotKind = z.infer<typeof PlotKindSchema>;
export const PlotPathSchema = ResultsPathSchema.extend({ plot: PlotKindSchema });

const IntervalSchema = z.tuple([z.number(), z.number()]);
const TestSchema = z.object({ statistic: z.number(), df: z.number().int(), p: z.number() });
const BoundSchema = z.enum(['lower', 'upper']).nullable();

export const DirectionFitSchema = z.object({
  directionDeg: z.number(),
  participant: z.number().int().nullable(),
  levels: z.array(z.object({ x: z.number(), n: z.number().int(), k: z.number().int() })),
  trials: z.number().int(),
  misses: z.number().int(),
  fit: z
    .object({
      link: z.enum(['logit', 'probit']),
      threshold: z.number(),
      spread: z.number(),
      lapse: z.number(),
      slopeAtThreshold: z.number(),
      interquartileSpread: z.number(),
      logLikelihood: z.number(),
      deviance: z.number(),
      bounds: z.object({ spreadAtBound: BoundSchema, lapseAtBound: BoundSchema }),
    })
    .nullable(),
  intervals: z.object({ threshold: IntervalSchema, spread: IntervalSchema, lapse: IntervalSchema, slopeAtThreshold: IntervalSchema }).nullable(),
  spreadAtBoundCount: z.number().int(),
  goodnessOfFit: z.object({ deviance: z.number(), p: z.number(), resamples: z.number().int() }).nullable(),
  problem: z.string().nullable(),
});
export type DirectionFitValue = z.infer<typeof DirectionFitSchema>;

/** The categorisation section of a report: fits per direction (pooled and per participant), tests and verdict. */
export const CategorisationSectionSchema = z.object({
  /** What x means in every fit. */
  xDefinition: z.string(),
  directionsDeg: z.array(z.number()),
  pooled: z.array(DirectionFitSchema),
  participants: z.array(z.object({ participant: z.number().int(), fits: z.array(DirectionFitSchema) })),
  slopeTests: z.array(z.object({ participant: z.number().int(), test: TestSchema.nullable(), problem: z.string().nullable() })),
  groupSlopeTest: TestSchema.nullable(),
  noBiasTest: TestSchema.nullable(),
  slopeRatio: z.object({ ratio: z.number(), interval: IntervalSchema, resamples: z.number().int() }).nullable(),
  verdict: z.object({ hasSlopeDifference: z.boolean(), hasBias: z.boolean().nullable(), text: z.string() }).nullable(),
  notes: z.array(z.string()),
});
export type CategorisationSectionValue = z.infer<typeof CategorisationSectionSchema>;

export const ReportExclusionSchema = z.object({
  participant: z.number().int(),
  sessionId: z.uuid().nullable(),
  trialIndex: z.number().int().nullable(),
  rule: z.enum(['catch-accuracy', 'rt-outlier', 'manual']),
  reason: z.string(),
  isOverridden: z.boolean(),
  manualId: z.string().nullable(),
});
export type ReportExclusionValue = z.infer<typeof ReportExclusionSchema>;

/**
 * `report.json`: a study's results, stamped with the study and the edition's content hash. Analyses live under
 * `sections` by name: `categorisation`, and `similarity` (perceptual vs designed RDMs, MDS) in the download.
 */
export const StudyReportSchema = z.object({
  format: z.literal('epicycle-study-report'),
  formatVersion: z.literal(1),
  study: z.object({ id: z.uuid(), name: z.string() }),
  edition: z.object({ id: z.uuid(), spaceName: z.string(), number: z.number().int(), contentHash: z.string() }),
  dataHash: z.string(),
  computedAt: z.string(),
  computeMs: z.number().int().nullable(),
  settings: ResultSettingsSchema,
  counts: z.object({ participants: z.number().int(), participantsIncluded: z.number().int(), trials: z.number().int(), trialsInFits: z.number().int() }),
  exclusions: z.array(ReportExclusionSchema),
  /** `similarity` is filled in the downloaded report.json of a study with a pair-similarity task. */
  sections: z.object({ categorisation: CategorisationSectionSchema.nullable(), similarity: StudySimilaritySchema.nullable().optional() }),
});
export type StudyReportValue = z.infer<typeof StudyReportSchema>;

export const ResultStateSchema = z.enum(['queued', 'running', 'ready', 'failed']);

/** The results of a study for its current data and settings: ready (with the report), being computed, or failed. */
export const StudyResultsSchema = z.object({
  state: ResultStateSchema,
  /** 0…1 while a job computes them. */
  progress: z.number(),
  error: z.string().nullable(),
  dataHash: z.string(),
  settings: ResultSettingsSchema,
  report: StudyReportSchema.nullable(),
});
export type StudyResultsValue = z.infer<typeof StudyResultsSchema>;
