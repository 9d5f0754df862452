// Web checks on the route wrapper: a change made with the session cookie must come from this site (Origin), while
// bearer tokens and non-browser clients (no Origin) are not asked; a refused change leaves nothing behind.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as api from '@/lib/server/api';
import { getDb } from '@/lib/server/db';
import { callRoute, createLabWithEveryRole, type TestLab } from '../support/actors';
import { TEST_SEED } from '../support/editions';
import { uniqueSuffix } from '../support/db';

describe('a foreign Origin', () => {
  let lab: TestLab;
  let token = '';
  const seeds = async () => Number((await getDb().selectFrom('seed_shapes').select(getDb().fn.countAll<string>().as('n')).where('lab_id', '=', lab.id).executeTakeFirstOrThrow()).n);
  const create = (headers: Record<string, string>, auth: { cookie?: string; bearer?: string } = { cookie: lab.members.designer.cookie }) =>
    callRoute(api.createSeedShapeRoute, { params: { lab: lab.slug }, body: { name: `Seed ${uniqueSuffix()}`, descriptor: TEST_SEED }, ...auth, headers: { host: '127.0.0.1', ...headers } });

  beforeAll(async () => {
    lab = await createLabWithEveryRole(getDb());
    const r = await callRoute(api.createApiTokenRoute, { params: { lab: lab.slug }, body: { name: 'origin', scope: 'write', expiresInDays: 1 }, cookie: lab.members.owner.cookie });
    token = (r.body as { token: string }).token;
  });
  afterAll(async () => {
    await getDb().destroy();
  });

  it('is refused for a change made with the session cookie, and nothing is stored', async () => {
    const before = await seeds();
    for (const origin of ['https://evil.example', 'http://127.0.0.1.evil.example', 'null']) {
      const r = await create({ origin });
      expect(r.status, origin).toBe(403);
      expect(r.headers.get('content-type')).toContain('application/problem+json');
      expect((r.body as { code: string }).code).toBe('forbidden:origin');
    }
    const del = await callRoute(api.signOutEverywhereRoute, { cookie: lab.members.reviewer.cookie, headers: { host: '127.0.0.1', origin: 'https://evil.example' } });
    expect(del.status).toBe(403);
    expect((await callRoute(api.listLabs, { cookie: lab.members.reviewer.cookie })).status, 'the refused sign-out changed nothing').toBe(200);
    expect(await seeds()).toBe(before);
  });

  it('is not asked of the same site, of a client that sends no Origin, of a bearer token, or of a read', async () => {
    expect((await create({ origin: 'http://127.0.0.1' })).status).toBe(201);
    expect((await create({})).status).toBe(201);
    const profile = { name: `Screen ${uniqueSuffix()}`, resolutionPx: { width: 1920, height: 1080 }, widthCm: 53.1, pixelsPerCm: null, viewingDistanceCm: 57 };
    const byToken = await callRoute(api.createDisplayProfileRoute, { params: { lab: lab.slug }, body: profile, bearer: token, headers: { origin: 'https://evil.example' } });
    expect(byToken.status).toBe(201);
    const read = await callRoute(api.listSeedShapesRoute, { params: { lab: lab.slug }, cookie: lab.members.reviewer.cookie, headers: { origin: 'https://evil.example' } });
    expect(read.status).toBe(200);
  });
});
