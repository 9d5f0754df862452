import type { Role } from '@/lib/schemas/roles';
import type { DbHandle } from '../client';
import type { InvitationRow } from '../database';

export function insertInvitation(
  db: DbHandle,
  inv: { labId: string; email: string; role: Role; tokenHash: string; invitedBy: string; expiresAt: Date },
): Promise<InvitationRow> {
  return db
    .insertInto('invitations')
    .values({
      lab_id: inv.labId,
      email: inv.email,
      role: inv.role,
      token_hash: inv.tokenHash,
      invited_by: inv.invitedBy,
      expires_at: inv.expiresAt,
    })
    .returningAll()
    .executeTakeFirstOrThrow();
}

export function findInvitationByTokenHash(db: DbHandle, tokenHash: string): Promise<InvitationRow | undefined> {
  return db.selectFrom('invitations').selectAll().where('token_hash', '=', tokenHash).executeTakeFirst();
}

/** Locks the invitation row for the accepting transaction, so a link works once even under a double click. */
export function lockInvitationByTokenHash(db: DbHandle, tokenHash: string): Promise<InvitationRow | undefined> {
  return db.selectFrom('invitations').selectAll().where('token_hash', '=', tokenHash).forUpdate().executeTakeFirst();
}

export function findInvitationInLab(db: DbHandle, labId: string, id: string): Promise<InvitationRow | undefined> {
  return db.selectFrom('invitations').selectAll().where('lab_id', '=', labId).where('id', '=', id).executeTakeFirst();
}

export function findPendingInvitation(db: DbHandle, labId: string, email: string): Promise<InvitationRow | undefined> {
  return db
    .selectFrom('invitations')
    .selectAll()
    .where('lab_id', '=', labId)
    .where('email', '=', email)
    .where('accepted_at', 'is', null)
    .where('revoked_at', 'is', null)
    .executeTakeFirst();
}

/** Invitations not yet accepted or revoked (expired ones included, so they can be resent). */
export function listOpenInvitations(db: DbHandle, labId: string): Promise<(InvitationRow & { invited_by_name: string | null })[]> {
  return db
    .selectFrom('invitations')
    .leftJoin('users', 'users.id', 'invitations.invited_by')
    .selectAll('invitations')
    .select('users.name as invited_by_name')
    .where('invitations.lab_id', '=', labId)
    .where('invitations.accepted_at', 'is', null)
    .where('invitations.revoked_at', 'is', null)
    .orderBy('invitations.created_at', 'desc')
    .execute();
}

export async function markInvitationAccepted(db: DbHandle, id: string, userId: string): Promise<void> {
  await db.updateTable('invitations').set({ accepted_at: new Date(), accepted_by: userId }).where('id', '=', id).execute();
}

export async function markInvitationRevoked(db: DbHandle, id: string): Promise<void> {
  await db.updateTable('invitations').set({ revoked_at: new Date() }).where('id', '=', id).execute();
}

/** A resend issues a new token and a new expiry; the old link stops working. */
export async function renewInvitation(db: DbHandle, id: string, tokenHash: string, expiresAt: Date): Promise<void> {
  await db
    .updateTable('invitations')
    .set({ token_hash: tokenHash, expires_at: expiresAt, sent_at: new Date() })
    .where('id', '=', id)
    .execute();
}
