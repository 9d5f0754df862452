import { z } from 'zod';

export const AuditEventSchema = z.object({
  id: z.uuid(),
  action: z.string(),
  subjectType: z.string(),
  subjectId: z.string().nullable(),
  actor: z.string().nullable(),
  details: z.record(z.string(), z.unknown()),
  at: z.string(),
});
export type AuditEvent = z.infer<typeof AuditEventSchema>;
