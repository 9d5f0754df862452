import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('seed_shapes')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('lab_id', 'uuid', (c) => c.notNull().references('labs.id').onDelete('cascade'))
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('family', 'text', (c) => c.notNull())
    .addColumn('harmonic_count', 'integer', (c) => c.notNull())
    .addColumn('descriptor', 'jsonb', (c) => c.notNull())
    .addColumn('origin', 'jsonb', (c) => c.notNull().defaultTo(sql`'{"kind":"editor"}'::jsonb`))
    .addColumn('version', 'integer', (c) => c.notNull().defaultTo(1))
    .addColumn('created_by', 'uuid', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('updated_by', 'uuid', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addCheckConstraint('seed_shapes_family', sql`family IN ('radial', 'elliptic', 'complex')`)
    .addCheckConstraint('seed_shapes_descriptor_family', sql`descriptor->>'family' = family`)
    .execute();
  await db.schema.createIndex('seed_shapes_lab_updated').on('seed_shapes').columns(['lab_id', 'updated_at', 'id']).execute();
  await sql`CREATE UNIQUE INDEX seed_shapes_lab_name ON seed_shapes (lab_id, lower(name))`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('seed_shapes').execute();
}
