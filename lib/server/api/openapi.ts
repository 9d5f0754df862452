import 'server-only';
import { z } from 'zod';
import { getEnv } from '../env';
import { defineRoute, registeredRoutes } from '../http';
import { buildOpenApiDocument } from '../openapi';

export const getOpenApiDocumentRoute = defineRoute({
  id: 'getOpenApiDocument',
  method: 'GET',
  path: '/api/v1/openapi.json',
  summary: 'This API as an OpenAPI 3.1 document, generated from the route registry',
  tags: ['system'],
  access: { kind: 'public' },
  response: z.record(z.string(), z.unknown()),
  handler: async () => buildOpenApiDocument(registeredRoutes(), getEnv().APP_URL),
});
