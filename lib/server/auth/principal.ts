import 'server-only';
import { cookies } from 'next/headers';
import { principalFromSessionToken, readCookie, sessionCookieName } from './session';

/** Who is asking: nobody, or a signed-in user. (Lab API tokens join with their issue.) */
export type Principal = { kind: 'anonymous' } | { kind: 'user'; userId: string };

export const ANONYMOUS: Principal = { kind: 'anonymous' };

/** Resolves the principal of an API request from its session cookie. */
export function getRequestPrincipal(request: Request): Promise<Principal> {
  return principalFromSessionToken(readCookie(request.headers.get('cookie'), sessionCookieName()));
}

/** Resolves the principal of a page render or server action from the request cookies. */
export async function getPagePrincipal(): Promise<Principal> {
  const store = await cookies();
  return principalFromSessionToken(store.get(sessionCookieName())?.value);
}
