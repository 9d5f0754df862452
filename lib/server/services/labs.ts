import 'server-only';
import type { Db } from '@/db/client';
import { listMembershipsOfUser } from '@/db/repositories/memberships';
import type { MyLab } from '@/lib/schemas/labs';

/** The labs the user belongs to, with their role in each. */
export async function listMyLabs(db: Db, userId: string): Promise<MyLab[]> {
  const rows = await listMembershipsOfUser(db, userId);
  return rows.map((r) => ({ id: r.id, slug: r.slug, name: r.name, createdAt: r.created_at.toISOString(), role: r.role }));
}
