import 'server-only';
import { z } from 'zod';
import {
  AcceptInvitationSchema,
  ChangeRoleSchema,
  CreateInvitationSchema,
  InvitationPathSchema,
  InvitationSchema,
  LabPathSchema,
  MemberPathSchema,
  MemberSchema,
  OkSchema,
} from '@/lib/schemas/account';
import { pageOf, PageQuerySchema } from '@/lib/schemas/common';
import { MyLabSchema } from '@/lib/schemas/labs';
import { AuditEventSchema } from '@/lib/schemas/audit';
import { listAuditEvents } from '../services/audit';
import { paginate } from '../pagination';
import { getDb } from '../db';
import { defineRoute } from '../http';
import { requireUser } from '../services/access';
import { createInvitation, listInvitations, resendInvitation, revokeInvitation, acceptInvitation } from '../services/invitations';
import { listMyLabs } from '../services/labs';
import { changeMemberRole, listMembers, removeMember } from '../services/members';

export const listLabs = defineRoute({
  id: 'listLabs',
  method: 'GET',
  path: '/api/v1/labs',
  summary: 'The labs the caller belongs to, with their role in each',
  tags: ['labs'],
  access: { kind: 'user' },
  query: PageQuerySchema,
  response: pageOf(MyLabSchema),
  handler: async ({ principal, query }) => paginate(await listMyLabs(getDb(), requireUser(principal)), query, (l) => l.slug),
});

export const listLabMembers = defineRoute({
  id: 'listLabMembers',
  method: 'GET',
  path: '/api/v1/labs/{lab}/members',
  summary: 'Members of the lab and their roles',
  tags: ['members'],
  access: { kind: 'lab', action: 'members:read' },
  params: LabPathSchema,
  query: PageQuerySchema,
  response: pageOf(MemberSchema),
  handler: async ({ labActor, query }) => paginate(await listMembers(getDb(), labActor()), query, (m) => m.userId),
});

export const joinLab = defineRoute({
  id: 'joinLab',
  method: 'POST',
  path: '/api/v1/labs/{lab}/members',
  summary: 'Join the lab by accepting an invitation addressed to the signed-in user',
  tags: ['members'],
  access: { kind: 'user' },
  params: LabPathSchema,
  body: AcceptInvitationSchema,
  response: z.object({ labSlug: z.string() }),
  successStatus: 201,
  handler: async ({ principal, params, body }) => ({
    labSlug: await acceptInvitation(getDb(), requireUser(principal), body.token, params.lab),
  }),
});

export const changeLabMemberRole = defineRoute({
  id: 'changeLabMemberRole',
  method: 'PATCH',
  path: '/api/v1/labs/{lab}/members/{userId}',
  summary: "Change a member's role (never the last Owner's)",
  tags: ['members'],
  access: { kind: 'lab', action: 'members:manage' },
  params: MemberPathSchema,
  body: ChangeRoleSchema,
  response: MemberSchema,
  handler: ({ labActor, params, body }) => changeMemberRole(getDb(), labActor(), params.userId, body.role),
});

export const removeLabMember = defineRoute({
  id: 'removeLabMember',
  method: 'DELETE',
  path: '/api/v1/labs/{lab}/members/{userId}',
  summary: 'Remove a member, or leave the lab (never the last Owner)',
  tags: ['members'],
  access: { kind: 'lab', action: 'lab:read' },
  params: MemberPathSchema,
  response: OkSchema,
  successStatus: 204,
  handler: async ({ labActor, params }) => {
    await removeMember(getDb(), labActor(), params.userId);
    return { ok: true as const };
  },
});

export const listLabInvitations = defineRoute({
  id: 'listLabInvitations',
  method: 'GET',
  path: '/api/v1/labs/{lab}/invitations',
  summary: 'Invitations not yet accepted or revoked',
  tags: ['members'],
  access: { kind: 'lab', action: 'members:read' },
  params: LabPathSchema,
  query: PageQuerySchema,
  response: pageOf(InvitationSchema),
  handler: async ({ labActor, query }) => paginate(await listInvitations(getDb(), labActor()), query, (i) => i.id),
});

export const createLabInvitation = defineRoute({
  id: 'createLabInvitation',
  method: 'POST',
  path: '/api/v1/labs/{lab}/invitations',
  summary: 'Invite an e-mail address with a role; the link is mailed and works once for 7 days',
  tags: ['members'],
  access: { kind: 'lab', action: 'members:manage' },
  params: LabPathSchema,
  body: CreateInvitationSchema,
  response: InvitationSchema,
  successStatus: 201,
  handler: ({ labActor, body }) => createInvitation(getDb(), labActor(), body.email, body.role),
});

export const resendLabInvitation = defineRoute({
  id: 'resendLabInvitation',
  method: 'POST',
  path: '/api/v1/labs/{lab}/invitations/{invitationId}/resend',
  summary: 'Send a fresh link (the old one stops working)',
  tags: ['members'],
  access: { kind: 'lab', action: 'members:manage' },
  params: InvitationPathSchema,
  response: InvitationSchema,
  handler: ({ labActor, params }) => resendInvitation(getDb(), labActor(), params.invitationId),
});

export const revokeLabInvitation = defineRoute({
  id: 'revokeLabInvitation',
  method: 'DELETE',
  path: '/api/v1/labs/{lab}/invitations/{invitationId}',
  summary: 'Withdraw an invitation',
  tags: ['members'],
  access: { kind: 'lab', action: 'members:manage' },
  params: InvitationPathSchema,
  response: OkSchema,
  successStatus: 204,
  handler: async ({ labActor, params }) => {
    await revokeInvitation(getDb(), labActor(), params.invitationId);
    return { ok: true as const };
  },
});

export const listAuditEventsRoute = defineRoute({
  id: 'listAuditEvents',
  method: 'GET',
  path: '/api/v1/labs/{lab}/audit-events',
  summary: "The lab's audit log, newest first",
  tags: ['labs'],
  access: { kind: 'lab', action: 'audit:read' },
  params: LabPathSchema,
  query: PageQuerySchema,
  response: pageOf(AuditEventSchema),
  handler: ({ labActor, query }) => listAuditEvents(getDb(), labActor(), query),
});
