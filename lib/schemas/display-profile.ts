import { z } from 'zod';
import { VersionSchema } from './common';
import { LabPathSchema } from './account';

const positive = (label: string) => z.number({ error: `${label} must be a number` }).refine(Number.isFinite, `${label} must be finite`).refine((v) => v > 0, `${label} must be above 0`);

const ProfileFields = z.object({
  name: z.string().trim().min(1, 'Name the display').max(80),
  resolutionPx: z.object({
    width: z.number().int('Whole pixels').min(1).max(32768),
    height: z.number().int('Whole pixels').min(1).max(32768),
  }),
  /** Physical width of the active screen area; or null when `pixelsPerCm` is given. */
  widthCm: positive('The screen width').max(1000).nullable(),
  pixelsPerCm: positive('The pixels per cm').max(10000).nullable(),
  viewingDistanceCm: positive('The viewing distance').max(10000),
  notes: z.string().trim().max(1000).default(''),
});

const onePitch = (p: { widthCm?: number | null | undefined; pixelsPerCm?: number | null | undefined }) => (p.widthCm == null) !== (p.pixelsPerCm == null);
const PITCH_MESSAGE = { message: 'Give either the physical screen width or the pixels per cm (one of the two)', path: ['widthCm'] };

export const DisplayProfileInputSchema = ProfileFields.refine(onePitch, PITCH_MESSAGE);
export type DisplayProfileInput = z.input<typeof DisplayProfileInputSchema>;

export const UpdateDisplayProfileSchema = ProfileFields.partial().extend({ version: VersionSchema });

export const DisplayProfilePathSchema = LabPathSchema.extend({ profileId: z.uuid() });

export const DisplayProfileSchema = ProfileFields.extend({
  id: z.uuid(),
  /** Derived: pixels per cm, and pixels per degree at the centre of the screen (θ = 2·atan(S/2D)). */
  derived: z.object({ pixelsPerCm: z.number(), pixelsPerDegree: z.number(), screenDeg: z.object({ width: z.number(), height: z.number() }) }),
  version: z.number().int(),
  updatedBy: z.string().nullable(),
  updatedAt: z.string(),
});
export type DisplayProfileValue = z.infer<typeof DisplayProfileSchema>;
