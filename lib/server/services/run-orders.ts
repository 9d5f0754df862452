import 'server-only';
import { AppError, conflict, validationError } from '@/lib/errors';
import type { Db } from '@/db/client';
import { toPage } from '@/db/pagination';
import { insertAuditEvent } from '@/db/repositories/audit-events';
import { getEdition as getEditionRow, getEditionSnapshot as getSnapshotRow } from '@/db/repositories/editions';
import { deleteRunOrder as deleteRunOrderRow, getRunOrder as getRunOrderRow, insertRunOrder, listRunOrders as listRunOrderRows, updateRunOrder, type RunOrderListRow } from '@/db/repositories/run-orders';
import { zipBytes } from '@/lib/pack/zip-pack';
import { bidsLabelsOf, buildRunOrderOf, checkRunOrderDefinition, definitionFieldOf, needsBackgroundSearch, runOrderResultOf } from '@/lib/run-order-build';
import { runOrderFiles, type RunOrderFile } from '@/lib/sequence/run-order-files';
import { SequenceError } from '@/lib/sequence/sequence-error';
import type { RunOrder } from '@/lib/sequence/types';
import type { Page, PageQuery } from '@/lib/schemas/common';
import { EditionSnapshotSchema } from '@/lib/schemas/edition';
import { RunOrderDefinitionSchema, type CreateRunOrderInput, type RunOrderDefinition, type RunOrderValue } from '@/lib/schemas/run-order';
import { fieldErrorsOf } from '../http';
import { getBoss, sendRunOrderJob } from '../jobs/boss';
import { authorize, type LabActor } from './access';

function toRunOrder(row: RunOrderListRow): RunOrderValue {
  const definition = RunOrderDefinitionSchema.parse(row.definition);
  return {
    id: row.id,
    name: row.name,
    edition: { id: row.edition_id, spaceId: row.space_id, spaceName: row.space_name, number: row.edition_number, state: row.edition_state },
    definition,
    state: row.state,
    error: row.error,
    result: row.result ? runOrderResultOf(row.result as RunOrder, definition) : null,
    version: row.version,
    createdBy: row.created_by_name,
    createdAt: row.created_at.toISOString(),
    updatedAt: row.updated_at.toISOString(),
  };
}

/** Every write checks the definition with the same schema, whatever the caller already did. */
function parseDefinition(value: unknown): RunOrderDefinition {
  const parsed = RunOrderDefinitionSchema.safeParse(value);
  if (!parsed.success) throw validationError('run-order', 'The run order is not valid.', fieldErrorsOf(parsed.error, 'definition'));
  return parsed.data;
}

/** A `SequenceError` as a field-level validation error on the definition. */
function asValidation(error: unknown): unknown {
  if (!(error instanceof SequenceError)) return error;
  return new AppError('validation:run-order', error.message, { fields: { [`definition.${definitionFieldOf(error)}`]: [error.message] }, cause: error });
}

async function stimulusIdsOf(db: Db, editionId: string): Promise<string[]> {
  return EditionSnapshotSchema.parse(await getSnapshotRow(db, editionId)).stimuli.map((s) => s.id);
}

type Plan = { state: 'ready'; result: RunOrder } | { state: 'queued'; result: null };

/** Builds the order now (n ≤ 12 for type-1 index-1, and every other type), or checks it and leaves the search to a job. */
function planOf(definition: RunOrderDefinition, ids: readonly string[]): Plan {
  try {
    if (needsBackgroundSearch(definition, ids)) {
      checkRunOrderDefinition(definition, ids);
      return { state: 'queued', result: null };
    }
    return { state: 'ready', result: buildRunOrderOf(definition, ids) };
  } catch (error) {
    throw asValidation(error);
  }
}

async function queueSearch(db: Db, id: string, version: number): Promise<void> {
  try {
    const jobId = await sendRunOrderJob(await getBoss(), { runOrderId: id, version });
    await updateRunOrder(db, id, { job_id: jobId }, { version });
  } catch (error) {
    await updateRunOrder(db, id, { state: 'failed', error: `The search could not be queued: ${error instanceof Error ? error.message : String(error)}` }, { version });
    throw error;
  }
}

