import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  // A space made from a norming study's perceptual equalisation, and the study that motivated it. The study's
  // name is kept, so the link still reads after the study is deleted.
  await db.schema
    .createTable('space_study_links')
    .addColumn('space_id', 'uuid', (c) => c.primaryKey().references('shape_spaces.id').onDelete('cascade'))
    .addColumn('lab_id', 'uuid', (c) => c.notNull().references('labs.id').onDelete('cascade'))
    .addColumn('study_id', 'uuid', (c) => c.references('studies.id').onDelete('set null'))
    .addColumn('study_name', 'text', (c) => c.notNull())
    .addColumn('edition_id', 'uuid', (c) => c.references('editions.id').onDelete('set null'))
    .addColumn('basis', 'text', (c) => c.notNull())
    // The suggestion as applied: per-direction rates and scales, the ratios before and (predicted) after.
    .addColumn('suggestion', 'jsonb', (c) => c.notNull())
    .addColumn('created_by', 'uuid', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addCheckConstraint('space_study_links_basis', sql`basis IN ('slopes', 'map')`)
    .execute();
  await db.schema.createIndex('space_study_links_study').on('space_study_links').column('study_id').execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('space_study_links').execute();
}
