// The authorisation matrix: every registered route is called as nobody, as a participant, as each role of its lab,
// as a member of another lab, and as a lab API token of each scope (and one of another lab), and each answer is
// checked against what the policy table (lib/server/policy.ts) predicts. The cells are generated from the route
// registry and the policy; the inputs come from the shared recipes (tests/support/route-recipes.ts), so a route
// without a recipe fails here by name. Refused cells send the recipe's real, valid request (a refusal must not
// depend on what was sent); allowed cells send a request that proves the caller got past authorisation without
// changing anything (see `allowedProbe`), and the recipe itself is then called once as its own caller.
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as api from '@/lib/server/api';
import { getDb } from '@/lib/server/db';
import { registeredActions, registeredRoutes, type AnyRouteSpec } from '@/lib/server/http';
import { can, canWithToken, ROLES, TOKEN_SCOPE_ROLES, type PolicyAction } from '@/lib/server/policy';
import { newInvite } from '@/lib/server/study-invite';
import { callRoute, createLabWithEveryRole, type TestLab } from '../support/actors';
import { authOf, callRecipe, prepareRouteRecipes, routesById, type RecipeBook, type RecipeCall, type RecipeCaller } from '../support/route-recipes';

type Answer = Awaited<ReturnType<typeof callRoute>>;
type Auth = { cookie?: string; bearer?: string };
type Scope = keyof typeof TOKEN_SCOPE_ROLES;

/** Server actions with a matrix entry; none is registered today (every change goes through an API route). */
const ACTION_CELLS: Record<string, never> = {};

const codeOf = (r: Answer): string | undefined => (r.body as { code?: string } | undefined)?.code;
const isProblem = (r: Answer) => (r.headers.get('content-type') ?? '').includes('application/problem+json');

/** Sends the recipe's request (params, query, body or file) with another caller's credentials. */
function asCaller(route: AnyRouteSpec, call: RecipeCall, auth: Auth, params = call.params): Promise<Answer> {
  return callRoute(route, {
    ...auth,
    ...(params ? { params } : {}),
    ...(call.query ? { query: call.query } : {}),
    ...(call.body !== undefined ? { body: call.body } : {}),
    ...(call.text ? { text: call.text } : {}),
  });
}

/**
 * A request that changes nothing and still shows the caller was let through: a GET is made as is (its recipe
 * status is expected); a body-taking method gets a body that is not JSON (or a file of a type it does not take),
 * which the wrapper reads only after authorising, so 400 means "allowed"; a DELETE names a resource that does not
 * exist, which only a caller past authorisation learns (404 for the resource, not for the lab).
 */
async function allowedProbe(route: AnyRouteSpec, call: RecipeCall, auth: Auth): Promise<{ ok: boolean; answer: Answer; expected: string }> {
  if (route.method === 'GET') {
    const answer = await asCaller(route, call, auth);
    return { ok: answer.status === call.status, answer, expected: String(call.status) };
  }
  if (route.method === 'DELETE') {
    const key = Object.keys(call.params ?? {}).filter((k) => k !== 'lab').pop();
    if (!key) throw new Error(`${route.id}: a DELETE route without a resource parameter needs its own allowed probe`);
    const answer = await asCaller(route, call, auth, { ...call.params, [key]: randomUUID() });
    return { ok: answer.status === 404 && codeOf(answer) !== 'not_found:lab', answer, expected: '404 for the resource' };
  }
  const text = route.textBody ? { type: 'application/x-matrix-probe', content: 'probe' } : { type: 'application/json', content: '{"unclosed": ' };
  const answer = await callRoute(route, { ...auth, ...(call.params ? { params: call.params } : {}), ...(call.query ? { query: call.query } : {}), text });
  return { ok: answer.status === 400 && codeOf(answer) === 'validation:request', answer, expected: '400 validation:request (past authorisation)' };
}

