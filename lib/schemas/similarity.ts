import { z } from 'zod';
import { StudyPathSchema } from './study';

/** The matrices the similarity section serves as TSV: the perceptual RDM and the edition's three model RDMs. */
export const SimilarityRdmNameSchema = z.enum(['perceptual', 'design', 'contour', 'silhouette']);
export type SimilarityRdmName = z.infer<typeof SimilarityRdmNameSchema>;
export const ModelRdmNameSchema = z.enum(['design', 'contour', 'silhouette']);

export const SimilarityRdmPathSchema = StudyPathSchema.extend({ rdm: SimilarityRdmNameSchema });

/** A square matrix as rows; null marks a pair without data. */
const MatrixSchema = z.array(z.array(z.number().nullable()));

const SuggestionSchema = z.object({
  basis: z.enum(['slopes', 'map']),
  directions: z.array(
    z.object({
      /** Degrees, counter-clockwise from Axis A: a diameter [0, 180) for slopes, a ray [0, 360) for the map. */
      angleDeg: z.number(),
      rate: z.number(),
      scale: z.number(),
      predictedRate: z.number(),
      limited: z.boolean(),
    }),
  ),
  ratioBefore: z.number(),
  ratioAfter: z.number(),
});
export type EqualizationSuggestionValue = z.infer<typeof SuggestionSchema>;

export const StudySimilaritySchema = z.object({
  study: z.object({ id: z.uuid(), name: z.string() }),
  edition: z.object({ id: z.uuid(), spaceId: z.uuid(), spaceName: z.string(), number: z.number().int(), contentHash: z.string() }),
  /** Answers used: excluded sessions and missed trials left out. */
  ratings: z.object({ count: z.number().int(), participants: z.number().int(), excludedSessions: z.number().int() }),
  scale: z.object({ low: z.string(), high: z.string() }).nullable(),
  /** The rated stimuli, in the edition's order: the rows and columns of every matrix below. */
  stimuli: z.array(z.object({ id: z.string(), kind: z.enum(['layout', 'prototype']), a: z.number(), b: z.number() })),
  perceptual: z.object({ values: MatrixSchema, counts: z.array(z.array(z.number().int())) }).nullable(),
  models: z.object({ design: MatrixSchema, contour: MatrixSchema, silhouette: MatrixSchema }).nullable(),
  noiseCeiling: z.object({ split: z.enum(['participants', 'repetitions']), splitHalf: z.number(), ceiling: z.number(), pairs: z.number().int() }).nullable(),
  correlations: z.array(
    z.object({
      model: ModelRdmNameSchema,
      spearman: z.number().nullable(),
      pairs: z.number().int(),
      mantel: z.object({ statistic: z.number(), p: z.number(), permutations: z.number().int(), method: z.literal('spearman'), seed: z.number().int() }).nullable(),
    }),
  ),
  mds: z
    .object({
      /** classical: Torgerson scaling of a complete RDM; smacof: metric MDS by majorisation over the rated pairs. */
      method: z.enum(['classical', 'smacof']),
      /** Pairs of the mapped stimuli with no rating (left out of a SMACOF map; 0 for a classical one). */
      unratedPairs: z.number().int(),
      /** Classical only: every eigenvalue, largest first (empty for SMACOF). */
      eigenvalues: z.array(z.number()),
      negativeEigenvalues: z.number().int(),
      /** Classical only: share of Σ|λ| in the two dimensions. */
      explained: z.number().nullable(),
      /** SMACOF only: normalised stress (stress-1) over the rated pairs. */
      stress: z.number().nullable(),
      iterations: z.number().int().nullable(),
      coordinates: z.array(z.tuple([z.number(), z.number()])),
      aligned: z.array(z.tuple([z.number(), z.number()])),
      procrustes: z.object({ rotation: z.array(z.array(z.number())), scale: z.number(), translation: z.array(z.number()), residual: z.number(), standardizedResidual: z.number() }),
    })
    .nullable(),
  /** Why there is no MDS map (too few rated stimuli, or rated pairs that do not link them all), when there is none. */
  mdsNote: z.string().nullable(),
  slopes: z.array(
    z.object({
      directionDeg: z.number(),
      trials: z.number().int(),
      slope: z.number().nullable(),
      threshold: z.number().nullable(),
      spread: z.number().nullable(),
      lapse: z.number().nullable(),
      spreadAtBound: z.enum(['lower', 'upper']).nullable(),
      error: z.string().nullable(),
    }),
  ),
  equalization: z.object({
    slopes: SuggestionSchema.nullable(),
    map: SuggestionSchema.nullable(),
    slopesNote: z.string().nullable(),
    mapNote: z.string().nullable(),
  }),
  derivedSpaces: z.array(z.object({ id: z.uuid(), name: z.string(), basis: z.enum(['slopes', 'map']), createdAt: z.string() })),
});
export type StudySimilarityValue = z.infer<typeof StudySimilaritySchema>;

export const EqualizeFromStudySchema = z.object({
  basis: z.enum(['slopes', 'map']),
  /** The new space's name; by default the edition's space's name with "(perceptually equalised)". */
  name: z.string().trim().min(1, 'Name the space').max(80).optional(),
});
export type EqualizeFromStudyInput = z.infer<typeof EqualizeFromStudySchema>;

export const SpaceOriginSchema = z.object({
  spaceId: z.uuid(),
  study: z.object({ id: z.uuid().nullable(), name: z.string() }),
  edition: z.object({ spaceId: z.uuid(), spaceName: z.string(), number: z.number().int(), contentHash: z.string() }).nullable(),
  basis: z.enum(['slopes', 'map']),
  suggestion: SuggestionSchema,
  createdAt: z.string(),
});
export type SpaceOriginValue = z.infer<typeof SpaceOriginSchema>;

export const EqualizedSpaceSchema = z.object({ space: z.object({ id: z.uuid(), name: z.string() }), origin: SpaceOriginSchema });
