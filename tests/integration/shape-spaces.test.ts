import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as api from '@/lib/server/api';
import { getDb } from '@/lib/server/db';
import { ROLES } from '@/lib/server/policy';
import { callRoute, createLabWithEveryRole, type TestLab } from '../support/actors';

const SEED = {
  family: 'radial',
  baseRadius: 1,
  terms: [
    { k: 2, amplitude: 0.1, phase: 0.3 },
    { k: 3, amplitude: 0.12, phase: 1.1 },
  ],
};

const settings = (over: Record<string, unknown> = {}) => ({
  axes: [
    { label: 'Lobe 2', changes: [{ harmonic: 2, field: 'amplitude', delta: 0.08 }] },
    { label: 'Lobe 4', changes: [{ harmonic: 4, field: 'amplitude', delta: 0.08 }] },
  ],
  extent: 1,
  layout: { kind: 'rings', rings: 5, spokes: 16 },
  normalization: { scale: 'equal-area-radius', centroid: true },
  equalize: false,
  ...over,
});

describe('shape spaces API', () => {
  let lab: TestLab;
  let seedId: string;
  beforeAll(async () => {
    lab = await createLabWithEveryRole(getDb());
    const seed = await callRoute(api.createSeedShapeRoute, { params: { lab: lab.slug }, body: { name: 'Seed', descriptor: SEED }, cookie: lab.members.designer.cookie });
    seedId = (seed.body as { id: string }).id;
  });
  afterAll(async () => {
    await getDb().destroy();
  });

  const create = (body: Record<string, unknown>, role: keyof TestLab['members'] = 'designer') =>
    callRoute(api.createShapeSpaceRoute, { params: { lab: lab.slug }, body: { name: `Space ${randomUUID().slice(0, 8)}`, seedShapeId: seedId, ...body }, cookie: lab.members[role].cookie });

  it('a Designer builds a Rings 5 × 16 space: 81 stimuli with stable layout ids', async () => {
    const r = await create(settings());
    expect(r.status, JSON.stringify(r.body)).toBe(201);
    const space = r.body as { id: string; stimulusCount: number; version: number };
    expect(space.stimulusCount).toBe(81);
    // The list pages by cursor: 50 by default, then the rest.
    const allIds = async (cookie: string) => {
      const seen: string[] = [];
      let cursor: string | null = null;
      do {
        const page = await callRoute(api.listSpaceStimuliRoute, { params: { lab: lab.slug, spaceId: space.id }, cookie, ...(cursor ? { query: { cursor } } : {}) });
        const body = page.body as { items: { id: string }[]; nextCursor: string | null };
        seen.push(...body.items.map((s) => s.id));
        cursor = body.nextCursor;
      } while (cursor);
      return seen;
    };
    const first = await callRoute(api.listSpaceStimuliRoute, { params: { lab: lab.slug, spaceId: space.id }, cookie: lab.members.reviewer.cookie });
    expect((first.body as { items: unknown[] }).items).toHaveLength(50);
    const ids = await allIds(lab.members.reviewer.cookie);
    expect(ids).toHaveLength(81);
    expect(new Set(ids).size).toBe(81);

    // Changing ρmax keeps every id: ids are layout positions.
    const patched = await callRoute(api.updateShapeSpaceRoute, { params: { lab: lab.slug, spaceId: space.id }, body: { extent: 0.8, version: space.version }, cookie: lab.members.owner.cookie });
    expect(patched.status, JSON.stringify(patched.body)).toBe(200);
    expect(await allIds(lab.members.designer.cookie)).toEqual(ids);
  });

  it('only Designer and Owner write; everyone reads', async () => {
    for (const role of ROLES) {
      const r = await create(settings(), role);
      expect(r.status, role).toBe(role === 'owner' || role === 'designer' ? 201 : 403);
      expect((await callRoute(api.listShapeSpacesRoute, { params: { lab: lab.slug }, cookie: lab.members[role].cookie })).status).toBe(200);
    }
  });

  it('refuses bad definitions with a clear message, and saves nothing', async () => {
    const before = (await getDb().selectFrom('shape_spaces').select('id').where('lab_id', '=', lab.id).execute()).length;
    const tooFar = await create(settings({ extent: 12 }));
    expect(tooFar.status).toBe(400);
    expect((tooFar.body as { detail: string }).detail).toMatch(/stimuli would be invalid at ρmax = 12: r\d/);

    const same = settings();
    const identical = await create({ ...same, axes: [same.axes[0], { ...same.axes[0], label: 'Copy' }] });
    expect(identical.status).toBe(400);
    expect((identical.body as { detail: string }).detail).toMatch(/identical|same/i);

    const zero = await create(settings({ axes: [{ label: 'Z', changes: [{ harmonic: 2, field: 'amplitude', delta: 0 }] }, same.axes[1]] }));
    expect(zero.status).toBe(400);
    expect((zero.body as { detail: string }).detail).toMatch(/changes nothing/i);

    const huge = await create(settings({ layout: { kind: 'rings', rings: 50, spokes: 128 } }));
    expect(huge.status).toBe(400);
    expect((huge.body as { detail: string }).detail).toMatch(/2,?000/);

    const ghost = await create({ ...settings(), seedShapeId: randomUUID() });
    expect(ghost.status).toBe(400);
    expect((ghost.body as { errors: Record<string, string[]> }).errors.seedShapeId).toBeDefined();

    const after = (await getDb().selectFrom('shape_spaces').select('id').where('lab_id', '=', lab.id).execute()).length;
    expect(after).toBe(before);
  });

  it('a seed shape cannot be deleted while a space uses it', async () => {
    const seed = await callRoute(api.createSeedShapeRoute, { params: { lab: lab.slug }, body: { name: 'Used seed', descriptor: SEED }, cookie: lab.members.designer.cookie });
    const id = (seed.body as { id: string }).id;
    const space = await callRoute(api.createShapeSpaceRoute, { params: { lab: lab.slug }, body: { name: 'On used seed', seedShapeId: id, ...settings() }, cookie: lab.members.designer.cookie });
    expect(space.status).toBe(201);
    const refused = await callRoute(api.deleteSeedShapeRoute, { params: { lab: lab.slug, seedShapeId: id }, cookie: lab.members.designer.cookie });
    expect(refused.status).toBe(409);
    expect((refused.body as { detail: string }).detail).toMatch(/shape space is built on/);
    const got = await callRoute(api.getSeedShapeRoute, { params: { lab: lab.slug, seedShapeId: id }, cookie: lab.members.designer.cookie });
    expect((got.body as { usedBySpaces: number }).usedBySpaces).toBe(1);

    const spaceId = (space.body as { id: string }).id;
    expect((await callRoute(api.deleteShapeSpaceRoute, { params: { lab: lab.slug, spaceId }, cookie: lab.members.designer.cookie })).status).toBe(204);
    expect((await callRoute(api.deleteSeedShapeRoute, { params: { lab: lab.slug, seedShapeId: id }, cookie: lab.members.designer.cookie })).status).toBe(204);
  });

  it('equalise is stored with the space and lowers the anisotropy index', async () => {
    // A deliberately anisotropic space: Axis B changes its harmonic three times faster than Axis A.
    const r = await create(
      settings({
        axes: [
          { label: 'Slow', changes: [{ harmonic: 2, field: 'amplitude', delta: 0.03 }] },
          { label: 'Fast', changes: [{ harmonic: 4, field: 'amplitude', delta: 0.09 }] },
        ],
        equalize: true,
      }),
    );
    expect(r.status, JSON.stringify(r.body)).toBe(201);
    const s = r.body as { equalization: unknown; anisotropy: { designed: number; equalized: number } };
    expect(s.equalization).not.toBeNull();
    expect(s.anisotropy.designed).toBeGreaterThan(1.5);
    expect(s.anisotropy.equalized).toBeLessThanOrEqual(1.05);
  });
});
