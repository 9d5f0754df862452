import 'server-only';
import type { Adapter, AdapterUser } from 'next-auth/adapters';
import type { Db } from '@/db/client';
import type { UserRow } from '@/db/database';
import { insertVerificationToken, takeVerificationToken } from '@/db/repositories/auth-tokens';
import { findUserByEmail, findUserById, markEmailVerified } from '@/db/repositories/users';

/** What next-auth sees of a user; `sessionVersion` rides along into the jwt callback. */
export type EpicycleAdapterUser = AdapterUser & { sessionVersion: number };

function toAdapterUser(u: UserRow): EpicycleAdapterUser {
  return { id: u.id, email: u.email, name: u.name, emailVerified: u.email_verified_at, sessionVersion: u.session_version };
}

/**
 * The small adapter next-auth's e-mail provider needs: verification tokens and users by e-mail. Accounts are made
 * only by sign-up or an invitation, never by a sign-in link, so `createUser` refuses.
 */
export function kyselyAdapter(db: Db): Adapter {
  return {
    async createUser() {
      throw new Error('Accounts are created by sign-up or invitation, not by a sign-in link.');
    },
    async getUser(id) {
      const u = await findUserById(db, id);
      return u ? toAdapterUser(u) : null;
    },
    async getUserByEmail(email) {
      const u = await findUserByEmail(db, email);
      return u ? toAdapterUser(u) : null;
    },
    async getUserByAccount() {
      return null;
    },
    async updateUser(user) {
      if (user.emailVerified) await markEmailVerified(db, user.id, user.emailVerified);
      const u = await findUserById(db, user.id);
      if (!u) throw new Error('user vanished during sign-in');
      return toAdapterUser(u);
    },
    async linkAccount() {
      return undefined;
    },
    async createVerificationToken(token) {
      await insertVerificationToken(db, token);
      return token;
    },
    async useVerificationToken({ identifier, token }) {
      const row = await takeVerificationToken(db, identifier, token);
      return row ?? null;
    },
  };
}
