import 'server-only';
import { z } from 'zod';
import { LabPathSchema, OkSchema } from '@/lib/schemas/account';
import { pageOf, PageQuerySchema } from '@/lib/schemas/common';
import { DescriptorSchema } from '@/lib/schemas/descriptor';
import { CreateSpaceSchema, ShapeSpaceSchema, SpacePathSchema, UpdateSpaceSchema } from '@/lib/schemas/space';
import { getDb } from '../db';
import { defineRoute } from '../http';
import { paginate } from '../pagination';
import { createShapeSpace, deleteShapeSpace, getShapeSpace, listShapeSpaces, listSpaceStimuli, updateShapeSpace } from '../services/shape-spaces';

export const listShapeSpacesRoute = defineRoute({
  id: 'listShapeSpaces',
  method: 'GET',
  path: '/api/v1/labs/{lab}/spaces',
  summary: "The lab's shape spaces, most recently changed first",
  tags: ['shape spaces'],
  access: { kind: 'lab', action: 'space:read' },
  params: LabPathSchema,
  query: PageQuerySchema,
  response: pageOf(ShapeSpaceSchema),
  handler: ({ labActor, query }) => listShapeSpaces(getDb(), labActor(), query),
});

export const getShapeSpaceRoute = defineRoute({
  id: 'getShapeSpace',
  method: 'GET',
  path: '/api/v1/labs/{lab}/spaces/{spaceId}',
  summary: 'One shape space definition',
  tags: ['shape spaces'],
  access: { kind: 'lab', action: 'space:read' },
  params: SpacePathSchema,
  response: ShapeSpaceSchema,
  handler: ({ labActor, params }) => getShapeSpace(getDb(), labActor(), params.spaceId),
});

export const createShapeSpaceRoute = defineRoute({
  id: 'createShapeSpace',
  method: 'POST',
  path: '/api/v1/labs/{lab}/spaces',
  summary: 'Create a shape space around a seed shape (every stimulus is checked; failures are listed)',
  tags: ['shape spaces'],
  access: { kind: 'lab', action: 'space:write' },
  params: LabPathSchema,
  body: CreateSpaceSchema,
  response: ShapeSpaceSchema,
  successStatus: 201,
  handler: ({ labActor, body }) => createShapeSpace(getDb(), labActor(), body),
});

export const updateShapeSpaceRoute = defineRoute({
  id: 'updateShapeSpace',
  method: 'PATCH',
  path: '/api/v1/labs/{lab}/spaces/{spaceId}',
  summary: 'Change a space; `version` must be the one the edit started from',
  tags: ['shape spaces'],
  access: { kind: 'lab', action: 'space:write' },
  params: SpacePathSchema,
  body: UpdateSpaceSchema,
  response: ShapeSpaceSchema,
  handler: ({ labActor, params, body }) => updateShapeSpace(getDb(), labActor(), params.spaceId, body),
});

export const deleteShapeSpaceRoute = defineRoute({
  id: 'deleteShapeSpace',
  method: 'DELETE',
  path: '/api/v1/labs/{lab}/spaces/{spaceId}',
  summary: 'Delete a shape space',
  tags: ['shape spaces'],
  access: { kind: 'lab', action: 'space:write' },
  params: SpacePathSchema,
  response: OkSchema,
  successStatus: 204,
  handler: async ({ labActor, params }) => {
    await deleteShapeSpace(getDb(), labActor(), params.spaceId);
    return { ok: true as const };
  },
});

const StimulusSchema = z.object({
  id: z.string(),
  position: z.object({ a: z.number(), b: z.number() }),
  polar: z.object({ rho: z.number(), angle: z.number() }),
  layoutPosition: z.record(z.string(), z.union([z.string(), z.number()])),
  descriptor: DescriptorSchema,
  metrics: z.object({ area: z.number(), perimeter: z.number(), compactness: z.number() }),
});

export const listSpaceStimuliRoute = defineRoute({
  id: 'listSpaceStimuli',
  method: 'GET',
  path: '/api/v1/labs/{lab}/spaces/{spaceId}/stimuli',
  summary: 'Every stimulus of the space: id (its layout position), coordinates, descriptor and metrics',
  tags: ['shape spaces'],
  access: { kind: 'lab', action: 'space:read' },
  params: SpacePathSchema,
  query: PageQuerySchema,
  response: pageOf(StimulusSchema),
  handler: async ({ labActor, params, query }) => paginate(await listSpaceStimuli(getDb(), labActor(), params.spaceId), query, (s) => s.id),
});
