import 'server-only';
import { conflict, notFound, validationError, type FieldErrors } from '@/lib/errors';
import type { Db, DbHandle } from '@/db/client';
import { toPage } from '@/db/pagination';
import { insertAuditEvent } from '@/db/repositories/audit-events';
import { findSeedShape } from '@/db/repositories/seed-shapes';
import {
  deleteShapeSpace as deleteShapeSpaceRow,
  getShapeSpace as getShapeSpaceRow,
  insertShapeSpace,
  listShapeSpaces as listShapeSpaceRows,
  updateShapeSpace as updateShapeSpaceRow,
  updateSpaceBoundaries,
  type ShapeSpaceListRow,
} from '@/db/repositories/shape-spaces';
import { anisotropyIndex, checkSpace, equalizeSpace, generateSpace, stimulusMetrics, type Equalization, type SpaceDefinition, type SpaceFailure } from '@/lib/space';
import type { ShapeDescriptor } from '@/lib/shape';
import type { Page, PageQuery } from '@/lib/schemas/common';
import { DescriptorSchema, type DescriptorInput } from '@/lib/schemas/descriptor';
import { BoundarySchema, type BoundaryValue } from '@/lib/schemas/boundary';
import { BoundaryError, checkBoundaries } from '@/lib/boundary';
import { EqualizationSchema, SpaceSettingsSchema, type ShapeSpace, type SpaceSettings } from '@/lib/schemas/space';
import { authorize, type LabActor } from './access';
import { isForeignKeyViolation, isUniqueViolation } from '@/db/errors';

/** Invalid stimuli named in one error message; the rest are counted. */
const FAILURES_LISTED = 12;

/** The full definition the engine takes: the seed's descriptor plus the stored settings. */
export function toDefinition(seed: ShapeDescriptor, settings: SpaceSettings, equalization: Equalization | null): SpaceDefinition {
  return { seed, axes: settings.axes, extent: settings.extent, layout: settings.layout, normalization: settings.normalization, equalization };
}

function failureField(f: SpaceFailure): string {
  return ['axes', 'extent', 'layout', 'normalization', 'seed', 'equalization'].includes(f.id) ? f.id : 'extent';
}

/** Refuses a definition with invalid stimuli, listing which fail and why (field: the part to change). */
function assertBuildable(def: SpaceDefinition): number {
  const report = checkSpace(def);
  if (report.ok) return report.count;
  const fields: FieldErrors = {};
  for (const f of report.failures.slice(0, FAILURES_LISTED)) (fields[failureField(f)] ??= []).push(f.id === failureField(f) ? f.reason : `${f.id}: ${f.reason}`);
  const stimuli = report.failures.filter((f) => failureField(f) === 'extent' && f.id !== 'extent');
  const more = report.failures.length > FAILURES_LISTED ? ` (and ${report.failures.length - FAILURES_LISTED} more)` : '';
  const message = stimuli.length
    ? `${stimuli.length} of ${report.count} stimuli would be invalid at ρmax = ${def.extent}: ${stimuli
        .slice(0, FAILURES_LISTED)
        .map((f) => `${f.id} — ${f.reason}`)
        .join('; ')}${more}. Lower ρmax or change the axes.`
    : report.failures.map((f) => f.reason).join(' ');
  throw validationError('space', message, fields);
}

function toShapeSpace(row: ShapeSpaceListRow): ShapeSpace {
  const settings = SpaceSettingsSchema.parse(row.settings);
  return {
    id: row.id,
    name: row.name,
    seedShape: { id: row.seed_shape_id, name: row.seed_name, family: row.seed_family, descriptor: DescriptorSchema.parse(row.seed_descriptor) },
    axes: settings.axes,
    extent: settings.extent,
    layout: settings.layout,
    normalization: settings.normalization,
    equalization: row.equalization === null ? null : EqualizationSchema.parse(row.equalization),
    equalizationSource: settings.radiusMap ? 'study' : row.equalization === null ? null : 'contour',
    anisotropy: row.anisotropy,
    stimulusCount: row.stimulus_count,
    version: row.version,
    boundaries: BoundarySchema.array().parse(row.boundaries),
    boundariesVersion: row.boundaries_version,
    editionCount: Number(row.edition_count ?? 0),
    createdBy: row.created_by_name,
    updatedBy: row.updated_by_name,
    createdAt: row.created_at.toISOString(),
    updatedAt: row.updated_at.toISOString(),
  };
}