/** Creates a run order of an edition: built at once, or (type-1 index-1 with n > 12) queued for a background search. */
export async function createRunOrder(db: Db, actor: LabActor, spaceId: string, number: number, input: CreateRunOrderInput): Promise<RunOrderValue> {
  authorize(actor, 'runorder:write');
  const definition = parseDefinition(input.definition);
  const edition = await getEditionRow(db, actor.labId, spaceId, number);
  const plan = planOf(definition, await stimulusIdsOf(db, edition.id));
  const id = await db.transaction().execute(async (trx) => {
    const { id } = await insertRunOrder(trx, { labId: actor.labId, editionId: edition.id, name: input.name, definition, state: plan.state, result: plan.result, createdBy: actor.userId });
    await insertAuditEvent(trx, {
      labId: actor.labId,
      actorUserId: actor.userId,
      action: 'run-order.create',
      subjectType: 'run-order',
      subjectId: id,
      details: { space: edition.space_name, edition: number, name: input.name, sequence: definition.sequence.kind, runs: definition.runs },
    });
    return id;
  });
  if (plan.state === 'queued') await queueSearch(db, id, 1);
  return toRunOrder(await getRunOrderRow(db, actor.labId, id));
}

export async function listRunOrders(db: Db, actor: LabActor, spaceId: string, number: number, query: PageQuery): Promise<Page<RunOrderValue>> {
  authorize(actor, 'runorder:read');
  const edition = await getEditionRow(db, actor.labId, spaceId, number);
  return toPage(await listRunOrderRows(db, actor.labId, edition.id, query), query.limit, (r) => r.created_at, toRunOrder);
}

export async function getRunOrder(db: Db, actor: LabActor, id: string): Promise<RunOrderValue> {
  authorize(actor, 'runorder:read');
  return toRunOrder(await getRunOrderRow(db, actor.labId, id));
}

/** Replaces a run order's name and definition (rebuilt, or searched again); `version` guards against lost edits. */
export async function updateRunOrderOf(db: Db, actor: LabActor, id: string, input: CreateRunOrderInput & { version: number }): Promise<RunOrderValue> {
  authorize(actor, 'runorder:write');
  const definition = parseDefinition(input.definition);
  const row = await getRunOrderRow(db, actor.labId, id);
  const plan = planOf(definition, await stimulusIdsOf(db, row.edition_id));
  const changed = await db.transaction().execute(async (trx) => {
    const ok = await updateRunOrder(trx, id, { name: input.name, definition, state: plan.state, result: plan.result, error: null, job_id: null }, { version: input.version, bump: true });
    if (ok) await insertAuditEvent(trx, { labId: actor.labId, actorUserId: actor.userId, action: 'run-order.update', subjectType: 'run-order', subjectId: id, details: { name: input.name, sequence: definition.sequence.kind } });
    return ok;
  });
  if (!changed) throw conflict('run-order', 'Someone changed this run order since you opened it. Reload it and make your change again.');
  if (plan.state === 'queued') await queueSearch(db, id, input.version + 1);
  return toRunOrder(await getRunOrderRow(db, actor.labId, id));
}

export async function deleteRunOrder(db: Db, actor: LabActor, id: string): Promise<void> {
  authorize(actor, 'runorder:write');
  const row = await getRunOrderRow(db, actor.labId, id);
  await db.transaction().execute(async (trx) => {
    await deleteRunOrderRow(trx, actor.labId, id);
    await insertAuditEvent(trx, { labId: actor.labId, actorUserId: actor.userId, action: 'run-order.delete', subjectType: 'run-order', subjectId: id, details: { name: row.name } });
  });
}

