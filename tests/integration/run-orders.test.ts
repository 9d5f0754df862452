import type PgBoss from 'pg-boss';
import JSZip from 'jszip';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as api from '@/lib/server/api';
import { getDb } from '@/lib/server/db';
import { toHandler } from '@/lib/server/http';
import { startBoss } from '@/lib/server/jobs/boss';
import { startPackWorker } from '@/lib/server/jobs/pack-worker';
import { packObjectKey } from '@/lib/server/jobs/run-pack-job';
import { startRunOrderWorker } from '@/lib/server/jobs/run-order-worker';
import { runRunOrderJob } from '@/lib/server/services/run-orders';
import { readObject } from '@/lib/server/storage';
import { renderPng } from '@/lib/render/render-png';
import { checkPairBalance } from '@/lib/sequence/check-pair-balance';
import { checkType1Index1Sequence } from '@/lib/sequence/check-type1-index1-sequence';
import { DEFAULT_RUN_ORDER_DEFINITION, type RunOrderDefinition, type RunOrderValue } from '@/lib/schemas/run-order';
import { DEFAULT_RENDER_OPTIONS } from '@/lib/schemas/render';
import { callRoute, createLabWithEveryRole, type TestLab } from '../support/actors';
import { TEST_SEED, testSpaceSettings } from '../support/editions';

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
type Problem = { code: string; detail: string; errors?: Record<string, string[]> };

/** A definition: the six stimuli of ring 1, unless overridden. */
const def = (over: Partial<RunOrderDefinition> = {}): RunOrderDefinition => ({
  ...DEFAULT_RUN_ORDER_DEFINITION,
  conditions: { selection: 'rings', indices: [1], includeCentre: false, nullEvents: false },
  ...over,
});

/** Parses a TSV into rows of cells (header first); checks that every line ends in \n. */
function tsvRows(text: string): string[][] {
  expect(text.endsWith('\n')).toBe(true);
  return text.slice(0, -1).split('\n').map((line) => line.split('\t'));
}

