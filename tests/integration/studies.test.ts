import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as api from '@/lib/server/api';
import { getDb } from '@/lib/server/db';
import { inviteTokenHash } from '@/lib/server/study-invite';
import { findStudyByInviteHash } from '@/db/repositories/studies';
import { callRoute, createLabWithEveryRole, type TestLab } from '../support/actors';
import { makeEdition } from '../support/editions';
import { categorisation } from '../support/study-designs';

type Study = {
  id: string;
  state: string;
  version: number;
  name: string;
  consentText: string;
  editionWarning: string | null;
  inviteUrl: string | null;
  design: { seed: number; categorisation: { steps: number; repetitions: number } | null };
  plannedTrials: { categorisation: number; similarity: number; total: number };
  flash: { peakPerSecond: number; isAboveLimit: boolean };
  estimatedSeconds: number;
};
type Problem = { status: number; code: string; errors?: Record<string, string[]> };
type Plan = { participant: number; keys: { left: string; right: string }; trials: { index: number; task: string }[]; summary: { cells: { trials: number; leftA: number }[]; totalTrials: number } };

const CATEGORISATION = categorisation({ directionsDeg: [0, 45, 90, 135], repetitions: 2, practiceTrials: 4, catchRate: 0.1, timing: { fixationMs: 500, probeMs: 300, blankMs: 200, responseMs: 2000, itiMs: 600 } });

