import 'server-only';
import { conflict, notFound } from '@/lib/errors';
import type { Db } from '@/db/client';
import { toPage } from '@/db/pagination';
import { insertAuditEvent } from '@/db/repositories/audit-events';
import {
  deleteSeedShape as deleteSeedShapeRow,
  getSeedShape as getSeedShapeRow,
  insertSeedShape,
  listSeedShapes as listSeedShapeRows,
  updateSeedShape as updateSeedShapeRow,
  type SeedShapeListRow,
} from '@/db/repositories/seed-shapes';
import { countSpacesBySeed } from '@/db/repositories/shape-spaces';
import { validateDescriptor, type ShapeDescriptor } from '@/lib/shape';
import { measureShape, sampleForMeasures, thumbnailPath } from '@/lib/shape/measure-shape';
import type { Page, PageQuery } from '@/lib/schemas/common';
import { DescriptorSchema, type DescriptorInput } from '@/lib/schemas/descriptor';
import { SeedShapeOriginSchema, type SeedShape, type SeedShapeOrigin } from '@/lib/schemas/seed-shapes';
import { authorize, type LabActor } from './access';
import { shapeErrorToAppError } from './shape-errors';
import { isForeignKeyViolation, isUniqueViolation } from '@/db/errors';


/** The number of harmonics a descriptor carries (its terms). */
function harmonicCount(d: DescriptorInput): number {
  return d.terms.length;
}

/** The engine's own validity checks (r > 0, no self-intersection), in the app's error words. */
function assertValidShape(descriptor: DescriptorInput): void {
  try {
    validateDescriptor(descriptor as ShapeDescriptor);
  } catch (error) {
    throw shapeErrorToAppError(error, 'seed-shape', 'descriptor', descriptor as ShapeDescriptor);
  }
}

function toSeedShape(row: SeedShapeListRow, spaces = 0): SeedShape {
  // Stored descriptors were validated on write; parsing again keeps a corrupted row from reaching a page.
  const descriptor = DescriptorSchema.parse(row.descriptor);
  const contour = sampleForMeasures(descriptor as ShapeDescriptor);
  return {
    id: row.id,
    name: row.name,
    family: row.family,
    harmonicCount: row.harmonic_count,
    descriptor,
    origin: SeedShapeOriginSchema.parse(row.origin),
    version: row.version,
    metrics: { ...measureShape(descriptor as ShapeDescriptor, contour) },
    thumbnailPath: thumbnailPath(contour),
    createdBy: row.created_by_name,
    updatedBy: row.updated_by_name,
    createdAt: row.created_at.toISOString(),
    updatedAt: row.updated_at.toISOString(),
    usedBySpaces: spaces,
  };
}

const NAME_TAKEN = conflict('seed-shape', 'A seed shape with that name already exists in this lab.', { name: ['Name already used'] });

export async function listSeedShapes(db: Db, actor: LabActor, query: PageQuery): Promise<Page<SeedShape>> {
  authorize(actor, 'seed:read');
  const rows = await listSeedShapeRows(db, actor.labId, query);
  const counts = await countSpacesBySeed(db, rows.map((r) => r.id));
  return toPage(rows, query.limit, (r) => r.updated_at, (r) => toSeedShape(r, counts.get(r.id) ?? 0));
}

export async function getSeedShape(db: Db, actor: LabActor, id: string): Promise<SeedShape> {
  authorize(actor, 'seed:read');
  const counts = await countSpacesBySeed(db, [id]);
  return toSeedShape(await getSeedShapeRow(db, actor.labId, id), counts.get(id) ?? 0);
}

export async function createSeedShape(
  db: Db,
  actor: LabActor,
  input: { name: string; descriptor: DescriptorInput; origin: SeedShapeOrigin },
): Promise<SeedShape> {
  authorize(actor, 'seed:write');
  assertValidShape(input.descriptor);
  try {
    const id = await db.transaction().execute(async (trx) => {
      const row = await insertSeedShape(trx, actor.labId, actor.userId, {
        name: input.name,
        family: input.descriptor.family,
        harmonicCount: harmonicCount(input.descriptor),
        descriptor: input.descriptor,
        origin: input.origin,
      });
      await insertAuditEvent(trx, { labId: actor.labId, actorUserId: actor.userId, action: 'seed-shape.create', subjectType: 'seed-shape', subjectId: row.id, details: { name: input.name, origin: input.origin.kind } });
      return row.id;
    });
    return getSeedShape(db, actor, id);
  } catch (error) {
    if (isUniqueViolation(error)) throw NAME_TAKEN;
    throw error;
  }
}

export async function updateSeedShape(
  db: Db,
  actor: LabActor,
  id: string,
  input: { name?: string | undefined; descriptor?: DescriptorInput | undefined; version: number },
): Promise<SeedShape> {
  authorize(actor, 'seed:write');
  if (input.descriptor) assertValidShape(input.descriptor);
  try {
    await db.transaction().execute(async (trx) => {
      const before = await getSeedShapeRow(trx, actor.labId, id);
      const row = await updateSeedShapeRow(trx, actor.labId, id, input.version, actor.userId, {
        ...(input.name !== undefined ? { name: input.name } : {}),
        ...(input.descriptor ? { descriptor: input.descriptor, family: input.descriptor.family, harmonicCount: harmonicCount(input.descriptor) } : {}),
      });
      if (!row) {
        throw conflict('seed-shape', `Someone saved this seed shape after you opened it (now version ${before.version}). Reload to see their change.`, {
          version: ['Out of date'],
        });
      }
      await insertAuditEvent(trx, {
        labId: actor.labId,
        actorUserId: actor.userId,
        action: 'seed-shape.update',
        subjectType: 'seed-shape',
        subjectId: id,
        details: { version: row.version, renamed: input.name !== undefined && input.name !== before.name, descriptorChanged: !!input.descriptor },
      });
    });
  } catch (error) {
    if (isUniqueViolation(error)) throw NAME_TAKEN;
    throw error;
  }
  return getSeedShape(db, actor, id);
}

/** Deletes a seed shape; refused while a shape space is built on it (the database's foreign key decides). */
export async function deleteSeedShape(db: Db, actor: LabActor, id: string): Promise<void> {
  authorize(actor, 'seed:write');
  try {
    await db.transaction().execute(async (trx) => {
      const before = await getSeedShapeRow(trx, actor.labId, id);
      if (!(await deleteSeedShapeRow(trx, actor.labId, id))) throw notFound('seed-shape', 'No such seed shape in this lab.');
      await insertAuditEvent(trx, { labId: actor.labId, actorUserId: actor.userId, action: 'seed-shape.delete', subjectType: 'seed-shape', subjectId: id, details: { name: before.name } });
    });
  } catch (error) {
    if (isForeignKeyViolation(error)) {
      throw conflict('seed-shape', 'A shape space is built on this seed shape; delete or re-seed that space first.');
    }
    throw error;
  }
}
