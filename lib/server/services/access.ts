import 'server-only';
import { forbidden, notFound, unauthenticated } from '@/lib/errors';
import { findLabMembership } from '@/db/repositories/memberships';
import type { Db } from '@/db/client';
import type { Principal } from '../auth/principal';
import type { ApiTokenScope } from '@/lib/schemas/api-token';
import { can, canWithToken, type PolicyAction, type Role } from '../policy';

/** A signed-in user acting in one lab, with their current role there (read per request). */
export interface LabActor {
  userId: string;
  labId: string;
  labSlug: string;
  labName: string;
  role: Role;
  /** Set when the caller is a lab API token: its scope narrows what `role` (its maker's) allows. */
  token?: { id: string; scope: ApiTokenScope };
}

/** The signed-in user's id, or 401; a lab API token is refused here, as it acts only inside its lab's routes. */
export function requireUser(principal: Principal): string {
  if (principal.kind === 'token') throw forbidden('token', 'Lab API tokens reach only the routes of their own lab, under /api/v1/labs/{lab}/.');
  if (principal.kind !== 'user') throw unauthenticated();
  return principal.userId;
}

/**
 * Resolves the caller's membership of a lab. A lab that does not exist and one the caller is not in both answer
 * 404, so nothing reveals that another lab's resource exists.
 */
export async function resolveLabActor(db: Db, principal: Principal, labSlug: string): Promise<LabActor> {
  if (principal.kind === 'token') {
    // Another lab's resources do not exist for a token.
    if (principal.labSlug !== labSlug) throw notFound('lab', 'No such lab.');
    const row = await findLabMembership(db, labSlug, principal.userId);
    if (!row) throw unauthenticated('The member who made this API token has left the lab, so the token no longer works.');
    return { userId: principal.userId, labId: row.id, labSlug: row.slug, labName: row.name, role: row.role, token: { id: principal.tokenId, scope: principal.scope } };
  }
  const userId = requireUser(principal);
  const row = await findLabMembership(db, labSlug, userId);
  if (!row) throw notFound('lab', 'No such lab.');
  return { userId, labId: row.id, labSlug: row.slug, labName: row.name, role: row.role };
}

/** Throws 403 unless the actor's role allows the action (the policy table decides). */
export function authorize(actor: LabActor, action: PolicyAction): void {
  const allowed = actor.token ? canWithToken(actor.role, actor.token.scope, action) : can(actor.role, action);
  if (!allowed) {
    const area = action.split(':')[0] ?? 'lab';
    throw actor.token && can(actor.role, action) ? forbidden(area, `A ${actor.token.scope} token may not do that; it needs a write token.`) : forbidden(area);
  }
}
