import 'server-only';
import { z } from 'zod';
import { PageQuerySchema, pageOf } from '@/lib/schemas/common';
import { PutBoundariesSchema } from '@/lib/schemas/boundary';
import {
  CommentPathSchema,
  CreateCommentSchema,
  DecideEditionSchema,
  DiffQuerySchema,
  EditionCommentSchema,
  EditionDiffSchema,
  EditionPathSchema,
  EditionSchema,
  EditionSnapshotSchema,
  FreezeEditionSchema,
  LabEditionsQuerySchema,
  UpdateCommentSchema,
  UpdateEditionSchema,
} from '@/lib/schemas/edition';
import { LabPathSchema } from '@/lib/schemas/account';
import { ShapeSpaceSchema, SpacePathSchema } from '@/lib/schemas/space';
import { getDb } from '../db';
import { defineRoute } from '../http';
import { paginate } from '../pagination';
import {
  addComment,
  decideEdition,
  diffEditionsOf,
  freezeEdition,
  getEdition,
  getEditionSnapshot,
  listComments,
  listEditions,
  listLabEditions,
  resolveComment,
  submitEdition,
  updateEdition,
} from '../services/editions';
import { putSpaceBoundaries } from '../services/shape-spaces';

export const putSpaceBoundariesRoute = defineRoute({
  id: 'putSpaceBoundaries',
  method: 'PUT',
  path: '/api/v1/labs/{lab}/spaces/{spaceId}/boundaries',
  summary: "Replace a space's category boundaries; `version` must be the boundaries version the edit started from",
  tags: ['boundaries'],
  access: { kind: 'lab', action: 'boundary:write' },
  params: SpacePathSchema,
  body: PutBoundariesSchema,
  response: ShapeSpaceSchema,
  handler: ({ labActor, params, body }) => putSpaceBoundaries(getDb(), labActor(), params.spaceId, body),
});

export const listEditionsRoute = defineRoute({
  id: 'listEditions',
  method: 'GET',
  path: '/api/v1/labs/{lab}/spaces/{spaceId}/editions',
  summary: "A space's editions, newest first",
  tags: ['editions'],
  access: { kind: 'lab', action: 'edition:read' },
  params: SpacePathSchema,
  query: PageQuerySchema,
  response: pageOf(EditionSchema),
  handler: ({ labActor, params, query }) => listEditions(getDb(), labActor(), params.spaceId, query),
});

export const listLabEditionsRoute = defineRoute({
  id: 'listLabEditions',
  method: 'GET',
  path: '/api/v1/labs/{lab}/editions',
  summary: "The lab's editions across its spaces, newest first; `state=approved` gives the ones ready for studies and packs",
  tags: ['editions'],
  access: { kind: 'lab', action: 'edition:read' },
  params: LabPathSchema,
  query: LabEditionsQuerySchema,
  response: pageOf(EditionSchema),
  handler: ({ labActor, query }) => listLabEditions(getDb(), labActor(), query),
});

export const freezeEditionRoute = defineRoute({
  id: 'freezeEdition',
  method: 'POST',
  path: '/api/v1/labs/{lab}/spaces/{spaceId}/editions',
  summary: 'Freeze the space as it is now into a new Draft edition (seed, definition, boundaries, engine version, every stimulus)',
  tags: ['editions'],
  access: { kind: 'lab', action: 'edition:freeze' },
  params: SpacePathSchema,
  body: FreezeEditionSchema,
  response: EditionSchema,
  successStatus: 201,
  handler: ({ labActor, params, body }) => freezeEdition(getDb(), labActor(), params.spaceId, body),
});

export const diffEditionsRoute = defineRoute({
  id: 'diffEditions',
  method: 'GET',
  path: '/api/v1/labs/{lab}/spaces/{spaceId}/editions/diff',
  summary: 'What changed between two editions of a space: parameters, and stimuli matched by id',
  tags: ['editions'],
  access: { kind: 'lab', action: 'edition:read' },
  params: SpacePathSchema,
  query: DiffQuerySchema,
  response: EditionDiffSchema,
  handler: ({ labActor, params, query }) => diffEditionsOf(getDb(), labActor(), params.spaceId, query.from, query.to),
});

export const getEditionRoute = defineRoute({
  id: 'getEdition',
  method: 'GET',
  path: '/api/v1/labs/{lab}/spaces/{spaceId}/editions/{number}',
  summary: 'One edition: state, content hash, author and review',
  tags: ['editions'],
  access: { kind: 'lab', action: 'edition:read' },
  params: EditionPathSchema,
  response: EditionSchema,
  handler: ({ labActor, params }) => getEdition(getDb(), labActor(), params.spaceId, params.number),
});

