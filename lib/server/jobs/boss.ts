import 'server-only';
import PgBoss from 'pg-boss';
import { createDb, poolOf } from '@/db/client';
import { getEnv } from '../env';
import { logEvent } from '../log';

/** The queue of pack builds. Queues are created at start-up: `send()` to a missing queue returns null silently. */
export const PACK_QUEUE = 'pack-build';

export interface PackJobData {
  packId: string;
}

/** The queue of type-1 index-1 searches too long to run inline (n > 12). */
export const RUN_ORDER_QUEUE = 'run-order-search';

export interface RunOrderJobData {
  runOrderId: string;
  /** The definition version the job searches for; a later edit makes the job a no-op. */
  version: number;
}

/** A search is deterministic: a retry after a timeout would time out again, so only a dead worker's job is retried. */
export function runOrderQueueOptions() {
  return { name: RUN_ORDER_QUEUE, retryLimit: 1, retryDelay: 2, expireInSeconds: 600 };
}

const holder = globalThis as unknown as { __epicycleBoss?: Promise<PgBoss> };

/** The queue's retry policy: a silent worker's job expires and is retried by another worker. */
export function packQueueOptions() {
  const env = getEnv();
  return { name: PACK_QUEUE, retryLimit: env.PACK_JOB_RETRIES, retryDelay: 2, expireInSeconds: env.PACK_JOB_EXPIRE_SECONDS };
}

/**
 * Starts a pg-boss instance on the app's database (schema `pgboss`) and creates the queues. `supervise` runs
 * the maintenance that expires and retries jobs of dead workers (workers do; the web server does not need to).
 */
export async function startBoss({ supervise, maintenanceIntervalSeconds = 10 }: { supervise: boolean; maintenanceIntervalSeconds?: number }): Promise<PgBoss> {
  // pg-boss runs on a pool of ours, whose connections carry error listeners (db/client.ts): its own pool lets a
  // connection lost mid-query (a PostgreSQL restart) raise an uncaught error that ends the worker.
  const pool = poolOf(createDb(getEnv().DATABASE_URL, 4));
  const boss = new PgBoss({ db: { executeSql: (text: string, values?: unknown[]) => pool.query(text, values) }, schema: 'pgboss', supervise, schedule: false, maintenanceIntervalSeconds });
  boss.on('error', (error: Error) => logEvent('error', 'job queue error', { error: error.message }));
  boss.on('stopped', () => void pool.end());
  await boss.start();
  await boss.createQueue(PACK_QUEUE, packQueueOptions());
  await boss.createQueue(RUN_ORDER_QUEUE, runOrderQueueOptions());
  await boss.createQueue(STUDY_RESULTS_QUEUE, studyResultsQueueOptions());
  return boss;
}

/** The web server's queue handle (no maintenance), started once per process. */
export function getBoss(): Promise<PgBoss> {
  holder.__epicycleBoss ??= startBoss({ supervise: false }).catch((error: unknown) => {
    holder.__epicycleBoss = undefined;
    throw error;
  });
  return holder.__epicycleBoss;
}

/** Queues a pack build; throws when the queue refuses it (it returns null rather than failing). */
export async function sendPackJob(boss: PgBoss, data: PackJobData): Promise<string> {
  const id = await boss.send(PACK_QUEUE, data, packQueueOptions());
  if (!id) throw new Error(`the job queue "${PACK_QUEUE}" refused the job (does the queue exist?)`);
  return id;
}

/** Queues a background type-1 index-1 search; throws when the queue refuses it. */
export async function sendRunOrderJob(boss: PgBoss, data: RunOrderJobData): Promise<string> {
  const id = await boss.send(RUN_ORDER_QUEUE, data, runOrderQueueOptions());
  if (!id) throw new Error(`the job queue "${RUN_ORDER_QUEUE}" refused the job (does the queue exist?)`);
  return id;
}

/** The queue of study results too long to compute in a request (over about a second of fitting). */
export const STUDY_RESULTS_QUEUE = 'study-results';

export interface StudyResultsJobData {
  resultId: string;
}

/** A computation is deterministic: only a dead worker's job is retried. */
export function studyResultsQueueOptions() {
  return { name: STUDY_RESULTS_QUEUE, retryLimit: 1, retryDelay: 2, expireInSeconds: 900 };
}

/** Queues a results computation; throws when the queue refuses it. */
export async function sendStudyResultsJob(boss: PgBoss, data: StudyResultsJobData): Promise<string> {
  const id = await boss.send(STUDY_RESULTS_QUEUE, data, studyResultsQueueOptions());
  if (!id) throw new Error(`the job queue "${STUDY_RESULTS_QUEUE}" refused the job (does the queue exist?)`);
  return id;
}
