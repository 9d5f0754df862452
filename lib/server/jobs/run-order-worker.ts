import 'server-only';
import type PgBoss from 'pg-boss';
import type { Db } from '@/db/client';
import { getEnv } from '../env';
import { logEvent } from '../log';
import { runRunOrderJob } from '../services/run-orders';
import { RUN_ORDER_QUEUE, type RunOrderJobData } from './boss';

/**
 * Takes background type-1 index-1 searches from the queue, one at a time. The search runs on this thread and
 * holds it for up to the budget (`RUN_ORDER_SEARCH_BUDGET_SECONDS`). Returns a stop function.
 */
export async function startRunOrderWorker({ db, boss, pollingIntervalSeconds = 1, timeBudgetMs }: { db: Db; boss: PgBoss; pollingIntervalSeconds?: number; timeBudgetMs?: number }): Promise<() => Promise<void>> {
  const budget = timeBudgetMs ?? getEnv().RUN_ORDER_SEARCH_BUDGET_SECONDS * 1000;
  await boss.work<RunOrderJobData>(RUN_ORDER_QUEUE, { batchSize: 1, pollingIntervalSeconds }, async (jobs) => {
    for (const job of jobs) {
      logEvent('info', 'run order search started', { runOrderId: job.data.runOrderId, jobId: job.id });
      const outcome = await runRunOrderJob(db, job.data.runOrderId, job.data.version, budget);
      logEvent('info', 'run order search ended', { runOrderId: job.data.runOrderId, outcome });
    }
  });
  return () => boss.offWork(RUN_ORDER_QUEUE);
}
