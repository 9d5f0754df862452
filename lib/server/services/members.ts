import 'server-only';
import { conflict, notFound } from '@/lib/errors';
import type { Db } from '@/db/client';
import { insertAuditEvent } from '@/db/repositories/audit-events';
import {
  deleteMembership,
  findMembership,
  listMembersOfLab,
  lockAndCountOwners,
  updateMembershipRole,
} from '@/db/repositories/memberships';
import type { Member } from '@/lib/schemas/account';
import type { Role } from '../policy';
import { authorize, type LabActor } from './access';

export async function listMembers(db: Db, actor: LabActor): Promise<Member[]> {
  authorize(actor, 'members:read');
  const rows = await listMembersOfLab(db, actor.labId);
  return rows.map((r) => ({ userId: r.user_id, name: r.name, email: r.email, role: r.role, joinedAt: r.created_at.toISOString() }));
}

const LAST_OWNER = 'A lab needs at least one Owner. Make someone else Owner first.';

/** Changes a member's role; the last Owner can be neither removed nor demoted. Takes effect on the next request. */
export async function changeMemberRole(db: Db, actor: LabActor, userId: string, role: Role): Promise<Member> {
  authorize(actor, 'members:manage');
  await db.transaction().execute(async (trx) => {
    const ownerCount = await lockAndCountOwners(trx, actor.labId);
    const member = await findMembership(trx, actor.labId, userId);
    if (!member) throw notFound('member', 'That person is not a member of this lab.');
    if (member.role === role) return;
    if (member.role === 'owner' && ownerCount <= 1) throw conflict('member', LAST_OWNER, { role: [LAST_OWNER] });
    await updateMembershipRole(trx, actor.labId, userId, role);
    await insertAuditEvent(trx, {
      labId: actor.labId,
      actorUserId: actor.userId,
      action: 'member.role-change',
      subjectType: 'user',
      subjectId: userId,
      details: { from: member.role, to: role },
    });
  });
  const members = await listMembersOfLab(db, actor.labId);
  const m = members.find((r) => r.user_id === userId)!;
  return { userId: m.user_id, name: m.name, email: m.email, role: m.role, joinedAt: m.created_at.toISOString() };
}

/** Removes a member (an Owner may remove anyone; anyone may leave); never the last Owner. */
export async function removeMember(db: Db, actor: LabActor, userId: string): Promise<void> {
  if (userId !== actor.userId) authorize(actor, 'members:manage');
  await db.transaction().execute(async (trx) => {
    const ownerCount = await lockAndCountOwners(trx, actor.labId);
    const member = await findMembership(trx, actor.labId, userId);
    if (!member) throw notFound('member', 'That person is not a member of this lab.');
    if (member.role === 'owner' && ownerCount <= 1) throw conflict('member', LAST_OWNER);
    await deleteMembership(trx, actor.labId, userId);
    await insertAuditEvent(trx, {
      labId: actor.labId,
      actorUserId: actor.userId,
      action: userId === actor.userId ? 'member.leave' : 'member.remove',
      subjectType: 'user',
      subjectId: userId,
      details: { role: member.role },
    });
  });
}
