// `npm run db:migrate` migrates to the latest version; `npm run db:migrate -- down` undoes the last migration.
import { createDb } from '@/db/client';
import { assertMigrated, createMigrator } from '@/db/migrate';
import { getEnv } from '@/lib/server/env';

const db = createDb(getEnv().DATABASE_URL, 1);
try {
  const migrator = createMigrator(db);
  const result = process.argv.includes('down') ? await migrator.migrateDown() : await migrator.migrateToLatest();
  for (const r of result.results ?? []) console.log(`[migrate] ${r.direction} ${r.migrationName}: ${r.status}`);
  assertMigrated(result);
  if ((result.results ?? []).length === 0) console.log('[migrate] already up to date');
} finally {
  await db.destroy();
}
