import 'server-only';
import { conflict, validationError, type FieldErrors } from '@/lib/errors';
import type { Db } from '@/db/client';
import { toPage } from '@/db/pagination';
import { insertAuditEvent } from '@/db/repositories/audit-events';
import { getEdition as getEditionRow } from '@/db/repositories/editions';
import { findPackByOptions, getPack as getPackRow, getPackManifest as getManifestRow, insertPack, listPacks as listPackRows, updatePack, type PackListRow } from '@/db/repositories/packs';
import { contentHash } from '@/lib/edition';
import { checkRender } from '@/lib/render/check-render';
import type { DisplayProfile } from '@/lib/render/types';
import { ENGINE_VERSION } from '@/lib/shape/engine-version';
import type { Page, PageQuery } from '@/lib/schemas/common';
import type { CreatePackInput, PackValue } from '@/lib/schemas/pack';
import { RenderOptionsSchema, type RenderOptionsValue } from '@/lib/schemas/render';
import { signDownload, verifyDownload } from '../download-token';
import { presignDownload } from '../storage';
import { getEnv } from '../env';
import { getBoss, PACK_QUEUE, sendPackJob } from '../jobs/boss';
import { authorize, type LabActor } from './access';
import { getCoreDisplayProfile } from './display-profiles';
import { packSequencesOf } from './run-orders';
import { isUniqueViolation } from '@/db/errors';


function toPack(row: PackListRow): PackValue {
  return {
    id: row.id,
    state: row.state,
    progress: row.progress,
    stage: row.stage,
    error: row.error,
    attempts: row.attempts,
    cancelRequested: row.cancel_requested,
    edition: { spaceId: row.space_id, spaceName: row.space_name, number: row.edition_number, state: row.edition_state, contentHash: row.edition_hash },
    profile: row.profile as DisplayProfile,
    render: RenderOptionsSchema.parse(row.render_options),
    optionsHash: row.options_hash,
    sizeBytes: row.size_bytes,
    sha256: row.sha256,
    stimulusCount: row.stimulus_count,
    createdBy: row.created_by_name,
    createdAt: row.created_at.toISOString(),
    startedAt: row.started_at?.toISOString() ?? null,
    finishedAt: row.finished_at?.toISOString() ?? null,
  };
}

/** The idempotency key of a pack: the same edition, profile, options and engine always give the same pack. */
export function packOptionsHash(editionHash: string, profile: DisplayProfile, render: RenderOptionsValue, sequences: readonly { name: string; text: string }[] = []): string {
  // Without attached run orders the key is what it always was, so earlier packs are still found again.
  const attached = sequences.length > 0 ? { sequences: sequences.map((f) => ({ name: f.name, text: f.text })) } : {};
  return contentHash({ edition: editionHash, profile: { ...profile }, render: { ...render }, engine: ENGINE_VERSION, ...attached });
}

async function queue(db: Db, packId: string): Promise<void> {
  try {
    const jobId = await sendPackJob(await getBoss(), { packId });
    await updatePack(db, packId, { job_id: jobId });
  } catch (error) {
    await updatePack(db, packId, { state: 'failed', stage: 'queue', error: `The job could not be queued: ${error instanceof Error ? error.message : String(error)}`, finished_at: new Date() });
    throw error;
  }
}

/**
 * Asks for a pack of an edition, drawn for a display profile with render options. Two identical requests make
 * one pack: an existing pack with the same key is returned (a failed or cancelled one is queued again).
 */
export async function createPack(db: Db, actor: LabActor, spaceId: string, number: number, input: CreatePackInput & { render: RenderOptionsValue }): Promise<{ pack: PackValue; reused: boolean }> {
  authorize(actor, 'pack:create');
  const edition = await getEditionRow(db, actor.labId, spaceId, number);
  const profile = await getCoreDisplayProfile(db, actor, input.displayProfileId).catch((e: unknown) => {
    if ((e as { kind?: string }).kind === 'not_found') throw validationError('pack', 'That display profile no longer exists in this lab.', { displayProfileId: ['Display profile not found'] });
    throw e;
  });
  const check = checkRender(profile, input.render);
  if (!check.ok) {
    const fields: FieldErrors = {};
    for (const i of check.errors) (fields[`render.${i.field}`] ??= []).push(i.message);
    throw validationError('pack', check.errors.map((i) => i.message).join(' '), fields);
  }
  const sequences = input.runOrderIds?.length ? await packSequencesOf(db, actor, edition.id, input.runOrderIds) : [];
  const optionsHash = packOptionsHash(edition.content_hash, profile, input.render, sequences);
  const existing = await findPackByOptions(db, edition.id, optionsHash);
  if (existing) {
    if (existing.state === 'failed' || existing.state === 'cancelled') return { pack: await retryPack(db, actor, existing.id), reused: true };
    return { pack: toPack(await getPackRow(db, actor.labId, existing.id)), reused: true };
  }
  let id: string;
  try {
    id = await db.transaction().execute(async (trx) => {
      const { id } = await insertPack(trx, { labId: actor.labId, editionId: edition.id, displayProfileId: input.displayProfileId, profile, renderOptions: input.render, optionsHash, createdBy: actor.userId, sequences });
      await insertAuditEvent(trx, {
        labId: actor.labId,
        actorUserId: actor.userId,
        action: 'pack.create',
        subjectType: 'pack',
        subjectId: id,
        details: { space: edition.space_name, edition: number, profile: profile.name, sizeDeg: input.render.sizeDeg, runOrders: input.runOrderIds?.length ?? 0 },
      });
      return id;
    });
  } catch (error) {
    if (isUniqueViolation(error)) {
      const again = await findPackByOptions(db, edition.id, optionsHash);
      if (again) return { pack: toPack(await getPackRow(db, actor.labId, again.id)), reused: true };
    }
    throw error;
  }
  await queue(db, id);
  return { pack: toPack(await getPackRow(db, actor.labId, id)), reused: false };
}

