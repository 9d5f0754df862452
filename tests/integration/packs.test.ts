import { createHash } from 'node:crypto';
import type PgBoss from 'pg-boss';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as api from '@/lib/server/api';
import { getDb } from '@/lib/server/db';
import { signDownload } from '@/lib/server/download-token';
import { PACK_QUEUE, startBoss } from '@/lib/server/jobs/boss';
import { startPackWorker } from '@/lib/server/jobs/pack-worker';
import { packObjectKey } from '@/lib/server/jobs/run-pack-job';
import { objectSize, readObject } from '@/lib/server/storage';
import { resolvePackDownload } from '@/lib/server/services/packs';
import { renderPng } from '@/lib/render/render-png';
import { DEFAULT_RENDER_OPTIONS } from '@/lib/schemas/render';
import { callRoute, createLabWithEveryRole, type TestLab } from '../support/actors';
import { TEST_SEED, testSpaceSettings } from '../support/editions';

// A dead worker's job must come back quickly here: the queue retries it after this many seconds.
process.env.PACK_JOB_EXPIRE_SECONDS = '3';

type Pack = { id: string; state: string; progress: number; sha256: string | null; sizeBytes: number | null; attempts: number; error: string | null; stimulusCount: number | null };

const sha = (b: Uint8Array) => createHash('sha256').update(b).digest('hex');
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

