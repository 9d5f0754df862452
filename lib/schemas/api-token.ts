import { z } from 'zod';
import { LabPathSchema } from './account';

/** What a lab API token may do: `read` acts as a Reviewer, `write` as an Experimenter (see the policy table). */
export const API_TOKEN_SCOPES = ['read', 'write'] as const;
export type ApiTokenScope = (typeof API_TOKEN_SCOPES)[number];
export const API_TOKEN_SCOPE_LABELS: Record<ApiTokenScope, string> = {
  read: 'Read (as a Reviewer)',
  write: 'Write (as an Experimenter)',
};

/** The longest a token may live, in days. */
export const MAX_TOKEN_DAYS = 366;

export const CreateApiTokenSchema = z.object({
  name: z.string().trim().min(1, 'Name the token after the script or machine that uses it').max(80),
  scope: z.enum(API_TOKEN_SCOPES, { error: 'Choose read or write' }),
  expiresInDays: z
    .number({ error: 'Give the days until it expires' })
    .int('Whole days')
    .min(1, 'At least 1 day')
    .max(MAX_TOKEN_DAYS, `At most ${MAX_TOKEN_DAYS} days`),
});
export type CreateApiTokenInput = z.input<typeof CreateApiTokenSchema>;

export const ApiTokenPathSchema = LabPathSchema.extend({ tokenId: z.uuid() });

export const ApiTokenSchema = z.object({
  id: z.uuid(),
  name: z.string(),
  scope: z.enum(API_TOKEN_SCOPES),
  /** The token's first characters, to tell tokens apart; never enough to use. */
  prefix: z.string(),
  createdBy: z.string().nullable(),
  createdAt: z.string(),
  expiresAt: z.string(),
  lastUsedAt: z.string().nullable(),
  revokedAt: z.string().nullable(),
  state: z.enum(['active', 'expired', 'revoked']),
});
export type ApiTokenValue = z.infer<typeof ApiTokenSchema>;

/** The answer to creating a token: the only time the secret itself is shown. */
export const CreatedApiTokenSchema = ApiTokenSchema.extend({ token: z.string() });
export type CreatedApiToken = z.infer<typeof CreatedApiTokenSchema>;