describe('run orders: API, roles, validation, zip, background search, packs', () => {
  let lab: TestLab;
  let spaceId: string;
  let bigSpaceId: string;
  let boss: PgBoss;
  const as = (role: keyof TestLab['members']) => lab.members[role].cookie;
  const create = (definition: unknown, role: keyof TestLab['members'] = 'experimenter', space = () => spaceId, name = 'Scan day') =>
    callRoute(api.createRunOrderRoute, { params: { lab: lab.slug, spaceId: space(), number: '1' }, body: { name, definition }, cookie: as(role) });
  const get = async (id: string) => (await callRoute(api.getRunOrderRoute, { params: { lab: lab.slug, runOrderId: id }, cookie: as('reviewer') })).body as RunOrderValue;
  async function download(id: string, role: keyof TestLab['members'] = 'reviewer'): Promise<Response> {
    const req = new Request(`http://127.0.0.1/api/v1/labs/${lab.slug}/run-orders/${id}/download`, { headers: { cookie: as(role) } });
    return toHandler(api.downloadRunOrderRoute)(req, { params: Promise.resolve({ lab: lab.slug, runOrderId: id }) });
  }
  async function makeSpace(name: string, layout: unknown, boundary: boolean): Promise<string> {
    const seed = await callRoute(api.createSeedShapeRoute, { params: { lab: lab.slug }, body: { name: `Seed ${name}`, descriptor: TEST_SEED }, cookie: as('designer') });
    const space = await callRoute(api.createShapeSpaceRoute, {
      params: { lab: lab.slug },
      body: { name, seedShapeId: (seed.body as { id: string }).id, ...testSpaceSettings(layout) },
      cookie: as('designer'),
    });
    const id = (space.body as { id: string }).id;
    if (boundary) await callRoute(api.putSpaceBoundariesRoute, { params: { lab: lab.slug, spaceId: id }, body: { boundaries: [{ key: 'split', angleDeg: 30 }], version: 1 }, cookie: as('designer') });
    expect((await callRoute(api.freezeEditionRoute, { params: { lab: lab.slug, spaceId: id }, body: { changeNote: '' }, cookie: as('designer') })).status).toBe(201);
    return id;
  }

  beforeAll(async () => {
    lab = await createLabWithEveryRole(getDb());
    // 2 rings × 6 spokes + centre = 13 layout stimuli, plus the boundary's two prototypes.
    spaceId = await makeSpace('Run order space', { kind: 'rings', rings: 2, spokes: 6 }, true);
    // 3 rings × 10 spokes + centre = 31 stimuli: a type-1 index-1 search that a zero budget cannot finish.
    bigSpaceId = await makeSpace('Big space', { kind: 'rings', rings: 3, spokes: 10 }, false);
    boss = await startBoss({ supervise: true, maintenanceIntervalSeconds: 1 });
  });
  afterAll(async () => {
    await boss.stop({ graceful: false, wait: true });
    await getDb().destroy();
  });

  it('Experimenter and Owner create; Designer and Reviewer get 403 and nothing is stored; everyone reads', async () => {
    for (const role of ['designer', 'reviewer'] as const) expect((await create(def(), role)).status).toBe(403);
    const list0 = await callRoute(api.listRunOrdersRoute, { params: { lab: lab.slug, spaceId, number: '1' }, cookie: as('owner') });
    expect((list0.body as { items: unknown[] }).items).toHaveLength(0);
    const made = await create(def({ sequence: { kind: 'type1-index1' }, runs: 2 }));
    expect(made.status, JSON.stringify(made.body)).toBe(201);
    const order = made.body as RunOrderValue;
    expect(order.state).toBe('ready');
    // 6 conditions, type-1 index-1: 37 trials per run, every ordered pair once per run.
    expect(order.result!.conditions.map((c) => c.id)).toEqual(['r01-s00', 'r01-s01', 'r01-s02', 'r01-s03', 'r01-s04', 'r01-s05']);
    expect(order.result!.runs.map((r) => r.trials)).toEqual([37, 37]);
    expect(order.result!.summary.transitionCounts.flat().every((c) => c === 2)).toBe(true);
    expect(order.result!.summary.isTransitionFlat).toBe(true);
    expect((await create(def(), 'owner')).status).toBe(201);
    for (const role of ['owner', 'designer', 'experimenter', 'reviewer'] as const) {
      const r = await callRoute(api.getRunOrderRoute, { params: { lab: lab.slug, runOrderId: order.id }, cookie: as(role) });
      expect(r.status).toBe(200);
    }
    const other = await createLabWithEveryRole(getDb());
    expect((await callRoute(api.getRunOrderRoute, { params: { lab: lab.slug, runOrderId: order.id }, cookie: other.members.owner.cookie })).status).toBe(404);
    const list = await callRoute(api.listRunOrdersRoute, { params: { lab: lab.slug, spaceId, number: '1' }, cookie: as('reviewer'), query: { limit: '1' } });
    expect((list.body as { items: unknown[]; nextCursor: string | null }).items).toHaveLength(1);
    expect((list.body as { nextCursor: string | null }).nextCursor).not.toBeNull();
  });

  it('the stored definition and seed rebuild the same order; the zip holds each run’s events.tsv and sidecar, byte-stable', async () => {
    const order = (await create(def({ conditions: { selection: 'rings', indices: [1], includeCentre: true, nullEvents: true }, runs: 2, seed: 77, bids: { subject: 'P07', session: 'mri1', task: 'shapes' } }))).body as RunOrderValue;
    const res = await download(order.id);
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('application/zip');
    const bytes = new Uint8Array(await res.arrayBuffer());
    const again = new Uint8Array(await (await download(order.id, 'designer')).arrayBuffer());
    expect(Buffer.from(again).equals(Buffer.from(bytes))).toBe(true);
    const zip = await JSZip.loadAsync(bytes);
    expect(Object.keys(zip.files).sort()).toEqual([
      'sub-P07_ses-mri1_task-shapes_run-1_events.json',
      'sub-P07_ses-mri1_task-shapes_run-1_events.tsv',
      'sub-P07_ses-mri1_task-shapes_run-2_events.json',
      'sub-P07_ses-mri1_task-shapes_run-2_events.tsv',
    ]);
    const rows = tsvRows(await zip.file('sub-P07_ses-mri1_task-shapes_run-1_events.tsv')!.async('string'));
    // BIDS "Task events": onset and duration first, in seconds; stim_file relative to stimuli/; n/a when missing.
    expect(rows[0]).toEqual(['onset', 'duration', 'trial_type', 'stim_file']);
    const trials = rows.slice(1);
    expect(trials).toHaveLength(8 * 8 + 1); // 6 stimuli + centre + null events = 8 conditions, de Bruijn n² + 1
    expect(trials[0]![0]).toBe('0.000');
    expect(trials.every((t) => t[1] === '1.000')).toBe(true);
    expect(trials.filter((t) => t[2] === 'null').every((t) => t[3] === 'n/a')).toBe(true);
    expect(trials.filter((t) => t[2] === 'c').every((t) => t[3] === 'svg/c.svg')).toBe(true);
    // Onsets step by trial duration + fixed ITI (1 + 2 s).
    expect(Number(trials[5]![0]) - Number(trials[4]![0])).toBeCloseTo(3, 6);
    const ids = order.result!.conditions.map((c) => c.id);
    expect(checkPairBalance(trials.map((t) => ids.indexOf(t[2]!)), ids.length).isBalanced).toBe(true);
    const sidecar = JSON.parse(await zip.file('sub-P07_ses-mri1_task-shapes_run-1_events.json')!.async('string')) as Record<string, { Units?: string; Levels?: Record<string, string> }>;
    expect(sidecar.onset!.Units).toBe('s');
    expect(Object.keys(sidecar.trial_type!.Levels!)).toContain('null');
    // The same definition stored twice gives the same files.
    const twin = (await create(order.definition)).body as RunOrderValue;
    const twinZip = await JSZip.loadAsync(new Uint8Array(await (await download(twin.id)).arrayBuffer()));
    expect(await twinZip.file('sub-P07_ses-mri1_task-shapes_run-2_events.tsv')!.async('string')).toBe(await zip.file('sub-P07_ses-mri1_task-shapes_run-2_events.tsv')!.async('string'));
    // Durations: runs add up to the total.
    expect(order.result!.runs.reduce((s, r) => s + r.duration, 0)).toBeCloseTo(order.result!.summary.duration, 9);
  });

  it('stored dummy volumes shift the onsets; cutting one sequence into runs lists the lost pairs', async () => {
    const timing = { ...DEFAULT_RUN_ORDER_DEFINITION.timing, dummyVolumes: 3, dummyVolumesStored: true };
    const stored = (await create(def({ timing }))).body as RunOrderValue;
    const zip = await JSZip.loadAsync(new Uint8Array(await (await download(stored.id)).arrayBuffer()));
    // BIDS: onsets count from the first stored volume, so 3 stored dummies of TR 2 s put the first trial at 6 s.
    expect(tsvRows(await zip.file('sub-01_task-shapes_run-1_events.tsv')!.async('string'))[1]![0]).toBe('6.000');
    expect(stored.result!.summary.acquiredVolumes).toBe(stored.result!.summary.volumes);
    const discarded = (await create(def({ timing: { ...timing, dummyVolumesStored: false } }))).body as RunOrderValue;
    expect(discarded.result!.summary.acquiredVolumes).toBe(discarded.result!.summary.volumes + 3);

    const cut = (await create(def({ runs: 3, runMode: 'cut' }))).body as RunOrderValue;
    // 37 trials in 3 runs (13, 12, 12): two cuts, each losing one ordered pair, named by the conditions' ids.
    expect(cut.result!.runs.map((r) => r.trials)).toEqual([13, 12, 12]);
    expect(cut.result!.lostPairs.map((p) => p.afterRun)).toEqual([1, 2]);
    for (const p of cut.result!.lostPairs) expect(cut.result!.conditions[p.from]!.id).toBe(p.fromId);
    expect(cut.result!.summary.isTransitionFlat).toBe(false);
  });

  it('refuses bad input with field-level messages, and stores nothing', async () => {
    const before = (await getDb().selectFrom('run_orders').select((eb) => eb.fn.countAll<string>().as('n')).where('lab_id', '=', lab.id).executeTakeFirstOrThrow()).n;
    // n = 3 for type-1 index-1: offers the de Bruijn cycle.
    const three = await create(def({ conditions: { selection: 'spokes', indices: [0], includeCentre: true, nullEvents: false }, sequence: { kind: 'type1-index1' } }));
    expect(three.status).toBe(400);
    expect((three.body as Problem).detail).toMatch(/No type-1 index-1 sequence exists for 3 conditions.*de Bruijn/);
    expect((three.body as Problem).errors!['definition.conditions']).toBeDefined();
    const bad = async (over: Partial<RunOrderDefinition>, field: string, message: RegExp) => {
      const r = await create(def(over));
      expect(r.status, field).toBe(400);
      expect((r.body as Problem).errors?.[field]?.join(' '), field).toMatch(message);
    };
    await bad({ timing: { ...DEFAULT_RUN_ORDER_DEFINITION.timing, trialDuration: 0 } }, 'definition.timing.trialDuration', /more than 0 s/);
    await bad({ timing: { ...DEFAULT_RUN_ORDER_DEFINITION.timing, tr: -2 } }, 'definition.timing.tr', /more than 0 s/);
    await bad({ timing: { ...DEFAULT_RUN_ORDER_DEFINITION.timing, iti: { kind: 'uniform', min: 3, max: 2 } } }, 'definition.timing.iti.max', /longer than the shortest/);
    // 37 trials cut into 40 runs: a run shorter than one trial.
    await bad({ sequence: { kind: 'de-bruijn' }, runs: 40, runMode: 'cut' }, 'definition.runs', /37 trials cannot be cut into 40 runs/);
    await bad({ bids: { subject: 'sub_1', session: '', task: 'shapes' } }, 'definition.bids.subject', /letters and digits/);
    await bad({ conditions: { selection: 'rings', indices: [], includeCentre: false, nullEvents: false } }, 'definition.conditions.indices', /at least one/);
    const after = (await getDb().selectFrom('run_orders').select((eb) => eb.fn.countAll<string>().as('n')).where('lab_id', '=', lab.id).executeTakeFirstOrThrow()).n;
    expect(after).toBe(before);
  });

  it('more than 200 conditions are refused with the trial count (checked on the core’s own message)', async () => {
    // No layout here has 201 stimuli; the count check is the core's, exercised through the service's mapping.
    const { buildRunOrderOf } = await import('@/lib/run-order-build');
    const ids = Array.from({ length: 201 }, (_, i) => `x${i}`);
    expect(() => buildRunOrderOf({ ...def(), conditions: { selection: 'all', indices: [], includeCentre: false, nullEvents: false } }, ids)).toThrow(/201 conditions would need 40402 trials/);
  });

  it('updates check the version; the definition is re-validated; delete removes it', async () => {
    const order = (await create(def())).body as RunOrderValue;
    const put = (version: number, definition: unknown, role: keyof TestLab['members'] = 'experimenter') =>
      callRoute(api.updateRunOrderRoute, { params: { lab: lab.slug, runOrderId: order.id }, body: { name: 'Renamed', definition, version }, cookie: as(role) });
    expect((await put(1, def({ seed: 9 }), 'reviewer')).status).toBe(403);
    const ok = await put(1, def({ seed: 9, runs: 3 }));
    expect(ok.status, JSON.stringify(ok.body)).toBe(200);
    expect((ok.body as RunOrderValue).version).toBe(2);
    expect((ok.body as RunOrderValue).result!.runs).toHaveLength(3);
    expect((await put(1, def({ seed: 10 }))).status).toBe(409);
    const invalid = await put(2, def({ timing: { ...DEFAULT_RUN_ORDER_DEFINITION.timing, tr: 0 } }));
    expect(invalid.status).toBe(400);
    expect((await get(order.id)).definition.seed).toBe(9);
    expect((await callRoute(api.deleteRunOrderRoute, { params: { lab: lab.slug, runOrderId: order.id }, cookie: as('reviewer') })).status).toBe(403);
    expect((await callRoute(api.deleteRunOrderRoute, { params: { lab: lab.slug, runOrderId: order.id }, cookie: as('owner') })).status).toBe(204);
    expect((await callRoute(api.getRunOrderRoute, { params: { lab: lab.slug, runOrderId: order.id }, cookie: as('owner') })).status).toBe(404);
  });

  it('type-1 index-1 with more than 12 conditions is searched by a background job; a search out of time says so', async () => {
    const all = { selection: 'all' as const, indices: [], includeCentre: true, nullEvents: false };
    const queued = await create(def({ conditions: all, sequence: { kind: 'type1-index1' } }));
    expect(queued.status, JSON.stringify(queued.body)).toBe(201);
    expect((queued.body as RunOrderValue).state).toBe('queued');
    const id = (queued.body as RunOrderValue).id;
    expect((await download(id)).status).toBe(409);
    const stop = await startRunOrderWorker({ db: getDb(), boss, pollingIntervalSeconds: 0.5, timeBudgetMs: 60_000 });
    try {
      let order = await get(id);
      for (let i = 0; i < 100 && order.state !== 'ready' && order.state !== 'failed'; i++) {
        await sleep(200);
        order = await get(id);
      }
      expect(order.state, order.error ?? '').toBe('ready');
      expect(order.result!.conditions).toHaveLength(15);
      const zip = await JSZip.loadAsync(new Uint8Array(await (await download(id)).arrayBuffer()));
      const rows = tsvRows(await zip.file('sub-01_task-shapes_run-1_events.tsv')!.async('string')).slice(1);
      const ids = order.result!.conditions.map((c) => c.id);
      // Nonyane & Theobald 2007 / Aguirre 2007: n² + 1 trials, n permuted blocks, every ordered pair once.
      expect(checkType1Index1Sequence(rows.map((r) => ids.indexOf(r[2]!)), 15).isValid).toBe(true);
    } finally {
      await stop();
    }
    // 31 conditions with no time at all: the search gives up and the run order says why and what to try.
    const big = await create(def({ conditions: all, sequence: { kind: 'type1-index1' } }), 'experimenter', () => bigSpaceId);
    expect((big.body as RunOrderValue).state).toBe('queued');
    expect(await runRunOrderJob(getDb(), (big.body as RunOrderValue).id, 1, 0)).toBe('failed');
    const failed = await get((big.body as RunOrderValue).id);
    expect(failed.state).toBe('failed');
    expect(failed.error).toMatch(/No type-1 index-1 sequence for 31 conditions was found within 0 s with seed 1.*de Bruijn/);
    // A job for an older version is skipped.
    expect(await runRunOrderJob(getDb(), (big.body as RunOrderValue).id, 7, 0)).toBe('skipped');
  });

  it('a run order attached to a pack lands under sequences/, listed in the manifest and in SHA256SUMS', async () => {
    const order = (await create(def({ runs: 2 }), 'experimenter', () => spaceId, 'Pack order')).body as RunOrderValue;
    const profile = await callRoute(api.createDisplayProfileRoute, {
      params: { lab: lab.slug },
      body: { name: 'Run order screen', resolutionPx: { width: 1920, height: 1080 }, widthCm: 53.1, pixelsPerCm: null, viewingDistanceCm: 57 },
      cookie: as('experimenter'),
    });
    const render = { ...DEFAULT_RENDER_OPTIONS, sizeDeg: 2, canvasDeg: 3, samples: 128 };
    const ask = (runOrderIds: string[]) =>
      callRoute(api.createPackRoute, { params: { lab: lab.slug, spaceId, number: '1' }, body: { displayProfileId: (profile.body as { id: string }).id, render, runOrderIds }, cookie: as('experimenter') });
    const foreign = await ask(['00000000-0000-4000-8000-000000000000']);
    expect(foreign.status).toBe(400);
    expect((foreign.body as Problem).errors!['runOrderIds.0']).toEqual(['Not a run order of this edition']);
    const plain = (await ask([])).body as { id: string };
    const r = await ask([order.id]);
    expect(r.status, JSON.stringify(r.body)).toBe(202);
    const packId = (r.body as { id: string }).id;
    expect(packId).not.toBe(plain.id);
    const stop = await startPackWorker({ db: getDb(), boss, pool: { render: renderPng }, pollingIntervalSeconds: 0.5 });
    try {
      let state = '';
      for (let i = 0; i < 200 && state !== 'succeeded' && state !== 'failed'; i++) {
        await sleep(250);
        state = ((await callRoute(api.getPackRoute, { params: { lab: lab.slug, packId }, cookie: as('reviewer') })).body as { state: string }).state;
      }
      expect(state).toBe('succeeded');
    } finally {
      await stop();
    }
    const zip = await JSZip.loadAsync(await readObject(packObjectKey(lab.id, packId)));
    const folder = `sequences/pack-order-${order.id.slice(0, 8)}`;
    const names = Object.keys(zip.files).filter((n) => n.startsWith('sequences/')).sort();
    expect(names).toEqual([`${folder}/sub-01_task-shapes_run-1_events.json`, `${folder}/sub-01_task-shapes_run-1_events.tsv`, `${folder}/sub-01_task-shapes_run-2_events.json`, `${folder}/sub-01_task-shapes_run-2_events.tsv`]);
    const sums = await zip.file('SHA256SUMS')!.async('string');
    for (const n of names) expect(sums).toContain(n);
    const manifest = await zip.file('manifest.json')!.async('string');
    for (const n of names) expect(manifest).toContain(n);
    const own = await JSZip.loadAsync(new Uint8Array(await (await download(order.id)).arrayBuffer()));
    expect(await zip.file(`${folder}/sub-01_task-shapes_run-2_events.tsv`)!.async('string')).toBe(await own.file('sub-01_task-shapes_run-2_events.tsv')!.async('string'));
  });
});
