import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as api from '@/lib/server/api';
import { getDb } from '@/lib/server/db';
import { toHandler } from '@/lib/server/http';
import { ROLES } from '@/lib/server/policy';
import { callRoute, createLabWithEveryRole, type TestLab } from '../support/actors';

const fixture = (p: string) => readFileSync(new URL(`../fixtures/${p}`, import.meta.url), 'utf8');

const TREFOIL = { family: 'radial', baseRadius: 1, terms: [{ k: 3, amplitude: 0.15, phase: 0 }] };

async function upload(lab: TestLab, body: string, type: string, query = 'family=elliptic&harmonics=12', cookie = lab.members.designer.cookie) {
  const req = new Request(`http://127.0.0.1/api/v1/labs/${lab.slug}/seed-shapes/fit?${query}`, {
    method: 'POST',
    headers: { cookie, 'content-type': type },
    body,
  });
  const res = await toHandler(api.fitSeedShapeRoute)(req, { params: Promise.resolve({ lab: lab.slug }) });
  return { status: res.status, body: (await res.json()) as Record<string, unknown> };
}

describe('seed shapes API', () => {
  let lab: TestLab;
  beforeAll(async () => {
    lab = await createLabWithEveryRole(getDb());
  });
  afterAll(async () => {
    await getDb().destroy();
  });

  it('a Designer creates, reads, renames and deletes a seed shape; every change is audited', async () => {
    const created = await callRoute(api.createSeedShapeRoute, { params: { lab: lab.slug }, body: { name: 'Trefoil', descriptor: TREFOIL }, cookie: lab.members.designer.cookie });
    expect(created.status).toBe(201);
    const shape = created.body as { id: string; version: number; metrics: { area: number; isSimple: boolean }; harmonicCount: number };
    // Wilkinson, Wilson & Habak (1998) radial-frequency area, derived: π r0² (1 + ½ A²) for A = 0.15, ω = 3 → 3.1769...
    expect(shape.metrics.area).toBeCloseTo(Math.PI * (1 + 0.5 * 0.15 ** 2), 3);
    expect(shape.metrics.isSimple).toBe(true);
    expect(shape.harmonicCount).toBe(1);

    const renamed = await callRoute(api.updateSeedShapeRoute, {
      params: { lab: lab.slug, seedShapeId: shape.id },
      body: { name: 'Soft trefoil', version: shape.version },
      cookie: lab.members.owner.cookie,
    });
    expect(renamed.status).toBe(200);
    expect((renamed.body as { version: number }).version).toBe(shape.version + 1);

    // A stale version is a conflict, not a silent overwrite.
    const stale = await callRoute(api.updateSeedShapeRoute, {
      params: { lab: lab.slug, seedShapeId: shape.id },
      body: { name: 'Lost update', version: shape.version },
      cookie: lab.members.designer.cookie,
    });
    expect(stale.status).toBe(409);

    const list = await callRoute(api.listSeedShapesRoute, { params: { lab: lab.slug }, cookie: lab.members.reviewer.cookie });
    expect((list.body as { items: { name: string }[] }).items.map((s) => s.name)).toContain('Soft trefoil');

    const del = await callRoute(api.deleteSeedShapeRoute, { params: { lab: lab.slug, seedShapeId: shape.id }, cookie: lab.members.designer.cookie });
    expect(del.status).toBe(204);
    const gone = await callRoute(api.getSeedShapeRoute, { params: { lab: lab.slug, seedShapeId: shape.id }, cookie: lab.members.designer.cookie });
    expect(gone.status).toBe(404);

    const actions = (await getDb().selectFrom('audit_events').select('action').where('subject_id', '=', shape.id).execute()).map((e) => e.action);
    expect(actions.sort()).toEqual(['seed-shape.create', 'seed-shape.delete', 'seed-shape.update']);
  });

  it('only Designer and Owner write; everyone in the lab reads; other labs see nothing', async () => {
    for (const role of ROLES) {
      const r = await callRoute(api.createSeedShapeRoute, { params: { lab: lab.slug }, body: { name: `By ${role}`, descriptor: TREFOIL }, cookie: lab.members[role].cookie });
      expect(r.status).toBe(role === 'owner' || role === 'designer' ? 201 : 403);
      const read = await callRoute(api.listSeedShapesRoute, { params: { lab: lab.slug }, cookie: lab.members[role].cookie });
      expect(read.status).toBe(200);
    }
    const outsider = await createLabWithEveryRole(getDb());
    const r = await callRoute(api.listSeedShapesRoute, { params: { lab: lab.slug }, cookie: outsider.members.owner.cookie });
    expect(r.status).toBe(404);
  });

  it('refuses invalid descriptors with a message naming the harmonic, and saves nothing', async () => {
    const count = async () => (await getDb().selectFrom('seed_shapes').select('id').where('lab_id', '=', lab.id).execute()).length;
    const before = await count();
    const cases: [unknown, string, RegExp][] = [
      [{ ...TREFOIL, terms: [{ k: 3, amplitude: 1.4, phase: 0 }] }, 'descriptor.terms.0', /radius|r\(/i],
      [{ ...TREFOIL, terms: [{ k: 200, amplitude: 0.1, phase: 0 }] }, 'descriptor.terms.0.k', /at most 128/],
      [{ ...TREFOIL, terms: [{ k: 3, amplitude: 'NaN', phase: 0 }] }, 'descriptor.terms.0.amplitude', /number/],
      [{ ...TREFOIL, terms: [{ k: 3, amplitude: 0.1, phase: 0 }, { k: 3, amplitude: 0.1, phase: 1 }] }, 'descriptor.terms.1.k', /twice/],
      [{ family: 'complex', terms: [{ k: 1, re: 1, im: 0 }, { k: -3, re: 0.9, im: 0 }] }, 'descriptor', /intersect|cross/i],
    ];
    for (const [descriptor, field, message] of cases) {
      const r = await callRoute(api.createSeedShapeRoute, { params: { lab: lab.slug }, body: { name: `Bad ${field}`, descriptor }, cookie: lab.members.designer.cookie });
      expect(r.status, JSON.stringify(r.body)).toBe(400);
      const errors = (r.body as { errors: Record<string, string[]> }).errors;
      const key = Object.keys(errors).find((k) => k.startsWith(field));
      expect(key, `${field} in ${JSON.stringify(errors)}`).toBeDefined();
      expect(errors[key!]!.join(' ')).toMatch(message);
    }
    expect(await count()).toBe(before);
  });

  it('fits an uploaded SVG: picks the largest closed outline, says so, and reports the error', async () => {
    const r = await upload(lab, fixture('outlines/blob.svg'), 'image/svg+xml');
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    expect((r.body.notes as string[]).join(' ')).toMatch(/largest closed one, path #blob/);
    expect(r.body.meanError as number).toBeLessThan(0.01);
    expect((r.body.descriptor as { family: string }).family).toBe('elliptic');
    expect(String(r.body.fittedPath)).toMatch(/^M/);
    // Nothing uploaded is stored.
    expect(JSON.stringify(await getDb().selectFrom('seed_shapes').selectAll().where('lab_id', '=', lab.id).execute())).not.toContain('blob');
  });

  it('fits a CSV outline to radial harmonics', async () => {
    const r = await upload(lab, fixture('outlines/ellipse.csv'), 'text/csv', 'family=radial&harmonics=16');
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    expect((r.body.descriptor as { family: string }).family).toBe('radial');
    expect(r.body.maxError as number).toBeLessThan(0.02);
  });

  it('rejects hostile and broken uploads with a message naming what was found', async () => {
    const cases: [string, RegExp][] = [
      ['hostile/script.svg', /<script>/],
      ['hostile/entity.svg', /DOCTYPE.*entity/],
      ['hostile/event-attribute.svg', /event-handler/],
      ['hostile/foreign-object.svg', /foreignObject/],
      ['hostile/external-href.svg', /external reference/],
      ['hostile/malformed.svg', /not well-formed/],
      ['outlines/open-path.svg', /not closed|closed/i],
    ];
    for (const [file, message] of cases) {
      const r = await upload(lab, fixture(file), 'image/svg+xml');
      expect(r.status, file).toBe(400);
      expect(String(r.body.detail), file).toMatch(message);
    }
  });

  it('refuses a file over 1 MiB with 413, a fit that crosses itself, and a Reviewer', async () => {
    const big = `<svg xmlns="http://www.w3.org/2000/svg"><!--${'x'.repeat(1024 * 1024)}--></svg>`;
    expect((await upload(lab, big, 'image/svg+xml')).status).toBe(413);
    expect((await upload(lab, fixture('outlines/blob.svg'), 'image/svg+xml', 'family=elliptic&harmonics=12', lab.members.reviewer.cookie)).status).toBe(403);
    const spiky = `<svg xmlns="http://www.w3.org/2000/svg"><path d="M0 0 L100 0 L100 100 L60 100 L60 20 L40 20 L40 100 L0 100 Z"/></svg>`;
    const r = await upload(lab, spiky, 'image/svg+xml', 'family=radial&harmonics=8');
    expect(r.status).toBe(400);
    expect(String(r.body.detail)).toMatch(/star-shaped|crosses itself/);
  });
});
