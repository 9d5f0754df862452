import { createHash } from 'node:crypto';
import { expect } from 'vitest';
import * as api from '@/lib/server/api';
import { getDb } from '@/lib/server/db';
import { packObjectKey } from '@/lib/server/jobs/run-pack-job';
import { listObjects, readObject } from '@/lib/server/storage';
import { DEFAULT_RENDER_OPTIONS } from '@/lib/schemas/render';
import { callRoute, createLabWithEveryRole, type TestLab } from './actors';
import { TEST_SEED, testSpaceSettings } from './editions';

export type FaultPack = { id: string; state: string; attempts: number; error: string | null; sha256: string | null; sizeBytes: number | null };

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
const sha = (b: Uint8Array) => createHash('sha256').update(b).digest('hex');

/**
 * The fault tests' lab: a Rings 3 × 8 edition (27 stimuli) and a display profile, with helpers to ask for a pack,
 * wait for a state (riding out a database that is away), and check what the object store holds.
 */
export async function makePackFaultLab() {
  const lab: TestLab = await createLabWithEveryRole(getDb());
  const as = (role: keyof TestLab['members']) => lab.members[role].cookie;
  const seed = await callRoute(api.createSeedShapeRoute, { params: { lab: lab.slug }, body: { name: 'Seed', descriptor: TEST_SEED }, cookie: as('designer') });
  const space = await callRoute(api.createShapeSpaceRoute, {
    params: { lab: lab.slug },
    body: { name: 'Fault space', seedShapeId: (seed.body as { id: string }).id, ...testSpaceSettings({ kind: 'rings', rings: 3, spokes: 8 }) },
    cookie: as('designer'),
  });
  const spaceId = (space.body as { id: string }).id;
  expect((await callRoute(api.freezeEditionRoute, { params: { lab: lab.slug, spaceId }, body: { changeNote: '' }, cookie: as('designer') })).status).toBe(201);
  const profile = await callRoute(api.createDisplayProfileRoute, {
    params: { lab: lab.slug },
    body: { name: 'Lab screen', resolutionPx: { width: 1920, height: 1080 }, widthCm: 53.1, pixelsPerCm: null, viewingDistanceCm: 57 },
    cookie: as('experimenter'),
  });
  const profileId = (profile.body as { id: string }).id;

  const ask = async (over: Record<string, unknown>): Promise<FaultPack> => {
    const r = await callRoute(api.createPackRoute, {
      params: { lab: lab.slug, spaceId, number: '1' },
      body: { displayProfileId: profileId, render: { ...DEFAULT_RENDER_OPTIONS, samples: 128, ...over } },
      cookie: as('experimenter'),
    });
    expect(r.status, JSON.stringify(r.body)).toBe(202);
    return r.body as FaultPack;
  };
  const get = async (id: string) => (await callRoute(api.getPackRoute, { params: { lab: lab.slug, packId: id }, cookie: as('reviewer') })).body as FaultPack;
  const until = async (id: string, done: (p: FaultPack) => boolean, ms = 60_000, everyMs = 200): Promise<FaultPack> => {
    const end = Date.now() + ms;
    for (;;) {
      const p = await get(id).catch(() => undefined);
      if (p && done(p)) return p;
      if (Date.now() > end) throw new Error(`pack ${id} stuck: ${JSON.stringify(p)}`);
      await sleep(everyMs);
    }
  };
  /** The lab's stored objects are exactly these packs' zips, each whole (its bytes hash to the recorded SHA-256). */
  const expectOnlyWholePacks = async (succeeded: FaultPack[]) => {
    const objects = await listObjects(`labs/${lab.id}/`);
    expect(objects.map((o) => o.key).sort()).toEqual(succeeded.map((p) => packObjectKey(lab.id, p.id)).sort());
    for (const p of succeeded) {
      const bytes = await readObject(packObjectKey(lab.id, p.id));
      expect(bytes.length).toBe(p.sizeBytes);
      expect(sha(bytes)).toBe(p.sha256);
    }
  };
  return { lab, ask, get, until, expectOnlyWholePacks };
}
