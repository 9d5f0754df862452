import { z } from 'zod';
import { LabPathSchema } from './account';
import { EditionStateSchema } from './edition';
import { RenderOptionsSchema } from './render';

export const PackStateSchema = z.enum(['queued', 'running', 'succeeded', 'failed', 'cancelled']);
export type PackStateValue = z.infer<typeof PackStateSchema>;
export const PACK_STATE_LABELS: Record<PackStateValue, string> = {
  queued: 'Waiting',
  running: 'Building',
  succeeded: 'Ready',
  failed: 'Failed',
  cancelled: 'Cancelled',
};

export const CreatePackSchema = z.object({
  displayProfileId: z.uuid('Choose a display profile'),
  render: RenderOptionsSchema,
  /** Run orders of the same edition whose BIDS files go into the pack under `sequences/<run order>/`. */
  runOrderIds: z.array(z.uuid('Choose a run order')).max(20, 'At most 20 run orders per pack').optional(),
});
export type CreatePackInput = z.input<typeof CreatePackSchema>;

export const PackPathSchema = LabPathSchema.extend({ packId: z.uuid() });

export const PackSchema = z.object({
  id: z.uuid(),
  state: PackStateSchema,
  /** 0…1, kept by the worker in the packs table (the queue has no progress field). */
  progress: z.number(),
  stage: z.string(),
  error: z.string().nullable(),
  attempts: z.number().int(),
  cancelRequested: z.boolean(),
  edition: z.object({ spaceId: z.uuid(), spaceName: z.string(), number: z.number().int(), state: EditionStateSchema, contentHash: z.string() }),
  profile: z.object({ name: z.string(), resolutionPx: z.object({ width: z.number(), height: z.number() }), widthCm: z.number().nullable(), pixelsPerCm: z.number().nullable(), viewingDistanceCm: z.number() }),
  render: RenderOptionsSchema,
  optionsHash: z.string(),
  sizeBytes: z.number().nullable(),
  sha256: z.string().nullable(),
  stimulusCount: z.number().int().nullable(),
  createdBy: z.string().nullable(),
  createdAt: z.string(),
  startedAt: z.string().nullable(),
  finishedAt: z.string().nullable(),
});
export type PackValue = z.infer<typeof PackSchema>;

export const DownloadLinkSchema = z.object({ url: z.string(), expiresAt: z.string() });
