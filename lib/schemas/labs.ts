import { z } from 'zod';
import { SlugSchema } from './common';

export const LabSchema = z.object({
  id: z.uuid(),
  slug: SlugSchema,
  name: z.string(),
  createdAt: z.string(),
});
export type Lab = z.infer<typeof LabSchema>;
