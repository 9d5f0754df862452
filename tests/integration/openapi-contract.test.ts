// The contract test: every operation of the OpenAPI document is called against real PostgreSQL (and the local S3
// fake, with a pack worker), and each answer is checked with ajv against the schema the document gives for that
// status. An operation without a call here fails the test, and so does a mounted route missing from the document.
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import { Ajv2020 } from 'ajv/dist/2020.js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { getDb } from '@/lib/server/db';
import { getEnv } from '@/lib/server/env';
import { registeredRoutes } from '@/lib/server/http';
import { buildOpenApiDocument } from '@/lib/server/openapi';
import '@/lib/server/api';
import { createLabWithEveryRole, type TestLab } from '../support/actors';
import { callRecipe, prepareRouteRecipes, routesById, type RecipeBook } from '../support/route-recipes';

type Doc = { paths: Record<string, Record<string, { operationId: string; responses: Record<string, { content?: Record<string, { schema: object }> } | { $ref: string }> }>>; components: { responses: Record<string, { content: Record<string, { schema: object }> }> } };

function mountedRoutes(): string[] {
  const root = fileURLToPath(new URL('../../app/api', import.meta.url));
  const walk = (dir: string): string[] => readdirSync(dir).flatMap((n) => (statSync(join(dir, n)).isDirectory() ? walk(join(dir, n)) : n === 'route.ts' ? [join(dir, n)] : []));
  return walk(root)
    .filter((f) => !f.includes('[...nextauth]'))
    .flatMap((file) => {
      const path = `/api/${relative(root, file).replace(/\/route\.ts$/, '')}`.replace(/\[([^\]]+)\]/g, '{$1}');
      return [...readFileSync(file, 'utf8').matchAll(/export const (GET|POST|PUT|PATCH|DELETE) = /g)].map((m) => `${m[1]} ${path}`);
    });
}

describe('the OpenAPI document and the API agree', () => {
  let lab: TestLab;
  let book: RecipeBook | undefined;
  const doc = () => buildOpenApiDocument(registeredRoutes(), getEnv().APP_URL) as unknown as Doc;

  beforeAll(async () => {
    lab = await createLabWithEveryRole(getDb());
  });
  afterAll(async () => {
    await book?.close();
    await getDb().destroy();
  });

  it('every mounted route is in the document, and every operation in the document is mounted', () => {
    const documented = Object.entries(doc().paths).flatMap(([path, ops]) => Object.keys(ops).map((m) => `${m.toUpperCase()} ${path}`));
    expect(documented.sort()).toEqual(mountedRoutes().sort());
  });

  it('every list takes cursor and limit and answers { items, nextCursor }', () => {
    const lists: string[] = [];
    for (const ops of Object.values(doc().paths)) {
      for (const op of Object.values(ops) as unknown as { operationId: string; parameters: { name: string; in: string }[]; responses: Record<string, { content?: Record<string, { schema: { properties?: Record<string, unknown> } }> }> }[]) {
        const ok = Object.entries(op.responses).find(([status]) => status.startsWith('2'))?.[1];
        const schema = ok?.content?.['application/json']?.schema;
        if (!schema?.properties?.items) continue;
        lists.push(op.operationId);
        expect(schema.properties.nextCursor, op.operationId).toBeDefined();
        const query = op.parameters.filter((p) => p.in === 'query').map((p) => p.name);
        expect(query, op.operationId).toEqual(expect.arrayContaining(['cursor', 'limit']));
      }
    }
    expect(lists.length).toBeGreaterThan(10);
  });

  it('every operation, called, answers as documented', async () => {
    book = await prepareRouteRecipes(lab);
    const document = doc();
    const byId = new Map<string, { path: string; method: string; responses: Doc['paths'][string][string]['responses'] }>();
    for (const [path, ops] of Object.entries(document.paths)) for (const [method, op] of Object.entries(ops)) byId.set(op.operationId, { path, method, responses: op.responses });
    const routes = routesById();
    expect(book.recipes.map((r) => r.id).sort(), 'a recipe (tests/support/route-recipes.ts) for every operation, and none for an operation the document lacks').toEqual([...byId.keys()].sort());

    const ajv = new Ajv2020({ strict: false, allErrors: true, validateFormats: false });
    for (const recipe of book.recipes) {
      const id = recipe.id;
      await recipe.before?.();
      const call = recipe.call();
      const res = await callRecipe(book, routes.get(id)!, call);
      expect(res.status, `${id}: ${JSON.stringify(res.body)}`).toBe(call.status);
      const documented = byId.get(id)!.responses[String(res.status)];
      expect(documented, `${id} answered ${res.status}, which the document does not list`).toBeDefined();
      const resolved = documented && '$ref' in documented ? document.components.responses[documented.$ref.split('/').pop()!] : documented;
      const [mediaType, content] = resolved?.content ? Object.entries(resolved.content)[0]! : [undefined, undefined];
      if (mediaType && !mediaType.includes('json')) {
        expect(res.headers.get('content-type'), `${id} answers ${mediaType}`).toContain(mediaType);
        expect(String(res.body ?? '').length, `${id} answers a file`).toBeGreaterThan(0);
      } else if (content) {
        const validate = ajv.compile(content.schema);
        expect(validate(res.body), `${id} ${res.status}: ${ajv.errorsText(validate.errors)}`).toBe(true);
      } else {
        expect(res.body, `${id} ${res.status} is documented without a body`).toBeUndefined();
      }
      await recipe.after?.(res.body);
    }
  }, 180_000);
});
