import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  // Participant indices are handed out from this counter (under the study's row lock), so an index is never
  // given twice, even after a withdrawn session's row is deleted.
  await db.schema.alterTable('studies').addColumn('participants_started', 'integer', (c) => c.notNull().defaultTo(0)).execute();

  await db.schema
    .createTable('study_sessions')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('study_id', 'uuid', (c) => c.notNull().references('studies.id').onDelete('cascade'))
    .addColumn('participant_index', 'integer', (c) => c.notNull())
    // SHA-256 of the session code the participant keeps (to resume or withdraw); the code itself is never stored.
    .addColumn('code_hash', 'text', (c) => c.notNull().unique())
    .addColumn('planned_trials', 'integer', (c) => c.notNull())
    .addColumn('stored_trials', 'integer', (c) => c.notNull().defaultTo(0))
    // Screen check: px per mm, viewing distance, refresh rate and how the distance was found (null once withdrawn).
    .addColumn('screen', 'jsonb')
    .addColumn('started_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('last_seen_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('completed_at', 'timestamptz')
    .addColumn('finish_code', 'text')
    .addColumn('withdrawn_at', 'timestamptz')
    .addColumn('is_excluded', 'boolean', (c) => c.notNull().defaultTo(false))
    .addColumn('exclusion_reason', 'text')
    .addColumn('excluded_by', 'uuid', (c) => c.references('users.id').onDelete('set null'))
    .addUniqueConstraint('study_sessions_participant', ['study_id', 'participant_index'])
    .addCheckConstraint('study_sessions_counts', sql`stored_trials BETWEEN 0 AND planned_trials AND planned_trials >= 1`)
    .addCheckConstraint('study_sessions_finish', sql`(completed_at IS NULL) = (finish_code IS NULL)`)
    .addCheckConstraint('study_sessions_exclusion', sql`is_excluded = false OR length(exclusion_reason) >= 1`)
    .execute();
  await db.schema.createIndex('study_sessions_study_started').on('study_sessions').columns(['study_id', 'started_at', 'id']).execute();

  await db.schema
    .createTable('trial_responses')
    .addColumn('session_id', 'uuid', (c) => c.notNull().references('study_sessions.id').onDelete('cascade'))
    .addColumn('client_trial_id', 'uuid', (c) => c.notNull())
    .addColumn('trial_index', 'integer', (c) => c.notNull())
    .addColumn('task', 'text', (c) => c.notNull())
    .addColumn('is_practice', 'boolean', (c) => c.notNull())
    .addColumn('is_catch', 'boolean', (c) => c.notNull())
    .addColumn('response_key', 'text')
    .addColumn('rating', 'integer')
    .addColumn('rt_ms', 'double precision')
    .addColumn('is_correct', 'boolean')
    .addColumn('achieved_ms', 'double precision', (c) => c.notNull())
    .addColumn('onset_ms', 'double precision', (c) => c.notNull())
    .addColumn('offset_ms', 'double precision', (c) => c.notNull())
    .addColumn('was_tab_hidden', 'boolean', (c) => c.notNull())
    .addColumn('left_full_screen', 'boolean', (c) => c.notNull())
    .addColumn('received_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addPrimaryKeyConstraint('trial_responses_pk', ['session_id', 'client_trial_id'])
    // One answer per planned trial: a retry under another id is refused like a repeat of the same id.
    .addUniqueConstraint('trial_responses_trial', ['session_id', 'trial_index'])
    .addCheckConstraint('trial_responses_task', sql`task IN ('categorisation', 'similarity')`)
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('trial_responses').execute();
  await db.schema.dropTable('study_sessions').execute();
  await db.schema.alterTable('studies').dropColumn('participants_started').execute();
}
