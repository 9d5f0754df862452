import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('studies')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('lab_id', 'uuid', (c) => c.notNull().references('labs.id').onDelete('cascade'))
    .addColumn('edition_id', 'uuid', (c) => c.notNull().references('editions.id').onDelete('restrict'))
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('state', 'text', (c) => c.notNull().defaultTo('draft'))
    // The tasks, their timing, the stimulus size and the seed; participants' plans are regenerated from it.
    .addColumn('design', 'jsonb', (c) => c.notNull())
    // Set when the edition was not Approved at setup, and kept with the study.
    .addColumn('edition_warning', 'text')
    .addColumn('consent_text', 'text', (c) => c.notNull())
    .addColumn('instructions_text', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('debrief_text', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('finish_code_prefix', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('target_participants', 'integer', (c) => c.notNull())
    // The invite link's token is an HMAC of this random nonce (recomputable by the app, never stored itself);
    // its SHA-256 is what a participant's link is looked up by. Both null: no active link.
    .addColumn('invite_nonce', 'text')
    .addColumn('invite_token_hash', 'text', (c) => c.unique())
    .addColumn('invite_rotated_at', 'timestamptz')
    .addColumn('version', 'integer', (c) => c.notNull().defaultTo(1))
    .addColumn('created_by', 'uuid', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('updated_by', 'uuid', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('opened_at', 'timestamptz')
    .addColumn('closed_at', 'timestamptz')
    .addCheckConstraint('studies_state', sql`state IN ('draft', 'open', 'closed')`)
    .addCheckConstraint('studies_name', sql`length(name) BETWEEN 1 AND 120`)
    .addCheckConstraint('studies_consent', sql`length(consent_text) >= 1`)
    .addCheckConstraint('studies_target', sql`target_participants >= 1`)
    .addCheckConstraint('studies_invite', sql`(invite_nonce IS NULL) = (invite_token_hash IS NULL)`)
    .execute();
  await db.schema.createIndex('studies_lab_updated').on('studies').columns(['lab_id', 'updated_at', 'id']).execute();

  // Opening fixes the design: the database refuses a changed design or edition once a study left Draft,
  // and allows only Draft → Open → Closed. Open and Closed studies are records and are not deleted.
  await sql`
    CREATE FUNCTION studies_guard() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF TG_OP = 'DELETE' THEN
        IF OLD.state <> 'draft' THEN
          RAISE EXCEPTION 'only a Draft study can be deleted' USING ERRCODE = 'P0001';
        END IF;
        RETURN OLD;
      END IF;
      IF OLD.state <> 'draft' AND (NEW.design IS DISTINCT FROM OLD.design OR NEW.edition_id IS DISTINCT FROM OLD.edition_id
         OR NEW.edition_warning IS DISTINCT FROM OLD.edition_warning) THEN
        RAISE EXCEPTION 'a study''s design is fixed once it is open' USING ERRCODE = 'P0001';
      END IF;
      IF NEW.lab_id IS DISTINCT FROM OLD.lab_id OR NEW.created_at IS DISTINCT FROM OLD.created_at THEN
        RAISE EXCEPTION 'a study cannot move' USING ERRCODE = 'P0001';
      END IF;
      IF NEW.state IS DISTINCT FROM OLD.state AND NOT (
           (OLD.state = 'draft' AND NEW.state = 'open') OR (OLD.state = 'open' AND NEW.state = 'closed')) THEN
        RAISE EXCEPTION 'no transition from % to %', OLD.state, NEW.state USING ERRCODE = 'P0001';
      END IF;
      RETURN NEW;
    END $$`.execute(db);
  await sql`CREATE TRIGGER studies_guard BEFORE UPDATE OR DELETE ON studies FOR EACH ROW EXECUTE FUNCTION studies_guard()`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('studies').execute();
  await sql`DROP FUNCTION studies_guard()`.execute(db);
}
