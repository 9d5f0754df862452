import 'server-only';
import { LabPathSchema, OkSchema } from '@/lib/schemas/account';
import { pageOf, PageQuerySchema } from '@/lib/schemas/common';
import {
  CreateSeedShapeSchema,
  FitQuerySchema,
  FitResultSchema,
  SeedShapePathSchema,
  SeedShapeSchema,
  UpdateSeedShapeSchema,
} from '@/lib/schemas/seed-shapes';
import { getDb } from '../db';
import { defineRoute } from '../http';
import { authorize } from '../services/access';
import { fitUploadedOutline, OUTLINE_UPLOAD_MAX_BYTES } from '../services/outline-upload';
import { createSeedShape, deleteSeedShape, getSeedShape, listSeedShapes, updateSeedShape } from '../services/seed-shapes';

const SVG_TYPES = ['image/svg+xml'];
const CSV_TYPES = ['text/csv', 'text/plain'];

export const listSeedShapesRoute = defineRoute({
  id: 'listSeedShapes',
  method: 'GET',
  path: '/api/v1/labs/{lab}/seed-shapes',
  summary: "The lab's seed shapes, most recently changed first",
  tags: ['seed shapes'],
  access: { kind: 'lab', action: 'seed:read' },
  params: LabPathSchema,
  query: PageQuerySchema,
  response: pageOf(SeedShapeSchema),
  handler: ({ labActor, query }) => listSeedShapes(getDb(), labActor(), query),
});

export const getSeedShapeRoute = defineRoute({
  id: 'getSeedShape',
  method: 'GET',
  path: '/api/v1/labs/{lab}/seed-shapes/{seedShapeId}',
  summary: 'One seed shape with its descriptor and metrics',
  tags: ['seed shapes'],
  access: { kind: 'lab', action: 'seed:read' },
  params: SeedShapePathSchema,
  response: SeedShapeSchema,
  handler: ({ labActor, params }) => getSeedShape(getDb(), labActor(), params.seedShapeId),
});

export const createSeedShapeRoute = defineRoute({
  id: 'createSeedShape',
  method: 'POST',
  path: '/api/v1/labs/{lab}/seed-shapes',
  summary: 'Create a seed shape from a descriptor (checked for r > 0 and self-intersection)',
  tags: ['seed shapes'],
  access: { kind: 'lab', action: 'seed:write' },
  params: LabPathSchema,
  body: CreateSeedShapeSchema,
  response: SeedShapeSchema,
  successStatus: 201,
  handler: ({ labActor, body }) => createSeedShape(getDb(), labActor(), body),
});

export const updateSeedShapeRoute = defineRoute({
  id: 'updateSeedShape',
  method: 'PATCH',
  path: '/api/v1/labs/{lab}/seed-shapes/{seedShapeId}',
  summary: 'Rename or change the descriptor; `version` must be the one the edit started from',
  tags: ['seed shapes'],
  access: { kind: 'lab', action: 'seed:write' },
  params: SeedShapePathSchema,
  body: UpdateSeedShapeSchema,
  response: SeedShapeSchema,
  handler: ({ labActor, params, body }) => updateSeedShape(getDb(), labActor(), params.seedShapeId, body),
});

export const deleteSeedShapeRoute = defineRoute({
  id: 'deleteSeedShape',
  method: 'DELETE',
  path: '/api/v1/labs/{lab}/seed-shapes/{seedShapeId}',
  summary: 'Delete a seed shape (refused while a shape space uses it)',
  tags: ['seed shapes'],
  access: { kind: 'lab', action: 'seed:write' },
  params: SeedShapePathSchema,
  response: OkSchema,
  successStatus: 204,
  handler: async ({ labActor, params }) => {
    await deleteSeedShape(getDb(), labActor(), params.seedShapeId);
    return { ok: true as const };
  },
});

export const fitSeedShapeRoute = defineRoute({
  id: 'fitSeedShapeFromUpload',
  method: 'POST',
  path: '/api/v1/labs/{lab}/seed-shapes/fit',
  summary: 'Fit harmonics to an uploaded outline (SVG ≤ 1 MiB, or CSV of x,y); nothing uploaded is stored',
  tags: ['seed shapes'],
  access: { kind: 'lab', action: 'seed:write' },
  params: LabPathSchema,
  query: FitQuerySchema,
  textBody: { contentTypes: [...SVG_TYPES, ...CSV_TYPES] },
  maxBodyBytes: OUTLINE_UPLOAD_MAX_BYTES,
  response: FitResultSchema,
  handler: async ({ labActor, query, text, request }) => {
    authorize(labActor(), 'seed:write');
    const type = (request.headers.get('content-type') ?? '').split(';')[0]!.trim().toLowerCase();
    return fitUploadedOutline(text, SVG_TYPES.includes(type) ? 'svg' : 'csv', query.family, query.harmonics);
  },
});
