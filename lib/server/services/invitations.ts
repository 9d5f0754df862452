import 'server-only';
import { conflict, forbidden, notFound, validationError } from '@/lib/errors';
import type { Db, DbHandle } from '@/db/client';
import type { InvitationRow } from '@/db/database';
import { insertAuditEvent } from '@/db/repositories/audit-events';
import {
  findInvitationByTokenHash,
  findInvitationInLab,
  findPendingInvitation,
  insertInvitation,
  listOpenInvitations,
  lockInvitationByTokenHash,
  markInvitationAccepted,
  markInvitationRevoked,
  renewInvitation,
} from '@/db/repositories/invitations';

import { getLabById } from '@/db/repositories/labs';
import { findMembership, insertMembership } from '@/db/repositories/memberships';
import { findUserByEmail, findUserById, getUserById, insertUser, markEmailVerified } from '@/db/repositories/users';
import type { Invitation } from '@/lib/schemas/account';
import { ROLE_LABELS, type Role } from '@/lib/schemas/roles';
import { createToken, hashPassword, hashToken } from '../auth/secrets';
import { getEnv } from '../env';
import { sendMail } from '../mail/mailer';
import { invitationMail } from '../mail/templates';
import { authorize, type LabActor } from './access';

/** An invitation link works for seven days, once. */
export const INVITATION_TTL_MS = 7 * 24 * 60 * 60 * 1000;

type InvitationState = Invitation['state'];

function stateOf(row: InvitationRow, now = Date.now()): InvitationState {
  if (row.revoked_at) return 'revoked';
  if (row.accepted_at) return 'accepted';
  return row.expires_at.getTime() < now ? 'expired' : 'pending';
}

function toInvitation(row: InvitationRow & { invited_by_name?: string | null }): Invitation {
  return {
    id: row.id,
    email: row.email,
    role: row.role,
    invitedBy: row.invited_by_name ?? null,
    createdAt: row.created_at.toISOString(),
    expiresAt: row.expires_at.toISOString(),
    sentAt: row.sent_at.toISOString(),
    state: stateOf(row),
  };
}

function invitationUrl(token: string): string {
  return `${getEnv().APP_URL}/invite/${encodeURIComponent(token)}`;
}

export async function listInvitations(db: Db, actor: LabActor): Promise<Invitation[]> {
  authorize(actor, 'members:read');
  return (await listOpenInvitations(db, actor.labId)).map(toInvitation);
}

/** Invites an address to the lab with a role and e-mails the link. */
export async function createInvitation(db: Db, actor: LabActor, email: string, role: Role): Promise<Invitation> {
  authorize(actor, 'members:manage');
  const token = createToken();
  const expiresAt = new Date(Date.now() + INVITATION_TTL_MS);
  const row = await db.transaction().execute(async (trx) => {
    const existingUser = await findUserByEmail(trx, email);
    if (existingUser && (await findMembership(trx, actor.labId, existingUser.id))) {
      throw conflict('invitation', `${email} is already a member of this lab.`, { email: ['Already a member'] });
    }
    const pending = await findPendingInvitation(trx, actor.labId, email);
    if (pending) {
      throw conflict('invitation', `${email} already has an open invitation; resend it instead.`, { email: ['Already invited'] });
    }
    const inv = await insertInvitation(trx, { labId: actor.labId, email, role, tokenHash: hashToken(token), invitedBy: actor.userId, expiresAt });
    await insertAuditEvent(trx, { labId: actor.labId, actorUserId: actor.userId, action: 'invitation.create', subjectType: 'invitation', subjectId: inv.id, details: { email, role } });
    return inv;
  });
  await mailInvitation(db, actor, row, token);
  return toInvitation(row);
}

async function mailInvitation(db: Db, actor: LabActor, row: InvitationRow, token: string) {
  const inviter = await getUserById(db, actor.userId);
  await sendMail(
    invitationMail({ to: row.email, labName: actor.labName, roleLabel: ROLE_LABELS[row.role], inviterName: inviter.name, url: invitationUrl(token), expiresAt: row.expires_at }),
  );
}

/** Sends a fresh link (new token, new seven days); the old link stops working. */
export async function resendInvitation(db: Db, actor: LabActor, invitationId: string): Promise<Invitation> {
  authorize(actor, 'members:manage');
  const row = await findInvitationInLab(db, actor.labId, invitationId);
  if (!row) throw notFound('invitation', 'No such invitation.');
  const state = stateOf(row);
  if (state === 'accepted' || state === 'revoked') throw conflict('invitation', `This invitation was ${state}; create a new one.`);
  const token = createToken();
  const expiresAt = new Date(Date.now() + INVITATION_TTL_MS);
  await db.transaction().execute(async (trx) => {
    await renewInvitation(trx, row.id, hashToken(token), expiresAt);
    await insertAuditEvent(trx, { labId: actor.labId, actorUserId: actor.userId, action: 'invitation.resend', subjectType: 'invitation', subjectId: row.id });
  });
  const renewed = { ...row, expires_at: expiresAt, sent_at: new Date() };
  await mailInvitation(db, actor, renewed, token);
  return toInvitation(renewed);
}

