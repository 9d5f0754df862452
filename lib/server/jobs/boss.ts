import 'server-only';
import PgBoss from 'pg-boss';
import { getEnv } from '../env';
import { logEvent } from '../log';

/** The queue of pack builds. Queues are created at start-up: `send()` to a missing queue returns null silently. */
export const PACK_QUEUE = 'pack-build';

export interface PackJobData {
  packId: string;
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
  const boss = new PgBoss({ connectionString: getEnv().DATABASE_URL, schema: 'pgboss', max: 4, supervise, schedule: false, maintenanceIntervalSeconds });
  boss.on('error', (error: Error) => logEvent('error', 'job queue error', { error: error.message }));
  await boss.start();
  await boss.createQueue(PACK_QUEUE, packQueueOptions());
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
