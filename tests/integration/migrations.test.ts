import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDb, type Db } from '@/db/client';
import { assertMigrated, createMigrator } from '@/db/migrate';
import { createScratchDatabase } from '../support/db';

async function tableNames(db: Db): Promise<string[]> {
  const r = await sql<{ table_name: string }>`
    SELECT table_name FROM information_schema.tables
    WHERE table_schema = 'public' AND table_name NOT LIKE 'kysely_%' ORDER BY table_name`.execute(db);
  return r.rows.map((row) => row.table_name);
}

describe('migrations', () => {
  let scratch: Awaited<ReturnType<typeof createScratchDatabase>>;
  let db: Db;

  beforeAll(async () => {
    scratch = await createScratchDatabase('epicycle_migration_check');
    db = createDb(scratch.url, 1);
  });
  afterAll(async () => {
    await db.destroy();
    await scratch.drop();
  });

  it('run up → down (all the way) → up again, leaving the same schema', async () => {
    const migrator = createMigrator(db);
    assertMigrated(await migrator.migrateToLatest());
    const afterFirstUp = await tableNames(db);
    expect(afterFirstUp).toEqual(expect.arrayContaining(['labs', 'audit_events']));

    const all = await migrator.getMigrations();
    for (let i = 0; i < all.length; i++) assertMigrated(await migrator.migrateDown());
    expect(await tableNames(db)).toEqual([]);

    assertMigrated(await migrator.migrateToLatest());
    expect(await tableNames(db)).toEqual(afterFirstUp);
  });

  it('creates the database in UTF8', async () => {
    const r = await sql<{ enc: string }>`SELECT pg_encoding_to_char(encoding) AS enc FROM pg_database WHERE datname = current_database()`.execute(db);
    expect(r.rows[0]?.enc).toBe('UTF8');
  });
});

describe('the migration list', () => {
  it('names every file in migrations/, in timestamp order', async () => {
    const { readdirSync } = await import('node:fs');
    const { MIGRATIONS } = await import('@/migrations');
    const files = readdirSync(new URL('../../migrations', import.meta.url))
      .filter((f) => /^\d{14}_.+\.ts$/.test(f))
      .map((f) => f.replace(/\.ts$/, ''))
      .sort();
    expect(Object.keys(MIGRATIONS)).toEqual(files);
  });
});
