import { z } from 'zod';
import { VersionSchema } from './common';
import { DescriptorSchema, FamilySchema } from './descriptor';
import { LabPathSchema } from './account';

export const SeedShapeNameSchema = z.string().trim().min(1, 'Name the seed shape').max(80, 'Use at most 80 characters');

export const SeedShapeOriginSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('editor') }),
  z.object({ kind: z.literal('preset'), preset: z.string().max(80) }),
  z.object({
    kind: z.literal('upload'),
    format: z.enum(['svg', 'csv']),
    fileName: z.string().max(200),
    harmonics: z.number().int(),
    meanError: z.number(),
    maxError: z.number(),
  }),
]);
export type SeedShapeOrigin = z.infer<typeof SeedShapeOriginSchema>;

export const MetricsSchema = z.object({
  area: z.number(),
  perimeter: z.number(),
  compactness: z.number(),
  convexity: z.number(),
  minRadius: z.number().nullable(),
  isSimple: z.boolean(),
  curvatureExtrema: z.number().int(),
});
export type ShapeMetrics = z.infer<typeof MetricsSchema>;

export const SeedShapeSchema = z.object({
  id: z.uuid(),
  name: z.string(),
  family: FamilySchema,
  harmonicCount: z.number().int(),
  descriptor: DescriptorSchema,
  origin: SeedShapeOriginSchema,
  version: z.number().int(),
  metrics: MetricsSchema,
  /** SVG path data of the contour, normalised to unit equal-area radius, for thumbnails. */
  thumbnailPath: z.string(),
  createdBy: z.string().nullable(),
  updatedBy: z.string().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
  usedBySpaces: z.number().int(),
});
export type SeedShape = z.infer<typeof SeedShapeSchema>;

export const CreateSeedShapeSchema = z.object({
  name: SeedShapeNameSchema,
  descriptor: DescriptorSchema,
  origin: SeedShapeOriginSchema.default({ kind: 'editor' }),
});
export type CreateSeedShapeInput = z.input<typeof CreateSeedShapeSchema>;

export const UpdateSeedShapeSchema = z.object({
  name: SeedShapeNameSchema.optional(),
  descriptor: DescriptorSchema.optional(),
  /** The version the edit started from; a newer stored version is a conflict, not a silent overwrite. */
  version: VersionSchema,
});

export const SeedShapePathSchema = LabPathSchema.extend({ seedShapeId: z.uuid() });

export const FitQuerySchema = z.object({
  family: z.enum(['radial', 'elliptic']),
  harmonics: z.coerce.number().int().min(1).max(64),
  fileName: z.string().max(200).default('outline'),
});

export const FitResultSchema = z.object({
  descriptor: DescriptorSchema,
  /** The uploaded outline and the fitted contour, both centred and scaled alike, as SVG path data (y up → y down). */
  outlinePath: z.string(),
  fittedPath: z.string(),
  /** Mean and max distance between outline and fit, in units of the outline's equal-area radius. */
  meanError: z.number(),
  maxError: z.number(),
  notes: z.array(z.string()),
  format: z.enum(['svg', 'csv']),
  metrics: MetricsSchema,
});
export type FitResult = z.infer<typeof FitResultSchema>;
