import { Migrator, type Kysely, type MigrationResultSet } from 'kysely';
import { MIGRATIONS } from '@/migrations';

/** A Kysely Migrator over the statically listed migrations in `migrations/index.ts`. */
// eslint-disable-next-line @typescript-eslint/no-explicit-any -- migrations run against any schema version
export function createMigrator(db: Kysely<any>): Migrator {
  // Features are built on parallel branches, so a migration may land after a later-dated one already ran here;
  // each migration stands alone (tables of its own), so running the missing ones in name order is safe.
  return new Migrator({ db, provider: { getMigrations: async () => MIGRATIONS }, allowUnorderedMigrations: true });
}

/** Throws with the failing migration named when a run did not succeed. */
export function assertMigrated(result: MigrationResultSet): void {
  const failed = result.results?.find((r) => r.status === 'Error');
  if (result.error || failed) {
    throw new Error(`migration ${failed?.migrationName ?? '(unknown)'} failed`, { cause: result.error });
  }
}
