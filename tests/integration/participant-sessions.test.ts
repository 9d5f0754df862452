import { randomUUID } from 'node:crypto';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as api from '@/lib/server/api';
import { getDb } from '@/lib/server/db';
import { neutralizeCsvCell as neutralizeCell } from '@/lib/csv';
import { callRoute, createLabWithEveryRole, type TestLab } from '../support/actors';
import { makeEdition } from '../support/editions';
import { categorisation, SCREEN } from '../support/study-designs';

type Trial = { index: number; task: string; isPractice: boolean; isCatch: boolean; correctKey: string | null };
type Session = { sessionCode: string; participant: number; stored: number; planned: number; isComplete: boolean; trials: Trial[]; answered: number[]; nextTrialIndex: number | null; finishCode: string | null };
type Receipt = { stored: number; planned: number; isNew: boolean };
type Problem = { status: number; code: string; detail: string; errors?: Record<string, string[]> };
type MonitorRow = { id: string; participant: number; stored: number; planned: number; completedAt: string | null; catchAccuracy: number | null; medianRtMs: number | null; tabHiddenTrials: number; isExcluded: boolean; exclusionReason: string | null; withdrawnAt: string | null };

// A small study: 1 direction × 7 levels × 1 repetition, 2 practice trials, some catch trials.
const CATEGORISATION = categorisation({ practiceTrials: 2, catchRate: 0.2 });