export const updateEditionRoute = defineRoute({
  id: 'updateEdition',
  method: 'PATCH',
  path: '/api/v1/labs/{lab}/spaces/{spaceId}/editions/{number}',
  summary: "Edit a Draft's change note (nothing else of an edition ever changes)",
  tags: ['editions'],
  access: { kind: 'lab', action: 'edition:freeze' },
  params: EditionPathSchema,
  body: UpdateEditionSchema,
  response: EditionSchema,
  handler: ({ labActor, params, body }) => updateEdition(getDb(), labActor(), params.spaceId, params.number, body),
});

export const getEditionSnapshotRoute = defineRoute({
  id: 'getEditionSnapshot',
  method: 'GET',
  path: '/api/v1/labs/{lab}/spaces/{spaceId}/editions/{number}/snapshot',
  summary: 'The frozen snapshot the content hash covers (SHA-256 of its RFC 8785 canonical JSON)',
  tags: ['editions'],
  access: { kind: 'lab', action: 'edition:read' },
  params: EditionPathSchema,
  response: EditionSnapshotSchema,
  handler: ({ labActor, params }) => getEditionSnapshot(getDb(), labActor(), params.spaceId, params.number),
});

export const submitEditionRoute = defineRoute({
  id: 'submitEdition',
  method: 'POST',
  path: '/api/v1/labs/{lab}/spaces/{spaceId}/editions/{number}/submit',
  summary: 'Send a Draft edition for review (mails the reviewers)',
  tags: ['editions'],
  access: { kind: 'lab', action: 'edition:submit' },
  params: EditionPathSchema,
  body: z.object({}).optional(),
  response: EditionSchema,
  handler: ({ labActor, params }) => submitEdition(getDb(), labActor(), params.spaceId, params.number),
});

export const decideEditionRoute = defineRoute({
  id: 'decideEdition',
  method: 'POST',
  path: '/api/v1/labs/{lab}/spaces/{spaceId}/editions/{number}/decision',
  summary: 'Approve or return an edition In review (not your own; mails the author)',
  tags: ['editions'],
  access: { kind: 'lab', action: 'edition:decide' },
  params: EditionPathSchema,
  body: DecideEditionSchema,
  response: EditionSchema,
  handler: ({ labActor, params, body }) => decideEdition(getDb(), labActor(), params.spaceId, params.number, body),
});

export const listEditionCommentsRoute = defineRoute({
  id: 'listEditionComments',
  method: 'GET',
  path: '/api/v1/labs/{lab}/spaces/{spaceId}/editions/{number}/comments',
  summary: "An edition's comments, oldest first",
  tags: ['editions'],
  access: { kind: 'lab', action: 'edition:read' },
  params: EditionPathSchema,
  query: PageQuerySchema,
  response: pageOf(EditionCommentSchema),
  handler: async ({ labActor, params, query }) => paginate(await listComments(getDb(), labActor(), params.spaceId, params.number), query, (c) => c.id),
});

export const addEditionCommentRoute = defineRoute({
  id: 'addEditionComment',
  method: 'POST',
  path: '/api/v1/labs/{lab}/spaces/{spaceId}/editions/{number}/comments',
  summary: 'Comment on an edition, or on one of its stimuli by id',
  tags: ['editions'],
  access: { kind: 'lab', action: 'edition:comment' },
  params: EditionPathSchema,
  body: CreateCommentSchema,
  response: EditionCommentSchema,
  successStatus: 201,
  handler: ({ labActor, params, body }) => addComment(getDb(), labActor(), params.spaceId, params.number, body),
});

export const resolveEditionCommentRoute = defineRoute({
  id: 'resolveEditionComment',
  method: 'PATCH',
  path: '/api/v1/labs/{lab}/spaces/{spaceId}/editions/{number}/comments/{commentId}',
  summary: 'Mark a comment resolved, or open it again',
  tags: ['editions'],
  access: { kind: 'lab', action: 'edition:comment' },
  params: CommentPathSchema,
  body: UpdateCommentSchema,
  response: EditionCommentSchema,
  handler: ({ labActor, params, body }) => resolveComment(getDb(), labActor(), params.spaceId, params.number, params.commentId, body.resolved),
});