export async function listPacks(db: Db, actor: LabActor, query: PageQuery): Promise<Page<PackValue>> {
  authorize(actor, 'pack:read');
  return toPage(await listPackRows(db, actor.labId, query), query.limit, (r) => r.created_at, toPack);
}

export async function getPack(db: Db, actor: LabActor, id: string): Promise<PackValue> {
  authorize(actor, 'pack:read');
  return toPack(await getPackRow(db, actor.labId, id));
}

/** A finished pack's manifest, with an ETag: a built pack never changes, so its zip's SHA-256 names the version. */
export async function getPackManifest(db: Db, actor: LabActor, id: string): Promise<{ manifest: unknown; etag: string }> {
  authorize(actor, 'pack:read');
  const { manifest, sha256 } = await getManifestRow(db, actor.labId, id);
  if (manifest === null) throw conflict('pack', 'This pack is not built yet, so it has no manifest.');
  return { manifest, etag: `"manifest-${sha256 ?? id}"` };
}

/** Cancels a waiting pack at once; a pack being built stops at its worker's next check, between stimuli. */
export async function cancelPack(db: Db, actor: LabActor, id: string): Promise<PackValue> {
  authorize(actor, 'pack:create');
  const row = await getPackRow(db, actor.labId, id);
  if (row.state === 'queued') {
    if (await updatePack(db, id, { state: 'cancelled', stage: 'cancelled', cancel_requested: true, finished_at: new Date() }, ['queued'])) {
      if (row.job_id) await (await getBoss()).cancel(PACK_QUEUE, row.job_id).catch(() => undefined);
    }
  } else if (row.state === 'running') {
    await updatePack(db, id, { cancel_requested: true }, ['running']);
  } else {
    throw conflict('pack', `This pack is ${row.state}; only a waiting or running pack can be cancelled.`);
  }
  await insertAuditEvent(db, { labId: actor.labId, actorUserId: actor.userId, action: 'pack.cancel', subjectType: 'pack', subjectId: id, details: {} });
  return getPack(db, actor, id);
}

/** Queues a failed or cancelled pack again (its last error stays visible until the new attempt starts). */
export async function retryPack(db: Db, actor: LabActor, id: string): Promise<PackValue> {
  authorize(actor, 'pack:create');
  const row = await getPackRow(db, actor.labId, id);
  if (!(await updatePack(db, id, { state: 'queued', stage: 'queued', progress: 0, cancel_requested: false, finished_at: null }, ['failed', 'cancelled']))) {
    throw conflict('pack', `This pack is ${row.state}; only a failed or cancelled pack can be retried.`);
  }
  await insertAuditEvent(db, { labId: actor.labId, actorUserId: actor.userId, action: 'pack.retry', subjectType: 'pack', subjectId: id, details: { previousError: row.error } });
  await queue(db, id);
  return getPack(db, actor, id);
}

/** A short-lived link to the finished zip, through the app (which checks it, then redirects to the store). */
export async function packDownloadLink(db: Db, actor: LabActor, id: string): Promise<{ url: string; expiresAt: string }> {
  authorize(actor, 'pack:read');
  const row = await getPackRow(db, actor.labId, id);
  if (row.state !== 'succeeded' || !row.object_key) throw conflict('pack', 'This pack is not ready to download yet.');
  const expiresAt = Date.now() + getEnv().DOWNLOAD_LINK_SECONDS * 1000;
  const token = signDownload({ packId: id, labId: actor.labId, expiresAt });
  return { url: `${getEnv().APP_URL}/packs/download/${token}`, expiresAt: new Date(expiresAt).toISOString() };
}

/** File name of a pack's zip: the space, the edition and the start of its content hash. */
export function packFileName(row: Pick<PackListRow, 'space_name' | 'edition_number' | 'sha256' | 'id'>): string {
  const space = row.space_name.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '') || 'space';
  return `${space}-edition-${row.edition_number}-${(row.sha256 ?? row.id).slice(0, 8)}.zip`;
}


export type DownloadResolution = { ok: true; url: string; etag: string } | { ok: false; status: 403 | 404 | 409; title: string; message: string };

/** Checks an app download link and, when it holds, gives a fresh presigned object-store URL to redirect to. */
export async function resolvePackDownload(db: Db, token: string): Promise<DownloadResolution> {
  const check = verifyDownload(token);
  if (!check.ok) {
    return check.reason === 'expired'
      ? { ok: false, status: 403, title: 'This download link has expired', message: 'Download links work for a few minutes. Open the packs page and choose Download again for a fresh link.' }
      : { ok: false, status: 403, title: 'This download link is not valid', message: 'The link is incomplete or was changed. Open the packs page and choose Download again.' };
  }
  const row = await getPackRow(db, check.grant.labId, check.grant.packId).catch(() => null);
  if (!row) return { ok: false, status: 404, title: 'Pack not found', message: 'This pack no longer exists.' };
  if (row.state !== 'succeeded' || !row.object_key) return { ok: false, status: 409, title: 'Pack not ready', message: 'This pack is not ready to download.' };
  return { ok: true, url: await presignDownload(row.object_key, packFileName(row)), etag: `"${row.sha256 ?? row.id}"` };
}
