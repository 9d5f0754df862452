import { z } from 'zod';
import { VersionSchema } from './common';
import { LabPathSchema } from './account';
import { EditionStateSchema } from './edition';

/** Largest seed: the core's generators take 0…2³²−1. */
const MAX_SEED = 4_294_967_295;
/** More runs than any session holds; the core's trial cap still applies. */
const MAX_RUNS = 100;
/** An hour per trial or interval is past any scanning or EEG design; it bounds typos. */
const MAX_SECONDS = 3600;
const MIN_TR_SECONDS = 0.05;
const BIDS_LABEL = z.string().regex(/^[A-Za-z0-9]+$/, 'Use letters and digits only (BIDS labels)').max(64, 'At most 64 characters');

const seconds = (what: string) =>
  z
    .number({ error: `Give the ${what} in seconds` })
    .finite()
    .positive(`The ${what} must be more than 0 s`)
    .max(MAX_SECONDS, `The ${what} must be at most ${MAX_SECONDS} s`);
const interval = (what: string) =>
  z
    .number({ error: `Give the ${what} in seconds` })
    .finite()
    .min(0, `The ${what} cannot be negative`)
    .max(MAX_SECONDS, `The ${what} must be at most ${MAX_SECONDS} s`);

export const RunOrderSelectionSchema = z.enum(['all', 'rings', 'spokes', 'diameters']);
export const RUN_ORDER_SELECTION_LABELS: Record<z.infer<typeof RunOrderSelectionSchema>, string> = {
  all: 'All stimuli',
  rings: 'Chosen rings',
  spokes: 'Chosen spokes',
  diameters: 'Chosen diameters',
};

export const RunOrderConditionsSchema = z
  .object({
    selection: RunOrderSelectionSchema,
    /** Rings count from 1; spokes and diameters from 0 (as in the stimulus ids). */
    indices: z.array(z.number().int().min(0).max(200)).max(200),
    includeCentre: z.boolean(),
    /** Add blank trials as one more condition (`trial_type` null, `stim_file` n/a). */
    nullEvents: z.boolean(),
  })
  .superRefine((v, ctx) => {
    if (v.selection !== 'all' && v.indices.length === 0) {
      ctx.addIssue({ code: 'custom', path: ['indices'], message: `Choose at least one of the ${v.selection}` });
    }
  });

export const RunOrderSequenceSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('de-bruijn') }),
  z.object({ kind: z.literal('type1-index1') }),
  z.object({ kind: z.literal('shuffled-blocks'), blocks: z.number({ error: 'Give a number of blocks' }).int('Blocks are a whole number').min(1, 'At least one block').max(10_000, 'At most 10,000 blocks') }),
]);
export const SEQUENCE_KIND_LABELS: Record<z.infer<typeof RunOrderSequenceSchema>['kind'], string> = {
  'de-bruijn': 'De Bruijn cycle (every ordered pair once)',
  'type1-index1': 'Type-1 index-1 (permuted blocks, every ordered pair once)',
  'shuffled-blocks': 'Shuffled blocks (no immediate repeat; not balanced)',
};

export const RunOrderItiSchema = z
  .discriminatedUnion('kind', [
    z.object({ kind: z.literal('fixed'), duration: interval('ITI') }),
    z.object({ kind: z.literal('uniform'), min: interval('shortest ITI'), max: interval('longest ITI') }),
    z.object({ kind: z.literal('truncated-exponential'), mean: interval('mean ITI'), min: interval('shortest ITI'), max: interval('longest ITI') }),
  ])
  .superRefine((v, ctx) => {
    if (v.kind === 'fixed') return;
    if (v.min >= v.max) ctx.addIssue({ code: 'custom', path: ['max'], message: 'The longest ITI must be longer than the shortest' });
    if (v.kind === 'truncated-exponential' && v.min < v.max && !(v.mean > v.min && v.mean < (v.min + v.max) / 2)) {
      ctx.addIssue({ code: 'custom', path: ['mean'], message: `The mean must lie between the shortest ITI and the midpoint (${((v.min + v.max) / 2).toFixed(3)} s)` });
    }
  });

export const RunOrderTimingSchema = z.object({
  trialDuration: seconds('trial duration'),
  iti: RunOrderItiSchema,
  // Below 50 ms no scanner acquires a volume; the floor also keeps the volume counts finite integers.
  tr: seconds('TR').min(MIN_TR_SECONDS, `The TR must be at least ${MIN_TR_SECONDS} s`),
  dummyVolumes: z.number({ error: 'Give a number of dummy volumes' }).int('Dummy volumes are a whole number').min(0, 'Dummy volumes cannot be negative').max(1000, 'At most 1,000 dummy volumes'),
  /** Whether the dummy volumes are written to the data file (BIDS onsets then count from the first of them). */
  dummyVolumesStored: z.boolean(),
});

