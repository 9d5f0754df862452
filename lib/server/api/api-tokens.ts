import 'server-only';
import { LabPathSchema } from '@/lib/schemas/account';
import { ApiTokenPathSchema, ApiTokenSchema, CreateApiTokenSchema, CreatedApiTokenSchema } from '@/lib/schemas/api-token';
import { PageQuerySchema, pageOf } from '@/lib/schemas/common';
import { getDb } from '../db';
import { defineRoute } from '../http';
import { createApiToken, listApiTokens, revokeApiToken } from '../services/api-tokens';

export const listApiTokensRoute = defineRoute({
  id: 'listApiTokens',
  method: 'GET',
  path: '/api/v1/labs/{lab}/api-tokens',
  summary: "The lab's API tokens (Owners): name, scope, expiry, last use; never the secret",
  tags: ['api tokens'],
  access: { kind: 'lab', action: 'tokens:manage' },
  params: LabPathSchema,
  query: PageQuerySchema,
  response: pageOf(ApiTokenSchema),
  handler: ({ labActor, query }) => listApiTokens(getDb(), labActor(), query),
});

export const createApiTokenRoute = defineRoute({
  id: 'createApiToken',
  method: 'POST',
  path: '/api/v1/labs/{lab}/api-tokens',
  summary: 'Make an API token with a scope and an expiry; the answer holds the secret, shown this once',
  tags: ['api tokens'],
  access: { kind: 'lab', action: 'tokens:manage' },
  params: LabPathSchema,
  body: CreateApiTokenSchema,
  response: CreatedApiTokenSchema,
  successStatus: 201,
  handler: ({ labActor, body }) => createApiToken(getDb(), labActor(), body),
});

export const revokeApiTokenRoute = defineRoute({
  id: 'revokeApiToken',
  method: 'DELETE',
  path: '/api/v1/labs/{lab}/api-tokens/{tokenId}',
  summary: 'Revoke an API token at once',
  tags: ['api tokens'],
  access: { kind: 'lab', action: 'tokens:manage' },
  params: ApiTokenPathSchema,
  response: ApiTokenSchema,
  handler: ({ labActor, params }) => revokeApiToken(getDb(), labActor(), params.tokenId),
});