describe('the authorisation matrix', () => {
  let lab: TestLab;
  let other: TestLab;
  let book: RecipeBook;
  const tokens = {} as Record<Scope, string>;
  let otherLabToken = '';

  beforeAll(async () => {
    lab = await createLabWithEveryRole(getDb());
    other = await createLabWithEveryRole(getDb());
    book = await prepareRouteRecipes(lab);
    for (const scope of Object.keys(TOKEN_SCOPE_ROLES) as Scope[]) {
      const r = await callRoute(api.createApiTokenRoute, { params: { lab: lab.slug }, body: { name: `matrix ${scope}`, scope, expiresInDays: 1 }, cookie: lab.members.owner.cookie });
      tokens[scope] = (r.body as { token: string }).token;
    }
    const r = await callRoute(api.createApiTokenRoute, { params: { lab: other.slug }, body: { name: 'matrix other', scope: 'write', expiresInDays: 1 }, cookie: other.members.owner.cookie });
    otherLabToken = (r.body as { token: string }).token;
  });
  afterAll(async () => {
    await book?.close();
    await getDb().destroy();
  });

  it('has a recipe for every registered route and an entry for every registered server action', () => {
    const recipes = new Set(book.recipes.map((r) => r.id));
    const missing = registeredRoutes().filter((r) => !recipes.has(r.id)).map((r) => `${r.id} (${r.method} ${r.path})`);
    expect(missing, `routes without a recipe in tests/support/route-recipes.ts: ${missing.join(', ')}`).toEqual([]);
    const actions = registeredActions().map((a) => a.id).filter((id) => !(id in ACTION_CELLS));
    expect(actions, `server actions without an entry in ACTION_CELLS: ${actions.join(', ')}`).toEqual([]);
  });

  it('every cell answers as the policy table predicts', async () => {
    const routes = routesById();
    const failures: string[] = [];
    let cells = 0;
    const check = (route: AnyRouteSpec, who: string, ok: boolean, answer: Answer, expected: string) => {
      cells += 1;
      if (!ok) failures.push(`${route.id} as ${who}: expected ${expected}, got ${answer.status} ${JSON.stringify(answer.body)?.slice(0, 200)}`);
    };
    const refused = async (route: AnyRouteSpec, call: RecipeCall, who: string, auth: Auth, status: number, params = call.params) => {
      const answer = await asCaller(route, call, auth, params);
      check(route, who, answer.status === status && isProblem(answer), answer, `${status} problem+json`);
      return answer;
    };
    const allowed = async (route: AnyRouteSpec, call: RecipeCall, who: string, auth: Auth) => {
      const { ok, answer, expected } = await allowedProbe(route, call, auth);
      check(route, who, ok, answer, expected);
    };

    for (const recipe of book.recipes) {
      const route = routes.get(recipe.id);
      if (!route) throw new Error(`the recipe ${recipe.id} names no registered route`);
      await recipe.before?.();
      const call = recipe.call();
      const caller: RecipeCaller = call.as ?? 'owner';
      const access = route.access;
      // Anyone holding a study link but no account: the invite token, offered as a credential.
      const participant = { bearer: book.ids.inviteToken ?? newInvite().token };

      if (access.kind === 'lab') {
        const action: PolicyAction = call.action ?? access.action;
        await refused(route, call, 'anonymous', {}, 401);
        await refused(route, call, 'a participant', participant, 401);
        for (const role of ROLES) {
          if (role === caller) continue;
          if (can(role, action)) await allowed(route, call, role, authOf(book, role));
          else await refused(route, call, role, authOf(book, role), 403);
        }
        for (const scope of Object.keys(tokens) as Scope[]) {
          if (canWithToken('owner', scope, action)) await allowed(route, call, `a ${scope} token`, { bearer: tokens[scope] });
          else await refused(route, call, `a ${scope} token`, { bearer: tokens[scope] }, 403);
        }
        // Another lab's member and token learn nothing: the answer is the one for a lab that does not exist.
        const outsider = await refused(route, call, "another lab's owner", { cookie: other.members.owner.cookie }, 404);
        check(route, "another lab's owner", codeOf(outsider) === 'not_found:lab', outsider, 'not_found:lab');
        const nowhere = await refused(route, call, 'a member, for a lab that does not exist', { cookie: other.members.owner.cookie }, 404, { ...call.params, lab: `no-such-lab-${randomUUID().slice(0, 8)}` });
        const same = (nowhere.body as { detail?: string }).detail === (outsider.body as { detail?: string }).detail && codeOf(nowhere) === codeOf(outsider);
        check(route, "another lab's owner", same, outsider, 'the same answer as for a lab that does not exist');
        await refused(route, call, "another lab's token", { bearer: otherLabToken }, 404);
        // The recipe's own caller must be one the policy allows.
        const callerAllowed = caller === 'token' ? canWithToken('owner', 'write', action) : typeof caller === 'string' && caller !== 'anonymous' && can(caller, action);
        cells += 1;
        if (!callerAllowed) failures.push(`${route.id}: its recipe calls it as ${JSON.stringify(caller)}, whom the policy does not allow ${action}`);
      } else if (access.kind === 'user') {
        await refused(route, call, 'anonymous', {}, 401);
        await refused(route, call, 'a participant', participant, 401);
        for (const role of ROLES) await allowed(route, call, `a signed-in ${role}`, authOf(book, role));
        for (const scope of Object.keys(tokens) as Scope[]) await refused(route, call, `a ${scope} token (account routes take no tokens)`, { bearer: tokens[scope] }, 403);
      } else if (call.params?.code) {
        // A participant's session route: the session code is the credential, and a made-up one opens nothing.
        await refused(route, call, 'a participant with a made-up session code', {}, 404, { ...call.params, code: 'ZZZZZ-ZZZZZ-ZZZZZ-ZZZZZ' });
      } else if (call.params?.token) {
        // A participant route: another study's link opens nothing here.
        await refused(route, call, "a participant with another study's link", {}, 404, { ...call.params, token: newInvite().token });
      }

      const answer = await callRecipe(book, route, call);
      check(route, `its recipe's caller (${typeof caller === 'string' ? caller : 'a session'})`, answer.status === call.status, answer, String(call.status));
      try {
        await recipe.after?.(answer.body);
      } catch (error) {
        // A refused cell that was let through changes what later recipes find; stop, and report what was seen.
        failures.push(`${route.id}: its recipe's follow-up failed (${String(error)}), so the matrix stopped here`);
        break;
      }
    }

    console.info(`authorisation matrix: ${cells} cells checked over ${book.recipes.length} routes`);
    expect(failures, failures.join('\n')).toEqual([]);
    expect(cells).toBeGreaterThan(book.recipes.length * 5);
  }, 240_000);
});