describe('participant sessions', () => {
  let lab: TestLab;
  let studyId: string;
  let token: string;
  const as = (role: keyof TestLab['members']) => lab.members[role].cookie;
  const S = () => ({ lab: lab.slug, studyId });
  const start = () => callRoute(api.startSessionRoute, { params: { token }, body: { screen: SCREEN } });
  const answer = (code: string, t: Trial, over: Record<string, unknown> = {}) =>
    callRoute(api.submitResponseRoute, {
      params: { token, code },
      body: { clientTrialId: randomUUID(), trialIndex: t.index, responseKey: t.correctKey ?? 'f', rating: null, rtMs: 400 + t.index, achievedMs: 200.4, onsetMs: 1000, offsetMs: 1200.4, wasTabHidden: false, leftFullScreen: false, ...over },
    });
  const storedRows = async (code: string) => (await callRoute(api.resumeSessionRoute, { params: { token, code } })).body as Session;
  const countRows = async () => Number((await sql<{ n: string }>`SELECT count(*) AS n FROM trial_responses r JOIN study_sessions s ON s.id = r.session_id WHERE s.study_id = ${studyId}`.execute(getDb())).rows[0]!.n);

  beforeAll(async () => {
    lab = await createLabWithEveryRole(getDb());
    const { editionId } = await makeEdition(lab, 'Session space', true);
    const made = await callRoute(api.createStudyRoute, {
      params: { lab: lab.slug },
      body: { name: 'Session study', editionId, consentText: 'I agree.', finishCodePrefix: 'EPI-', targetParticipants: 5, design: { stimulusSizeDeg: 4, categorisation: CATEGORISATION, similarity: null } },
      cookie: as('experimenter'),
    });
    studyId = (made.body as { id: string }).id;
    const opened = await callRoute(api.openStudyRoute, { params: S(), body: { confirmEthics: true }, cookie: as('experimenter') });
    token = new URL((opened.body as { inviteUrl: string }).inviteUrl).pathname.split('/').pop()!;
  }, 60_000);
  afterAll(async () => {
    await getDb().destroy();
  });

  it('the link shows the study without sign-in; a made-up link is a clear 404', async () => {
    const r = await callRoute(api.getJoinStudyRoute, { params: { token } });
    expect(r.status).toBe(200);
    expect(r.body).toMatchObject({ name: 'Session study', state: 'open', isAccepting: true, consentText: 'I agree.' });
    const bad = await callRoute(api.getJoinStudyRoute, { params: { token: 'x'.repeat(43) } });
    expect(bad.status).toBe(404);
    expect((bad.body as Problem).code).toBe('not_found:invite');
  });

  it('participants get consecutive indices, each with their own regenerated plan', async () => {
    const [a, b] = await Promise.all([start(), start()]);
    expect(a.status).toBe(201);
    expect(b.status).toBe(201);
    const indices = [(a.body as Session).participant, (b.body as Session).participant].sort();
    expect(indices[1]! - indices[0]!).toBe(1);
    const plan = await callRoute(api.getStudyPlanRoute, { params: S(), query: { participant: String((a.body as Session).participant) }, cookie: as('reviewer') });
    expect((a.body as Session).trials).toEqual((plan.body as { trials: unknown[] }).trials);
    expect((a.body as Session).planned).toBe((a.body as Session).trials.length);
  });

  it('submission is idempotent: the same UUID twice is stored once, and every answer returns the count the server holds', async () => {
    const s = (await start()).body as Session;
    const t0 = s.trials[0]!;
    const id = randomUUID();
    const first = await answer(s.sessionCode, t0, { clientTrialId: id, rtMs: 321 });
    expect(first.status).toBe(200);
    expect(first.body).toEqual({ stored: 1, planned: s.planned, isComplete: false, isNew: true });
    const again = await answer(s.sessionCode, t0, { clientTrialId: id, rtMs: 999 });
    expect(again.body).toMatchObject({ stored: 1, isNew: false });
    // Another UUID for a trial already answered is refused the same way: one answer per planned trial.
    const other = await answer(s.sessionCode, t0, { rtMs: 555 });
    expect(other.body).toMatchObject({ stored: 1, isNew: false });
    // In parallel, ten copies of the next trial: still one row.
    const t1 = s.trials[1]!;
    const id1 = randomUUID();
    const copies = await Promise.all(Array.from({ length: 10 }, () => answer(s.sessionCode, t1, { clientTrialId: id1 })));
    expect(copies.every((c) => c.status === 200)).toBe(true);
    expect(copies.filter((c) => (c.body as Receipt).isNew)).toHaveLength(1);
    const resumed = await storedRows(s.sessionCode);
    expect(resumed.stored).toBe(2);
    expect(resumed.answered).toEqual([t0.index, t1.index]);
    expect(resumed.nextTrialIndex).toBe(s.trials[2]!.index);
    const trials = (await callRoute(api.listStudyTrialsRoute, { params: S(), cookie: as('reviewer') })).body as { items: { trialIndex: number; rtMs: number; participant: number }[] };
    const mine = trials.items.filter((r) => r.participant === s.participant);
    expect(mine.map((r) => r.trialIndex)).toEqual([t0.index, t1.index]);
    expect(mine[0]!.rtMs).toBe(321); // the first write won
  });

  it('unknown trials, wrong keys and oversized payloads get clear answers and store nothing', async () => {
    const s = (await start()).body as Session;
    const before = await countRows();
    const unknown = await answer(s.sessionCode, { ...s.trials[0]!, index: s.planned });
    expect(unknown.status).toBe(400);
    expect((unknown.body as Problem).errors).toHaveProperty('trialIndex');
    const key = await answer(s.sessionCode, s.trials[0]!, { responseKey: 'q' });
    expect(key.status).toBe(400);
    expect((key.body as Problem).errors).toHaveProperty('responseKey');
    const big = await answer(s.sessionCode, s.trials[0]!, { padding: 'x'.repeat(10_000) });
    expect(big.status).toBe(413);
    const noSession = await callRoute(api.submitResponseRoute, {
      params: { token, code: 'AAAAA-BBBBB-CCCCC-DDDDD' },
      body: { clientTrialId: randomUUID(), trialIndex: 0, responseKey: 'f', rating: null, rtMs: 1, achievedMs: 1, onsetMs: 1, offsetMs: 2, wasTabHidden: false, leftFullScreen: false },
    });
    expect(noSession.status).toBe(404);
    expect(await countRows()).toBe(before);
  });

  it('the session completes only when every planned trial is stored; then the finish code, and later answers are refused', async () => {
    const s = (await start()).body as Session;
    for (const t of s.trials.slice(0, -1)) expect((await answer(s.sessionCode, t, { wasTabHidden: t.index === 3 })).status).toBe(200);
    const early = await callRoute(api.finishSessionRoute, { params: { token, code: s.sessionCode } });
    expect(early.status).toBe(409);
    expect((early.body as Problem).code).toBe('conflict:session-incomplete');
    expect((early.body as Problem).detail).toContain(`${s.planned - 1} of ${s.planned}`);
    const last = await answer(s.sessionCode, s.trials.at(-1)!);
    expect((last.body as Receipt).stored).toBe(s.planned);
    const done = await callRoute(api.finishSessionRoute, { params: { token, code: s.sessionCode } });
    expect(done.status).toBe(200);
    const code = (done.body as { finishCode: string }).finishCode;
    expect(code).toMatch(/^EPI-[0-9A-Z]{8}$/);
    // Asking again gives the same code, not a new one.
    expect(((await callRoute(api.finishSessionRoute, { params: { token, code: s.sessionCode } })).body as { finishCode: string }).finishCode).toBe(code);
    const after = await answer(s.sessionCode, s.trials[0]!);
    expect(after.status).toBe(409);
    expect((after.body as Problem).code).toBe('conflict:session-complete');

    const monitor = (await callRoute(api.listStudySessionsRoute, { params: S(), cookie: as('reviewer') })).body as { items: MonitorRow[] };
    const row = monitor.items.find((m) => m.participant === s.participant)!;
    expect(row).toMatchObject({ stored: s.planned, planned: s.planned, tabHiddenTrials: 1 });
    expect(row.completedAt).not.toBeNull();
    // Every answer was the correct key, so catch accuracy is 1 (when the plan has catch trials outside practice).
    const catches = s.trials.filter((t) => t.isCatch && !t.isPractice).length;
    expect(row.catchAccuracy).toBe(catches > 0 ? 1 : null);
    const rts = s.trials.filter((t) => !t.isPractice).map((t) => 400 + t.index).sort((x, y) => x - y);
    const mid = rts.length / 2;
    expect(row.medianRtMs).toBeCloseTo(rts.length % 2 ? rts[Math.floor(mid)]! : (rts[mid - 1]! + rts[mid]!) / 2, 6);
  });

  it('withdrawal deletes the answers, during the session or afterwards; the lab can then delete the session', async () => {
    const s = (await start()).body as Session;
    for (const t of s.trials.slice(0, 3)) await answer(s.sessionCode, t);
    const w = await callRoute(api.withdrawSessionRoute, { body: { sessionCode: s.sessionCode.toLowerCase() } });
    expect(w.status).toBe(200);
    expect(w.body).toEqual({ ok: true, deletedTrials: 3 });
    const left = await sql<{ n: string }>`SELECT count(*) AS n FROM trial_responses r JOIN study_sessions s ON s.id = r.session_id WHERE s.study_id = ${studyId} AND s.participant_index = ${s.participant}`.execute(getDb());
    expect(Number(left.rows[0]!.n)).toBe(0);
    expect((await answer(s.sessionCode, s.trials[3]!)).status).toBe(409);
    expect((await callRoute(api.resumeSessionRoute, { params: { token, code: s.sessionCode } })).status).toBe(409);

    const monitor = (await callRoute(api.listStudySessionsRoute, { params: S(), cookie: as('reviewer') })).body as { items: MonitorRow[] };
    const row = monitor.items.find((m) => m.participant === s.participant)!;
    expect(row.withdrawnAt).not.toBeNull();
    expect(row.stored).toBe(0);
    // Reviewers and Designers may not delete; the Experimenter may, and only a withdrawn session.
    for (const role of ['reviewer', 'designer'] as const) {
      expect((await callRoute(api.deleteStudySessionRoute, { params: { ...S(), sessionId: row.id }, cookie: as(role) })).status).toBe(403);
    }
    const complete = monitor.items.find((m) => m.completedAt && !m.withdrawnAt)!;
    expect((await callRoute(api.deleteStudySessionRoute, { params: { ...S(), sessionId: complete.id }, cookie: as('experimenter') })).status).toBe(409);
    expect((await callRoute(api.deleteStudySessionRoute, { params: { ...S(), sessionId: row.id }, cookie: as('experimenter') })).status).toBe(204);
    expect(await getDb().selectFrom('study_sessions').select('id').where('id', '=', row.id).executeTakeFirst()).toBeUndefined();
  });

  it('exclusion needs a reason and a role that manages sessions; CSV neutralises formula cells', async () => {
    const monitor = (await callRoute(api.listStudySessionsRoute, { params: S(), query: { limit: '1' }, cookie: as('reviewer') })).body as { items: MonitorRow[]; nextCursor: string | null };
    expect(monitor.items).toHaveLength(1);
    expect(monitor.nextCursor).not.toBeNull();
    const next = (await callRoute(api.listStudySessionsRoute, { params: S(), query: { limit: '1', cursor: monitor.nextCursor! }, cookie: as('reviewer') })).body as { items: MonitorRow[] };
    expect(next.items[0]!.id).not.toBe(monitor.items[0]!.id);
    const id = monitor.items[0]!.id;
    const noReason = await callRoute(api.setSessionExclusionRoute, { params: { ...S(), sessionId: id }, body: { isExcluded: true, reason: ' ' }, cookie: as('experimenter') });
    expect(noReason.status).toBe(400);
    expect((noReason.body as Problem).errors).toHaveProperty('reason');
    expect((await callRoute(api.setSessionExclusionRoute, { params: { ...S(), sessionId: id }, body: { isExcluded: true, reason: 'Looked away' }, cookie: as('reviewer') })).status).toBe(403);
    const ex = await callRoute(api.setSessionExclusionRoute, { params: { ...S(), sessionId: id }, body: { isExcluded: true, reason: 'Catch trials at chance' }, cookie: as('experimenter') });
    expect(ex.body).toMatchObject({ isExcluded: true, exclusionReason: 'Catch trials at chance' });
    const inc = await callRoute(api.setSessionExclusionRoute, { params: { ...S(), sessionId: id }, body: { isExcluded: false, reason: '' }, cookie: as('owner') });
    expect(inc.body).toMatchObject({ isExcluded: false });

    const csv = await callRoute(api.studyTrialsCsvRoute, { params: S(), cookie: as('reviewer') });
    expect(csv.status).toBe(200);
    expect(csv.headers.get('content-type')).toContain('text/csv');
    const lines = (csv.body as string).trim().split('\n');
    expect(lines[0]).toContain('trialIndex');
    expect(lines.length - 1).toBe(await countRows());
    expect(neutralizeCell('=HYPERLINK("x")')).toBe(`'=HYPERLINK("x")`);
    expect(neutralizeCell('+1+2')).toBe(`'+1+2`);
    expect(neutralizeCell('@SUM(A1)')).toBe(`'@SUM(A1)`);
    expect(neutralizeCell('-1+2')).toBe(`'-1+2`);
    expect(neutralizeCell(-0.4)).toBe('-0.4');
    expect(neutralizeCell('f')).toBe('f');
    // Outside the lab, the monitor does not exist.
    const other = await createLabWithEveryRole(getDb());
    expect((await callRoute(api.listStudySessionsRoute, { params: { lab: other.slug, studyId }, cookie: other.members.owner.cookie })).status).toBe(404);
  });

  it("a session code works only under its own study's link: the one it started from, or the study's current one", async () => {
    const made = await callRoute(api.createStudyRoute, {
      params: { lab: lab.slug },
      body: { name: 'Other study', editionId: (await makeEdition(lab, 'Other space', true)).editionId, consentText: 'I agree.', finishCodePrefix: 'OTH-', targetParticipants: 5, design: { stimulusSizeDeg: 4, categorisation: CATEGORISATION, similarity: null } },
      cookie: as('experimenter'),
    });
    const otherId = (made.body as { id: string }).id;
    const opened = await callRoute(api.openStudyRoute, { params: { lab: lab.slug, studyId: otherId }, body: { confirmEthics: true }, cookie: as('experimenter') });
    const otherToken = new URL((opened.body as { inviteUrl: string }).inviteUrl).pathname.split('/').pop()!;
    const tokenOf = (body: unknown) => new URL((body as { inviteUrl: string }).inviteUrl).pathname.split('/').pop()!;

    const s = (await start()).body as Session;
    const unknown = await callRoute(api.resumeSessionRoute, { params: { token, code: 'AAAAA-BBBBB-CCCCC-DDDDD' } });
    expect(unknown.status).toBe(404);
    const asUnknown = { status: 404, body: { code: (unknown.body as Problem).code, detail: (unknown.body as Problem).detail } };
    const before = await countRows();
    // Under another study's link, the code is unknown: resume, answers (even one already cached) and finish alike.
    expect((await answer(s.sessionCode, s.trials[0]!)).status).toBe(200);
    const foreign = { token: otherToken, code: s.sessionCode };
    const resumed = await callRoute(api.resumeSessionRoute, { params: foreign });
    expect(resumed).toMatchObject(asUnknown);
    const answered = await callRoute(api.submitResponseRoute, {
      params: foreign,
      body: { clientTrialId: randomUUID(), trialIndex: s.trials[1]!.index, responseKey: 'f', rating: null, rtMs: 400, achievedMs: 200, onsetMs: 0, offsetMs: 200, wasTabHidden: false, leftFullScreen: false },
    });
    expect(answered).toMatchObject(asUnknown);
    expect((await callRoute(api.finishSessionRoute, { params: foreign })).status).toBe(404);
    expect(await countRows()).toBe(before + 1);

    // The lab replaces the link: the session goes on under the link it started from, and under the new one.
    const rotated = await callRoute(api.rotateStudyInviteRoute, { params: S(), cookie: as('experimenter') });
    expect(rotated.status).toBe(200);
    const oldToken = token;
    token = tokenOf(rotated.body);
    expect((await answer(s.sessionCode, s.trials[1]!)).status).toBe(200);
    token = oldToken;
    expect((await answer(s.sessionCode, s.trials[2]!)).status).toBe(200);
    token = tokenOf(rotated.body);
    expect((await storedRows(s.sessionCode)).stored).toBe(3);
    // A session started under the new link is not admitted by the old one, which is neither its own nor current.
    const later = (await start()).body as Session;
    expect((await callRoute(api.resumeSessionRoute, { params: { token: oldToken, code: later.sessionCode } })).status).toBe(404);
    expect((await callRoute(api.resumeSessionRoute, { params: { token, code: later.sessionCode } })).status).toBe(200);
  });

  it('a closed study takes no new participants but lets a session in progress finish; a revoked link is refused', async () => {
    const s = (await start()).body as Session;
    expect((await callRoute(api.closeStudyRoute, { params: S(), cookie: as('experimenter') })).status).toBe(200);
    const view = await callRoute(api.getJoinStudyRoute, { params: { token } });
    expect(view.body).toMatchObject({ state: 'closed', isAccepting: false });
    const late = await start();
    expect(late.status).toBe(409);
    expect((late.body as Problem).code).toBe('conflict:study-closed');
    expect((await answer(s.sessionCode, s.trials[0]!)).status).toBe(200);
    expect((await callRoute(api.revokeStudyInviteRoute, { params: S(), cookie: as('experimenter') })).status).toBe(200);
    const revoked = await callRoute(api.getJoinStudyRoute, { params: { token } });
    expect(revoked.status).toBe(404);
    expect((revoked.body as Problem).detail).toMatch(/not valid any more/);
    expect((await start()).status).toBe(404);
    // Withdrawing afterwards needs only the session code, whatever became of the link.
    const w = await callRoute(api.withdrawSessionRoute, { body: { sessionCode: s.sessionCode } });
    expect(w.body).toEqual({ ok: true, deletedTrials: 1 });
    expect((await callRoute(api.withdrawSessionRoute, { body: { sessionCode: 'AAAAA-BBBBB-CCCCC-DDDDD' } })).status).toBe(404);
  });
});
