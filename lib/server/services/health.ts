import 'server-only';
import { sql } from 'kysely';
import type { Db } from '@/db/client';
import type { Health } from '@/lib/schemas/health';
import { APP_VERSION } from '../version';

/** Checks that the database answers a query; the app is degraded when it does not. */
export async function checkHealth(db: Db): Promise<Health> {
  const started = performance.now();
  let ok = false;
  try {
    await sql`SELECT 1`.execute(db);
    ok = true;
  } catch {
    ok = false;
  }
  return {
    status: ok ? 'ok' : 'degraded',
    database: { ok, latencyMs: ok ? Math.round((performance.now() - started) * 100) / 100 : null },
    version: APP_VERSION,
    time: new Date().toISOString(),
  };
}
