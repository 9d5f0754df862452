// Schema-driven fuzzing: for every registered route, bodies, queries and path parameters drawn from its own request
// schemas (valid ones and ones broken in one place, plus hostile strings), sent by a caller the route lets in. The
// server must never answer 5xx, and every 4xx must be problem details. Seeded (EPICYCLE_FUZZ_SEED) and bounded
// (EPICYCLE_FUZZ_RUNS cases per route and part); a failure prints the seed and the case to replay it.
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { insertUser } from '@/db/repositories/users';
import { getDb } from '@/lib/server/db';
import type { AnyRouteSpec } from '@/lib/server/http';
import { callRoute, createLabWithEveryRole, sessionCookie, type TestLab } from '../support/actors';
import { uniqueSuffix } from '../support/db';
import { HOSTILE_STRINGS, invalidOf, requestJsonSchema, validOf, type JsonSchema } from '../support/json-schema-arbitrary';
import { authOf, callRecipe, prepareRouteRecipes, routesById, type RecipeBook, type RecipeCall } from '../support/route-recipes';

const SEED = Number(process.env.EPICYCLE_FUZZ_SEED ?? 20261202);
const RUNS = Number(process.env.EPICYCLE_FUZZ_RUNS ?? 8);
/** A single request slower than this is listed in the output (a hint of unbounded work). */
const SLOW_CASE_MS = 2000;

type Case = { part: string; params?: Record<string, string>; query?: Record<string, string>; body?: unknown; text?: { type: string; content: string } };

/** A generated value as it travels in a URL: strings as they are, anything else as JSON; no URL holds a lone surrogate. */
const asUrlValue = (v: unknown): string => (typeof v === 'string' ? v : (JSON.stringify(v) ?? '')).replace(/[\uD800-\uDFFF]/g, '\uFFFD');
const urlRecord = (v: unknown): Record<string, string> =>
  v && typeof v === 'object' && !Array.isArray(v) ? Object.fromEntries(Object.entries(v).map(([k, x]) => [k, asUrlValue(x)])) : { value: asUrlValue(v) };

/** The cases of one route: each request part fuzzed in turn, the others as the recipe has them. */
function casesOf(route: AnyRouteSpec, call: RecipeCall, seed: number): Case[] {
  const sample = <T>(arb: fc.Arbitrary<T>, n = RUNS) => fc.sample(arb, { seed, numRuns: n });
  const cases: Case[] = [];
  const base = { ...(call.params ? { params: call.params } : {}), ...(call.query ? { query: call.query } : {}) };
  const hasBody = route.method !== 'GET' && route.method !== 'DELETE';
  if (route.textBody) {
    const type = route.textBody.contentTypes[0]!;
    const content = fc.oneof(fc.string({ maxLength: 400 }), fc.constantFrom(...HOSTILE_STRINGS), fc.array(fc.tuple(fc.double(), fc.double()), { maxLength: 80 }).map((rows) => rows.map((r) => r.join(',')).join('\n')));
    for (const text of sample(content, RUNS * 2)) cases.push({ part: 'file', ...base, text: { type, content: text } });
  } else if (route.body && hasBody) {
    const schema = requestJsonSchema(route.body);
    for (const body of sample(validOf(schema))) cases.push({ part: 'valid body', ...base, body });
    for (const body of sample(invalidOf(schema))) cases.push({ part: 'invalid body', ...base, body });
  } else if (hasBody) {
    for (const body of sample(fc.jsonValue({ maxDepth: 2 }), 2)) cases.push({ part: 'unexpected body', ...base, body });
  }
  if (route.query) {
    const schema = requestJsonSchema(route.query);
    for (const query of sample(validOf(schema))) cases.push({ part: 'valid query', ...base, query: urlRecord(query), ...(call.body !== undefined ? { body: call.body } : {}) });
    for (const query of sample(invalidOf(schema))) cases.push({ part: 'invalid query', ...base, query: urlRecord(query), ...(call.body !== undefined ? { body: call.body } : {}) });
  }
  if (route.params && call.params) {
    const schema = requestJsonSchema(route.params) as JsonSchema;
    const keys = Object.keys(schema.properties ?? {});
    const broken = fc.constantFrom(...keys).chain((k) => fc.tuple(fc.constant(k), fc.oneof(validOf(schema.properties![k]!, schema), invalidOf(schema.properties![k]!, schema))));
    for (const [k, v] of sample(broken)) cases.push({ part: `path ${k}`, ...base, params: { ...call.params, [k]: asUrlValue(v) }, ...(call.body !== undefined ? { body: call.body } : {}), ...(call.text ? { text: call.text } : {}) });
  }
  return cases;
}

