import { z } from 'zod';
import { VersionSchema } from './common';
import { LabPathSchema } from './account';
import { BoundarySchema } from './boundary';
import { DescriptorSchema, FamilySchema, MAX_HARMONIC } from './descriptor';

/** Limits of a shape space (DESIGN: up to 2,000 stimuli; the live view draws up to 441 at once). */
export const MAX_SPACE_STIMULI = 2000;
export const MAX_AXIS_CHANGES = 32;

const finite = (label: string) => z.number({ error: `${label} must be a number` }).refine(Number.isFinite, `${label} must be finite`);

export const AxisFieldSchema = z.enum(['amplitude', 'phase', 'baseRadius', 'a', 'b', 'c', 'd', 're', 'im']);
export type AxisField = z.infer<typeof AxisFieldSchema>;

export const AxisChangeSchema = z.object({
  harmonic: z.number().int('Harmonic must be a whole number').min(-MAX_HARMONIC).max(MAX_HARMONIC),
  field: AxisFieldSchema,
  delta: finite('Change'),
});

export const SpaceAxisSchema = z.object({
  label: z.string().trim().min(1, 'Label the axis').max(40),
  changes: z.array(AxisChangeSchema).min(1, 'An axis needs at least one change').max(MAX_AXIS_CHANGES),
});

export const SpaceLayoutSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('rings'), rings: z.number().int().min(1).max(50), spokes: z.number().int().min(1).max(128) }),
  z.object({ kind: z.literal('lattice'), size: z.number().int().min(2).max(45) }),
  z.object({
    kind: z.literal('diameters'),
    directions: z.number().int().min(1).max(64),
    steps: z
      .number()
      .int()
      .min(3)
      .max(101)
      .refine((s) => s % 2 === 1, 'Use an odd number of steps, so the centre lies on every diameter'),
  }),
]);
export type SpaceLayoutInput = z.infer<typeof SpaceLayoutSchema>;

export const SpaceNormalizationSchema = z.object({
  scale: z.enum(['equal-area-radius', 'area', 'max-radius', 'perimeter', 'none']),
  centroid: z.boolean(),
});

export const EqualizationSchema = z.object({
  directions: z
    .array(z.object({ angle: finite('Angle'), knots: z.array(z.tuple([finite('ρ'), finite('mapped ρ')])).min(1).max(256) }))
    .min(1)
    .max(256),
});

/** What a designer sets; the seed descriptor is read from the seed shape. */
export const SpaceSettingsSchema = z.object({
  axes: z.tuple([SpaceAxisSchema, SpaceAxisSchema]),
  extent: finite('ρmax').refine((v) => v > 0, 'ρmax must be above 0').refine((v) => v <= 100, 'ρmax must be at most 100'),
  layout: SpaceLayoutSchema,
  normalization: SpaceNormalizationSchema,
  /** Re-map the radius per direction so contour distance grows evenly (computed by the server). */
  equalize: z.boolean().default(false),
  /**
   * A radius re-mapping given with the space instead (a perceptual equalisation from a norming study); absent on
   * spaces made by hand. Cannot be combined with `equalize`.
   */
  radiusMap: EqualizationSchema.optional(),
});
export type SpaceSettings = z.infer<typeof SpaceSettingsSchema>;

export const CreateSpaceSchema = SpaceSettingsSchema.extend({
  name: z.string().trim().min(1, 'Name the space').max(80),
  seedShapeId: z.uuid('Pick a seed shape'),
});
export type CreateSpaceInput = z.input<typeof CreateSpaceSchema>;

export const UpdateSpaceSchema = CreateSpaceSchema.partial().extend({ version: VersionSchema });

export const SpacePathSchema = LabPathSchema.extend({ spaceId: z.uuid() });

export const ShapeSpaceSchema = z.object({
  id: z.uuid(),
  name: z.string(),
  seedShape: z.object({ id: z.uuid(), name: z.string(), family: FamilySchema, descriptor: DescriptorSchema }),
  axes: z.tuple([SpaceAxisSchema, SpaceAxisSchema]),
  extent: z.number(),
  layout: SpaceLayoutSchema,
  normalization: SpaceNormalizationSchema,
  equalization: EqualizationSchema.nullable(),
  /** Where the re-mapping came from: contour equalisation on save, a norming study's perceptual one, or none. */
  equalizationSource: z.enum(['contour', 'study']).nullable(),
  /** Anisotropy index (largest / smallest contour-distance growth rate across directions) as designed, and after equalisation. */
  anisotropy: z.object({ designed: z.number().nullable(), equalized: z.number().nullable() }),
  stimulusCount: z.number().int(),
  version: z.number().int(),
  boundaries: z.array(BoundarySchema),
  boundariesVersion: z.number().int(),
  /** Editions frozen from this space so far. */
  editionCount: z.number().int(),
  createdBy: z.string().nullable(),
  updatedBy: z.string().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type ShapeSpace = z.infer<typeof ShapeSpaceSchema>;
