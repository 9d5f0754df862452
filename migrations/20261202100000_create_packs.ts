import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('packs')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('lab_id', 'uuid', (c) => c.notNull().references('labs.id').onDelete('cascade'))
    .addColumn('edition_id', 'uuid', (c) => c.notNull().references('editions.id').onDelete('restrict'))
    // The profile as it was when the pack was asked for: a later edit or deletion of the profile changes nothing.
    .addColumn('display_profile_id', 'uuid', (c) => c.references('display_profiles.id').onDelete('set null'))
    .addColumn('profile', 'jsonb', (c) => c.notNull())
    .addColumn('render_options', 'jsonb', (c) => c.notNull())
    // SHA-256 of the canonical JSON of (edition hash, profile, options, engine): two identical requests, one pack.
    .addColumn('options_hash', 'text', (c) => c.notNull())
    .addColumn('state', 'text', (c) => c.notNull().defaultTo('queued'))
    .addColumn('progress', 'real', (c) => c.notNull().defaultTo(0))
    .addColumn('stage', 'text', (c) => c.notNull().defaultTo('queued'))
    .addColumn('error', 'text')
    .addColumn('attempts', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('cancel_requested', 'boolean', (c) => c.notNull().defaultTo(false))
    .addColumn('job_id', 'uuid')
    .addColumn('object_key', 'text')
    .addColumn('size_bytes', 'bigint')
    .addColumn('sha256', 'text')
    .addColumn('stimulus_count', 'integer')
    .addColumn('manifest', 'jsonb')
    .addColumn('created_by', 'uuid', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('started_at', 'timestamptz')
    .addColumn('finished_at', 'timestamptz')
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addCheckConstraint('packs_state', sql`state IN ('queued', 'running', 'succeeded', 'failed', 'cancelled')`)
    .addCheckConstraint('packs_progress', sql`progress BETWEEN 0 AND 1`)
    .addUniqueConstraint('packs_edition_options', ['edition_id', 'options_hash'])
    .execute();
  await db.schema.createIndex('packs_lab_created').on('packs').columns(['lab_id', 'created_at', 'id']).execute();
  // The manifest can be queried: e.g. packs whose manifest names a given stimulus or boundary.
  await sql`CREATE INDEX packs_manifest ON packs USING gin (manifest jsonb_path_ops)`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('packs').execute();
}
