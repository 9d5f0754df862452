import { afterAll, describe, expect, it } from 'vitest';
import { z } from 'zod';
import { PROBLEM_CONTENT_TYPE, validationError } from '@/lib/errors';
import { HealthSchema } from '@/lib/schemas/health';
import { getHealth } from '@/lib/server/api/health';
import { getDb } from '@/lib/server/db';
import { defineRoute, registeredRoutes, toHandler } from '@/lib/server/http';
import { createDb } from '@/db/client';
import { checkHealth } from '@/lib/server/services/health';

afterAll(async () => {
  await getDb().destroy();
});

describe('GET /api/health', () => {
  it('answers 200 with a healthy database, validated by its response schema', async () => {
    const res = await toHandler(getHealth)(new Request('http://127.0.0.1/api/health'));
    expect(res.status).toBe(200);
    const body = HealthSchema.parse(await res.json());
    expect(body.status).toBe('ok');
    expect(body.database.ok).toBe(true);
  });

  it('reports degraded when the database cannot be reached', async () => {
    const unreachable = createDb('postgres://postgres:x@127.0.0.1:1/none', 1);
    const health = await checkHealth(unreachable);
    await unreachable.destroy();
    expect(health.status).toBe('degraded');
    expect(health.database.ok).toBe(false);
  });
});

describe('the route wrapper', () => {
  const echo = defineRoute({
    id: 'testEcho',
    method: 'POST',
    path: '/api/v1/test/echo/{n}',
    summary: 'test only',
    access: { kind: 'public' },
    params: z.object({ n: z.coerce.number().int().min(1) }),
    body: z.object({ word: z.string().min(2) }),
    response: z.object({ word: z.string(), n: z.number() }),
    maxBodyBytes: 64,
    handler: async ({ params, body }) => {
      if (body.word === 'taken') throw validationError('test', 'That word is taken.', { word: ['Taken'] });
      return { word: body.word, n: params.n };
    },
  });
  const handle = toHandler(echo);
  const post = (body: string, n = '3', type = 'application/json') =>
    handle(new Request(`http://127.0.0.1/api/v1/test/echo/${n}`, { method: 'POST', body, headers: { 'content-type': type } }), {
      params: Promise.resolve({ n }),
    });

  it('registers the route', () => {
    expect(registeredRoutes().some((r) => r.id === 'testEcho')).toBe(true);
  });

  it('parses params and body and returns JSON', async () => {
    const res = await post(JSON.stringify({ word: 'hello' }));
    expect(res.status).toBe(200);
    expect(await res.json()).toEqual({ word: 'hello', n: 3 });
  });

  it('answers a bad body with problem details naming the field', async () => {
    const res = await post(JSON.stringify({ word: 'x' }));
    expect(res.status).toBe(400);
    expect(res.headers.get('content-type')).toBe(PROBLEM_CONTENT_TYPE);
    const problem = await res.json();
    expect(problem.code).toBe('validation:request');
    expect(Object.keys(problem.errors)).toEqual(['word']);
  });

  it('answers a bad path parameter with 400', async () => {
    const res = await post(JSON.stringify({ word: 'hello' }), '0');
    expect(res.status).toBe(400);
    expect((await res.json()).errors.n).toBeDefined();
  });

  it('refuses invalid JSON, a wrong content type and an oversized body', async () => {
    expect((await post('{not json')).status).toBe(400);
    expect((await post(JSON.stringify({ word: 'hello' }), '3', 'text/plain')).status).toBe(400);
    const big = await post(JSON.stringify({ word: 'x'.repeat(200) }));
    expect(big.status).toBe(413);
  });

  it('maps domain errors with their field messages', async () => {
    const res = await post(JSON.stringify({ word: 'taken' }));
    expect(res.status).toBe(400);
    expect((await res.json()).errors).toEqual({ word: ['Taken'] });
  });
});
