import { z } from 'zod';
import { VersionSchema } from './common';
import { BOUNDARY_KEY_PATTERN, MAX_BOUNDARY_KEY_LENGTH } from '@/lib/boundary/boundary-limits';

/** At most this many boundaries per space. */
export const MAX_BOUNDARIES = 12;

export const BoundarySchema = z.object({
  key: z
    .string()
    .min(1, 'Give the boundary a key')
    .max(MAX_BOUNDARY_KEY_LENGTH)
    .regex(BOUNDARY_KEY_PATTERN, 'Use lower-case letters, digits and single hyphens'),
  label: z.string().trim().max(60).default(''),
  angleDeg: z
    .number({ error: 'The angle must be a number' })
    .refine(Number.isFinite, 'The angle must be finite')
    .refine((v) => v >= 0 && v < 180, 'The angle must be from 0° up to (not including) 180°'),
  /** Distance of the prototypes from the centre, axis units; null: 0.75·ρmax. */
  prototypeDistance: z.number().positive('The prototype distance must be above 0').max(100).nullable().default(null),
});
export type BoundaryInput = z.input<typeof BoundarySchema>;
export type BoundaryValue = z.infer<typeof BoundarySchema>;

export const PutBoundariesSchema = z.object({
  boundaries: z
    .array(BoundarySchema)
    .max(MAX_BOUNDARIES, `At most ${MAX_BOUNDARIES} boundaries per space`)
    .refine((bs) => new Set(bs.map((b) => b.key)).size === bs.length, 'Two boundaries have the same key'),
  /** The boundaries version the edit started from. */
  version: VersionSchema,
});
