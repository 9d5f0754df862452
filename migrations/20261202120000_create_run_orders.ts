import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('run_orders')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('lab_id', 'uuid', (c) => c.notNull().references('labs.id').onDelete('cascade'))
    .addColumn('edition_id', 'uuid', (c) => c.notNull().references('editions.id').onDelete('restrict'))
    .addColumn('name', 'text', (c) => c.notNull())
    // Conditions, sequence type, timing, runs, BIDS labels and the seed: the same definition always rebuilds the same order.
    .addColumn('definition', 'jsonb', (c) => c.notNull())
    .addColumn('state', 'text', (c) => c.notNull().defaultTo('ready'))
    .addColumn('error', 'text')
    .addColumn('job_id', 'uuid')
    // The built order (trials, summaries); kept so a long type-1 index-1 search is not repeated on every download.
    .addColumn('result', 'jsonb')
    .addColumn('version', 'integer', (c) => c.notNull().defaultTo(1))
    .addColumn('created_by', 'uuid', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addCheckConstraint('run_orders_state', sql`state IN ('ready', 'queued', 'running', 'failed')`)
    .addCheckConstraint('run_orders_name', sql`length(name) BETWEEN 1 AND 120`)
    .execute();
  await db.schema.createIndex('run_orders_edition_created').on('run_orders').columns(['edition_id', 'created_at', 'id']).execute();
  await db.schema.createIndex('run_orders_lab').on('run_orders').column('lab_id').execute();
  // Run order files attached to a pack, copied when the pack is asked for, so a later edit never changes a pack.
  await db.schema.alterTable('packs').addColumn('sequences', 'jsonb', (c) => c.notNull().defaultTo(sql`'[]'::jsonb`)).execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('packs').dropColumn('sequences').execute();
  await db.schema.dropTable('run_orders').execute();
}
