import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('lab_api_tokens')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('lab_id', 'uuid', (c) => c.notNull().references('labs.id').onDelete('cascade'))
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('scope', 'text', (c) => c.notNull())
    // SHA-256 of the whole token (hex); the token itself is shown once and never stored.
    .addColumn('token_hash', 'text', (c) => c.notNull().unique())
    // The first characters, so a list can tell tokens apart without holding them.
    .addColumn('token_prefix', 'text', (c) => c.notNull())
    .addColumn('created_by', 'uuid', (c) => c.notNull().references('users.id').onDelete('cascade'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('expires_at', 'timestamptz', (c) => c.notNull())
    .addColumn('last_used_at', 'timestamptz')
    .addColumn('revoked_at', 'timestamptz')
    .addColumn('revoked_by', 'uuid', (c) => c.references('users.id').onDelete('set null'))
    .addCheckConstraint('lab_api_tokens_scope', sql`scope IN ('read', 'write')`)
    .addCheckConstraint('lab_api_tokens_expiry', sql`expires_at > created_at`)
    .execute();
  await db.schema.createIndex('lab_api_tokens_lab_created').on('lab_api_tokens').columns(['lab_id', 'created_at', 'id']).execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('lab_api_tokens').execute();
}
