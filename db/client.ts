import { Kysely, PostgresDialect, type Transaction } from 'kysely';
import pg from 'pg';
import type { Database } from './database';

// pg returns int8 and numeric as strings by default. Counts (int8) fit in a double for any realistic table,
// and numeric columns here hold measurements, so both are parsed to numbers on purpose.
const INT8_OID = 20;
const NUMERIC_OID = 1700;
pg.types.setTypeParser(INT8_OID, (v) => Number.parseInt(v, 10));
pg.types.setTypeParser(NUMERIC_OID, (v) => Number.parseFloat(v));

/** Creates a Kysely handle over its own pool. Used by the app (once), the scripts and the tests. */
export function createDb(connectionString: string, max = 10): Kysely<Database> {
  const pool = new pg.Pool({ connectionString, max, application_name: 'epicycle' });
  // An idle client can be cut by the server (restart, admin termination). Without a listener that error would
  // crash the process; the pool drops the client and the next query reconnects.
  pool.on('error', (error) => {
    process.stderr.write(`[db] idle client error: ${error.message}\n`);
  });
  // The pool's own listener covers idle clients only. A client in use when the server goes away (a restart)
  // emits 'error' as well as failing its query; with no listener that event would crash the process.
  pool.on('connect', (client) => {
    client.on('error', (error) => {
      process.stderr.write(`[db] connection lost: ${error.message}\n`);
    });
  });
  const db = new Kysely<Database>({ dialect: new PostgresDialect({ pool }) });
  pools.set(db, pool);
  return db;
}

const pools = new WeakMap<Kysely<Database>, pg.Pool>();

/** The pg pool a handle made by `createDb` runs on. */
export function poolOf(db: Kysely<Database>): pg.Pool {
  const pool = pools.get(db);
  if (!pool) throw new Error('handle was not made by createDb');
  return pool;
}

export type Db = Kysely<Database>;

/** What a repository takes as its first argument: the pool handle or an open transaction. */
export type DbHandle = Db | Transaction<Database>;
