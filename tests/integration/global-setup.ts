import { createDb } from '@/db/client';
import { assertMigrated, createMigrator } from '@/db/migrate';

/** Migrates the integration database once before the tier; `npm test` gives a freshly made cluster. */
export default async function setup(): Promise<void> {
  const url = process.env.TEST_DATABASE_URL;
  if (!url) throw new Error('TEST_DATABASE_URL is not set: run `npm test` or `npm run test:integration`.');
  const db = createDb(url, 1);
  try {
    assertMigrated(await createMigrator(db).migrateToLatest());
  } finally {
    await db.destroy();
  }
}
