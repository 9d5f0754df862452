import 'server-only';
import {
  AcceptInvitationAsNewUserSchema,
  OkSchema,
  PasswordResetConfirmSchema,
  PasswordResetRequestSchema,
  SignUpResultSchema,
  SignUpSchema,
} from '@/lib/schemas/account';
import { getDb } from '../db';
import { defineRoute } from '../http';
import { requireUser } from '../services/access';
import { requestPasswordReset, resetPassword, signOutEverywhere, signUp } from '../services/accounts';
import { acceptInvitationAsNewUser } from '../services/invitations';

export const createAccount = defineRoute({
  id: 'createAccount',
  method: 'POST',
  path: '/api/v1/account',
  summary: 'Sign up: a new user and a new lab in which they are Owner',
  tags: ['account'],
  access: { kind: 'public' },
  body: SignUpSchema,
  response: SignUpResultSchema,
  successStatus: 201,
  handler: ({ body }) => signUp(getDb(), body),
});

export const requestPasswordResetRoute = defineRoute({
  id: 'requestPasswordReset',
  method: 'POST',
  path: '/api/v1/account/password-reset',
  summary: 'E-mail a password reset link (same answer whether or not the account exists)',
  tags: ['account'],
  access: { kind: 'public' },
  body: PasswordResetRequestSchema,
  response: OkSchema,
  successStatus: 202,
  handler: async ({ body }) => {
    await requestPasswordReset(getDb(), body.email);
    return { ok: true as const };
  },
});

export const confirmPasswordReset = defineRoute({
  id: 'confirmPasswordReset',
  method: 'POST',
  path: '/api/v1/account/password-reset/confirm',
  summary: 'Set a new password with a reset token (once, before it expires); other sessions end',
  tags: ['account'],
  access: { kind: 'public' },
  body: PasswordResetConfirmSchema,
  response: OkSchema,
  handler: async ({ body }) => {
    await resetPassword(getDb(), body.token, body.password);
    return { ok: true as const };
  },
});

export const signOutEverywhereRoute = defineRoute({
  id: 'signOutEverywhere',
  method: 'POST',
  path: '/api/v1/account/sign-out-everywhere',
  summary: 'End every session of the signed-in user',
  tags: ['account'],
  access: { kind: 'user' },
  response: OkSchema,
  handler: async ({ principal }) => {
    await signOutEverywhere(getDb(), requireUser(principal));
    return { ok: true as const };
  },
});

export const acceptInvitationAsNewUserRoute = defineRoute({
  id: 'acceptInvitationAsNewUser',
  method: 'POST',
  path: '/api/v1/invitations/accept',
  summary: 'Accept an invitation by creating an account for the invited address',
  tags: ['account'],
  access: { kind: 'public' },
  body: AcceptInvitationAsNewUserSchema,
  response: SignUpResultSchema,
  successStatus: 201,
  handler: async ({ body }) => {
    const r = await acceptInvitationAsNewUser(getDb(), body.token, body.name, body.password);
    return { userId: r.userId, labSlug: r.labSlug };
  },
});
