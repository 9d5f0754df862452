import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  // The hash of the invite token a session was started from. Its later requests must come under the same token, so
  // a session code works only on its own study's link; a link the lab replaces keeps working for the sessions
  // already started from it. Sessions started before this column existed get the study's current link when they
  // began under it, and otherwise none (their code alone admits them, as before).
  await db.schema.alterTable('study_sessions').addColumn('invite_token_hash', 'text').execute();
  await sql`
    UPDATE study_sessions AS s SET invite_token_hash = st.invite_token_hash
    FROM studies AS st
    WHERE s.study_id = st.id AND st.invite_token_hash IS NOT NULL
      AND (st.invite_rotated_at IS NULL OR s.started_at >= st.invite_rotated_at)
  `.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('study_sessions').dropColumn('invite_token_hash').execute();
}
