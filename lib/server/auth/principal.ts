import 'server-only';
import { cookies } from 'next/headers';
import type { ApiTokenScope } from '@/lib/schemas/api-token';
import { principalFromBearer, bearerTokenOf } from './api-token-auth';
import { principalFromSessionToken, readCookie, sessionCookieName } from './session';

/**
 * Who is asking: nobody, a signed-in user, or a lab API token (which acts in its own lab only, for the member who
 * made it, within its scope).
 */
export type Principal =
  | { kind: 'anonymous' }
  | { kind: 'user'; userId: string }
  | { kind: 'token'; tokenId: string; labId: string; labSlug: string; scope: ApiTokenScope; userId: string };

export const ANONYMOUS: Principal = { kind: 'anonymous' };

/**
 * Resolves the principal of an API request: a bearer token when the request carries an Authorization header
 * (a bad one is 401, never a fall-back to the cookie), else its session cookie.
 */
export function getRequestPrincipal(request: { headers: { get(name: string): string | null } }): Promise<Principal> {
  const bearer = bearerTokenOf(request.headers.get('authorization'));
  if (bearer !== undefined) return principalFromBearer(bearer);
  return principalFromSessionToken(readCookie(request.headers.get('cookie'), sessionCookieName()));
}

/** Resolves the principal of a page render or server action from the request cookies. */
export async function getPagePrincipal(): Promise<Principal> {
  const store = await cookies();
  return principalFromSessionToken(store.get(sessionCookieName())?.value);
}
