import { z } from 'zod';

export const HealthSchema = z.object({
  status: z.enum(['ok', 'degraded']),
  database: z.object({ ok: z.boolean(), latencyMs: z.number().nullable() }),
  version: z.string(),
  time: z.string(),
});
export type Health = z.infer<typeof HealthSchema>;
