import 'server-only';
import { forbidden, notFound, unauthenticated } from '@/lib/errors';
import { findLabMembership } from '@/db/repositories/memberships';
import type { Db } from '@/db/client';
import type { Principal } from '../auth/principal';
import { can, type PolicyAction, type Role } from '../policy';

/** A signed-in user acting in one lab, with their current role there (read per request). */
export interface LabActor {
  userId: string;
  labId: string;
  labSlug: string;
  labName: string;
  role: Role;
}

/** The signed-in user's id, or 401. */
export function requireUser(principal: Principal): string {
  if (principal.kind !== 'user') throw unauthenticated();
  return principal.userId;
}

/**
 * Resolves the caller's membership of a lab. A lab that does not exist and one the caller is not in both answer
 * 404, so nothing reveals that another lab's resource exists.
 */
export async function resolveLabActor(db: Db, principal: Principal, labSlug: string): Promise<LabActor> {
  const userId = requireUser(principal);
  const row = await findLabMembership(db, labSlug, userId);
  if (!row) throw notFound('lab', 'No such lab.');
  return { userId, labId: row.id, labSlug: row.slug, labName: row.name, role: row.role };
}

/** Throws 403 unless the actor's role allows the action (the policy table decides). */
export function authorize(actor: LabActor, action: PolicyAction): void {
  if (!can(actor.role, action)) throw forbidden(action.split(':')[0] ?? 'lab');
}
