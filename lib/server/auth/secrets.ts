import 'server-only';
import { createHash, randomBytes } from 'node:crypto';
import bcrypt from 'bcryptjs';

/** bcrypt cost: about 0.2 s per hash on this class of machine, the usual target for interactive sign-in. */
const BCRYPT_COST = 12;
/** Random bytes in an e-mailed token (256 bits). */
const TOKEN_BYTES = 32;

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, BCRYPT_COST);
}

// A hash of a random string, compared against when the e-mail is unknown, so both paths cost one bcrypt compare.
const DUMMY_HASH = bcrypt.hashSync(randomBytes(16).toString('hex'), BCRYPT_COST);

/** Compares in constant work whether or not the user exists (pass `null` for an unknown user). */
export async function verifyPassword(password: string, hash: string | null): Promise<boolean> {
  const ok = await bcrypt.compare(password, hash ?? DUMMY_HASH);
  return ok && hash !== null;
}

/** A url-safe random token for links sent by e-mail. */
export function createToken(): string {
  return randomBytes(TOKEN_BYTES).toString('base64url');
}

/** Tokens are stored only as their SHA-256. */
export function hashToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}
