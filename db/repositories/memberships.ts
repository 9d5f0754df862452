import type { Role } from '@/lib/schemas/roles';
import type { DbHandle } from '../client';
import type { LabRow, MembershipRow } from '../database';

export function findMembership(db: DbHandle, labId: string, userId: string): Promise<MembershipRow | undefined> {
  return db
    .selectFrom('memberships')
    .selectAll()
    .where('lab_id', '=', labId)
    .where('user_id', '=', userId)
    .executeTakeFirst();
}

/** The lab (by slug) and the user's membership of it, in one query. */
export function findLabMembership(
  db: DbHandle,
  labSlug: string,
  userId: string,
): Promise<(LabRow & { role: Role }) | undefined> {
  return db
    .selectFrom('labs')
    .innerJoin('memberships', 'memberships.lab_id', 'labs.id')
    .selectAll('labs')
    .select('memberships.role')
    .where('labs.slug', '=', labSlug)
    .where('memberships.user_id', '=', userId)
    .executeTakeFirst();
}

export function listMembershipsOfUser(db: DbHandle, userId: string): Promise<(LabRow & { role: Role })[]> {
  return db
    .selectFrom('labs')
    .innerJoin('memberships', 'memberships.lab_id', 'labs.id')
    .selectAll('labs')
    .select('memberships.role')
    .where('memberships.user_id', '=', userId)
    .orderBy('labs.name')
    .execute();
}

export interface MemberRow {
  user_id: string;
  name: string;
  email: string;
  role: Role;
  created_at: Date;
}

export function listMembersOfLab(db: DbHandle, labId: string): Promise<MemberRow[]> {
  return db
    .selectFrom('memberships')
    .innerJoin('users', 'users.id', 'memberships.user_id')
    .select(['memberships.user_id', 'users.name', 'users.email', 'memberships.role', 'memberships.created_at'])
    .where('memberships.lab_id', '=', labId)
    .orderBy('users.name')
    .execute();
}

export async function insertMembership(db: DbHandle, labId: string, userId: string, role: Role): Promise<void> {
  await db.insertInto('memberships').values({ lab_id: labId, user_id: userId, role }).execute();
}

export async function updateMembershipRole(db: DbHandle, labId: string, userId: string, role: Role): Promise<void> {
  await db.updateTable('memberships').set({ role }).where('lab_id', '=', labId).where('user_id', '=', userId).execute();
}

export async function deleteMembership(db: DbHandle, labId: string, userId: string): Promise<void> {
  await db.deleteFrom('memberships').where('lab_id', '=', labId).where('user_id', '=', userId).execute();
}

/** Locks the lab's Owner memberships (FOR UPDATE) and counts them, so two demotions cannot race past the last one. */
export async function lockAndCountOwners(db: DbHandle, labId: string): Promise<number> {
  const rows = await db
    .selectFrom('memberships')
    .select('user_id')
    .where('lab_id', '=', labId)
    .where('role', '=', 'owner')
    .forUpdate()
    .execute();
  return rows.length;
}