describe('pack jobs, storage and downloads', () => {
  let lab: TestLab;
  let spaceId: string;
  let profileId: string;
  let boss: PgBoss;
  let stopWorker: (() => Promise<void>) | null = null;
  const as = (role: keyof TestLab['members']) => lab.members[role].cookie;
  const render = (over: Record<string, unknown> = {}) => ({ ...DEFAULT_RENDER_OPTIONS, sizeDeg: 2, canvasDeg: 3, samples: 128, ...over });
  const ask = (r: Record<string, unknown>, role: keyof TestLab['members'] = 'experimenter') =>
    callRoute(api.createPackRoute, { params: { lab: lab.slug, spaceId, number: '1' }, body: { displayProfileId: profileId, render: r }, cookie: as(role) });
  const get = async (id: string) => (await callRoute(api.getPackRoute, { params: { lab: lab.slug, packId: id }, cookie: as('reviewer') })).body as Pack;
  async function until(id: string, done: (p: Pack) => boolean, ms = 45_000): Promise<Pack> {
    const end = Date.now() + ms;
    for (;;) {
      const p = await get(id);
      if (done(p)) return p;
      if (Date.now() > end) throw new Error(`pack ${id} stuck: ${JSON.stringify(p)}`);
      await sleep(200);
    }
  }
  /** `delayMs` slows every PNG, so a build is still running when a test cancels it. */
  const startWorker = async (delayMs = 0) => {
    const render = async (req: Parameters<typeof renderPng>[0]) => {
      if (delayMs) await sleep(delayMs);
      return renderPng(req);
    };
    stopWorker = await startPackWorker({ db: getDb(), boss, pool: { render }, pollingIntervalSeconds: 0.5 });
  };
  const halt = async () => {
    await stopWorker?.();
    stopWorker = null;
  };

  beforeAll(async () => {
    lab = await createLabWithEveryRole(getDb());
    const seed = await callRoute(api.createSeedShapeRoute, { params: { lab: lab.slug }, body: { name: 'Seed', descriptor: TEST_SEED }, cookie: as('designer') });
    const space = await callRoute(api.createShapeSpaceRoute, {
      params: { lab: lab.slug },
      body: { name: 'Pack space', seedShapeId: (seed.body as { id: string }).id, ...testSpaceSettings({ kind: 'rings', rings: 2, spokes: 6 }) },
      cookie: as('designer'),
    });
    spaceId = (space.body as { id: string }).id;
    await callRoute(api.putSpaceBoundariesRoute, { params: { lab: lab.slug, spaceId }, body: { boundaries: [{ key: 'split', angleDeg: 30 }], version: 1 }, cookie: as('designer') });
    expect((await callRoute(api.freezeEditionRoute, { params: { lab: lab.slug, spaceId }, body: { changeNote: '' }, cookie: as('designer') })).status).toBe(201);
    const profile = await callRoute(api.createDisplayProfileRoute, {
      params: { lab: lab.slug },
      body: { name: 'Lab screen', resolutionPx: { width: 1920, height: 1080 }, widthCm: 53.1, pixelsPerCm: null, viewingDistanceCm: 57 },
      cookie: as('experimenter'),
    });
    profileId = (profile.body as { id: string }).id;
    boss = await startBoss({ supervise: true, maintenanceIntervalSeconds: 1 });
  });
  afterAll(async () => {
    await halt();
    await boss.stop({ graceful: false, wait: true });
    await getDb().destroy();
  });

  it('a job runs end to end: the stored object is the built zip, byte for byte; identical requests give one pack', async () => {
    expect((await ask(render(), 'reviewer')).status).toBe(403);
    const r = await ask(render());
    expect(r.status, JSON.stringify(r.body)).toBe(202);
    const queued = r.body as Pack;
    expect(queued.state).toBe('queued');
    const again = await ask(render());
    expect((again.body as Pack).id).toBe(queued.id);

    await startWorker();
    const done = await until(queued.id, (p) => p.state === 'succeeded' || p.state === 'failed');
    expect(done.state, done.error ?? '').toBe('succeeded');
    expect(done.progress).toBe(1);
    expect(done.stimulusCount).toBe(2 * 6 + 1 + 2);
    const stored = await readObject(packObjectKey(lab.id, queued.id));
    expect(stored.length).toBe(done.sizeBytes);
    expect(sha(stored)).toBe(done.sha256);

    // The manifest is kept in PostgreSQL and served as JSON; it names the edition.
    const manifest = await callRoute(api.getPackManifestRoute, { params: { lab: lab.slug, packId: queued.id }, cookie: as('reviewer') });
    expect(manifest.status).toBe(200);
    expect(JSON.stringify(manifest.body)).toContain('p-split-a');
    const rows = await getDb()
      .selectFrom('packs')
      .select('id')
      .where('lab_id', '=', lab.id)
      .where((eb) => eb(eb.ref('manifest'), '@>', JSON.stringify({ stimuli: [{ id: 'r02-s03' }] }) as never))
      .execute();
    expect(rows.map((x) => x.id)).toContain(queued.id);

    // The download link redirects to a presigned URL that serves the same bytes.
    const link = await callRoute(api.packDownloadLinkRoute, { params: { lab: lab.slug, packId: queued.id }, cookie: as('reviewer') });
    expect(link.status).toBe(200);
    const token = (link.body as { url: string }).url.split('/packs/download/')[1]!;
    const resolved = await resolvePackDownload(getDb(), token);
    expect(resolved.ok).toBe(true);
    const fetched = new Uint8Array(await (await fetch((resolved as { url: string }).url)).arrayBuffer());
    expect(sha(fetched)).toBe(done.sha256);
  });

  it('an expired or altered download link is refused with 403 and says why', async () => {
    const p = ((await callRoute(api.listPacksRoute, { params: { lab: lab.slug }, cookie: as('owner') })).body as { items: Pack[] }).items[0]!;
    const expired = await resolvePackDownload(getDb(), signDownload({ packId: p.id, labId: lab.id, expiresAt: Date.now() - 1000 }));
    expect(expired).toMatchObject({ ok: false, status: 403, title: 'This download link has expired' });
    const altered = signDownload({ packId: p.id, labId: lab.id, expiresAt: Date.now() + 60_000 }).slice(0, -2) + 'xx';
    expect(await resolvePackDownload(getDb(), altered)).toMatchObject({ ok: false, status: 403 });
  });

  it('cancel: a waiting pack at once; a running one between stimuli, leaving no object', async () => {
    await halt();
    const waiting = (await ask(render({ sizeDeg: 2.5 }))).body as Pack;
    const c1 = await callRoute(api.cancelPackRoute, { params: { lab: lab.slug, packId: waiting.id }, cookie: as('experimenter') });
    expect((c1.body as Pack).state).toBe('cancelled');

    const big = (await ask(render({ sizeDeg: 3, canvasDeg: 4 }))).body as Pack;
    await startWorker(3000);
    await until(big.id, (p) => p.state === 'running');
    const c2 = await callRoute(api.cancelPackRoute, { params: { lab: lab.slug, packId: big.id }, cookie: as('experimenter') });
    expect(c2.status).toBe(200);
    const ended = await until(big.id, (p) => p.state !== 'running');
    expect(ended.state).toBe('cancelled');
    expect(await objectSize(packObjectKey(lab.id, big.id))).toBeNull();
    // A cancelled pack can be retried.
    await halt();
    await startWorker();
    expect((await callRoute(api.retryPackRoute, { params: { lab: lab.slug, packId: waiting.id }, cookie: as('owner') })).status).toBe(200);
    expect((await until(waiting.id, (p) => p.state === 'succeeded' || p.state === 'failed')).state).toBe('succeeded');
  });

  it("a crashed worker's job expires, is retried by another worker, and finishes", async () => {
    await halt();
    const p = (await ask(render({ sizeDeg: 1.5 }))).body as Pack;
    // A worker takes the job and dies without a word.
    const taken = await boss.fetch(PACK_QUEUE);
    expect(taken.map((j) => (j.data as { packId: string }).packId)).toContain(p.id);
    await getDb().updateTable('packs').set({ state: 'running', stage: 'drawing and measuring', progress: 0.3, attempts: 1 }).where('id', '=', p.id).execute();
    await sleep(3500);
    await boss.expire();
    await startWorker();
    const done = await until(p.id, (x) => x.state === 'succeeded' || x.state === 'failed');
    expect(done.state, done.error ?? '').toBe('succeeded');
  });

  it('bad render options are refused with the reason, and nothing is queued', async () => {
    const tooSmall = await ask(render({ sizeDeg: 0.05, canvasDeg: 0.1 }));
    expect(tooSmall.status).toBe(400);
    expect((tooSmall.body as { detail: string }).detail).toMatch(/px/);
    const other = await createLabWithEveryRole(getDb());
    const foreign = await callRoute(api.getPackRoute, { params: { lab: other.slug, packId: ((await callRoute(api.listPacksRoute, { params: { lab: lab.slug }, cookie: as('owner') })).body as { items: Pack[] }).items[0]!.id }, cookie: other.members.owner.cookie });
    expect(foreign.status).toBe(404);
  });
});