export async function revokeInvitation(db: Db, actor: LabActor, invitationId: string): Promise<void> {
  authorize(actor, 'members:manage');
  await db.transaction().execute(async (trx) => {
    const row = await findInvitationInLab(trx, actor.labId, invitationId);
    if (!row) throw notFound('invitation', 'No such invitation.');
    if (row.accepted_at) throw conflict('invitation', 'This invitation was already accepted; remove the member instead.');
    if (row.revoked_at) return;
    await markInvitationRevoked(trx, row.id);
    await insertAuditEvent(trx, { labId: actor.labId, actorUserId: actor.userId, action: 'invitation.revoke', subjectType: 'invitation', subjectId: row.id });
  });
}

/** What the accept page shows about a link, before anyone signs in. */
export interface InvitationPreview {
  state: InvitationState | 'unknown';
  email?: string;
  role?: Role;
  labName?: string;
  labSlug?: string;
  hasAccount?: boolean;
}

export async function previewInvitation(db: Db, token: string): Promise<InvitationPreview> {
  const row = await findInvitationByTokenHash(db, hashToken(token));
  if (!row) return { state: 'unknown' };
  const lab = await getLabById(db, row.lab_id);
  return { state: stateOf(row), email: row.email, role: row.role, labName: lab.name, labSlug: lab.slug, hasAccount: !!(await findUserByEmail(db, row.email)) };
}

function refuseUnusable(row: InvitationRow | undefined): asserts row is InvitationRow {
  const state = row ? stateOf(row) : 'unknown';
  if (state === 'pending') return;
  const message = {
    unknown: 'This invitation link is not valid.',
    expired: 'This invitation has expired. Ask the lab Owner to resend it.',
    accepted: 'This invitation was already used.',
    revoked: 'This invitation was withdrawn by the lab.',
  }[state as Exclude<InvitationState | 'unknown', 'pending'>];
  throw validationError('invitation', message, { token: [message] });
}

async function joinLab(trx: DbHandle, row: InvitationRow, userId: string) {
  await markInvitationAccepted(trx, row.id, userId);
  if (!(await findMembership(trx, row.lab_id, userId))) await insertMembership(trx, row.lab_id, userId, row.role);
  await insertAuditEvent(trx, { labId: row.lab_id, actorUserId: userId, action: 'invitation.accept', subjectType: 'invitation', subjectId: row.id, details: { role: row.role } });
}

/** An existing, signed-in user accepts; the invitation must be addressed to them. Returns the lab's slug. */
export async function acceptInvitation(db: Db, userId: string, token: string, labSlug?: string): Promise<string> {
  return db.transaction().execute(async (trx) => {
    const row = await lockInvitationByTokenHash(trx, hashToken(token));
    refuseUnusable(row);
    const lab = await getLabById(trx, row.lab_id);
    if (labSlug && labSlug !== lab.slug) throw notFound('invitation', 'This invitation is for another lab.');
    const user = await findUserById(trx, userId);
    if (!user || user.email !== row.email) {
      throw forbidden('invitation', `This invitation is for ${row.email}, but you are signed in as ${user?.email ?? 'someone else'}. Sign out and open the link again.`);
    }
    await joinLab(trx, row, userId);
    await markEmailVerified(trx, userId, new Date());
    return lab.slug;
  });
}

/** A new user accepts: the account is created with the invited address, then joins the lab. */
export async function acceptInvitationAsNewUser(db: Db, token: string, name: string, password: string): Promise<{ userId: string; email: string; labSlug: string }> {
  // A made-up link is refused before the costly hash (and again under the row lock below).
  refuseUnusable(await lockInvitationByTokenHash(db, hashToken(token)));
  const passwordHash = await hashPassword(password);
  return db.transaction().execute(async (trx) => {
    const row = await lockInvitationByTokenHash(trx, hashToken(token));
    refuseUnusable(row);
    if (await findUserByEmail(trx, row.email)) {
      throw conflict('invitation', `An account for ${row.email} already exists. Sign in to accept.`, { token: ['Sign in to accept'] });
    }
    const user = await insertUser(trx, { email: row.email, name, passwordHash, emailVerifiedAt: new Date() });
    await joinLab(trx, row, user.id);
    const lab = await getLabById(trx, row.lab_id);
    return { userId: user.id, email: user.email, labSlug: lab.slug };
  });
}

