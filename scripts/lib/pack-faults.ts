// The fault scripts' side of pack jobs (`npm run load -- --restart-db`, `-- --kill-worker`): ask for a pack of the
// demo lab's first edition as its Experimenter, follow it, and check what the object store holds afterwards.
import { createHash } from 'node:crypto';
import type { Db } from '@/db/client';
import { DEMO_LAB, DEMO_SPACE } from '@/db/seed';
import demo from '@/db/demo-users.json' with { type: 'json' };
import { DEFAULT_RENDER_OPTIONS } from '@/lib/schemas/render';
import { packObjectKey } from '@/lib/server/jobs/run-pack-job';
import { resolveLabActor, type LabActor } from '@/lib/server/services/access';
import { listDisplayProfiles } from '@/lib/server/services/display-profiles';
import { createPack } from '@/lib/server/services/packs';
import { listShapeSpaces } from '@/lib/server/services/shape-spaces';
import { listObjects, readObject } from '@/lib/server/storage';

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

export interface PackState {
  state: string;
  attempts: number;
  error: string | null;
  sha256: string | null;
  sizeBytes: number | null;
}

async function experimenter(db: Db): Promise<LabActor> {
  const email = demo.users.find((u) => u.role === 'experimenter')!.email;
  const user = await db.selectFrom('users').select('id').where('email', '=', email).executeTakeFirstOrThrow();
  return resolveLabActor(db, { kind: 'user', userId: user.id }, DEMO_LAB.slug);
}

/** A new pack (its sample count drawn at random, so it is never an earlier pack reused), queued for the workers. */
export async function askForPack(db: Db, { heavy }: { heavy: boolean }): Promise<{ packId: string; labId: string }> {
  const actor = await experimenter(db);
  const space = (await listShapeSpaces(db, actor, { limit: 100 })).items.find((s) => s.name === DEMO_SPACE.name);
  if (!space) throw new Error('the demo space is missing: start the server once with `npm start` (it seeds the demo lab)');
  const profile = (await listDisplayProfiles(db, actor, { limit: 100 })).items[0];
  if (!profile) throw new Error('the demo lab has no display profile');
  // Heavy: many outline samples and a large canvas, a pack that takes long enough to be caught mid-way by a restart.
  const samples = heavy ? 4096 + Math.floor(Math.random() * 4096) : 256 + Math.floor(Math.random() * 1024);
  const render = heavy ? { ...DEFAULT_RENDER_OPTIONS, sizeDeg: 6, canvasDeg: 8, samples } : { ...DEFAULT_RENDER_OPTIONS, samples };
  const { pack, reused } = await createPack(db, actor, space.id, 1, { displayProfileId: profile.id, render });
  if (reused) throw new Error('an earlier pack was reused; run again');
  return { packId: pack.id, labId: actor.labId };
}

/** The pack's row now, or undefined while the database is away. */
export async function packState(db: Db, packId: string): Promise<PackState | undefined> {
  try {
    const row = await db.selectFrom('packs').select(['state', 'attempts', 'error', 'sha256', 'size_bytes']).where('id', '=', packId).executeTakeFirstOrThrow();
    return { state: row.state, attempts: row.attempts, error: row.error, sha256: row.sha256, sizeBytes: row.size_bytes === null ? null : Number(row.size_bytes) };
  } catch {
    return undefined;
  }
}

/** Waits until the pack is in one of `states` (riding out a database that is away). */
export async function packUntil(db: Db, packId: string, states: readonly string[], timeoutMs: number, everyMs = 100): Promise<PackState> {
  const end = Date.now() + timeoutMs;
  for (;;) {
    const p = await packState(db, packId);
    if (p && states.includes(p.state)) return p;
    if (Date.now() > end) throw new Error(`pack ${packId} not ${states.join('/')} after ${timeoutMs / 1000} s: ${JSON.stringify(p)}`);
    await sleep(everyMs);
  }
}

/**
 * What the store holds under the lab's prefix: every object must be the zip of a pack the database says succeeded,
 * whole (its size and SHA-256 those recorded). Counts the objects, and any partial or orphan ones.
 */
export async function checkStore(db: Db, labId: string): Promise<{ objects: number; whole: number; partialOrOrphan: string[] }> {
  const succeeded = await db.selectFrom('packs').select(['id', 'sha256', 'size_bytes']).where('lab_id', '=', labId).where('state', '=', 'succeeded').execute();
  const byKey = new Map(succeeded.map((p) => [packObjectKey(labId, p.id), p]));
  const objects = await listObjects(`labs/${labId}/`);
  const bad: string[] = [];
  let whole = 0;
  for (const o of objects) {
    const p = byKey.get(o.key);
    if (!p) {
      bad.push(`${o.key} (no succeeded pack)`);
      continue;
    }
    const bytes = await readObject(o.key);
    const sha = createHash('sha256').update(bytes).digest('hex');
    if (bytes.length !== Number(p.size_bytes) || sha !== p.sha256) bad.push(`${o.key} (size or SHA-256 differs)`);
    else whole += 1;
  }
  return { objects: objects.length, whole, partialOrOrphan: bad };
}
