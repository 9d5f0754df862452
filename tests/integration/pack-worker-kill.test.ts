import { spawn, type ChildProcess } from 'node:child_process';
import type PgBoss from 'pg-boss';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { getDb } from '@/lib/server/db';
import { startBoss } from '@/lib/server/jobs/boss';
import { startPackWorker } from '@/lib/server/jobs/pack-worker';
import { renderPng } from '@/lib/render/render-png';
import { makePackFaultLab } from '../support/pack-faults';

// A real worker process (scripts/worker.ts) is killed mid-job. A job whose worker went silent comes back after
// PACK_JOB_EXPIRE_SECONDS, the setting a site tunes; short here so the test is quick.
process.env.PACK_JOB_EXPIRE_SECONDS = '3';

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

describe('a pack worker killed mid-job', () => {
  let f: Awaited<ReturnType<typeof makePackFaultLab>>;
  let boss: PgBoss;
  let stopWorker: (() => Promise<void>) | null = null;
  let child: ChildProcess | null = null;

  beforeAll(async () => {
    f = await makePackFaultLab();
    boss = await startBoss({ supervise: true, maintenanceIntervalSeconds: 1 });
  }, 60_000);
  afterAll(async () => {
    child?.kill('SIGKILL');
    await stopWorker?.();
    await boss.stop({ graceful: false, wait: true });
    await getDb().destroy();
  });

  it('its job expires, and another worker takes it up and finishes it', async () => {
    child = spawn(process.execPath, ['--conditions=react-server', '--import', 'tsx', 'scripts/worker.ts'], { env: { ...process.env, PACK_RENDER_THREADS: '1' }, stdio: 'ignore' });
    const p = await f.ask({ sizeDeg: 3, canvasDeg: 4 });
    await f.until(p.id, (x) => x.state === 'running', 60_000, 50);
    child.kill('SIGKILL');
    const killedAt = Date.now();
    await sleep(500);
    expect((await f.get(p.id)).state).toBe('running');

    stopWorker = await startPackWorker({ db: getDb(), boss, pool: { render: renderPng }, pollingIntervalSeconds: 0.5 });
    const done = await f.until(p.id, (x) => x.state === 'succeeded' || x.state === 'failed');
    expect(done.state, done.error ?? '').toBe('succeeded');
    // Taken up only after the expiry, by the second worker: the second attempt.
    expect(Date.now() - killedAt).toBeGreaterThan(3000);
    expect(done.attempts).toBe(2);
    await f.expectOnlyWholePacks([done]);
  }, 120_000);
});
