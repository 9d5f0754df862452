import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('display_profiles')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('lab_id', 'uuid', (c) => c.notNull().references('labs.id').onDelete('cascade'))
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('width_px', 'integer', (c) => c.notNull())
    .addColumn('height_px', 'integer', (c) => c.notNull())
    // Exactly one of the physical width and the pixel density gives the pixel pitch.
    .addColumn('width_cm', 'double precision')
    .addColumn('pixels_per_cm', 'double precision')
    .addColumn('viewing_distance_cm', 'double precision', (c) => c.notNull())
    .addColumn('notes', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('version', 'integer', (c) => c.notNull().defaultTo(1))
    .addColumn('created_by', 'uuid', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('updated_by', 'uuid', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addCheckConstraint('display_profiles_resolution', sql`width_px BETWEEN 1 AND 32768 AND height_px BETWEEN 1 AND 32768`)
    .addCheckConstraint('display_profiles_pitch', sql`(width_cm IS NULL) <> (pixels_per_cm IS NULL) AND coalesce(width_cm, pixels_per_cm) > 0`)
    .addCheckConstraint('display_profiles_distance', sql`viewing_distance_cm > 0`)
    .execute();
  await sql`CREATE UNIQUE INDEX display_profiles_lab_name ON display_profiles (lab_id, lower(name))`.execute(db);
  await db.schema.createIndex('display_profiles_lab_updated').on('display_profiles').columns(['lab_id', 'updated_at', 'id']).execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('display_profiles').execute();
}
