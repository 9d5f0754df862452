import 'server-only';
import type pg from 'pg';
import { createDb, poolOf, type Db } from '@/db/client';
import { getEnv } from './env';

// One pool per server process; kept on globalThis so dev-mode module reloads do not leak pools.
const holder = globalThis as unknown as { __epicycleDb?: Db };

/** The process-wide database handle. */
export function getDb(): Db {
  if (!holder.__epicycleDb) {
    const env = getEnv();
    holder.__epicycleDb = createDb(env.DATABASE_URL, env.DATABASE_POOL_MAX);
  }
  return holder.__epicycleDb;
}

/** The pg pool under the handle, for libraries that speak to pg directly (the rate limiter). */
export function getPool(): pg.Pool {
  return poolOf(getDb());
}
