import 'server-only';
import { createHmac, randomBytes } from 'node:crypto';
import { hashToken } from './auth/secrets';
import { getEnv } from './env';

/** Random bytes of a nonce (128 bits): rotating draws a new one, and the old link stops working. */
const NONCE_BYTES = 16;

const key = () => createHmac('sha256', getEnv().AUTH_SECRET).update('epicycle study invites v1').digest();

/**
 * A study's invite token: the HMAC of a random nonce under the app secret. The database keeps the nonce and the
 * token's SHA-256 (for look-up), never the token, so a copy of the database alone opens no study; the app can
 * show the link again to the lab at any time.
 */
export function inviteTokenOf(nonce: string): string {
  return createHmac('sha256', key()).update(nonce).digest('base64url');
}

/** A fresh invite: the nonce to store, the hash to look the token up by, and the token itself. */
export function newInvite(): { nonce: string; tokenHash: string; token: string } {
  const nonce = randomBytes(NONCE_BYTES).toString('base64url');
  const token = inviteTokenOf(nonce);
  return { nonce, token, tokenHash: hashToken(token) };
}

/** The hash a participant's token is looked up by (the next step, the participant session, uses it). */
export function inviteTokenHash(token: string): string {
  return hashToken(token);
}

export function inviteUrl(nonce: string): string {
  return `${getEnv().APP_URL}/join/${inviteTokenOf(nonce)}`;
}