/**
 * A run order's definition: everything needed to rebuild it byte for byte, the seed included. The same schema
 * checks every write (create and update), the form and the stored value when it is read back.
 */
export const RunOrderDefinitionSchema = z.object({
  conditions: RunOrderConditionsSchema,
  sequence: RunOrderSequenceSchema,
  timing: RunOrderTimingSchema,
  runs: z.number({ error: 'Give a number of runs' }).int('Runs are a whole number').min(1, 'At least one run').max(MAX_RUNS, `At most ${MAX_RUNS} runs`),
  /** `independent`: each run a complete sequence of its own; `cut`: one long sequence cut into runs. */
  runMode: z.enum(['independent', 'cut']),
  seed: z.number({ error: 'Give a seed' }).int('The seed is a whole number').min(0, 'The seed is 0 or more').max(MAX_SEED, `The seed is at most ${MAX_SEED}`),
  bids: z.object({ subject: BIDS_LABEL, session: BIDS_LABEL.or(z.literal('')), task: BIDS_LABEL }),
});
export type RunOrderDefinition = z.infer<typeof RunOrderDefinitionSchema>;

export const CreateRunOrderSchema = z.object({
  name: z.string().trim().min(1, 'Give the run order a name').max(120, 'At most 120 characters'),
  definition: RunOrderDefinitionSchema,
});
export type CreateRunOrderInput = z.infer<typeof CreateRunOrderSchema>;
export const UpdateRunOrderSchema = CreateRunOrderSchema.extend({ version: VersionSchema });

export const RunOrderPathSchema = LabPathSchema.extend({ runOrderId: z.uuid() });
export const RunOrderStateSchema = z.enum(['ready', 'queued', 'running', 'failed']);
export const RUN_ORDER_STATE_LABELS: Record<z.infer<typeof RunOrderStateSchema>, string> = {
  ready: 'Ready',
  queued: 'Waiting for the search',
  running: 'Searching',
  failed: 'Not found',
};

const SummarySchema = z.object({
  trials: z.number().int(),
  duration: z.number(),
  volumes: z.number().int(),
  acquiredVolumes: z.number().int(),
  conditionCounts: z.array(z.number().int()),
  transitionCounts: z.array(z.array(z.number().int())),
  isTransitionFlat: z.boolean(),
  peakOnsetRate: z.number(),
  exceedsFlashLimit: z.boolean(),
});

/** The figures of a built run order (no trials: download the files for those). */
export const RunOrderResultSchema = z.object({
  conditions: z.array(z.object({ id: z.string(), stimFile: z.string().nullable(), isNullEvent: z.boolean() })),
  runs: z.array(SummarySchema.omit({ transitionCounts: true, conditionCounts: true }).extend({ index: z.number().int(), fileName: z.string() })),
  lostPairs: z.array(z.object({ afterRun: z.number().int(), from: z.number().int(), to: z.number().int(), fromId: z.string(), toId: z.string() })),
  summary: SummarySchema,
});

export const RunOrderSchema = z.object({
  id: z.uuid(),
  name: z.string(),
  edition: z.object({ id: z.uuid(), spaceId: z.uuid(), spaceName: z.string(), number: z.number().int(), state: EditionStateSchema }),
  definition: RunOrderDefinitionSchema,
  state: RunOrderStateSchema,
  error: z.string().nullable(),
  result: RunOrderResultSchema.nullable(),
  version: z.number().int(),
  createdBy: z.string().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type RunOrderValue = z.infer<typeof RunOrderSchema>;
export type RunOrderResultValue = z.infer<typeof RunOrderResultSchema>;

/** A sensible start: every stimulus, a de Bruijn cycle, 1 s trials, a 2 s fixed ITI, TR 2 s, one run. */
export const DEFAULT_RUN_ORDER_DEFINITION: RunOrderDefinition = {
  conditions: { selection: 'all', indices: [], includeCentre: true, nullEvents: false },
  sequence: { kind: 'de-bruijn' },
  timing: { trialDuration: 1, iti: { kind: 'fixed', duration: 2 }, tr: 2, dummyVolumes: 0, dummyVolumesStored: false },
  runs: 1,
  runMode: 'independent',
  seed: 1,
  bids: { subject: '01', session: '', task: 'shapes' },
};
