import 'server-only';
import { conflict, notFound, validationError, type FieldErrors } from '@/lib/errors';
import type { Db } from '@/db/client';
import { toPage } from '@/db/pagination';
import { insertAuditEvent } from '@/db/repositories/audit-events';
import {
  deleteDisplayProfile as deleteRow,
  getDisplayProfile as getRow,
  insertDisplayProfile,
  listDisplayProfiles as listRows,
  updateDisplayProfile as updateRow,
  type DisplayProfileListRow,
  type DisplayProfileWrite,
} from '@/db/repositories/display-profiles';
import { checkDisplayProfile, pixelsPerCm, pixelsPerDegree, visualAngle, type DisplayProfile } from '@/lib/render';
import type { Page, PageQuery } from '@/lib/schemas/common';
import type { DisplayProfileInput, DisplayProfileValue } from '@/lib/schemas/display-profile';
import { authorize, type LabActor } from './access';
import { isUniqueViolation } from '@/db/errors';

const NAME_TAKEN = conflict('profile', 'A display profile with that name already exists in this lab.', { name: ['Name already used'] });

/** The core's view of a stored profile. */
export function toCoreProfile(row: DisplayProfileListRow): DisplayProfile {
  return {
    name: row.name,
    resolutionPx: { width: row.width_px, height: row.height_px },
    widthCm: row.width_cm,
    pixelsPerCm: row.pixels_per_cm,
    viewingDistanceCm: row.viewing_distance_cm,
  };
}

function toValue(row: DisplayProfileListRow): DisplayProfileValue {
  const core = toCoreProfile(row);
  const pxPerCm = pixelsPerCm(core);
  return {
    id: row.id,
    name: row.name,
    resolutionPx: core.resolutionPx,
    widthCm: row.width_cm,
    pixelsPerCm: row.pixels_per_cm,
    viewingDistanceCm: row.viewing_distance_cm,
    notes: row.notes,
    derived: {
      pixelsPerCm: pxPerCm,
      pixelsPerDegree: pixelsPerDegree(core),
      screenDeg: { width: visualAngle(row.width_px / pxPerCm, row.viewing_distance_cm), height: visualAngle(row.height_px / pxPerCm, row.viewing_distance_cm) },
    },
    version: row.version,
    updatedBy: row.updated_by_name,
    updatedAt: row.updated_at.toISOString(),
  };
}

/** The core's checks (`lib/render`) on top of the schema: one clear message per field. */
function toWrite(input: Required<Omit<DisplayProfileInput, 'notes'>> & { notes?: string | undefined }): DisplayProfileWrite {
  const profile: DisplayProfile = { name: input.name, resolutionPx: input.resolutionPx, widthCm: input.widthCm, pixelsPerCm: input.pixelsPerCm, viewingDistanceCm: input.viewingDistanceCm };
  const issues = checkDisplayProfile(profile);
  if (issues.length) {
    const fields: FieldErrors = {};
    for (const i of issues) (fields[i.field] ??= []).push(i.message);
    throw validationError('profile', issues.map((i) => i.message).join(' '), fields);
  }
  return {
    name: input.name,
    widthPx: input.resolutionPx.width,
    heightPx: input.resolutionPx.height,
    widthCm: input.widthCm,
    pixelsPerCm: input.pixelsPerCm,
    viewingDistanceCm: input.viewingDistanceCm,
    notes: input.notes ?? '',
  };
}

async function uniqueName<T>(work: () => Promise<T>): Promise<T> {
  try {
    return await work();
  } catch (error) {
    if (isUniqueViolation(error)) throw NAME_TAKEN;
    throw error;
  }
}

export async function listDisplayProfiles(db: Db, actor: LabActor, query: PageQuery): Promise<Page<DisplayProfileValue>> {
  authorize(actor, 'profile:read');
  return toPage(await listRows(db, actor.labId, query), query.limit, (r) => r.updated_at, toValue);
}

export async function getDisplayProfile(db: Db, actor: LabActor, id: string): Promise<DisplayProfileValue> {
  authorize(actor, 'profile:read');
  return toValue(await getRow(db, actor.labId, id));
}

/** The stored profile as the render core takes it (for pack jobs). */
export async function getCoreDisplayProfile(db: Db, actor: LabActor, id: string): Promise<DisplayProfile> {
  authorize(actor, 'profile:read');
  return toCoreProfile(await getRow(db, actor.labId, id));
}

export async function createDisplayProfile(db: Db, actor: LabActor, input: DisplayProfileInput & { notes: string }): Promise<DisplayProfileValue> {
  authorize(actor, 'profile:write');
  const write = toWrite(input as Parameters<typeof toWrite>[0]);
  const id = await uniqueName(() =>
    db.transaction().execute(async (trx) => {
      const { id } = await insertDisplayProfile(trx, actor.labId, actor.userId, write);
      await insertAuditEvent(trx, { labId: actor.labId, actorUserId: actor.userId, action: 'profile.create', subjectType: 'display_profile', subjectId: id, details: { name: write.name } });
      return id;
    }),
  );
  return getDisplayProfile(db, actor, id);
}

export async function updateDisplayProfile(db: Db, actor: LabActor, id: string, patch: Partial<DisplayProfileInput> & { version: number }): Promise<DisplayProfileValue> {
  authorize(actor, 'profile:write');
  await uniqueName(() =>
    db.transaction().execute(async (trx) => {
      const current = toValue(await getRow(trx, actor.labId, id));
      const merged = { ...current, ...Object.fromEntries(Object.entries(patch).filter(([k, v]) => v !== undefined && k !== 'version')) } as Parameters<typeof toWrite>[0];
      if (patch.widthCm != null && patch.pixelsPerCm === undefined) merged.pixelsPerCm = null;
      if (patch.pixelsPerCm != null && patch.widthCm === undefined) merged.widthCm = null;
      const row = await updateRow(trx, actor.labId, id, patch.version, actor.userId, toWrite(merged));
      if (!row) throw conflict('profile', `Someone saved this profile after you opened it (now version ${current.version}). Reload to see their change.`, { version: ['Out of date'] });
      await insertAuditEvent(trx, { labId: actor.labId, actorUserId: actor.userId, action: 'profile.update', subjectType: 'display_profile', subjectId: id, details: { version: row.version } });
    }),
  );
  return getDisplayProfile(db, actor, id);
}

export async function deleteDisplayProfile(db: Db, actor: LabActor, id: string): Promise<void> {
  authorize(actor, 'profile:write');
  await db.transaction().execute(async (trx) => {
    const before = await getRow(trx, actor.labId, id);
    if (!(await deleteRow(trx, actor.labId, id))) throw notFound('profile', 'No such display profile in this lab.');
    await insertAuditEvent(trx, { labId: actor.labId, actorUserId: actor.userId, action: 'profile.delete', subjectType: 'display_profile', subjectId: id, details: { name: before.name } });
  });
}
