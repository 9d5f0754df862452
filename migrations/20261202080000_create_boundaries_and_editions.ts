import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  // Boundaries belong to the space but are edited apart from its definition (Experimenters may edit them), so
  // they carry their own version for optimistic locking.
  await db.schema
    .alterTable('shape_spaces')
    .addColumn('boundaries', 'jsonb', (c) => c.notNull().defaultTo(sql`'[]'::jsonb`))
    .addColumn('boundaries_version', 'integer', (c) => c.notNull().defaultTo(1))
    .execute();

  await db.schema
    .createTable('editions')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('lab_id', 'uuid', (c) => c.notNull().references('labs.id').onDelete('cascade'))
    // A space cannot be deleted once it has editions: they are the record of what was reviewed.
    .addColumn('space_id', 'uuid', (c) => c.notNull().references('shape_spaces.id').onDelete('restrict'))
    .addColumn('number', 'integer', (c) => c.notNull())
    .addColumn('snapshot', 'jsonb', (c) => c.notNull())
    .addColumn('content_hash', 'text', (c) => c.notNull())
    .addColumn('engine_version', 'text', (c) => c.notNull())
    .addColumn('stimulus_count', 'integer', (c) => c.notNull())
    .addColumn('change_note', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('author_id', 'uuid', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('state', 'text', (c) => c.notNull().defaultTo('draft'))
    .addColumn('submitted_by', 'uuid', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('submitted_at', 'timestamptz')
    .addColumn('decided_by', 'uuid', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('decided_at', 'timestamptz')
    .addColumn('decision_note', 'text')
    .addColumn('superseded_by', 'uuid', (c) => c.references('editions.id').onDelete('set null'))
    .addCheckConstraint('editions_state', sql`state IN ('draft', 'in_review', 'approved', 'returned')`)
    .addCheckConstraint('editions_hash', sql`content_hash ~ '^[0-9a-f]{64}$'`)
    .addCheckConstraint('editions_number', sql`number >= 1`)
    .addUniqueConstraint('editions_space_number', ['space_id', 'number'])
    .execute();
  await db.schema.createIndex('editions_lab_space').on('editions').columns(['lab_id', 'space_id', 'number']).execute();

  // The snapshot and its hash never change after freezing, in any state; only the review fields move, and an
  // Approved or Returned edition's decision is final. Editions are never deleted (a lab's cascade aside).
  await sql`
    CREATE FUNCTION editions_guard() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF TG_OP = 'DELETE' THEN
        RAISE EXCEPTION 'editions are permanent records and cannot be deleted' USING ERRCODE = 'P0001';
      END IF;
      IF NEW.snapshot IS DISTINCT FROM OLD.snapshot
         OR NEW.content_hash IS DISTINCT FROM OLD.content_hash
         OR NEW.engine_version IS DISTINCT FROM OLD.engine_version
         OR NEW.stimulus_count IS DISTINCT FROM OLD.stimulus_count
         OR NEW.number IS DISTINCT FROM OLD.number
         OR NEW.space_id IS DISTINCT FROM OLD.space_id
         OR NEW.lab_id IS DISTINCT FROM OLD.lab_id
         OR NEW.created_at IS DISTINCT FROM OLD.created_at THEN
        RAISE EXCEPTION 'an edition''s snapshot is immutable once frozen' USING ERRCODE = 'P0001';
      END IF;
      IF OLD.state IN ('approved', 'returned') AND (NEW.state IS DISTINCT FROM OLD.state
         OR NEW.decision_note IS DISTINCT FROM OLD.decision_note OR NEW.decided_at IS DISTINCT FROM OLD.decided_at
         OR NEW.change_note IS DISTINCT FROM OLD.change_note) THEN
        RAISE EXCEPTION 'a decided edition cannot change' USING ERRCODE = 'P0001';
      END IF;
      IF NEW.state IS DISTINCT FROM OLD.state AND NOT (
           (OLD.state = 'draft' AND NEW.state = 'in_review')
        OR (OLD.state = 'in_review' AND NEW.state IN ('approved', 'returned'))) THEN
        RAISE EXCEPTION 'no transition from % to %', OLD.state, NEW.state USING ERRCODE = 'P0001';
      END IF;
      RETURN NEW;
    END $$`.execute(db);
  await sql`CREATE TRIGGER editions_guard BEFORE UPDATE OR DELETE ON editions FOR EACH ROW EXECUTE FUNCTION editions_guard()`.execute(db);

  await db.schema
    .createTable('edition_comments')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('lab_id', 'uuid', (c) => c.notNull().references('labs.id').onDelete('cascade'))
    .addColumn('edition_id', 'uuid', (c) => c.notNull().references('editions.id').onDelete('cascade'))
    // Null: a comment on the whole edition; otherwise pinned to one of its stimulus ids.
    .addColumn('stimulus_id', 'text')
    .addColumn('body', 'text', (c) => c.notNull())
    .addColumn('author_id', 'uuid', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('resolved_by', 'uuid', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('resolved_at', 'timestamptz')
    .addCheckConstraint('edition_comments_body', sql`length(body) BETWEEN 1 AND 4000`)
    .execute();
  await db.schema.createIndex('edition_comments_edition').on('edition_comments').columns(['edition_id', 'created_at']).execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('edition_comments').execute();
  await db.schema.dropTable('editions').execute();
  await sql`DROP FUNCTION editions_guard()`.execute(db);
  await db.schema.alterTable('shape_spaces').dropColumn('boundaries').dropColumn('boundaries_version').execute();
}
