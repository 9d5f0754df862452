import 'server-only';

/** Who is asking: nobody, or a signed-in user. (Lab API tokens join with their issue.) */
export type Principal = { kind: 'anonymous' } | { kind: 'user'; userId: string };

export const ANONYMOUS: Principal = { kind: 'anonymous' };

/** Resolves the principal of an API request. Sign-in lands with the accounts issue; until then, anonymous. */
export async function getRequestPrincipal(_request: Request): Promise<Principal> {
  return ANONYMOUS;
}
