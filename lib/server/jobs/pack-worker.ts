import 'server-only';
import { sql } from 'kysely';
import type PgBoss from 'pg-boss';
import type { Db } from '@/db/client';
import type { PackJobRunner } from '@/lib/pack/pack-job';
import type { PackPngRequest } from '@/lib/pack/types';
import { logEvent } from '../log';
import { PACK_QUEUE, type PackJobData } from './boss';
import { runPackJob } from './run-pack-job';

/** How long a failed job waits for the database to answer before handing its failure to the queue. */
const DATABASE_WAIT_MS = 60_000;

/** Resolves once the database answers a query, or after `timeoutMs` (the job then expires and is retried). */
export async function waitForDatabase(db: Db, timeoutMs: number): Promise<boolean> {
  const end = Date.now() + timeoutMs;
  for (;;) {
    try {
      await sql`SELECT 1`.execute(db);
      return true;
    } catch {
      if (Date.now() > end) return false;
      await new Promise((r) => setTimeout(r, 500));
    }
  }
}

/**
 * Takes pack jobs from the queue, one at a time per process (a pack already uses every core through the PNG
 * pool). Any number of these processes, on any machines sharing the database and the object store, share the
 * queue. Returns a stop function that waits for the job in hand.
 */
export async function startPackWorker({ db, boss, pool, pollingIntervalSeconds = 1 }: { db: Db; boss: PgBoss; pool: { render: (request: PackPngRequest) => Promise<Uint8Array>; run?: PackJobRunner }; pollingIntervalSeconds?: number }): Promise<() => Promise<void>> {
  await boss.work<PackJobData>(PACK_QUEUE, { batchSize: 1, includeMetadata: true, pollingIntervalSeconds }, async (jobs) => {
    // Handlers receive an array of jobs, even with a batch size of 1.
    for (const job of jobs) {
      const attempt = job.retryCount + 1;
      logEvent('info', 'pack job started', { packId: job.data.packId, jobId: job.id, attempt });
      let outcome;
      try {
        outcome = await runPackJob(db, job.data.packId, { renderPng: pool.render, ...(pool.run ? { runJob: pool.run } : {}), attempt, finalAttempt: job.retryCount >= job.retryLimit });
      } catch (error) {
        // pg-boss 10 records the failure without awaiting it: were the database still away (a restart), the
        // record would be lost and the job would wait for its expiry. Waiting for the database first makes the
        // retry come after `retryDelay` instead.
        await waitForDatabase(db, DATABASE_WAIT_MS);
        throw error;
      }
      logEvent('info', 'pack job ended', { packId: job.data.packId, outcome });
    }
  });
  return () => boss.offWork(PACK_QUEUE);
}