describe('norming studies API', () => {
  let lab: TestLab;
  let approved: { editionId: string; stimulusCount: number };
  let draft: { editionId: string; stimulusCount: number };
  const as = (role: keyof TestLab['members']) => lab.members[role].cookie;
  const body = (over: Record<string, unknown> = {}, design: Record<string, unknown> = {}) => ({
    name: 'Diameter norming',
    editionId: approved.editionId,
    consentText: 'I agree to take part.',
    targetParticipants: 24,
    design: { stimulusSizeDeg: 4, categorisation: CATEGORISATION, similarity: null, ...design },
    ...over,
  });
  const create = (b: unknown, role: keyof TestLab['members'] = 'experimenter') => callRoute(api.createStudyRoute, { params: { lab: lab.slug }, body: b, cookie: as(role) });
  const countStudies = async () => Number((await sql<{ n: string }>`SELECT count(*) AS n FROM studies WHERE lab_id = ${lab.id}`.execute(getDb())).rows[0]!.n);

  beforeAll(async () => {
    lab = await createLabWithEveryRole(getDb());
    approved = await makeEdition(lab, 'Study space approved', true);
    draft = await makeEdition(lab, 'Study space draft', false);
  }, 60_000);
  afterAll(async () => {
    await getDb().destroy();
  });

  it('an Experimenter sets up a study on an Approved edition, with counts, duration and flash check', async () => {
    const r = await create(body());
    expect(r.status, JSON.stringify(r.body)).toBe(201);
    const s = r.body as Study;
    expect(s).toMatchObject({ state: 'draft', editionWarning: null, inviteUrl: null, version: 1 });
    expect(Number.isInteger(s.design.seed)).toBe(true);
    // 4 directions × (7 levels × 2 reps = 14, + round(14·0.1/0.9) = 2 catch) + 4 practice = 68.
    expect(s.plannedTrials).toEqual({ categorisation: 68, similarity: 0, total: 68 });
    expect(s.estimatedSeconds).toBeCloseTo(68 * 3.6 + 180, 9);
    expect(s.flash).toEqual({ peakPerSecond: 2, isAboveLimit: false });
  });

  it('a Draft edition is allowed, and its "not approved" warning is stored with the study', async () => {
    const r = await create(body({ name: 'On a draft', editionId: draft.editionId }));
    expect(r.status, JSON.stringify(r.body)).toBe(201);
    const s = r.body as Study;
    expect(s.editionWarning).toMatch(/not Approved/);
    const row = await getDb().selectFrom('studies').select('edition_warning').where('id', '=', s.id).executeTakeFirstOrThrow();
    expect(row.edition_warning).toBe(s.editionWarning);
  });

  it('Owners and Experimenters edit; Designers and Reviewers read only', async () => {
    expect((await create(body({ name: 'By the owner' }), 'owner')).status).toBe(201);
    for (const role of ['designer', 'reviewer'] as const) {
      expect((await create(body({ name: `By ${role}` }), role)).status).toBe(403);
      const list = await callRoute(api.listStudiesRoute, { params: { lab: lab.slug }, cookie: as(role) });
      expect(list.status).toBe(200);
      expect((list.body as { items: Study[] }).items.map((s) => s.name)).toContain('Diameter norming');
    }
    const id = ((await callRoute(api.listStudiesRoute, { params: { lab: lab.slug }, cookie: as('reviewer') })).body as { items: Study[] }).items[0]!.id;
    expect((await callRoute(api.openStudyRoute, { params: { lab: lab.slug, studyId: id }, body: { confirmEthics: true }, cookie: as('reviewer') })).status).toBe(403);
    expect((await callRoute(api.getStudyPlanRoute, { params: { lab: lab.slug, studyId: id }, cookie: as('reviewer') })).status).toBe(200);
  });

  it('gives a field-level message for each kind of bad input, and saves nothing', async () => {
    const other = await createLabWithEveryRole(getDb());
    const foreign = await makeEdition(other, 'Foreign space', true);
    const before = await countStudies();
    const cases: [unknown, string][] = [
      [body({}, { categorisation: { ...CATEGORISATION, directionsDeg: [] } }), 'design.categorisation.directionsDeg'],
      [body({ consentText: '' }), 'consentText'],
      [body({}, { categorisation: { ...CATEGORISATION, steps: 8 } }), 'design.categorisation.steps'],
      [body({}, { categorisation: { ...CATEGORISATION, timing: { ...CATEGORISATION.timing, blankMs: 0 } } }), 'design.categorisation.timing.blankMs'],
      [body({}, { categorisation: { ...CATEGORISATION, timing: { ...CATEGORISATION.timing, itiMs: -100 } } }), 'design.categorisation.timing.itiMs'],
      // 4 directions × 21 steps × 60 repetitions = 5,040 trials.
      [body({}, { categorisation: { ...CATEGORISATION, steps: 21, repetitions: 60, catchRate: 0, practiceTrials: 0 } }), 'design.categorisation.repetitions'],
      [body({ editionId: foreign.editionId }), 'editionId'],
      [body({}, { categorisation: null, similarity: null }), 'design.tasks'],
    ];
    for (const [bad, field] of cases) {
      const r = await create(bad);
      expect(r.status, field).toBe(400);
      const p = r.body as Problem;
      expect(p.code).toMatch(/^validation:/);
      expect(Object.keys(p.errors ?? {}), JSON.stringify(p)).toContain(field);
      expect(p.errors![field]![0]!.length).toBeGreaterThan(8);
    }
    expect(await countStudies()).toBe(before);
  });

  it('a balanced pair subset must use every stimulus equally often; the plan shows it does', async () => {
    const n = approved.stimulusCount;
    const similarity = {
      pairSet: 'balanced',
      pairCount: n + 1,
      presentation: 'simultaneous',
      scaleLow: 'Different',
      scaleHigh: 'Same',
      repetitions: 1,
      timing: { fixationMs: 500, stimulusMs: 1500, gapMs: 400, responseMs: 4000, itiMs: 500 },
    };
    const bad = await create(body({ name: 'Pairs' }, { categorisation: null, similarity }));
    expect(bad.status).toBe(400);
    expect(Object.keys((bad.body as Problem).errors ?? {})).toEqual(['design.similarity.pairCount']);
    const good = await create(body({ name: 'Pairs' }, { categorisation: null, similarity: { ...similarity, pairCount: n } }));
    expect(good.status, JSON.stringify(good.body)).toBe(201);
    const id = (good.body as Study).id;
    const plan = (await callRoute(api.getStudyPlanRoute, { params: { lab: lab.slug, studyId: id }, query: { participant: '3' }, cookie: as('reviewer') })).body as { summary: { stimulusUse: Record<string, number> } };
    expect(Object.keys(plan.summary.stimulusUse)).toHaveLength(n);
    expect(new Set(Object.values(plan.summary.stimulusUse))).toEqual(new Set([2]));
  });

  it('previews a participant plan that is the same on every call and differs between participants', async () => {
    const s = (await create(body({ name: 'Plans' }))).body as Study;
    const plan = async (p: string) => (await callRoute(api.getStudyPlanRoute, { params: { lab: lab.slug, studyId: s.id }, query: { participant: p }, cookie: as('designer') })).body as Plan;
    const p2 = await plan('2');
    expect(p2.trials).toHaveLength(68);
    expect(p2.trials.map((t) => t.index)).toEqual(p2.trials.map((_, i) => i));
    for (const cell of p2.summary.cells) expect(cell).toMatchObject({ trials: 2, leftA: 1 });
    expect(await plan('2')).toEqual(p2);
    expect((await plan('3')).trials).not.toEqual(p2.trials);
    expect((await plan('3')).keys).toEqual({ left: 'j', right: 'f' });
    const bad = await callRoute(api.getStudyPlanRoute, { params: { lab: lab.slug, studyId: s.id }, query: { participant: '-1' }, cookie: as('designer') });
    expect(bad.status).toBe(400);
  });

  it('opening needs the ethics confirmation, fixes the design (service and database trigger), and keeps texts editable', async () => {
    const s = (await create(body({ name: 'To open' }))).body as Study;
    const params = { lab: lab.slug, studyId: s.id };
    const unconfirmed = await callRoute(api.openStudyRoute, { params, body: {}, cookie: as('experimenter') });
    expect(unconfirmed.status).toBe(400);
    expect(Object.keys((unconfirmed.body as Problem).errors ?? {})).toContain('confirmEthics');
    // A Draft's design can change.
    const edited = await callRoute(api.updateStudyRoute, { params, body: { version: s.version, design: { stimulusSizeDeg: 5, categorisation: { ...CATEGORISATION, steps: 9 }, similarity: null } }, cookie: as('experimenter') });
    expect(edited.status, JSON.stringify(edited.body)).toBe(200);
    expect((edited.body as Study).design.seed).toBe(s.design.seed);
    const opened = await callRoute(api.openStudyRoute, { params, body: { confirmEthics: true }, cookie: as('experimenter') });
    expect(opened.status, JSON.stringify(opened.body)).toBe(200);
    const o = opened.body as Study;
    expect(o.state).toBe('open');
    expect(o.inviteUrl).toMatch(/\/join\/[A-Za-z0-9_-]{43}$/);

    const redesign = await callRoute(api.updateStudyRoute, { params, body: { version: o.version, design: { stimulusSizeDeg: 5, categorisation: { ...CATEGORISATION, steps: 11 }, similarity: null } }, cookie: as('experimenter') });
    expect(redesign.status).toBe(409);
    expect(Object.keys((redesign.body as Problem).errors ?? {})).toContain('design');
    const reEdition = await callRoute(api.updateStudyRoute, { params, body: { version: o.version, editionId: draft.editionId }, cookie: as('experimenter') });
    expect(reEdition.status).toBe(409);
    const texts = await callRoute(api.updateStudyRoute, { params, body: { version: o.version, consentText: 'I agree, having read the information sheet.', name: 'Opened study' }, cookie: as('experimenter') });
    expect(texts.status, JSON.stringify(texts.body)).toBe(200);
    expect(texts.body).toMatchObject({ consentText: 'I agree, having read the information sheet.', name: 'Opened study', design: { categorisation: { steps: 9 } } });

    // The trigger refuses it even past the service.
    await expect(sql`UPDATE studies SET design = jsonb_set(design, '{stimulusSizeDeg}', '6') WHERE id = ${s.id}`.execute(getDb())).rejects.toThrow(/fixed once it is open/);
    await expect(sql`UPDATE studies SET state = 'draft' WHERE id = ${s.id}`.execute(getDb())).rejects.toThrow(/no transition/);
    await expect(sql`DELETE FROM studies WHERE id = ${s.id}`.execute(getDb())).rejects.toThrow(/only a Draft/);
    expect((await callRoute(api.deleteStudyRoute, { params, cookie: as('owner') })).status).toBe(409);
    expect((await callRoute(api.openStudyRoute, { params, body: { confirmEthics: true }, cookie: as('experimenter') })).status).toBe(409);
  });

  it('the invite link rotates and is revoked; the token is found by its hash and never stored', async () => {
    const s = (await create(body({ name: 'Links' }))).body as Study;
    const params = { lab: lab.slug, studyId: s.id };
    expect((await callRoute(api.rotateStudyInviteRoute, { params, cookie: as('experimenter') })).status).toBe(409);
    const o = (await callRoute(api.openStudyRoute, { params, body: { confirmEthics: true }, cookie: as('owner') })).body as Study;
    const token1 = o.inviteUrl!.split('/join/')[1]!;
    expect((await findStudyByInviteHash(getDb(), inviteTokenHash(token1)))?.id).toBe(s.id);
    const stored = await sql<{ row: string }>`SELECT row_to_json(studies)::text AS row FROM studies WHERE id = ${s.id}`.execute(getDb());
    expect(stored.rows[0]!.row).not.toContain(token1);
    // The same link is shown on every read.
    expect(((await callRoute(api.getStudyRoute, { params, cookie: as('reviewer') })).body as Study).inviteUrl).toBe(o.inviteUrl);

    const rotated = (await callRoute(api.rotateStudyInviteRoute, { params, cookie: as('experimenter') })).body as Study;
    const token2 = rotated.inviteUrl!.split('/join/')[1]!;
    expect(token2).not.toBe(token1);
    expect(await findStudyByInviteHash(getDb(), inviteTokenHash(token1))).toBeUndefined();
    expect((await findStudyByInviteHash(getDb(), inviteTokenHash(token2)))?.id).toBe(s.id);
    expect((await callRoute(api.rotateStudyInviteRoute, { params, cookie: as('reviewer') })).status).toBe(403);

    const revoked = await callRoute(api.revokeStudyInviteRoute, { params, cookie: as('experimenter') });
    expect(revoked.status).toBe(200);
    expect((revoked.body as Study).inviteUrl).toBeNull();
    expect(await findStudyByInviteHash(getDb(), inviteTokenHash(token2))).toBeUndefined();
    expect((await callRoute(api.revokeStudyInviteRoute, { params, cookie: as('experimenter') })).status).toBe(409);

    const closed = await callRoute(api.closeStudyRoute, { params, cookie: as('experimenter') });
    expect((closed.body as Study).state).toBe('closed');
    expect((await callRoute(api.updateStudyRoute, { params, body: { version: (closed.body as Study).version, name: 'Later' }, cookie: as('experimenter') })).status).toBe(409);
  });

  it('stale versions conflict; a Draft can be deleted; other labs see nothing', async () => {
    const s = (await create(body({ name: 'Short-lived' }))).body as Study;
    const params = { lab: lab.slug, studyId: s.id };
    expect((await callRoute(api.updateStudyRoute, { params, body: { version: s.version, name: 'Renamed' }, cookie: as('experimenter') })).status).toBe(200);
    expect((await callRoute(api.updateStudyRoute, { params, body: { version: s.version, name: 'Again' }, cookie: as('experimenter') })).status).toBe(409);
    const other = await createLabWithEveryRole(getDb());
    expect((await callRoute(api.getStudyRoute, { params: { lab: other.slug, studyId: s.id }, cookie: other.members.owner.cookie })).status).toBe(404);
    expect((await callRoute(api.deleteStudyRoute, { params, cookie: as('experimenter') })).status).toBe(204);
    expect((await callRoute(api.getStudyRoute, { params, cookie: as('experimenter') })).status).toBe(404);
  });
});
