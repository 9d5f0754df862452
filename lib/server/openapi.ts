import 'server-only';
import { z } from 'zod';
import { ProblemSchema } from '@/lib/schemas/common';
import type { AnyRouteSpec } from './http';
import { APP_VERSION } from './version';

type JsonSchema = Record<string, unknown>;

/** JSON Schema 2020-12 of a zod schema as a request (`input`) or a response (`output`) has it, for OpenAPI 3.1. */
export function jsonSchemaOf(schema: z.ZodType, io: 'input' | 'output'): JsonSchema {
  const { $schema: _dialect, ...rest } = z.toJSONSchema(schema, { target: 'draft-2020-12', io, unrepresentable: 'any' }) as JsonSchema;
  return rest;
}

function parametersOf(schema: z.ZodType | undefined, where: 'path' | 'query'): JsonSchema[] {
  if (!schema) return [];
  const object = jsonSchemaOf(schema, 'input') as { properties?: Record<string, JsonSchema>; required?: string[] };
  return Object.entries(object.properties ?? {}).map(([name, s]) => ({
    name,
    in: where,
    required: where === 'path' || (object.required ?? []).includes(name),
    ...(typeof s.description === 'string' ? { description: s.description } : {}),
    schema: s,
  }));
}

function requestBodyOf(route: AnyRouteSpec): JsonSchema | undefined {
  if (route.method === 'GET' || route.method === 'DELETE') return undefined;
  const content: Record<string, JsonSchema> = {};
  if (route.textBody) for (const type of route.textBody.contentTypes) content[type] = { schema: { type: 'string' } };
  else if (route.body) content['application/json'] = { schema: jsonSchemaOf(route.body, 'input') };
  if (route.binaryBody) for (const type of route.binaryBody.contentTypes) content[type] = { schema: { type: 'string', contentMediaType: type } };
  return Object.keys(content).length > 0 ? { required: route.body !== undefined || route.textBody !== undefined, content } : undefined;
}

const PROBLEM = { $ref: '#/components/responses/Problem' };

function responsesOf(route: AnyRouteSpec): JsonSchema {
  const status = String(route.successStatus ?? 200);
  const etagHeader = { ETag: { description: 'The version of this answer; send it back as If-None-Match', schema: { type: 'string' } } };
  const success =
    status === '204'
      ? { description: 'Done; no body' }
      : {
          description: route.summary,
          ...(route.etag ? { headers: etagHeader } : {}),
          content: route.produces ? { [route.produces]: { schema: { type: 'string', contentMediaType: route.produces } } } : { 'application/json': { schema: jsonSchemaOf(route.response, 'output') } },
        };
  const errors: Record<string, JsonSchema> = { '400': PROBLEM, '500': PROBLEM };
  if (route.etag) errors['304'] = { description: 'Not modified: the If-None-Match ETag is still current', headers: etagHeader };
  if (route.access.kind !== 'public') Object.assign(errors, { '401': PROBLEM, '403': PROBLEM, '429': PROBLEM });
  if (route.access.kind === 'lab') errors['404'] = PROBLEM;
  for (const status of route.errors ?? []) errors[String(status)] = PROBLEM;
  return { [status]: success, ...errors };
}

function securityOf(route: AnyRouteSpec): JsonSchema[] {
  if (route.access.kind === 'public') return [];
  // Lab API tokens reach lab routes only; account routes take the session cookie.
  return route.access.kind === 'lab' ? [{ bearerToken: [] }, { sessionCookie: [] }] : [{ sessionCookie: [] }];
}

/**
 * The OpenAPI 3.1 document of every route in the registry, generated from the routes' own zod schemas (request
 * as input, response as output), so it cannot drift from what the handlers parse and answer. Errors are RFC 9457
 * problem details. Each lab route names the policy action it needs (`x-policy-action`).
 */
export function buildOpenApiDocument(routes: readonly AnyRouteSpec[], serverUrl: string): JsonSchema {
  const paths: Record<string, Record<string, JsonSchema>> = {};
  for (const route of [...routes].sort((a, b) => a.path.localeCompare(b.path) || a.method.localeCompare(b.method))) {
    const body = requestBodyOf(route);
    (paths[route.path] ??= {})[route.method.toLowerCase()] = {
      operationId: route.id,
      summary: route.summary,
      tags: route.tags ?? [],
      parameters: [...parametersOf(route.params, 'path'), ...parametersOf(route.query, 'query')],
      ...(body ? { requestBody: body } : {}),
      responses: responsesOf(route),
      security: securityOf(route),
      ...(route.access.kind === 'lab' ? { 'x-policy-action': route.access.action } : {}),
    };
  }
  return {
    openapi: '3.1.0',
    jsonSchemaDialect: 'https://json-schema.org/draft/2020-12/schema',
    info: {
      title: 'Epicycle API',
      version: APP_VERSION,
      description:
        'Shape spaces, editions, stimulus packs, studies and run orders of a lab. Send a lab API token as `Authorization: Bearer epk_…` (made by a lab Owner; `read` acts as a Reviewer, `write` as an Experimenter), or use the session cookie of a signed-in browser. Lists take `cursor` and `limit` and answer `{ items, nextCursor }`. Errors are problem details (application/problem+json). Tokens are rate-limited per minute (429 with Retry-After).',
    },
    servers: [{ url: serverUrl }],
    paths,
    components: {
      securitySchemes: {
        bearerToken: { type: 'http', scheme: 'bearer', description: 'A lab API token (epk_…), for its own lab only.' },
        sessionCookie: { type: 'apiKey', in: 'cookie', name: 'next-auth.session-token', description: 'The signed-in browser session.' },
      },
      responses: {
        Problem: { description: 'Problem details (RFC 9457)', content: { 'application/problem+json': { schema: jsonSchemaOf(ProblemSchema, 'output') } } },
      },
    },
  };
}
