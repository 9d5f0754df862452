import 'server-only';
import { AppError, conflict, validationError } from '@/lib/errors';
import type { Db, DbHandle } from '@/db/client';
import { insertAuditEvent } from '@/db/repositories/audit-events';
import {
  expireOpenPasswordResetTokens,
  insertPasswordResetToken,
  lockPasswordResetToken,
  markPasswordResetTokenUsed,
} from '@/db/repositories/auth-tokens';
import { findLabBySlug, insertLab } from '@/db/repositories/labs';
import { insertMembership } from '@/db/repositories/memberships';
import { bumpSessionVersion, findUserByEmail, insertUser, updateUserPassword } from '@/db/repositories/users';
import { createToken, hashPassword, hashToken, verifyPassword } from '../auth/secrets';
import { clearSignInAttempts, consumeSignInAttempt } from '../auth/rate-limit';
import { getEnv } from '../env';
import { sendMail } from '../mail/mailer';
import { passwordResetMail } from '../mail/templates';
import { isUniqueViolation } from '@/db/errors';

/** A reset link is good for one hour. */
const PASSWORD_RESET_TTL_MS = 60 * 60 * 1000;

export const INVALID_CREDENTIALS_MESSAGE = 'That e-mail and password do not match an account.';

export interface SessionUser {
  id: string;
  email: string;
  name: string;
  sessionVersion: number;
}

/** Turns a lab name into a unique slug (`halden-form`, `halden-form-2`, …). */
async function uniqueLabSlug(db: DbHandle, name: string): Promise<string> {
  const base =
    name
      .toLowerCase()
      .normalize('NFKD')
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-+|-+$/g, '')
      .slice(0, 40) || 'lab';
  for (let i = 1; i < 1000; i++) {
    const slug = i === 1 ? (base.length >= 2 ? base : `${base}-lab`) : `${base}-${i}`;
    if (!(await findLabBySlug(db, slug))) return slug;
  }
  throw conflict('lab', 'Could not find a free address for the lab; choose another name.');
}

/** Sign-up: a new user and a new lab in which they are Owner, in one transaction. */
export async function signUp(
  db: Db,
  input: { name: string; email: string; password: string; labName: string },
): Promise<{ userId: string; labSlug: string }> {
  const passwordHash = await hashPassword(input.password);
  try {
    return await db.transaction().execute(async (trx) => {
      if (await findUserByEmail(trx, input.email)) {
        throw conflict('account', 'An account with that e-mail already exists.', { email: ['Already registered — sign in instead'] });
      }
      const user = await insertUser(trx, { email: input.email, name: input.name, passwordHash });
      const slug = await uniqueLabSlug(trx, input.labName);
      const lab = await insertLab(trx, { slug, name: input.labName });
      await insertMembership(trx, lab.id, user.id, 'owner');
      await insertAuditEvent(trx, { labId: lab.id, actorUserId: user.id, action: 'lab.create', subjectType: 'lab', subjectId: lab.id, details: { name: lab.name } });
      return { userId: user.id, labSlug: lab.slug };
    });
  } catch (error) {
    // Two sign-ups racing on one address: the unique index decides.
    if (isUniqueViolation(error)) {
      throw conflict('account', 'An account with that e-mail already exists.', { email: ['Already registered — sign in instead'] });
    }
    throw error;
  }
}

/**
 * Checks e-mail and password for the credentials provider. Unknown e-mail and wrong password give the same
 * answer after the same work (one bcrypt compare); attempts are rate-limited per e-mail and per IP.
 */
export async function verifyCredentials(db: Db, email: string, password: string, ip: string): Promise<SessionUser> {
  const address = email.trim().toLowerCase();
  await consumeSignInAttempt(address, ip);
  const user = await findUserByEmail(db, address);
  const ok = await verifyPassword(password, user?.password_hash ?? null);
  if (!ok || !user) throw new AppError('unauthenticated:credentials', INVALID_CREDENTIALS_MESSAGE);
  await clearSignInAttempts(address);
  return { id: user.id, email: user.email, name: user.name, sessionVersion: user.session_version };
}

/** Sends a reset link when the account exists; answers the same either way. */
export async function requestPasswordReset(db: Db, email: string): Promise<void> {
  const user = await findUserByEmail(db, email);
  if (!user) return;
  const token = createToken();
  await insertPasswordResetToken(db, { userId: user.id, tokenHash: hashToken(token), expiresAt: new Date(Date.now() + PASSWORD_RESET_TTL_MS) });
  const url = `${getEnv().APP_URL}/reset-password?token=${encodeURIComponent(token)}`;
  await sendMail(passwordResetMail({ to: user.email, url }));
}

/** Spends a reset token (once, before it expires), sets the password and signs out every other session. */
export async function resetPassword(db: Db, token: string, password: string): Promise<void> {
  const refuse = () => validationError('password-reset', 'This reset link has expired or was already used. Ask for a new one.', { token: ['Expired or already used'] });
  const isUsable = (row: Awaited<ReturnType<typeof lockPasswordResetToken>>) => row !== undefined && !row.used_at && row.expires_at.getTime() >= Date.now();
  // A made-up link is refused before the costly hash, so anyone cannot make the server hash at will; the check is
  // repeated under the row lock below.
  if (!isUsable(await lockPasswordResetToken(db, hashToken(token)))) throw refuse();
  const passwordHash = await hashPassword(password);
  await db.transaction().execute(async (trx) => {
    const row = await lockPasswordResetToken(trx, hashToken(token));
    if (!row || !isUsable(row)) throw refuse();
    await markPasswordResetTokenUsed(trx, row.id);
    await expireOpenPasswordResetTokens(trx, row.user_id);
    await updateUserPassword(trx, row.user_id, passwordHash);
    await insertAuditEvent(trx, { labId: null, actorUserId: row.user_id, action: 'user.password-reset', subjectType: 'user', subjectId: row.user_id });
  });
}

/** Ends every session of the user, this one included. */
export async function signOutEverywhere(db: Db, userId: string): Promise<void> {
  await db.transaction().execute(async (trx) => {
    await bumpSessionVersion(trx, userId);
    await insertAuditEvent(trx, { labId: null, actorUserId: userId, action: 'user.sign-out-everywhere', subjectType: 'user', subjectId: userId });
  });
}
