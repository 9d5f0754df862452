import 'server-only';
import { createHash } from 'node:crypto';
import { createWriteStream } from 'node:fs';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Db } from '@/db/client';
import { getEditionSnapshot } from '@/db/repositories/editions';
import { getPack, getPackSequences, isCancelRequested, updatePack } from '@/db/repositories/packs';
import { buildPack } from '@/lib/pack/build-pack';
import type { PackJobRunner } from '@/lib/pack/pack-job';
import type { PackInput, PackPngRequest, PackStage } from '@/lib/pack/types';
import type { DisplayProfile, RenderOptions } from '@/lib/render/types';
import { EditionSnapshotSchema } from '@/lib/schemas/edition';
import type { ShapeDescriptor } from '@/lib/shape/types';
import packageJson from '../../../package.json' with { type: 'json' };
import { logEvent } from '../log';
import { deleteObject, putFile } from '../storage';

class Cancelled extends Error {}

export interface PackJobContext {
  renderPng: (request: PackPngRequest) => Promise<Uint8Array>;
  /** Runs lib/pack's heavy pure jobs (RDM rows, table lines, perimeters) on the pool's threads; absent: here. */
  runJob?: PackJobRunner;
  /** 1 for the first try. */
  attempt: number;
  /** No retry follows a failure of this attempt. */
  finalAttempt: boolean;
}

/** Where a pack's zip is stored. */
export const packObjectKey = (labId: string, packId: string) => `labs/${labId}/packs/${packId}.zip`;

// Overall progress: the PNGs (on the worker threads) and the RDMs (on this thread) run at the same time.
const WEIGHTS = { before: 0.1, png: 0.4, rdm: 0.25, tables: 0.05, zip: 0.12, upload: 0.08 };

/**
 * Builds one pack: the edition's snapshot, drawn for the stored profile and options, zipped to a temporary file
 * while hashing it, then uploaded in one PUT. Progress goes to the packs table (throttled); a cancel request is
 * seen between stimuli. A failure removes any stored object; the pack shows the error, and is queued again when
 * the queue will retry it.
 */
