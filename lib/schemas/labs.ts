import { z } from 'zod';
import { SlugSchema } from './common';
import { RoleSchema } from './roles';

export const LabSchema = z.object({
  id: z.uuid(),
  slug: SlugSchema,
  name: z.string(),
  createdAt: z.string(),
});
export type Lab = z.infer<typeof LabSchema>;

/** A lab as seen by one member: with their role in it. */
export const MyLabSchema = LabSchema.extend({ role: RoleSchema });
export type MyLab = z.infer<typeof MyLabSchema>;
