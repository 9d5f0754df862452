import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as api from '@/lib/server/api';
import { getDb } from '@/lib/server/db';
import { hashApiToken } from '@/lib/server/auth/api-token-auth';
import { callRoute, createLabWithEveryRole, type TestLab } from '../support/actors';

type Created = { id: string; token: string; prefix: string; scope: string; state: string };
const SEED = { family: 'radial', baseRadius: 1, terms: [{ k: 3, amplitude: 0.1, phase: 0.2 }] };

describe('lab API tokens', () => {
  let lab: TestLab;
  let other: TestLab;
  const make = async (t: TestLab, scope: 'read' | 'write', name = `t-${Math.random().toString(36).slice(2, 8)}`) => {
    const r = await callRoute(api.createApiTokenRoute, { params: { lab: t.slug }, body: { name, scope, expiresInDays: 30 }, cookie: t.members.owner.cookie });
    expect(r.status, JSON.stringify(r.body)).toBe(201);
    return r.body as Created;
  };
  const listSeeds = (t: TestLab, bearer: string, query?: Record<string, string>) => callRoute(api.listSeedShapesRoute, { params: { lab: t.slug }, bearer, ...(query ? { query } : {}) });
  const createSeed = (t: TestLab, bearer: string) => callRoute(api.createSeedShapeRoute, { params: { lab: t.slug }, body: { name: `s-${Math.random()}`, descriptor: SEED }, bearer });

  beforeAll(async () => {
    lab = await createLabWithEveryRole(getDb());
    other = await createLabWithEveryRole(getDb());
  });
  afterAll(async () => {
    await getDb().destroy();
  });

  it('only an Owner makes tokens; the secret is shown once and stored only as its SHA-256', async () => {
    for (const role of ['designer', 'experimenter', 'reviewer'] as const) {
      const r = await callRoute(api.createApiTokenRoute, { params: { lab: lab.slug }, body: { name: 'x', scope: 'read', expiresInDays: 5 }, cookie: lab.members[role].cookie });
      expect(r.status, role).toBe(403);
    }
    const t = await make(lab, 'read', 'analysis laptop');
    expect(t.token).toMatch(/^epk_[A-Za-z0-9_-]{43}$/);
    expect(t.token.startsWith(t.prefix)).toBe(true);
    const row = await getDb().selectFrom('lab_api_tokens').selectAll().where('id', '=', t.id).executeTakeFirstOrThrow();
    expect(row.token_hash).toBe(hashApiToken(t.token));
    expect(JSON.stringify(row)).not.toContain(t.token);
    const list = await callRoute(api.listApiTokensRoute, { params: { lab: lab.slug }, cookie: lab.members.owner.cookie });
    expect(JSON.stringify(list.body)).toContain('analysis laptop');
    expect(JSON.stringify(list.body)).not.toContain(t.token);
    const bad = await callRoute(api.createApiTokenRoute, { params: { lab: lab.slug }, body: { name: '', scope: 'admin', expiresInDays: 0 }, cookie: lab.members.owner.cookie });
    expect(bad.status).toBe(400);
    expect(Object.keys((bad.body as { errors: Record<string, string[]> }).errors).sort()).toEqual(['expiresInDays', 'name', 'scope']);
  });

  it('a read token reads as a Reviewer, may not write (403), and its use is recorded', async () => {
    const t = await make(lab, 'read');
    const r = await listSeeds(lab, t.token);
    expect(r.status).toBe(200);
    expect((await createSeed(lab, t.token)).status).toBe(403);
    const row = await getDb().selectFrom('lab_api_tokens').select('last_used_at').where('id', '=', t.id).executeTakeFirstOrThrow();
    expect(row.last_used_at).not.toBeNull();
    // A token manages no tokens and reaches no account routes.
    expect((await callRoute(api.listApiTokensRoute, { params: { lab: lab.slug }, bearer: t.token })).status).toBe(403);
    expect((await callRoute(api.listLabs, { bearer: t.token })).status).toBe(403);
  });

  it('a write token acts as an Experimenter: it makes what Experimenters make, not what only Designers make', async () => {
    const t = await make(lab, 'write');
    const profile = await callRoute(api.createDisplayProfileRoute, {
      params: { lab: lab.slug },
      body: { name: `Screen ${t.id}`, resolutionPx: { width: 1920, height: 1080 }, widthCm: 53, pixelsPerCm: null, viewingDistanceCm: 57 },
      bearer: t.token,
    });
    expect(profile.status).toBe(201);
    expect((await createSeed(lab, t.token)).status).toBe(403);
  });

  it('never more than the Owner who made it: when the maker is no longer an Owner, the token shrinks with them', async () => {
    const fresh = await createLabWithEveryRole(getDb());
    const t = await make(fresh, 'write');
    expect((await callRoute(api.createDisplayProfileRoute, { params: { lab: fresh.slug }, body: { name: 'A', resolutionPx: { width: 800, height: 600 }, widthCm: 30, pixelsPerCm: null, viewingDistanceCm: 60 }, bearer: t.token })).status).toBe(201);
    await getDb().updateTable('memberships').set({ role: 'reviewer' }).where('lab_id', '=', fresh.id).where('user_id', '=', fresh.members.owner.id).execute();
    expect((await callRoute(api.createDisplayProfileRoute, { params: { lab: fresh.slug }, body: { name: 'B', resolutionPx: { width: 800, height: 600 }, widthCm: 30, pixelsPerCm: null, viewingDistanceCm: 60 }, bearer: t.token })).status).toBe(403);
    expect((await listSeeds(fresh, t.token)).status).toBe(200);
    await getDb().deleteFrom('memberships').where('lab_id', '=', fresh.id).where('user_id', '=', fresh.members.owner.id).execute();
    expect((await listSeeds(fresh, t.token)).status).toBe(401);
  });

  it('missing, malformed, unknown, expired and revoked tokens are 401, each saying why', async () => {
    const t = await make(lab, 'read');
    expect((await callRoute(api.listSeedShapesRoute, { params: { lab: lab.slug } })).status).toBe(401);
    const malformed = await listSeeds(lab, 'not-a-token');
    expect(malformed.status).toBe(401);
    expect(malformed.headers.get('www-authenticate')).toMatch(/^Bearer/);
    const unknown = await listSeeds(lab, `epk_${'A'.repeat(43)}`);
    expect(unknown.status).toBe(401);
    expect((unknown.body as { detail: string }).detail).toMatch(/not known/);

    const expiring = await make(lab, 'read');
    await getDb().updateTable('lab_api_tokens').set({ expires_at: new Date(Date.now() - 1000), created_at: new Date(Date.now() - 5000) }).where('id', '=', expiring.id).execute();
    const expired = await listSeeds(lab, expiring.token);
    expect(expired.status).toBe(401);
    expect((expired.body as { detail: string }).detail).toMatch(/expired/);

    expect((await listSeeds(lab, t.token)).status).toBe(200);
    const revoked = await callRoute(api.revokeApiTokenRoute, { params: { lab: lab.slug, tokenId: t.id }, cookie: lab.members.owner.cookie });
    expect(revoked.status).toBe(200);
    expect((revoked.body as { state: string }).state).toBe('revoked');
    const after = await listSeeds(lab, t.token);
    expect(after.status).toBe(401);
    expect((after.body as { detail: string }).detail).toMatch(/revoked/);
    expect((await callRoute(api.revokeApiTokenRoute, { params: { lab: lab.slug, tokenId: t.id }, cookie: lab.members.owner.cookie })).status).toBe(404);
  });

  it("another lab's token gets 404, never a hint that the resource exists", async () => {
    const foreign = await make(other, 'write');
    const seed = await callRoute(api.createSeedShapeRoute, { params: { lab: lab.slug }, body: { name: 'Private seed', descriptor: SEED }, cookie: lab.members.designer.cookie });
    const seedId = (seed.body as { id: string }).id;
    const r = await callRoute(api.getSeedShapeRoute, { params: { lab: lab.slug, seedShapeId: seedId }, bearer: foreign.token });
    expect(r.status).toBe(404);
    expect((await listSeeds(lab, foreign.token)).status).toBe(404);
    expect((await callRoute(api.listSeedShapesRoute, { params: { lab: 'no-such-lab' }, bearer: foreign.token })).status).toBe(404);
  });

  it('a malformed cursor is 400 on every list', async () => {
    const t = await make(lab, 'read');
    const lists = [api.listSeedShapesRoute, api.listShapeSpacesRoute, api.listLabEditionsRoute, api.listPacksRoute, api.listDisplayProfilesRoute, api.listAuditEventsRoute, api.listLabMembers];
    for (const route of lists) {
      const r = await callRoute(route, { params: { lab: lab.slug }, bearer: t.token, query: { cursor: 'bm90LWEtY3Vyc29y' } });
      expect(r.status, route.id).toBe(400);
      expect((r.body as { errors: Record<string, string[]> }).errors.cursor, route.id).toBeDefined();
    }
  });

  it('a token over its minute gets 429 with Retry-After', async () => {
    const t = await make(lab, 'read');
    const limit = Number(process.env.API_TOKEN_REQUESTS_PER_MINUTE ?? 600);
    let last = 200;
    let retryAfter: string | null = null;
    for (let i = 0; i <= limit && last !== 429; i++) {
      const r = await listSeeds(lab, t.token, { limit: '1' });
      last = r.status;
      retryAfter = r.headers.get('retry-after');
    }
    expect(last).toBe(429);
    expect(Number(retryAfter)).toBeGreaterThan(0);
  }, 120_000);
});
