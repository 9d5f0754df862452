import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as api from '@/lib/server/api';
import { getDb } from '@/lib/server/db';
import { callRoute, createLabWithEveryRole, type TestLab } from '../support/actors';

type Profile = { id: string; version: number; name: string; widthCm: number | null; pixelsPerCm: number | null; derived: { pixelsPerCm: number; pixelsPerDegree: number } };

describe('display profiles API', () => {
  let lab: TestLab;
  beforeAll(async () => {
    lab = await createLabWithEveryRole(getDb());
  });
  afterAll(async () => {
    await getDb().destroy();
  });
  const body = (over: Record<string, unknown> = {}) => ({ name: 'Booth monitor', resolutionPx: { width: 1920, height: 1080 }, widthCm: 53.1, pixelsPerCm: null, viewingDistanceCm: 57, ...over });
  const create = (b: unknown, role: keyof TestLab['members'] = 'experimenter') => callRoute(api.createDisplayProfileRoute, { params: { lab: lab.slug }, body: b, cookie: lab.members[role].cookie });

  it('derives pixels per degree from θ = 2·atan(S/2D): 1° at D spans 2·D·tan(0.5°) cm', async () => {
    const r = await create(body());
    expect(r.status, JSON.stringify(r.body)).toBe(201);
    const p = r.body as Profile;
    const pxPerCm = 1920 / 53.1;
    expect(p.derived.pixelsPerCm).toBeCloseTo(pxPerCm, 10);
    expect(p.derived.pixelsPerDegree).toBeCloseTo(2 * 57 * Math.tan((0.5 * Math.PI) / 180) * pxPerCm, 10);
  });

  it('Designers, Experimenters and Owners edit; Reviewers read only', async () => {
    expect((await create(body({ name: 'Reviewer screen' }), 'reviewer')).status).toBe(403);
    const list = await callRoute(api.listDisplayProfilesRoute, { params: { lab: lab.slug }, cookie: lab.members.reviewer.cookie });
    expect(list.status).toBe(200);
    expect((list.body as { items: Profile[] }).items.map((p) => p.name)).toContain('Booth monitor');
  });

  it('refuses a viewing distance ≤ 0, both pitches or none, and a duplicate name, saving nothing', async () => {
    for (const bad of [body({ name: 'A', viewingDistanceCm: 0 }), body({ name: 'B', viewingDistanceCm: -10 }), body({ name: 'C', pixelsPerCm: 40 }), body({ name: 'D', widthCm: null })]) {
      const r = await create(bad);
      expect(r.status, JSON.stringify(bad)).toBe(400);
      expect((r.body as { detail: string }).detail.length).toBeGreaterThan(10);
    }
    const dup = await create(body({ name: 'booth MONITOR' }));
    expect(dup.status).toBe(409);
    const list = await callRoute(api.listDisplayProfilesRoute, { params: { lab: lab.slug }, cookie: lab.members.owner.cookie });
    expect((list.body as { items: Profile[] }).items).toHaveLength(1);
  });

  it('switching the pitch to px/cm clears the width; stale versions conflict; delete works', async () => {
    const p = ((await callRoute(api.listDisplayProfilesRoute, { params: { lab: lab.slug }, cookie: lab.members.owner.cookie })).body as { items: Profile[] }).items[0]!;
    const patched = await callRoute(api.updateDisplayProfileRoute, { params: { lab: lab.slug, profileId: p.id }, body: { pixelsPerCm: 40, version: p.version }, cookie: lab.members.designer.cookie });
    expect(patched.status, JSON.stringify(patched.body)).toBe(200);
    expect(patched.body).toMatchObject({ widthCm: null, pixelsPerCm: 40, version: p.version + 1 });
    const stale = await callRoute(api.updateDisplayProfileRoute, { params: { lab: lab.slug, profileId: p.id }, body: { viewingDistanceCm: 60, version: p.version }, cookie: lab.members.designer.cookie });
    expect(stale.status).toBe(409);
    const other = await createLabWithEveryRole(getDb());
    expect((await callRoute(api.getDisplayProfileRoute, { params: { lab: other.slug, profileId: p.id }, cookie: other.members.owner.cookie })).status).toBe(404);
    expect((await callRoute(api.deleteDisplayProfileRoute, { params: { lab: lab.slug, profileId: p.id }, cookie: lab.members.experimenter.cookie })).status).toBe(204);
  });
});
