import { PageQuerySchema, VersionSchema } from './common';
import { z } from 'zod';
import { DescriptorSchema } from './descriptor';
import { EqualizationSchema, SpaceAxisSchema, SpaceLayoutSchema, SpaceNormalizationSchema, SpacePathSchema } from './space';

export const EditionStateSchema = z.enum(['draft', 'in_review', 'approved', 'returned']);
export type EditionState = z.infer<typeof EditionStateSchema>;
export const EDITION_STATE_LABELS: Record<EditionState, string> = {
  draft: 'Draft',
  in_review: 'In review',
  approved: 'Approved',
  returned: 'Returned',
};

const Position = z.object({ a: z.number(), b: z.number() });

export const SnapshotStimulusSchema = z.object({
  id: z.string(),
  kind: z.enum(['layout', 'prototype']),
  position: Position,
  polar: z.object({ rho: z.number(), angle: z.number() }),
  descriptor: DescriptorSchema,
  contourOffset: z.tuple([z.number(), z.number()]),
  prototypeOf: z.object({ boundaryKey: z.string(), side: z.enum(['A', 'B']) }).optional(),
});

export const SnapshotBoundarySchema = z.object({ key: z.string(), label: z.string(), angleDeg: z.number(), prototypeDistance: z.number() });

/** The frozen content of an edition (what its content hash covers). */
export const EditionSnapshotSchema = z.object({
  format: z.literal(1),
  engineVersion: z.string(),
  space: z.object({ id: z.uuid(), name: z.string() }),
  seed: z.object({ id: z.uuid(), name: z.string(), descriptor: DescriptorSchema }),
  definition: z.object({
    axes: z.tuple([SpaceAxisSchema, SpaceAxisSchema]),
    extent: z.number(),
    layout: SpaceLayoutSchema,
    normalization: SpaceNormalizationSchema,
    equalization: EqualizationSchema.nullable(),
  }),
  boundaries: z.array(SnapshotBoundarySchema),
  stimuli: z.array(SnapshotStimulusSchema),
});
export type EditionSnapshotValue = z.infer<typeof EditionSnapshotSchema>;

const Person = z.object({ id: z.uuid(), name: z.string() }).nullable();

export const EditionSchema = z.object({
  id: z.uuid(),
  spaceId: z.uuid(),
  spaceName: z.string(),
  number: z.number().int(),
  state: EditionStateSchema,
  contentHash: z.string(),
  engineVersion: z.string(),
  stimulusCount: z.number().int(),
  changeNote: z.string(),
  author: Person,
  createdAt: z.string(),
  submittedBy: Person,
  submittedAt: z.string().nullable(),
  decidedBy: Person,
  decidedAt: z.string().nullable(),
  decisionNote: z.string().nullable(),
  /** The edition that replaced this Returned one, by number. */
  supersededBy: z.number().int().nullable(),
  openComments: z.number().int(),
});
export type Edition = z.infer<typeof EditionSchema>;

export const EditionPathSchema = SpacePathSchema.extend({ number: z.coerce.number().int().min(1).max(1_000_000) });
export const CommentPathSchema = EditionPathSchema.extend({ commentId: z.uuid() });

export const FreezeEditionSchema = z.object({
  changeNote: z.string().trim().max(2000, 'Keep the note under 2,000 characters').default(''),
  /** The space version the designer looked at; refused if someone saved since. */
  spaceVersion: VersionSchema.optional(),
  boundariesVersion: VersionSchema.optional(),
});

export const UpdateEditionSchema = z.object({ changeNote: z.string().trim().max(2000) });

export const DecideEditionSchema = z.object({
  decision: z.enum(['approve', 'return']),
  note: z.string().trim().max(4000).default(''),
}).refine((d) => d.decision === 'approve' || d.note.length > 0, { message: 'Say what needs to change when you return an edition', path: ['note'] });

export const CreateCommentSchema = z.object({
  body: z.string().trim().min(1, 'Write a comment').max(4000),
  /** Pin the comment to one stimulus of the edition; omit for the whole edition. */
  stimulusId: z.string().min(1).max(40).nullable().default(null),
});

export const UpdateCommentSchema = z.object({ resolved: z.boolean() });

export const EditionCommentSchema = z.object({
  id: z.uuid(),
  stimulusId: z.string().nullable(),
  body: z.string(),
  author: Person,
  createdAt: z.string(),
  resolvedBy: Person,
  resolvedAt: z.string().nullable(),
});
export type EditionComment = z.infer<typeof EditionCommentSchema>;

export const DiffQuerySchema = z.object({
  from: z.coerce.number().int().min(1).max(1_000_000),
  to: z.coerce.number().int().min(1).max(1_000_000),
});

const DiffStimulus = SnapshotStimulusSchema;
export const EditionDiffSchema = z.object({
  from: z.number().int(),
  to: z.number().int(),
  parameters: z.array(z.object({ path: z.string(), before: z.unknown(), after: z.unknown() })),
  added: z.array(DiffStimulus),
  removed: z.array(DiffStimulus),
  changed: z.array(z.object({ id: z.string(), fields: z.array(z.enum(['position', 'descriptor'])), before: DiffStimulus, after: DiffStimulus })),
  unchangedCount: z.number().int(),
});
export type EditionDiffValue = z.infer<typeof EditionDiffSchema>;

/** The lab-wide list of editions: every one, or those in one state (e.g. `approved`). */
export const LabEditionsQuerySchema = PageQuerySchema.extend({ state: EditionStateSchema.optional() });
export type LabEditionsQuery = z.infer<typeof LabEditionsQuerySchema>;
