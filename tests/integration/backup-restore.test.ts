import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDb, type Db } from '@/db/client';
import { contentHash } from '@/lib/edition';
import { getDb } from '@/lib/server/db';
import { createLabWithEveryRole } from '../support/actors';
import { makeEdition } from '../support/editions';

// `npm run db:backup` and `npm run db:restore` (pg_dump / pg_restore, custom format) on the integration database,
// which holds what the earlier test files wrote: the restored copy must hold the same rows in every table, and every
// edition's stored snapshot must still hash to its content hash.

const run = (script: string, args: string[], env: Record<string, string>) =>
  execFileSync(process.execPath, [script, ...args], { env: { ...process.env, ...env }, encoding: 'utf8' });

async function rowCounts(db: Db): Promise<Record<string, number>> {
  const tables = await sql<{ name: string }>`
    SELECT format('%I.%I', schemaname, tablename) AS name FROM pg_tables
    WHERE schemaname NOT IN ('pg_catalog', 'information_schema') ORDER BY 1`.execute(db);
  const out: Record<string, number> = {};
  for (const t of tables.rows) out[t.name] = Number((await sql<{ n: string }>`SELECT count(*) AS n FROM ${sql.raw(t.name)}`.execute(db)).rows[0]!.n);
  return out;
}

async function editionHashes(db: Db): Promise<{ id: string; stored: string; recomputed: string }[]> {
  const rows = await db.selectFrom('editions').select(['id', 'content_hash', 'snapshot']).orderBy('id').execute();
  return rows.map((r) => ({ id: r.id, stored: r.content_hash, recomputed: contentHash(r.snapshot) }));
}

describe('backup and restore', () => {
  const dir = mkdtempSync(join(tmpdir(), 'epicycle-backup-'));
  const source = process.env.TEST_DATABASE_URL!;
  const target = new URL(source);
  target.pathname = `/epicycle_restore_${Date.now().toString(36)}`;
  let restored: Db | null = null;

  beforeAll(async () => {
    // At least one edition of our own, whatever ran before.
    await makeEdition(await createLabWithEveryRole(getDb()), 'Backup space', true);
  }, 60_000);
  afterAll(async () => {
    await restored?.destroy();
    await sql`DROP DATABASE IF EXISTS ${sql.id(target.pathname.slice(1))}`.execute(getDb());
    await getDb().destroy();
    rmSync(dir, { recursive: true, force: true });
  });

  it('restores into a fresh database with the same row count in every table and every edition hash intact', async () => {
    const file = join(dir, 'it.dump');
    const backup = JSON.parse(run('scripts/db-backup.mjs', ['--out', file], { DATABASE_URL: source })) as { bytes: number };
    expect(backup.bytes).toBeGreaterThan(1000);
    const before = await rowCounts(getDb());
    const hashesBefore = await editionHashes(getDb());

    const result = JSON.parse(run('scripts/db-restore.mjs', [file, '--to', target.toString()], { DATABASE_URL: source })) as { created: boolean; tables: number };
    expect(result.created).toBe(true);
    restored = createDb(target.toString(), 2);
    const after = await rowCounts(restored);
    expect(Object.keys(after).length).toBe(result.tables);
    expect(after).toEqual(before);
    expect(before['public.editions']).toBeGreaterThan(0);
    expect(before['public.users']).toBeGreaterThan(0);

    const hashesAfter = await editionHashes(restored);
    expect(hashesAfter).toEqual(hashesBefore);
    for (const e of hashesAfter) expect(e.recomputed, `edition ${e.id}`).toBe(e.stored);

    // A restore never writes over data: the same target again is refused.
    expect(() => run('scripts/db-restore.mjs', [file, '--to', target.toString()], { DATABASE_URL: source })).toThrow(/already holds/);
  }, 120_000);
});
