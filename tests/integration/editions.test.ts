import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as api from '@/lib/server/api';
import { getDb } from '@/lib/server/db';
import { contentHash } from '@/lib/edition';
import { ROLES, can, type Role } from '@/lib/server/policy';
import { callRoute, createLabWithEveryRole, mailTo, type TestLab } from '../support/actors';

const SEED = { family: 'radial', baseRadius: 1, terms: [{ k: 3, amplitude: 0.1, phase: 0.2 }] };
const SETTINGS = {
  axes: [
    { label: 'Lobe 2', changes: [{ harmonic: 2, field: 'amplitude', delta: 0.08 }] },
    { label: 'Lobe 4', changes: [{ harmonic: 4, field: 'amplitude', delta: 0.08 }] },
  ],
  extent: 1,
  layout: { kind: 'rings', rings: 2, spokes: 8 },
  normalization: { scale: 'equal-area-radius', centroid: true },
  equalize: false,
};

type Space = { id: string; version: number; boundariesVersion: number; boundaries: unknown[] };
type Edition = { id: string; number: number; state: string; contentHash: string; stimulusCount: number; supersededBy: number | null; openComments: number };

describe('boundaries, editions and their review', () => {
  let lab: TestLab;
  let space: Space;
  const as = (role: Role) => lab.members[role].cookie;
  const params = (extra: Record<string, string> = {}) => ({ lab: lab.slug, spaceId: space.id, ...extra });

  beforeAll(async () => {
    lab = await createLabWithEveryRole(getDb());
    const seed = await callRoute(api.createSeedShapeRoute, { params: { lab: lab.slug }, body: { name: 'Seed', descriptor: SEED }, cookie: as('designer') });
    const created = await callRoute(api.createShapeSpaceRoute, {
      params: { lab: lab.slug },
      body: { name: 'Review space', seedShapeId: (seed.body as { id: string }).id, ...SETTINGS },
      cookie: as('designer'),
    });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    space = created.body as Space;
  });
  afterAll(async () => {
    await getDb().destroy();
  });

  const putBoundaries = (role: Role, boundaries: unknown[], version: number) => callRoute(api.putSpaceBoundariesRoute, { params: params(), body: { boundaries, version }, cookie: as(role) });
  const freeze = (role: Role, changeNote = '') => callRoute(api.freezeEditionRoute, { params: params(), body: { changeNote }, cookie: as(role) });
  const submit = (role: Role, n: number) => callRoute(api.submitEditionRoute, { params: params({ number: String(n) }), cookie: as(role) });
  const decide = (role: Role, n: number, decision: 'approve' | 'return', note = 'checked') =>
    callRoute(api.decideEditionRoute, { params: params({ number: String(n) }), body: { decision, note }, cookie: as(role) });
  const edition = async (n: number) => (await callRoute(api.getEditionRoute, { params: params({ number: String(n) }), cookie: as('reviewer') })).body as Edition;

  it('boundaries: Designers, Experimenters and Owners edit them; bad angles, duplicate keys and stale versions change nothing', async () => {
    const reviewer = await putBoundaries('reviewer', [{ key: 'x', angleDeg: 10 }], space.boundariesVersion);
    expect(reviewer.status).toBe(403);
    const outOfRange = await putBoundaries('experimenter', [{ key: 'x', angleDeg: 180 }], space.boundariesVersion);
    expect(outOfRange.status).toBe(400);
    expect((outOfRange.body as { detail: string; errors: Record<string, string[]> }).errors['boundaries.0.angleDeg']?.[0]).toMatch(/180/);
    const duplicate = await putBoundaries('experimenter', [{ key: 'x', angleDeg: 10 }, { key: 'x', angleDeg: 20 }], space.boundariesVersion);
    expect(duplicate.status).toBe(400);
    const tooFar = await putBoundaries('experimenter', [{ key: 'x', angleDeg: 10, prototypeDistance: 3 }], space.boundariesVersion);
    expect(tooFar.status).toBe(400);

    const ok = await putBoundaries('experimenter', [{ key: 'round-vs-lobed', label: 'Round vs lobed', angleDeg: 22.5 }], space.boundariesVersion);
    expect(ok.status, JSON.stringify(ok.body)).toBe(200);
    const after = ok.body as Space;
    expect(after.boundaries).toEqual([{ key: 'round-vs-lobed', label: 'Round vs lobed', angleDeg: 22.5, prototypeDistance: null }]);
    expect(after.boundariesVersion).toBe(space.boundariesVersion + 1);
    expect(after.version).toBe(space.version);

    const stale = await putBoundaries('designer', [], space.boundariesVersion);
    expect(stale.status).toBe(409);
    space = after;
  });

  it('freezing: only Designers and Owners; the stored snapshot re-hashes to the stored content hash', async () => {
    expect((await freeze('experimenter')).status).toBe(403);
    expect((await freeze('reviewer')).status).toBe(403);
    const r = await freeze('designer', 'First cut');
    expect(r.status, JSON.stringify(r.body)).toBe(201);
    const e = r.body as Edition;
    expect(e).toMatchObject({ number: 1, state: 'draft', stimulusCount: 2 * 8 + 1 + 2 });
    expect(e.contentHash).toMatch(/^[0-9a-f]{64}$/);
    const snap = await callRoute(api.getEditionSnapshotRoute, { params: params({ number: '1' }), cookie: as('reviewer') });
    expect(snap.status).toBe(200);
    expect(contentHash(snap.body)).toBe(e.contentHash);
    // Freezing the unchanged space again gives the same content, so the same hash.
    const again = await freeze('owner');
    expect((again.body as Edition).number).toBe(2);
    expect((again.body as Edition).contentHash).toBe(e.contentHash);
  });

  it('submitting: Draft → In review by Designers and Owners only, mailing the reviewers', async () => {
    for (const role of ROLES) {
      if (can(role, 'edition:submit')) continue;
      expect((await submit(role, 1)).status, role).toBe(403);
    }
    expect((await edition(1)).state).toBe('draft');
    const r = await submit('designer', 1);
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    expect((r.body as Edition).state).toBe('in_review');
    const again = await submit('designer', 1);
    expect(again.status).toBe(409);
    expect((again.body as { detail: string }).detail).toMatch(/only a Draft/);
    const mail = await mailTo(lab.members.reviewer.email);
    expect(mail[0]?.subject).toMatch(/Review requested: Review space, edition 1/);
    expect((await mailTo(lab.members.owner.email))[0]?.subject).toMatch(/edition 1/);
  });

  it('deciding: Reviewers and Owners, never the author, only In review; the author is mailed', async () => {
    // Edition 2 was frozen by the owner: the owner may not decide on it.
    expect((await submit('owner', 2)).status).toBe(200);
    const own = await decide('owner', 2, 'approve');
    expect(own.status).toBe(403);
    expect((own.body as { detail: string }).detail).toMatch(/someone else must review/);
    for (const role of ['designer', 'experimenter'] as const) expect((await decide(role, 1, 'approve')).status, role).toBe(403);
    expect((await edition(1)).state).toBe('in_review');
    const noNote = await decide('reviewer', 1, 'return', '');
    expect(noNote.status).toBe(400);

    const approved = await decide('reviewer', 1, 'approve', 'Looks even');
    expect(approved.status, JSON.stringify(approved.body)).toBe(200);
    expect((approved.body as Edition).state).toBe('approved');
    expect((await mailTo(lab.members.designer.email))[0]?.subject).toMatch(/edition 1: approved/);
    const twice = await decide('owner', 1, 'return', 'changed my mind');
    expect(twice.status).toBe(409);
    expect((await edition(1)).state).toBe('approved');
    // A decision on a Draft is refused too.
    const draft = await freeze('designer');
    expect((await decide('reviewer', (draft.body as Edition).number, 'approve')).status).toBe(409);
  });

  it('an Approved edition cannot be edited: a clear 409, and the note stays', async () => {
    const r = await callRoute(api.updateEditionRoute, { params: params({ number: '1' }), body: { changeNote: 'rewritten' }, cookie: as('designer') });
    expect(r.status).toBe(409);
    expect((r.body as { detail: string }).detail).toMatch(/never changes.*freeze a new edition/i);
    const draft = await callRoute(api.updateEditionRoute, { params: params({ number: '3' }), body: { changeNote: 'draft note' }, cookie: as('designer') });
    expect(draft.status, JSON.stringify(draft.body)).toBe(200);
  });

  it('the database refuses any change to a snapshot, its hash or its number, and any deletion', async () => {
    const db = getDb();
    const id = (await edition(1)).id;
    await expect(sql`UPDATE editions SET snapshot = '{}'::jsonb WHERE id = ${id}`.execute(db)).rejects.toThrow(/immutable/);
    await expect(sql`UPDATE editions SET content_hash = ${'0'.repeat(64)} WHERE id = ${id}`.execute(db)).rejects.toThrow(/immutable/);
    await expect(sql`UPDATE editions SET number = 99 WHERE id = ${id}`.execute(db)).rejects.toThrow(/immutable/);
    await expect(sql`UPDATE editions SET state = 'draft' WHERE id = ${id}`.execute(db)).rejects.toThrow(/decided edition/);
    await expect(sql`DELETE FROM editions WHERE id = ${id}`.execute(db)).rejects.toThrow(/cannot be deleted/);
    const third = (await edition(3)).id;
    await expect(sql`UPDATE editions SET state = 'approved' WHERE id = ${third}`.execute(db)).rejects.toThrow(/no transition from draft to approved/);
    const snap = await callRoute(api.getEditionSnapshotRoute, { params: params({ number: '1' }), cookie: as('reviewer') });
    expect(contentHash(snap.body)).toBe((await edition(1)).contentHash);
  });

  it('comments: on the edition or one of its stimuli (prototypes included); an unknown stimulus id is refused', async () => {
    const post = (body: unknown, role: Role = 'reviewer') => callRoute(api.addEditionCommentRoute, { params: params({ number: '2' }), body, cookie: as(role) });
    expect((await post({ body: 'Whole set looks fine' })).status).toBe(201);
    const pinned = await post({ body: 'This one is too lumpy', stimulusId: 'r02-s03' });
    expect(pinned.status, JSON.stringify(pinned.body)).toBe(201);
    expect((await post({ body: 'Prototype reads well', stimulusId: 'p-round-vs-lobed-a' }, 'experimenter')).status).toBe(201);
    const unknown = await post({ body: 'Where is it?', stimulusId: 'r09-s99' });
    expect(unknown.status).toBe(400);
    expect((unknown.body as { detail: string }).detail).toMatch(/no stimulus "r09-s99"/);
    const list = await callRoute(api.listEditionCommentsRoute, { params: params({ number: '2' }), cookie: as('designer') });
    const items = (list.body as { items: { id: string; stimulusId: string | null }[] }).items;
    expect(items.map((c) => c.stimulusId)).toEqual([null, 'r02-s03', 'p-round-vs-lobed-a']);
    expect((await edition(2)).openComments).toBe(3);
    const resolved = await callRoute(api.resolveEditionCommentRoute, { params: params({ number: '2', commentId: items[1]!.id }), body: { resolved: true }, cookie: as('designer') });
    expect(resolved.status).toBe(200);
    expect((resolved.body as { resolvedAt: string | null }).resolvedAt).not.toBeNull();
    expect((await edition(2)).openComments).toBe(2);
  });

  it('a Returned edition is superseded by the next freeze; the diff matches stimuli by id', async () => {
    expect((await decide('reviewer', 2, 'return', 'Make ring 2 smaller')).status).toBe(200);
    expect((await mailTo(lab.members.owner.email))[0]?.subject).toMatch(/edition 2: returned/);
    expect((await submit('owner', 2)).status).toBe(409);

    const moved = await putBoundaries('designer', [{ key: 'round-vs-lobed', label: 'Round vs lobed', angleDeg: 67.5 }], space.boundariesVersion);
    expect(moved.status).toBe(200);
    const patched = await callRoute(api.updateShapeSpaceRoute, { params: params(), body: { layout: { kind: 'rings', rings: 3, spokes: 8 }, version: space.version }, cookie: as('designer') });
    expect(patched.status, JSON.stringify(patched.body)).toBe(200);
    const next = (await freeze('designer', 'Third ring')).body as Edition;
    expect((await edition(2)).supersededBy).toBe(next.number);
    expect((await edition(1)).supersededBy).toBeNull();

    const diff = await callRoute(api.diffEditionsRoute, { params: params(), query: { from: '1', to: String(next.number) }, cookie: as('reviewer') });
    expect(diff.status, JSON.stringify(diff.body)).toBe(200);
    const d = diff.body as { parameters: { path: string }[]; added: { id: string }[]; removed: unknown[]; changed: { id: string }[]; unchangedCount: number };
    expect(d.parameters.map((p) => p.path)).toEqual(expect.arrayContaining(['/boundaries/0/angleDeg', '/definition/layout/rings']));
    expect(d.added.map((s) => s.id).sort()).toEqual(Array.from({ length: 8 }, (_, s) => `r03-s0${s}`));
    expect(d.removed).toHaveLength(0);
    expect(d.changed.map((c) => c.id)).toEqual(expect.arrayContaining(['p-round-vs-lobed-a', 'p-round-vs-lobed-b', 'r01-s00']));
    expect(d.unchangedCount).toBe(1); // the centre
  });

  it('every transition is in the audit log, and a space with editions cannot be deleted', async () => {
    const rows = await getDb().selectFrom('audit_events').select('action').where('lab_id', '=', lab.id).where('subject_type', '=', 'edition').execute();
    const actions = rows.map((r) => r.action);
    for (const a of ['edition.freeze', 'edition.submit', 'edition.approve', 'edition.return', 'edition.comment']) expect(actions, a).toContain(a);
    const del = await callRoute(api.deleteShapeSpaceRoute, { params: params(), cookie: as('owner') });
    expect(del.status).toBe(409);
    expect((del.body as { detail: string }).detail).toMatch(/editions/);
  });

  it('another lab sees none of it: 404', async () => {
    const other = await createLabWithEveryRole(getDb());
    const r = await callRoute(api.getEditionRoute, { params: { lab: lab.slug, spaceId: space.id, number: '1' }, cookie: other.members.owner.cookie });
    expect(r.status).toBe(404);
    const own = await callRoute(api.getEditionRoute, { params: { lab: other.slug, spaceId: space.id, number: '1' }, cookie: other.members.owner.cookie });
    expect(own.status).toBe(404);
  });
});
