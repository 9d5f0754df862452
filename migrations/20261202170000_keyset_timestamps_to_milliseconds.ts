import { type Kysely, sql } from 'kysely';

/**
 * The columns that list pages are sorted and cursored by. PostgreSQL keeps microseconds, but a cursor carries a
 * JavaScript Date, which keeps milliseconds: two rows made within the same millisecond could fall between the
 * cursor and the row it was taken from, and a page would skip them. Stored at millisecond precision, the value a
 * cursor carries is exactly the value in the row.
 */
const KEYSET_COLUMNS: ReadonlyArray<readonly [table: string, column: string]> = [
  ['labs', 'created_at'],
  ['audit_events', 'created_at'],
  ['seed_shapes', 'updated_at'],
  ['shape_spaces', 'updated_at'],
  ['editions', 'created_at'],
  ['display_profiles', 'updated_at'],
  ['packs', 'created_at'],
  ['studies', 'updated_at'],
  ['run_orders', 'created_at'],
  ['lab_api_tokens', 'created_at'],
  ['study_sessions', 'started_at'],
];

async function setPrecision(db: Kysely<any>, type: string): Promise<void> {
  for (const [table, column] of KEYSET_COLUMNS) {
    await sql`ALTER TABLE ${sql.table(table)} ALTER COLUMN ${sql.ref(column)} TYPE ${sql.raw(type)}`.execute(db);
  }
}

export async function up(db: Kysely<any>): Promise<void> {
  await setPrecision(db, 'timestamptz(3)');
}

export async function down(db: Kysely<any>): Promise<void> {
  await setPrecision(db, 'timestamptz');
}
