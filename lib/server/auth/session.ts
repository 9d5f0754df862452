import 'server-only';
import { decode } from 'next-auth/jwt';
import { findUserById } from '@/db/repositories/users';
import { getDb } from '../db';
import { getEnv } from '../env';
import type { Principal } from './principal';

const ANONYMOUS: Principal = { kind: 'anonymous' };

/** The JWT carries only the user id and the session version; everything else is read per request. */
export interface SessionClaims {
  uid: string;
  sv: number;
}

/** next-auth's cookie name: the `__Secure-` form whenever the app is served over https. */
export function sessionCookieName(): string {
  return getEnv().APP_URL.startsWith('https://') ? '__Secure-next-auth.session-token' : 'next-auth.session-token';
}

/**
 * Decodes a session token and checks it against the user's current session version, so "sign out everywhere"
 * and a password change end old sessions at once. A tampered or stale token is anonymous.
 */
export async function principalFromSessionToken(token: string | undefined): Promise<Principal> {
  if (!token) return ANONYMOUS;
  let claims: Partial<SessionClaims> | null = null;
  try {
    claims = (await decode({ token, secret: getEnv().AUTH_SECRET })) as Partial<SessionClaims> | null;
  } catch {
    return ANONYMOUS;
  }
  if (!claims || typeof claims.uid !== 'string' || typeof claims.sv !== 'number') return ANONYMOUS;
  const user = await findUserById(getDb(), claims.uid);
  if (!user || user.session_version !== claims.sv) return ANONYMOUS;
  return { kind: 'user', userId: user.id };
}

/** Reads one cookie from a Cookie header. */
export function readCookie(header: string | null, name: string): string | undefined {
  if (!header) return undefined;
  for (const part of header.split(';')) {
    const eq = part.indexOf('=');
    if (eq > 0 && part.slice(0, eq).trim() === name) return decodeURIComponent(part.slice(eq + 1).trim());
  }
  return undefined;
}
