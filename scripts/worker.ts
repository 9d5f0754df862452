// `npm run worker`: a pack and run order worker process. It takes pack jobs from the queue in PostgreSQL and renders
// them with a worker-thread pool across all cores, uploading the zips to the object store; and it runs the background
// type-1 index-1 searches of run orders (more than 12 conditions) and the study results too long for a request. Run as many as you like,
// on as many machines as share the database (DATABASE_URL) and the object store (S3_*).
import { createServer } from 'node:http';
import { createDb } from '@/db/client';
import { getEnv } from '@/lib/server/env';
import { startBoss } from '@/lib/server/jobs/boss';
import { startPackWorker } from '@/lib/server/jobs/pack-worker';
import { PackPool } from '@/lib/server/jobs/pack-pool';
import { startResultsWorker } from '@/lib/server/jobs/results-worker';
import { startRunOrderWorker } from '@/lib/server/jobs/run-order-worker';

// pg-boss 10 records a job's end without awaiting it; if the database is away at that moment the rejection is
// unhandled. The job then stays active until it expires and is retried, so it is logged rather than fatal.
process.on('unhandledRejection', (reason) => {
  console.error(`[worker] unhandled rejection (the job will be retried after it expires): ${reason instanceof Error ? reason.message : String(reason)}`);
});

const env = getEnv();
const db = createDb(env.DATABASE_URL, 4);
const pool = new PackPool(env.PACK_RENDER_THREADS);
await pool.warm();
const boss = await startBoss({ supervise: true });
const stopWorking = await startPackWorker({ db, boss, pool });
const stopSearching = await startRunOrderWorker({ db, boss });
const stopComputing = await startResultsWorker({ db, boss });
console.log(`[worker] taking pack jobs with ${pool.size} pack threads, run order searches and study results`);

// An optional health port, for process supervisors and the e2e harness.
const healthPort = Number(process.env.WORKER_HEALTH_PORT ?? 0);
const health = healthPort
  ? createServer((_req, res) => {
      res.writeHead(200, { 'content-type': 'application/json' });
      res.end(JSON.stringify({ status: 'ok', threads: pool.size }));
    }).listen(healthPort, '127.0.0.1')
  : null;

let stopping = false;
async function stop(signal: string) {
  if (stopping) return;
  stopping = true;
  console.log(`[worker] ${signal}: finishing the job in hand, then stopping`);
  health?.close();
  await stopWorking();
  await stopSearching();
  await stopComputing();
  await boss.stop({ graceful: true, wait: true });
  await pool.close();
  await db.destroy();
  process.exit(0);
}
process.on('SIGINT', () => void stop('SIGINT'));
process.on('SIGTERM', () => void stop('SIGTERM'));
