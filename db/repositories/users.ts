import { notFound } from '@/lib/errors';
import type { DbHandle } from '../client';
import type { UserRow } from '../database';

export function findUserById(db: DbHandle, id: string): Promise<UserRow | undefined> {
  return db.selectFrom('users').selectAll().where('id', '=', id).executeTakeFirst();
}

export async function getUserById(db: DbHandle, id: string): Promise<UserRow> {
  const user = await findUserById(db, id);
  if (!user) throw notFound('user', 'No such user.');
  return user;
}

/** Looks a user up by e-mail (stored lower-case). */
export function findUserByEmail(db: DbHandle, email: string): Promise<UserRow | undefined> {
  return db.selectFrom('users').selectAll().where('email', '=', email.toLowerCase()).executeTakeFirst();
}

export function insertUser(
  db: DbHandle,
  user: { email: string; name: string; passwordHash: string | null; emailVerifiedAt?: Date | null },
): Promise<UserRow> {
  return db
    .insertInto('users')
    .values({
      email: user.email.toLowerCase(),
      name: user.name,
      password_hash: user.passwordHash,
      email_verified_at: user.emailVerifiedAt ?? null,
    })
    .returningAll()
    .executeTakeFirstOrThrow();
}

export async function updateUserPassword(db: DbHandle, id: string, passwordHash: string): Promise<void> {
  await db
    .updateTable('users')
    .set((eb) => ({ password_hash: passwordHash, session_version: eb('session_version', '+', 1), updated_at: new Date() }))
    .where('id', '=', id)
    .execute();
}

export async function markEmailVerified(db: DbHandle, id: string, at: Date): Promise<void> {
  await db.updateTable('users').set({ email_verified_at: at, updated_at: new Date() }).where('id', '=', id).execute();
}

/** Invalidates every session of the user by bumping the version their tokens carry. */
export async function bumpSessionVersion(db: DbHandle, id: string): Promise<number> {
  const row = await db
    .updateTable('users')
    .set((eb) => ({ session_version: eb('session_version', '+', 1), updated_at: new Date() }))
    .where('id', '=', id)
    .returning('session_version')
    .executeTakeFirstOrThrow();
  return row.session_version;
}