/** Validates settings against the seed and derives the stored parts (equalisation, anisotropy, count). */
async function prepareWrite(db: DbHandle, actor: LabActor, input: { name: string; seedShapeId: string } & SpaceSettings) {
  const seedRow = await findSeedShape(db, actor.labId, input.seedShapeId);
  if (!seedRow) {
    throw validationError('space', 'That seed shape no longer exists in this lab; pick another.', { seedShapeId: ['Seed shape not found'] });
  }
  const seed = DescriptorSchema.parse(seedRow.descriptor) as ShapeDescriptor;
  const designed = toDefinition(seed, input, null);
  const count = assertBuildable(designed);
  const designedIndex = anisotropyIndex(designed);
  if (input.equalize && input.radiusMap) {
    throw validationError('space', 'This space keeps the radius re-mapping it was made with (from a norming study); it cannot also be equalised by contour distance.', { equalize: ['Not with a given radius re-mapping'] });
  }
  let equalization: Equalization | null = input.radiusMap ?? null;
  let equalizedIndex: number | null = null;
  if (input.equalize) equalization = equalizeSpace(designed);
  if (equalization) {
    const equalized = toDefinition(seed, input, equalization);
    assertBuildable(equalized);
    equalizedIndex = anisotropyIndex(equalized);
  }
  // A space without a given re-mapping stores exactly the settings it always did.
  const radiusMap = input.radiusMap ? { radiusMap: input.radiusMap } : {};
  return {
    name: input.name,
    seedShapeId: input.seedShapeId,
    settings: { axes: input.axes, extent: input.extent, layout: input.layout, normalization: input.normalization, equalize: input.equalize, ...radiusMap } satisfies SpaceSettings,
    equalization,
    anisotropy: { designed: finiteOrNull(designedIndex), equalized: finiteOrNull(equalizedIndex) },
    stimulusCount: count,
  };
}

function finiteOrNull(v: number | null): number | null {
  return v !== null && Number.isFinite(v) ? v : null;
}

const NAME_TAKEN = conflict('space', 'A shape space with that name already exists in this lab.', { name: ['Name already used'] });

export async function listShapeSpaces(db: Db, actor: LabActor, query: PageQuery): Promise<Page<ShapeSpace>> {
  authorize(actor, 'space:read');
  return toPage(await listShapeSpaceRows(db, actor.labId, query), query.limit, (r) => r.updated_at, toShapeSpace);
}

export async function getShapeSpace(db: Db, actor: LabActor, id: string): Promise<ShapeSpace> {
  authorize(actor, 'space:read');
  return toShapeSpace(await getShapeSpaceRow(db, actor.labId, id));
}

/**
 * Validates and inserts a space inside the caller's transaction, with its audit event; the caller has authorised
 * the action (`space:write`, or `space:derive` for a space made from a study). Returns the new id.
 */
export async function insertShapeSpaceIn(trx: DbHandle, actor: LabActor, input: { name: string; seedShapeId: string } & SpaceSettings, details: Record<string, unknown> = {}): Promise<string> {
  const write = await prepareWrite(trx, actor, input);
  const row = await insertShapeSpace(trx, actor.labId, actor.userId, write);
  await insertAuditEvent(trx, { labId: actor.labId, actorUserId: actor.userId, action: 'space.create', subjectType: 'space', subjectId: row.id, details: { name: input.name, stimuli: write.stimulusCount, ...details } });
  return row.id;
}

/** Maps a unique-name violation to the field error a form shows. */
export function nameTakenOr(error: unknown): unknown {
  return isUniqueViolation(error) ? NAME_TAKEN : error;
}

export async function createShapeSpace(db: Db, actor: LabActor, input: { name: string; seedShapeId: string } & SpaceSettings): Promise<ShapeSpace> {
  authorize(actor, 'space:write');
  try {
    const id = await db.transaction().execute((trx) => insertShapeSpaceIn(trx, actor, input));
    return getShapeSpace(db, actor, id);
  } catch (error) {
    throw nameTakenOr(error);
  }
}