/** The files of a built run order (events.tsv and _events.json per run); 409 while its search is pending or failed. */
export function runOrderFilesOf(row: RunOrderListRow): RunOrderFile[] {
  if (row.state !== 'ready' || !row.result) {
    throw conflict('run-order', row.state === 'failed' ? `This run order has no trials: ${row.error ?? 'its search failed.'}` : 'This run order is still being searched for; try again in a moment.');
  }
  return runOrderFiles(row.result as RunOrder, bidsLabelsOf(RunOrderDefinitionSchema.parse(row.definition)));
}

/** File-name-safe form of a run order's name, for its zip and its folder in a pack. */
export function runOrderSlug(row: Pick<RunOrderListRow, 'name' | 'id'>): string {
  const base = row.name.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '').slice(0, 60) || 'run-order';
  return `${base}-${row.id.slice(0, 8)}`;
}

/**
 * The run order as a zip of its BIDS files, byte for byte the same for the same definition: entries in run order,
 * dated by the edition (as packs are), never by the clock.
 */
export async function runOrderZip(db: Db, actor: LabActor, id: string): Promise<{ fileName: string; bytes: Uint8Array }> {
  authorize(actor, 'runorder:read');
  const row = await getRunOrderRow(db, actor.labId, id);
  const encoder = new TextEncoder();
  const files = runOrderFilesOf(row).map((f) => ({ path: f.name, data: encoder.encode(f.text), compression: 'DEFLATE' as const }));
  return { fileName: `${runOrderSlug(row)}.zip`, bytes: await zipBytes(files, row.edition_created_at) };
}

/** Sequence files for a pack: each ready run order of the edition under `<slug>/`, in the order given. */
export async function packSequencesOf(db: Db, actor: LabActor, editionId: string, ids: readonly string[]): Promise<RunOrderFile[]> {
  authorize(actor, 'runorder:read');
  const files: RunOrderFile[] = [];
  for (const [index, id] of [...new Set(ids)].entries()) {
    const row = await getRunOrderRow(db, actor.labId, id).catch(() => null);
    if (!row || row.edition_id !== editionId) throw validationError('pack', 'That run order is not one of this edition’s.', { [`runOrderIds.${index}`]: ['Not a run order of this edition'] });
    if (row.state !== 'ready') throw validationError('pack', `The run order “${row.name}” is not built yet.`, { [`runOrderIds.${index}`]: ['Not built yet'] });
    const slug = runOrderSlug(row);
    for (const f of runOrderFilesOf(row)) files.push({ name: `${slug}/${f.name}`, text: f.text });
  }
  return files;
}

/**
 * The background search of one run order (type-1 index-1, n > 12) within `timeBudgetMs`. A job for an older
 * version is skipped. When no sequence is found in time the run order shows why and what to try instead.
 */
export async function runRunOrderJob(db: Db, runOrderId: string, version: number, timeBudgetMs: number): Promise<'ready' | 'failed' | 'skipped'> {
  const row = await getRunOrderRow(db, null, runOrderId).catch(() => null);
  if (!row || row.version !== version || row.state === 'ready') return 'skipped';
  if (!(await updateRunOrder(db, runOrderId, { state: 'running', error: null }, { version }))) return 'skipped';
  const definition = RunOrderDefinitionSchema.parse(row.definition);
  const ids = await stimulusIdsOf(db, row.edition_id);
  try {
    const order = buildRunOrderOf(definition, ids, timeBudgetMs);
    await updateRunOrder(db, runOrderId, { state: 'ready', result: order, error: null }, { version });
    return 'ready';
  } catch (error) {
    if (!(error instanceof SequenceError)) throw error;
    const n = (error.details.conditions ?? ids.length).toString();
    const message =
      error.code === 'search-timeout'
        ? `No type-1 index-1 sequence for ${n} conditions was found within ${Math.round(timeBudgetMs / 1000)} s with seed ${definition.seed}. ` +
          'Try another seed, choose fewer conditions, or use the de Bruijn cycle (also n² + 1 trials, every ordered pair once).'
        : error.message;
    await updateRunOrder(db, runOrderId, { state: 'failed', error: message }, { version });
    return 'failed';
  }
}
