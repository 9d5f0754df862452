import 'server-only';
import { createHash, randomBytes } from 'node:crypto';
import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';
import { findApiTokenByHash, touchApiToken } from '@/db/repositories/api-tokens';
import { AppError } from '@/lib/errors';
import { getDb, getPool } from '../db';
import { getEnv } from '../env';
import type { Principal } from './principal';

/** Every token starts so, which makes a leaked one easy to search for in code and logs. */
export const API_TOKEN_PREFIX = 'epk_';
/** Characters of a token kept in the clear, to tell tokens apart in lists. */
const SHOWN_PREFIX_LENGTH = API_TOKEN_PREFIX.length + 6;
const TOKEN_PATTERN = /^epk_[A-Za-z0-9_-]{43}$/;

/** A new token: 32 random bytes, and what is stored of it (its SHA-256 and its first characters). */
export function mintApiToken(): { token: string; hash: string; prefix: string } {
  const token = API_TOKEN_PREFIX + randomBytes(32).toString('base64url');
  return { token, hash: hashApiToken(token), prefix: token.slice(0, SHOWN_PREFIX_LENGTH) };
}

export function hashApiToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

/** The token of an `Authorization: Bearer …` header; undefined when the request has no Authorization header. */
export function bearerTokenOf(header: string | null): string | undefined {
  if (header === null) return undefined;
  const m = /^Bearer\s+(\S+)\s*$/i.exec(header);
  return m?.[1] ?? '';
}

const tokenRejected = (message: string) => new AppError('unauthenticated:token', message, { headers: { 'www-authenticate': 'Bearer realm="epicycle"' } });

const holder = globalThis as unknown as { __epicycleTokenLimiter?: RateLimiterPostgres };

function limiter(): RateLimiterPostgres {
  holder.__epicycleTokenLimiter ??= new RateLimiterPostgres({
    storeClient: getPool(),
    tableName: 'rate_limits',
    tableCreated: true,
    clearExpiredByTimeout: false,
    keyPrefix: 'api-token',
    points: getEnv().API_TOKEN_REQUESTS_PER_MINUTE,
    duration: 60,
  });
  return holder.__epicycleTokenLimiter;
}

/** Counts one request of a token; 429 with Retry-After once its minute's allowance is spent. */
async function consumeTokenRequest(tokenId: string): Promise<void> {
  try {
    await limiter().consume(tokenId);
  } catch (error) {
    if (error instanceof RateLimiterRes) {
      const seconds = Math.max(1, Math.ceil(error.msBeforeNext / 1000));
      throw new AppError('rate_limited:token', `This token made more than ${getEnv().API_TOKEN_REQUESTS_PER_MINUTE} requests in a minute. Try again in ${seconds} s.`, {
        headers: { 'retry-after': String(seconds) },
      });
    }
    throw error;
  }
}

/**
 * The principal of a bearer token. A malformed, unknown, revoked or expired token is 401 with a message that
 * says which (none of them reveals anything about a lab); a token over its rate is 429. A good one's use is
 * recorded.
 */
export async function principalFromBearer(token: string): Promise<Principal> {
  if (!TOKEN_PATTERN.test(token)) throw tokenRejected('The bearer token is malformed. Lab API tokens start with epk_ and are 47 characters long.');
  const db = getDb();
  const row = await findApiTokenByHash(db, hashApiToken(token));
  if (!row) throw tokenRejected('This API token is not known. It may have been mistyped, or its lab deleted.');
  if (row.revoked_at) throw tokenRejected('This API token was revoked. Ask a lab Owner for a new one.');
  const now = new Date();
  if (row.expires_at.getTime() <= now.getTime()) throw tokenRejected('This API token has expired. Ask a lab Owner for a new one.');
  await consumeTokenRequest(row.id);
  await touchApiToken(db, row.id, now);
  return { kind: 'token', tokenId: row.id, labId: row.lab_id, labSlug: row.lab_slug, scope: row.scope, userId: row.created_by };
}
