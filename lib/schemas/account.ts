import { z } from 'zod';
import { RoleSchema } from './roles';

/** Minimum password length (NIST SP 800-63B recommends length over composition rules). */
export const PASSWORD_MIN_LENGTH = 10;
/** bcrypt reads at most 72 bytes; longer passwords would be silently truncated. */
export const PASSWORD_MAX_BYTES = 72;

export const EmailSchema = z
  .string()
  .trim()
  .max(254)
  .pipe(z.email('Enter a valid e-mail address'))
  .transform((e) => e.toLowerCase());

export const PasswordSchema = z
  .string()
  .min(PASSWORD_MIN_LENGTH, `Use at least ${PASSWORD_MIN_LENGTH} characters`)
  .refine((p) => new TextEncoder().encode(p).length <= PASSWORD_MAX_BYTES, `Use at most ${PASSWORD_MAX_BYTES} bytes`);

export const PersonNameSchema = z.string().trim().min(1, 'Enter your name').max(120);

export const SignUpSchema = z.object({
  name: PersonNameSchema,
  email: EmailSchema,
  password: PasswordSchema,
  labName: z.string().trim().min(2, 'Name your lab').max(120),
});
export type SignUpInput = z.input<typeof SignUpSchema>;

export const SignUpResultSchema = z.object({ userId: z.uuid(), labSlug: z.string() });

export const PasswordResetRequestSchema = z.object({ email: EmailSchema });
export const PasswordResetConfirmSchema = z.object({
  token: z.string().min(20).max(200),
  password: PasswordSchema,
});

export const AcceptInvitationSchema = z.object({ token: z.string().min(20).max(200) });
export const AcceptInvitationAsNewUserSchema = z.object({
  token: z.string().min(20).max(200),
  name: PersonNameSchema,
  password: PasswordSchema,
});

export const OkSchema = z.object({ ok: z.literal(true) });

export const MemberSchema = z.object({
  userId: z.uuid(),
  name: z.string(),
  email: z.string(),
  role: RoleSchema,
  joinedAt: z.string(),
});
export type Member = z.infer<typeof MemberSchema>;

export const InvitationSchema = z.object({
  id: z.uuid(),
  email: z.string(),
  role: RoleSchema,
  invitedBy: z.string().nullable(),
  createdAt: z.string(),
  expiresAt: z.string(),
  sentAt: z.string(),
  state: z.enum(['pending', 'expired', 'accepted', 'revoked']),
});
export type Invitation = z.infer<typeof InvitationSchema>;

export const CreateInvitationSchema = z.object({ email: EmailSchema, role: RoleSchema });
export type CreateInvitationInput = z.input<typeof CreateInvitationSchema>;
export const ChangeRoleSchema = z.object({ role: RoleSchema });

export const LabPathSchema = z.object({ lab: z.string().min(1).max(64) });
export const MemberPathSchema = LabPathSchema.extend({ userId: z.uuid() });
export const InvitationPathSchema = LabPathSchema.extend({ invitationId: z.uuid() });
