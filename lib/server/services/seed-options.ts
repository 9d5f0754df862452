import 'server-only';
import type { Db } from '@/db/client';
import { listSeedShapes } from '@/db/repositories/seed-shapes';
import { DescriptorSchema } from '@/lib/schemas/descriptor';
import type { ShapeDescriptor } from '@/lib/shape';
import { authorize, type LabActor } from './access';

/** Seed shapes a space can be built on: id, name and descriptor only (the space editor's picker). */
export async function listSeedOptions(db: Db, actor: LabActor): Promise<{ id: string; name: string; version: number; descriptor: ShapeDescriptor }[]> {
  authorize(actor, 'seed:read');
  const rows = await listSeedShapes(db, actor.labId, { limit: 500 });
  return rows.map((r) => ({ id: r.id, name: r.name, version: r.version, descriptor: DescriptorSchema.parse(r.descriptor) as ShapeDescriptor }));
}
