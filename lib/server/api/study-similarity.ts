import 'server-only';
import { z } from 'zod';
import { EqualizedSpaceSchema, EqualizeFromStudySchema, SimilarityRdmPathSchema, SpaceOriginSchema, StudySimilaritySchema } from '@/lib/schemas/similarity';
import { SpacePathSchema } from '@/lib/schemas/space';
import { StudyPathSchema } from '@/lib/schemas/study';
import { getDb } from '../db';
import { defineRoute } from '../http';
import { createEqualizedSpace, getSpaceOrigin, getStudySimilarity, studySimilarityCsv, studySimilarityRdmTsv } from '../services/study-similarity';

const tags = ['studies'];

export const getStudySimilarityRoute = defineRoute({
  id: 'getStudySimilarity',
  method: 'GET',
  path: '/api/v1/labs/{lab}/studies/{studyId}/similarity',
  summary: 'Perceptual vs designed similarity: the perceptual RDM with its noise ceiling, Spearman and Mantel against the model RDMs, classical MDS with Procrustes, slopes and equalisation suggestions',
  tags,
  access: { kind: 'lab', action: 'similarity:read' },
  params: StudyPathSchema,
  response: StudySimilaritySchema,
  handler: ({ labActor, params }) => getStudySimilarity(getDb(), labActor(), params.studyId),
});

export const studySimilarityCsvRoute = defineRoute({
  id: 'downloadStudySimilarityCsv',
  method: 'GET',
  path: '/api/v1/labs/{lab}/studies/{studyId}/similarity/csv',
  summary: 'similarity.csv: one row per rated pair with its mean rating and the model dissimilarities, stamped with the study and the edition hash',
  tags,
  access: { kind: 'lab', action: 'similarity:read' },
  produces: 'text/csv',
  params: StudyPathSchema,
  response: z.string(),
  handler: async ({ labActor, params }) =>
    new Response(await studySimilarityCsv(getDb(), labActor(), params.studyId), {
      headers: { 'content-type': 'text/csv; charset=utf-8', 'content-disposition': `attachment; filename="study-${params.studyId}-similarity.csv"`, 'cache-control': 'no-store' },
    }),
});

export const studySimilarityRdmRoute = defineRoute({
  id: 'downloadStudySimilarityRdm',
  method: 'GET',
  path: '/api/v1/labs/{lab}/studies/{studyId}/similarity/rdms/{rdm}',
  summary: 'One RDM of the study (perceptual, design, contour or silhouette) as TSV, stamped with the study and the edition hash',
  tags,
  access: { kind: 'lab', action: 'similarity:read' },
  errors: [409],
  produces: 'text/tab-separated-values',
  params: SimilarityRdmPathSchema,
  response: z.string(),
  handler: async ({ labActor, params }) =>
    new Response(await studySimilarityRdmTsv(getDb(), labActor(), params.studyId, params.rdm), {
      headers: { 'content-type': 'text/tab-separated-values; charset=utf-8', 'content-disposition': `attachment; filename="study-${params.studyId}-rdm-${params.rdm}.tsv"`, 'cache-control': 'no-store' },
    }),
});

export const createEqualizedSpaceRoute = defineRoute({
  id: 'createEqualizedSpace',
  method: 'POST',
  path: '/api/v1/labs/{lab}/studies/{studyId}/similarity/equalize',
  summary: "A new space: a copy of the edition's space with the suggested radius re-mapping per direction (from the slopes or the MDS map), linked to the study",
  tags,
  access: { kind: 'lab', action: 'space:derive' },
  errors: [409],
  params: StudyPathSchema,
  body: EqualizeFromStudySchema,
  response: EqualizedSpaceSchema,
  successStatus: 201,
  handler: ({ labActor, params, body }) => createEqualizedSpace(getDb(), labActor(), params.studyId, body),
});

export const getSpaceOriginRoute = defineRoute({
  id: 'getSpaceOrigin',
  method: 'GET',
  path: '/api/v1/labs/{lab}/spaces/{spaceId}/origin',
  summary: 'The norming study a space was made from (its perceptual equalisation), or null for a space made by hand',
  tags: ['spaces'],
  access: { kind: 'lab', action: 'space:read' },
  params: SpacePathSchema,
  response: SpaceOriginSchema.nullable(),
  handler: ({ labActor, params }) => getSpaceOrigin(getDb(), labActor(), params.spaceId),
});