describe('request fuzzing from the route schemas', () => {
  let lab: TestLab;
  let book: RecipeBook;
  let userCookie = '';

  beforeAll(async () => {
    lab = await createLabWithEveryRole(getDb());
    book = await prepareRouteRecipes(lab);
    // Every recipe runs first, so the fuzzed requests name real resources (and some already deleted).
    const routes = routesById();
    for (const recipe of book.recipes) {
      await recipe.before?.();
      const call = recipe.call();
      const r = await callRecipe(book, routes.get(recipe.id)!, call);
      if (r.status !== call.status) throw new Error(`recipe ${recipe.id} answered ${r.status}: ${JSON.stringify(r.body)}`);
      await recipe.after?.(r.body);
    }
    await book.close();
    const user = await insertUser(getDb(), { email: `fuzz-${uniqueSuffix()}@test.example`, name: 'Fuzz', passwordHash: null });
    userCookie = await sessionCookie(user.id);
  }, 120_000);
  afterAll(async () => {
    await getDb().destroy();
  });

  it('never answers 5xx, and every 4xx is problem details', async () => {
    const routes = routesById();
    const failures: string[] = [];
    let count = 0;
    const started = Date.now();
    const timings: [string, number][] = [];
    const slowCases: string[] = [];
    for (const [index, recipe] of book.recipes.entries()) {
      const routeStarted = Date.now();
      const route = routes.get(recipe.id)!;
      const call = recipe.call();
      // A caller the route lets in, so the request reaches parsing and the service: the lab's Owner for lab routes
      // (a cookie, as a token's per-minute limit would cut the run short), a user of its own for account routes.
      const auth = route.access.kind === 'lab' ? authOf(book, 'owner') : route.access.kind === 'user' ? { cookie: userCookie } : {};
      for (const c of casesOf(route, call, SEED + index)) {
        count += 1;
        const { part, ...request } = c;
        const caseStarted = Date.now();
        const r = await callRoute(route, { ...auth, ...request });
        const caseMs = Date.now() - caseStarted;
        if (caseMs > SLOW_CASE_MS) slowCases.push(`${route.id} (${part}) ${caseMs} ms: ${JSON.stringify(request).slice(0, 400)}`);
        const type = r.headers.get('content-type') ?? '';
        const problem = r.body as { status?: number; code?: string } | undefined;
        const isProblem = type.includes('application/problem+json') && problem?.status === r.status && typeof problem.code === 'string';
        if (r.status >= 500 || (r.status >= 400 && !isProblem)) {
          failures.push(`${route.id} (${part}, seed ${SEED + index}): ${r.status} ${type} ${JSON.stringify(r.body)?.slice(0, 200)} for ${JSON.stringify(request).slice(0, 300)}`);
        }
      }
      timings.push([route.id, Date.now() - routeStarted]);
    }
    const slowest = timings.sort((a, b) => b[1] - a[1]).slice(0, 5).map(([id, ms]) => `${id} ${ms} ms`);
    console.info(`request fuzzing, slowest routes: ${slowest.join(', ')}`);
    if (slowCases.length > 0) console.info(`request fuzzing, cases over ${SLOW_CASE_MS} ms:\n${slowCases.join('\n')}`);
    console.info(`request fuzzing: ${count} cases over ${book.recipes.length} routes in ${((Date.now() - started) / 1000).toFixed(1)} s (seed ${SEED}, ${RUNS} per part)`);
    expect(failures, failures.join('\n')).toEqual([]);
    expect(count).toBeGreaterThan(book.recipes.length * 3);
  }, 300_000);
});
