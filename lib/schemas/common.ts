import { z } from 'zod';

/** Opaque cursor for keyset pagination; clients pass back `nextCursor` unchanged. */
export const CursorSchema = z.string().regex(/^[A-Za-z0-9_-]{1,200}$/, 'Malformed cursor');

export const PageQuerySchema = z.object({
  cursor: CursorSchema.optional(),
  limit: z.coerce.number().int().min(1).max(200).default(50),
});
export type PageQuery = z.infer<typeof PageQuerySchema>;

/** A page of items with the cursor for the next page (null at the end). */
export function pageOf<T extends z.ZodType>(item: T) {
  return z.object({ items: z.array(item), nextCursor: z.string().nullable() });
}
export interface Page<T> {
  items: T[];
  nextCursor: string | null;
}

export const IdSchema = z.uuid();

/** PostgreSQL's integer ceiling: a larger number sent for an integer column is a field error, not a database error. */
export const PG_INT_MAX = 2_147_483_647;
/** A row's version, sent back with a change (optimistic locking). */
export const VersionSchema = z.number().int().min(1).max(PG_INT_MAX);
export const SlugSchema = z
  .string()
  .min(2)
  .max(48)
  .regex(/^[a-z0-9]+(?:-[a-z0-9]+)*$/, 'Use lower-case letters, digits and single hyphens');

export const ProblemSchema = z.object({
  type: z.string(),
  title: z.string(),
  status: z.number().int(),
  detail: z.string(),
  code: z.string(),
  errors: z.record(z.string(), z.array(z.string())).optional(),
  instance: z.string().optional(),
});