export async function updateShapeSpace(
  db: Db,
  actor: LabActor,
  id: string,
  patch: Partial<{ name: string; seedShapeId: string } & SpaceSettings> & { version: number },
): Promise<ShapeSpace> {
  authorize(actor, 'space:write');
  try {
    await db.transaction().execute(async (trx) => {
      const before = await getShapeSpaceRow(trx, actor.labId, id);
      const current = toShapeSpace(before);
      const stored = SpaceSettingsSchema.parse(before.settings);
      const merged = { name: current.name, seedShapeId: current.seedShape.id, ...stored, ...stripUndefined(patch) };
      const write = await prepareWrite(trx, actor, merged);
      const row = await updateShapeSpaceRow(trx, actor.labId, id, patch.version, actor.userId, write);
      if (!row) throw conflict('space', `Someone saved this space after you opened it (now version ${current.version}). Reload to see their change.`, { version: ['Out of date'] });
      await insertAuditEvent(trx, { labId: actor.labId, actorUserId: actor.userId, action: 'space.update', subjectType: 'space', subjectId: id, details: { version: row.version } });
    });
  } catch (error) {
    throw nameTakenOr(error);
  }
  return getShapeSpace(db, actor, id);
}

function stripUndefined<T extends object>(o: T): Partial<T> {
  return Object.fromEntries(Object.entries(o).filter(([k, v]) => v !== undefined && k !== 'version')) as Partial<T>;
}


export async function deleteShapeSpace(db: Db, actor: LabActor, id: string): Promise<void> {
  authorize(actor, 'space:write');
  try {
    await db.transaction().execute(async (trx) => {
      const before = await getShapeSpaceRow(trx, actor.labId, id);
      if (!(await deleteShapeSpaceRow(trx, actor.labId, id))) throw notFound('space', 'No such shape space in this lab.');
      await insertAuditEvent(trx, { labId: actor.labId, actorUserId: actor.userId, action: 'space.delete', subjectType: 'space', subjectId: id, details: { name: before.name } });
    });
  } catch (error) {
    if (isForeignKeyViolation(error)) {
      throw conflict('space', 'This space has editions, which are permanent records, so it cannot be deleted.');
    }
    throw error;
  }
}

/**
 * Replaces the space's category boundaries (Designers, Experimenters and Owners), checked by `lib/boundary`
 * against the space: unique keys, angles in [0°, 180°), prototypes inside the space.
 */
export async function putSpaceBoundaries(db: Db, actor: LabActor, id: string, input: { boundaries: BoundaryValue[]; version: number }): Promise<ShapeSpace> {
  authorize(actor, 'boundary:write');
  await db.transaction().execute(async (trx) => {
    const space = toShapeSpace(await getShapeSpaceRow(trx, actor.labId, id));
    const tooFar = input.boundaries.filter((b) => b.prototypeDistance !== null && b.prototypeDistance > space.extent);
    if (tooFar.length > 0) {
      throw validationError('boundary', `Prototypes must lie inside the space (distance at most ρmax = ${space.extent}): ${tooFar.map((b) => b.key).join(', ')}.`, {
        boundaries: ['Prototype distance beyond ρmax'],
      });
    }
    try {
      checkBoundaries(input.boundaries.map((b) => ({ key: b.key, angleDeg: b.angleDeg, ...(b.prototypeDistance === null ? {} : { prototypeDistance: b.prototypeDistance }) })));
    } catch (error) {
      if (error instanceof BoundaryError) throw validationError('boundary', error.message, { boundaries: [error.message] });
      throw error;
    }
    const row = await updateSpaceBoundaries(trx, actor.labId, id, input.version, actor.userId, input.boundaries);
    if (!row) throw conflict('boundary', `Someone changed these boundaries after you opened them (now version ${space.boundariesVersion}). Reload to see their change.`, { version: ['Out of date'] });
    await insertAuditEvent(trx, {
      labId: actor.labId,
      actorUserId: actor.userId,
      action: 'space.boundaries',
      subjectType: 'space',
      subjectId: id,
      details: { boundaries: input.boundaries.map((b) => `${b.key} @ ${b.angleDeg}°`), version: row.boundaries_version },
    });
  });
  return getShapeSpace(db, actor, id);
}

/** Every stimulus of a space with its coordinates, descriptor and metrics (what lab scripts fetch). */
export async function listSpaceStimuli(db: Db, actor: LabActor, id: string) {
  const space = await getShapeSpace(db, actor, id);
  const def = toDefinition(space.seedShape.descriptor as ShapeDescriptor, { ...space, equalize: space.equalization !== null }, space.equalization);
  return generateSpace(def).stimuli.map((s) => ({
    id: s.id,
    position: s.position,
    polar: s.polar,
    layoutPosition: s.layoutPosition as unknown as Record<string, string | number>,
    descriptor: s.descriptor as DescriptorInput,
    metrics: stimulusMetrics(s),
  }));
}
