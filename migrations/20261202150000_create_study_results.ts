import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  // The analysis settings of a study (link, lapse, resamples, seed, exclusion rules), one row per study.
  await db.schema
    .createTable('study_result_settings')
    .addColumn('study_id', 'uuid', (c) => c.primaryKey().references('studies.id').onDelete('cascade'))
    .addColumn('settings', 'jsonb', (c) => c.notNull())
    .addColumn('updated_by', 'uuid', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();

  // Manual exclusion decisions: a session or one of its trials left out, or an automatic exclusion overridden
  // ("keep"). Rows are never deleted while the session exists; a removal is recorded on the row.
  await db.schema
    .createTable('study_exclusions')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('study_id', 'uuid', (c) => c.notNull().references('studies.id').onDelete('cascade'))
    .addColumn('session_id', 'uuid', (c) => c.notNull().references('study_sessions.id').onDelete('cascade'))
    .addColumn('trial_index', 'integer')
    .addColumn('action', 'text', (c) => c.notNull())
    .addColumn('reason', 'text', (c) => c.notNull())
    .addColumn('created_by', 'uuid', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('removed_at', 'timestamptz')
    .addColumn('removed_by', 'uuid', (c) => c.references('users.id').onDelete('set null'))
    .addCheckConstraint('study_exclusions_action', sql`action IN ('exclude', 'keep')`)
    .addCheckConstraint('study_exclusions_reason', sql`length(reason) BETWEEN 1 AND 500`)
    .addCheckConstraint('study_exclusions_trial', sql`trial_index IS NULL OR trial_index >= 0`)
    .execute();
  await db.schema.createIndex('study_exclusions_study_created').on('study_exclusions').columns(['study_id', 'created_at', 'id']).execute();

  // Computed results, cached by the SHA-256 of their input (the data after exclusions and the options): the same
  // data and options are never computed twice. Long computations run as jobs and report progress here.
  await db.schema
    .createTable('study_results')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('study_id', 'uuid', (c) => c.notNull().references('studies.id').onDelete('cascade'))
    .addColumn('data_hash', 'text', (c) => c.notNull())
    .addColumn('state', 'text', (c) => c.notNull())
    .addColumn('progress', 'double precision', (c) => c.notNull().defaultTo(0))
    .addColumn('input', 'jsonb', (c) => c.notNull())
    .addColumn('result', 'jsonb')
    .addColumn('error', 'text')
    .addColumn('job_id', 'text')
    .addColumn('compute_ms', 'integer')
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addUniqueConstraint('study_results_hash', ['study_id', 'data_hash'])
    .addCheckConstraint('study_results_state', sql`state IN ('queued', 'running', 'ready', 'failed')`)
    .addCheckConstraint('study_results_progress', sql`progress BETWEEN 0 AND 1`)
    .addCheckConstraint('study_results_ready', sql`(state = 'ready') = (result IS NOT NULL)`)
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('study_results').execute();
  await db.schema.dropTable('study_exclusions').execute();
  await db.schema.dropTable('study_result_settings').execute();
}
