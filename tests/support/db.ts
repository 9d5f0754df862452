import { sql } from 'kysely';
import { createDb, type Db } from '@/db/client';

/** A handle on the integration database (already migrated by the global setup). */
export function testDb(): Db {
  const url = process.env.TEST_DATABASE_URL;
  if (!url) throw new Error('TEST_DATABASE_URL is not set');
  return createDb(url, 4);
}

/** Creates an empty scratch database for tests that need their own (e.g. migrations up → down → up). */
export async function createScratchDatabase(name: string): Promise<{ url: string; drop: () => Promise<void> }> {
  const adminUrl = process.env.TEST_ADMIN_DATABASE_URL;
  if (!adminUrl) throw new Error('TEST_ADMIN_DATABASE_URL is not set');
  const admin = createDb(adminUrl, 1);
  await sql.raw(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`).execute(admin);
  await sql.raw(`CREATE DATABASE "${name}" ENCODING 'UTF8' TEMPLATE template0`).execute(admin);
  const url = new URL(adminUrl);
  url.pathname = `/${name}`;
  return {
    url: url.toString(),
    drop: async () => {
      await sql.raw(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`).execute(admin);
      await admin.destroy();
    },
  };
}

/** A unique lower-case suffix for names made by one test. */
export function uniqueSuffix(): string {
  return `${Date.now().toString(36)}${Math.floor(Math.random() * 1e6).toString(36)}`;
}
