import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('users')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('email', 'text', (c) => c.notNull())
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('password_hash', 'text')
    .addColumn('email_verified_at', 'timestamptz')
    .addColumn('session_version', 'integer', (c) => c.notNull().defaultTo(1))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addCheckConstraint('users_email_lower', sql`email = lower(email)`)
    .execute();
  await db.schema.createIndex('users_email_unique').on('users').column('email').unique().execute();

  await db.schema
    .createTable('memberships')
    .addColumn('lab_id', 'uuid', (c) => c.notNull().references('labs.id').onDelete('cascade'))
    .addColumn('user_id', 'uuid', (c) => c.notNull().references('users.id').onDelete('cascade'))
    .addColumn('role', 'text', (c) => c.notNull())
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addPrimaryKeyConstraint('memberships_pk', ['lab_id', 'user_id'])
    .addCheckConstraint('memberships_role', sql`role IN ('owner', 'designer', 'experimenter', 'reviewer')`)
    .execute();
  await db.schema.createIndex('memberships_user').on('memberships').column('user_id').execute();

  await db.schema
    .createTable('invitations')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('lab_id', 'uuid', (c) => c.notNull().references('labs.id').onDelete('cascade'))
    .addColumn('email', 'text', (c) => c.notNull())
    .addColumn('role', 'text', (c) => c.notNull())
    .addColumn('token_hash', 'text', (c) => c.notNull().unique())
    .addColumn('invited_by', 'uuid', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('expires_at', 'timestamptz', (c) => c.notNull())
    .addColumn('sent_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('accepted_at', 'timestamptz')
    .addColumn('accepted_by', 'uuid', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('revoked_at', 'timestamptz')
    .addCheckConstraint('invitations_role', sql`role IN ('owner', 'designer', 'experimenter', 'reviewer')`)
    .addCheckConstraint('invitations_email_lower', sql`email = lower(email)`)
    .execute();
  // At most one pending invitation per lab and address.
  await sql`CREATE UNIQUE INDEX invitations_pending_unique ON invitations (lab_id, email)
            WHERE accepted_at IS NULL AND revoked_at IS NULL`.execute(db);

  // next-auth's e-mail sign-in links (the token column holds next-auth's own hash of the token).
  await db.schema
    .createTable('verification_tokens')
    .addColumn('identifier', 'text', (c) => c.notNull())
    .addColumn('token', 'text', (c) => c.notNull())
    .addColumn('expires', 'timestamptz', (c) => c.notNull())
    .addPrimaryKeyConstraint('verification_tokens_pk', ['identifier', 'token'])
    .execute();

  await db.schema
    .createTable('password_reset_tokens')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('user_id', 'uuid', (c) => c.notNull().references('users.id').onDelete('cascade'))
    .addColumn('token_hash', 'text', (c) => c.notNull().unique())
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('expires_at', 'timestamptz', (c) => c.notNull())
    .addColumn('used_at', 'timestamptz')
    .execute();

  // The store of rate-limiter-flexible's RateLimiterPostgres (its own layout, created here rather than at run time).
  await sql`CREATE TABLE rate_limits (key varchar(255) PRIMARY KEY, points integer NOT NULL DEFAULT 0, expire bigint)`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('rate_limits').execute();
  await db.schema.dropTable('password_reset_tokens').execute();
  await db.schema.dropTable('verification_tokens').execute();
  await db.schema.dropTable('invitations').execute();
  await db.schema.dropTable('memberships').execute();
  await db.schema.dropTable('users').execute();
}
