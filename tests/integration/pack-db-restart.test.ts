import type PgBoss from 'pg-boss';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { getDb } from '@/lib/server/db';
import { startBoss } from '@/lib/server/jobs/boss';
import { startPackWorker } from '@/lib/server/jobs/pack-worker';
import { renderPng } from '@/lib/render/render-png';
import { makePackFaultLab } from '../support/pack-faults';
import { startTestCluster, stopTestCluster } from '../support/postgres-control';

// PostgreSQL is stopped and started again under a running pack job (real PostgreSQL, pg-boss and object store).
// The job's time limit (its expiry) is longer than the outage, so the retry comes from the recorded failure.
process.env.PACK_JOB_EXPIRE_SECONDS = '60';

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

describe('a pack job under a PostgreSQL restart', () => {
  let f: Awaited<ReturnType<typeof makePackFaultLab>>;
  let boss: PgBoss;
  let stopWorker: (() => Promise<void>) | null = null;

  beforeAll(async () => {
    f = await makePackFaultLab();
    boss = await startBoss({ supervise: true, maintenanceIntervalSeconds: 1 });
  }, 60_000);
  afterAll(async () => {
    await stopWorker?.();
    await boss.stop({ graceful: false, wait: true });
    await getDb().destroy();
  });

  it('the attempt that meets the outage fails, its upload is removed, and the retry finishes the pack', async () => {
    let drawn = 0;
    let restart: Promise<void> | null = null;
    // The database goes down halfway through the drawing and stays down past the upload, then comes back.
    const render = async (req: Parameters<typeof renderPng>[0]) => {
      drawn += 1;
      if (drawn === 12) {
        stopTestCluster();
        restart = sleep(5000).then(startTestCluster);
      }
      return renderPng(req);
    };
    stopWorker = await startPackWorker({ db: getDb(), boss, pool: { render }, pollingIntervalSeconds: 0.5 });
    const p = await f.ask({ sizeDeg: 2, canvasDeg: 3 });
    await f.until(p.id, () => restart !== null, 60_000, 100);
    await restart;
    const done = await f.until(p.id, (x) => x.state === 'succeeded' || x.state === 'failed');
    expect(done.state, done.error ?? '').toBe('succeeded');
    // Every stimulus was drawn again by the second attempt.
    expect(drawn).toBeGreaterThanOrEqual(12 + 27);
    expect(done.attempts).toBe(2);
    await f.expectOnlyWholePacks([done]);
  }, 90_000);
});