export async function runPackJob(db: Db, packId: string, ctx: PackJobContext): Promise<'succeeded' | 'cancelled' | 'skipped'> {
  const row = await getPack(db, null, packId);
  if (row.state === 'succeeded' || row.state === 'cancelled') return 'skipped';
  if (row.cancel_requested) {
    await updatePack(db, packId, { state: 'cancelled', stage: 'cancelled', finished_at: new Date() });
    return 'cancelled';
  }
  await updatePack(db, packId, { state: 'running', stage: 'starting', progress: 0.01, attempts: row.attempts + 1, started_at: new Date(), error: null });

  const key = packObjectKey(row.lab_id, packId);
  const dir = await mkdtemp(join(tmpdir(), 'epicycle-pack-'));
  let cancelled = false;
  let uploaded = false;
  const parts = { before: 0, png: 0, rdm: 0, tables: 0, zip: 0, upload: 0 };
  let stage = 'starting';
  let lastWrite = 0;
  const report = (force = false) => {
    const now = Date.now();
    if (!force && now - lastWrite < 300) return;
    lastWrite = now;
    const progress = Math.min(0.999, Object.entries(parts).reduce((sum, [k, v]) => sum + WEIGHTS[k as keyof typeof WEIGHTS] * v, 0));
    void updatePack(db, packId, { progress, stage }, ['running']).catch(() => undefined);
  };
  const poll = setInterval(() => {
    void isCancelRequested(db, packId).then((c) => (cancelled ||= c)).catch(() => undefined);
  }, 500);
  const checkCancel = () => {
    if (cancelled) throw new Cancelled('cancelled');
  };

  try {
    const snapshot = EditionSnapshotSchema.parse(await getEditionSnapshot(db, row.edition_id));
    const input: PackInput = {
      edition: { spaceName: row.space_name, number: row.edition_number, contentHash: row.edition_hash, state: row.edition_state, createdAt: zipEntryDate(row.edition_created_at) },
      definition: { seed: snapshot.seed.descriptor as ShapeDescriptor, ...snapshot.definition } as PackInput['definition'],
      boundaries: snapshot.boundaries.map((b) => ({ key: b.key, ...(b.label ? { label: b.label } : {}), angleDeg: b.angleDeg, prototypeDistance: b.prototypeDistance })),
      profile: row.profile as DisplayProfile,
      render: row.render_options as RenderOptions,
      versions: { product: packageJson.version, engine: snapshot.engineVersion },
      sequences: await getPackSequences(db, packId),
    };
    const pack = await buildPack(input, {
      renderPng: (request) => {
        checkCancel();
        return ctx.renderPng(request);
      },
      ...(ctx.runJob ? { runJob: ctx.runJob } : {}),
      sha256Hex: (bytes) => createHash('sha256').update(bytes).digest('hex'),
      onProgress: (s: PackStage, fraction) => {
        checkCancel();
        stage = s === 'png' || s === 'rdm' ? 'drawing and measuring' : s;
        if (s === 'png') parts.png = fraction;
        else if (s === 'rdm') parts.rdm = fraction;
        else if (s === 'tables' || s === 'hash') parts.tables = fraction;
        else parts.before = Math.max(parts.before, s === 'check' ? 0.2 : s === 'synthesize' ? 0.7 : 1);
        report();
      },
    });
    checkCancel();

    stage = 'zipping';
    parts.png = parts.rdm = parts.tables = parts.before = 1;
    const path = join(dir, 'pack.zip');
    const hash = createHash('sha256');
    const out = createWriteStream(path);
    const total = pack.files.reduce((n, f) => n + f.bytes, 0);
    let written = 0;
    await pack.writeZip(
      (chunk) =>
        new Promise<void>((resolve, reject) => {
          hash.update(chunk);
          written += chunk.length;
          parts.zip = Math.min(1, written / Math.max(1, total));
          report();
          out.write(chunk, (error) => (error ? reject(error) : resolve()));
        }),
    );
    await new Promise<void>((resolve, reject) => out.end((error?: Error | null) => (error ? reject(error) : resolve())));
    checkCancel();

    stage = 'uploading';
    parts.zip = 1;
    report(true);
    const sha256 = hash.digest('hex');
    uploaded = true;
    const size = await putFile(key, path, 'application/zip', { sha256, edition: row.edition_hash });
    // A cancel asked for at any moment before the pack is marked done wins.
    if (await isCancelRequested(db, packId)) throw new Cancelled('cancelled');
    const done = await updatePack(
      db,
      packId,
      {
        state: 'succeeded',
        stage: 'done',
        progress: 1,
        object_key: key,
        size_bytes: size,
        sha256,
        stimulus_count: pack.manifest.stimuli.length,
        manifest: JSON.stringify(pack.manifest),
        finished_at: new Date(),
        error: null,
      },
      ['running'],
    );
    if (!done) {
      // Cancelled (or taken over) while uploading: keep nothing.
      await deleteObject(key).catch(() => undefined);
      return 'cancelled';
    }
    logEvent('info', 'pack built', { packId, stimuli: pack.manifest.stimuli.length, bytes: size });
    return 'succeeded';
  } catch (error) {
    if (uploaded) await deleteObject(key).catch(() => undefined);
    if (error instanceof Cancelled || cancelled) {
      await updatePack(db, packId, { state: 'cancelled', stage: 'cancelled', finished_at: new Date() });
      return 'cancelled';
    }
    const message = error instanceof Error ? error.message : String(error);
    logEvent('error', 'pack failed', { packId, attempt: ctx.attempt, error: message });
    await updatePack(db, packId, {
      state: ctx.finalAttempt ? 'failed' : 'queued',
      stage: ctx.finalAttempt ? 'failed' : 'waiting to retry',
      error: ctx.finalAttempt ? message : `Attempt ${ctx.attempt} failed (${message}); it will be retried.`,
      ...(ctx.finalAttempt ? { finished_at: new Date() } : {}),
    });
    throw error;
  } finally {
    clearInterval(poll);
    await rm(dir, { recursive: true, force: true });
  }
}

/** The zip's entry dates: the edition's creation, in whole seconds, UTC. */
function zipEntryDate(createdAt: Date): string {
  return new Date(Math.floor(createdAt.getTime() / 1000) * 1000).toISOString().replace('.000Z', 'Z');
}
