import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('shape_spaces')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('lab_id', 'uuid', (c) => c.notNull().references('labs.id').onDelete('cascade'))
    .addColumn('name', 'text', (c) => c.notNull())
    // A seed shape cannot be deleted while a space is built on it.
    .addColumn('seed_shape_id', 'uuid', (c) => c.notNull().references('seed_shapes.id').onDelete('restrict'))
    .addColumn('settings', 'jsonb', (c) => c.notNull())
    .addColumn('equalization', 'jsonb')
    .addColumn('anisotropy', 'jsonb', (c) => c.notNull().defaultTo(sql`'{"designed":null,"equalized":null}'::jsonb`))
    .addColumn('stimulus_count', 'integer', (c) => c.notNull())
    .addColumn('version', 'integer', (c) => c.notNull().defaultTo(1))
    .addColumn('created_by', 'uuid', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('updated_by', 'uuid', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addCheckConstraint('shape_spaces_stimulus_count', sql`stimulus_count BETWEEN 1 AND 2000`)
    .execute();
  await db.schema.createIndex('shape_spaces_lab_updated').on('shape_spaces').columns(['lab_id', 'updated_at', 'id']).execute();
  await db.schema.createIndex('shape_spaces_seed').on('shape_spaces').column('seed_shape_id').execute();
  await sql`CREATE UNIQUE INDEX shape_spaces_lab_name ON shape_spaces (lab_id, lower(name))`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('shape_spaces').execute();
}
