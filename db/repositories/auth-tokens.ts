import type { DbHandle } from '../client';

/** next-auth verification tokens (sign-in links); the token column already holds next-auth's hash. */
export async function insertVerificationToken(db: DbHandle, t: { identifier: string; token: string; expires: Date }) {
  await db.insertInto('verification_tokens').values(t).execute();
}

/** Deletes and returns the token: a sign-in link works once. */
export function takeVerificationToken(db: DbHandle, identifier: string, token: string) {
  return db
    .deleteFrom('verification_tokens')
    .where('identifier', '=', identifier)
    .where('token', '=', token)
    .returningAll()
    .executeTakeFirst();
}

export async function insertPasswordResetToken(db: DbHandle, t: { userId: string; tokenHash: string; expiresAt: Date }) {
  await db
    .insertInto('password_reset_tokens')
    .values({ user_id: t.userId, token_hash: t.tokenHash, expires_at: t.expiresAt })
    .execute();
}

/** Locks an unused reset token for the transaction that spends it. */
export function lockPasswordResetToken(db: DbHandle, tokenHash: string) {
  return db
    .selectFrom('password_reset_tokens')
    .selectAll()
    .where('token_hash', '=', tokenHash)
    .forUpdate()
    .executeTakeFirst();
}

export async function markPasswordResetTokenUsed(db: DbHandle, id: string) {
  await db.updateTable('password_reset_tokens').set({ used_at: new Date() }).where('id', '=', id).execute();
}

/** Spends every other open reset token of the user once one has been used. */
export async function expireOpenPasswordResetTokens(db: DbHandle, userId: string) {
  await db
    .updateTable('password_reset_tokens')
    .set({ used_at: new Date() })
    .where('user_id', '=', userId)
    .where('used_at', 'is', null)
    .execute();
}
