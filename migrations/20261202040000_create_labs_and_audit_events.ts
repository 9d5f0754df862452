import { type Kysely, sql } from 'kysely';

// Migrations never import app code: they speak to the database as it was at their time.
export async function up(db: Kysely<any>): Promise<void> {
  await sql`CREATE EXTENSION IF NOT EXISTS pgcrypto`.execute(db);

  await db.schema
    .createTable('labs')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('slug', 'text', (c) => c.notNull().unique())
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addCheckConstraint('labs_slug_format', sql`slug ~ '^[a-z0-9]+(-[a-z0-9]+)*$'`)
    .execute();

  await db.schema
    .createTable('audit_events')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('lab_id', 'uuid', (c) => c.references('labs.id').onDelete('cascade'))
    .addColumn('actor_user_id', 'uuid')
    .addColumn('action', 'text', (c) => c.notNull())
    .addColumn('subject_type', 'text', (c) => c.notNull())
    .addColumn('subject_id', 'text')
    .addColumn('details', 'jsonb', (c) => c.notNull().defaultTo(sql`'{}'::jsonb`))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex('audit_events_lab_time').on('audit_events').columns(['lab_id', 'created_at']).execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('audit_events').execute();
  await db.schema.dropTable('labs').execute();
}
