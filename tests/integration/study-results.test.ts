import { randomUUID } from 'node:crypto';
import { XMLValidator } from 'fast-xml-parser';
import type PgBoss from 'pg-boss';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as api from '@/lib/server/api';
import { getDb } from '@/lib/server/db';
import { startBoss } from '@/lib/server/jobs/boss';
import { startResultsWorker } from '@/lib/server/jobs/results-worker';
import { getStudyResults } from '@/lib/server/services/study-results';
import { resolveLabActor } from '@/lib/server/services/access';
import type { StudyReportValue, StudyResultsValue } from '@/lib/schemas/study-results';
import { evaluatePsychometric } from '@/lib/stats';
import { participantKeys } from '@/lib/study';
import { callRoute, createLabWithEveryRole, type TestLab } from '../support/actors';
import { parseCsv } from '../support/csv';
import { makeEdition } from '../support/editions';
import { keyedDraws } from '../support/keyed-draws';
import { categorisation, SCREEN } from '../support/study-designs';

type Trial = { index: number; task: string; isPractice: boolean; isCatch: boolean; position: number; directionDeg: number; leftAnchor: 'A' | 'B'; correctKey: string | null };
type Session = { sessionCode: string; participant: number; trials: Trial[] };
type Problem = { status: number; code: string; errors?: Record<string, string[]> };

// Two diameters × 7 levels × 4 repetitions, catch trials, 2 practice trials (an invented study).
const CATEGORISATION = categorisation({ directionsDeg: [0, 90], repetitions: 4, practiceTrials: 2, catchRate: 0.15 });
const SETTINGS = { link: 'logit', lapseMode: 'free', lapseValue: 0.06, resamples: 1000, seed: 11, alpha: 0.05, catchAccuracyMin: 0.75, rtMadK: 3 };
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

describe('study results', () => {
  let lab: TestLab;
  let studyId: string;
  let token: string;
  const sessions: { id: string; participant: number; slowTrial: number }[] = [];
  const as = (role: keyof TestLab['members']) => lab.members[role].cookie;
  const S = () => ({ lab: lab.slug, studyId });
  let boss: PgBoss;
  let stopWorker: () => Promise<void>;
  /** The results through the route, waiting while the worker computes them (larger analyses go to a job). */
  const results = async () => {
    for (let i = 0; ; i++) {
      const r = await callRoute(api.getStudyResultsRoute, { params: S(), cookie: as('reviewer') });
      expect(r.status).toBe(200);
      const body = r.body as StudyResultsValue;
      if (body.state === 'ready' || body.state === 'failed' || i >= 300) return body;
      await sleep(200);
    }
  };

  /** An invented observer: P(B) logistic in the position towards B (spread 0.15, PSE 0.05), seeded; catch trials right or wrong. */
  async function runParticipant(seed: number, catchRight: boolean) {
    const started = await callRoute(api.startSessionRoute, { params: { token }, body: { screen: SCREEN } });
    const s = started.body as Session;
    const keys = participantKeys(['f', 'j'], s.participant);
    // The choices are keyed by what each trial shows, so the study's random seed (the order) does not change them.
    const draw = keyedDraws();
    const answerable = s.trials.filter((t) => t.task === 'categorisation' && !t.isPractice && !t.isCatch);
    // The slow trial is picked by what it shows (an easy one: the far end of the first direction), not by its place
    // in the order, which the study's random seed sets: the data left after the RT rule are then the same every run.
    const far = Math.max(...answerable.map((t) => t.position));
    const slowTrial = answerable.find((t) => t.directionDeg === Math.min(...answerable.map((a) => a.directionDeg)) && t.position === far)!.index;
    for (const t of s.trials) {
      let key: string;
      if (t.task !== 'categorisation' || t.isPractice || t.isCatch) {
        const right = t.correctKey ?? 'f';
        key = t.isCatch && !catchRight ? (right === 'f' ? 'j' : 'f') : right;
      } else {
        const choseB = draw(`${seed}|${t.directionDeg}|${t.position}`) < evaluatePsychometric('logit', { threshold: 0.05, spread: 0.15, lapse: 0.01 }, -t.position);
        key = (choseB ? 'B' : 'A') === t.leftAnchor ? keys.left : keys.right;
      }
      const rtMs = t.index === slowTrial ? 9000 : 450 + Math.round(100 * draw(`rt|${seed}|${t.index}`));
      const r = await callRoute(api.submitResponseRoute, {
        params: { token, code: s.sessionCode },
        body: { clientTrialId: randomUUID(), trialIndex: t.index, responseKey: key, rating: null, rtMs, achievedMs: 200, onsetMs: 1000, offsetMs: 1200, wasTabHidden: false, leftFullScreen: false },
      });
      expect(r.status).toBe(200);
    }
    const list = await callRoute(api.listStudySessionsRoute, { params: S(), cookie: as('reviewer') });
    const id = (list.body as { items: { id: string; participant: number }[] }).items.find((x) => x.participant === s.participant)!.id;
    sessions.push({ id, participant: s.participant, slowTrial });
  }

  beforeAll(async () => {
    boss = await startBoss({ supervise: false });
    stopWorker = await startResultsWorker({ db: getDb(), boss, pollingIntervalSeconds: 0.5 });
    lab = await createLabWithEveryRole(getDb());
    const { editionId } = await makeEdition(lab, 'Results space', true);
    const made = await callRoute(api.createStudyRoute, {
      params: { lab: lab.slug },
      body: { name: 'Results study', editionId, consentText: 'I agree.', finishCodePrefix: 'RS-', targetParticipants: 5, design: { stimulusSizeDeg: 4, categorisation: CATEGORISATION, similarity: null } },
      cookie: as('experimenter'),
    });
    studyId = (made.body as { id: string }).id;
    const opened = await callRoute(api.openStudyRoute, { params: S(), body: { confirmEthics: true }, cookie: as('experimenter') });
    token = new URL((opened.body as { inviteUrl: string }).inviteUrl).pathname.split('/').pop()!;
    await runParticipant(1, true);
    await runParticipant(2, true);
    await runParticipant(3, false);
    expect((await callRoute(api.updateResultSettingsRoute, { params: S(), body: SETTINGS, cookie: as('experimenter') })).status).toBe(200);
  }, 120_000);
  afterAll(async () => {
    await stopWorker();
    await boss.stop({ graceful: false, wait: true });
    await getDb().destroy();
  });

  it('fits every direction from simulated sessions, with the exclusions the rules make, and caches the result', { timeout: 60_000 }, async () => {
    const started = performance.now();
    const first = await results();
    const firstMs = performance.now() - started;
    expect(first.state).toBe('ready');
    const report = first.report!;
    const section = report.sections.categorisation!;
    expect(section.pooled.map((f) => f.directionDeg)).toEqual([0, 90]);
    for (const f of section.pooled) {
      expect(f.fit).not.toBeNull();
      // Simulated PSE 0.05 and spread 0.15 (two participants × 4 repetitions: generous tolerances).
      expect(f.fit!.threshold).toBeGreaterThan(-0.15);
      expect(f.fit!.threshold).toBeLessThan(0.25);
      expect(f.fit!.spread).toBeGreaterThan(0.04);
      expect(f.fit!.spread).toBeLessThan(0.4);
      expect(f.intervals!.threshold[0]).toBeLessThan(f.fit!.threshold);
      expect(f.intervals!.threshold[1]).toBeGreaterThan(f.fit!.threshold);
      expect(f.goodnessOfFit!.resamples).toBe(1000);
      expect(f.levels.map((l) => l.x)).toHaveLength(7);
    }
    // The third participant got every catch trial wrong; each participant's 9-s answer is an RT outlier.
    const catchOut = report.exclusions.filter((e) => e.rule === 'catch-accuracy');
    expect(catchOut.map((e) => e.participant)).toEqual([sessions[2]!.participant]);
    expect(catchOut[0]!.sessionId).toBe(sessions[2]!.id);
    const rtOut = report.exclusions.filter((e) => e.rule === 'rt-outlier');
    expect(rtOut.map((e) => e.trialIndex).sort()).toEqual(expect.arrayContaining([sessions[0]!.slowTrial, sessions[1]!.slowTrial]));
    expect(report.counts).toMatchObject({ participants: 3, participantsIncluded: 2 });
    expect(section.participants).toHaveLength(2);
    expect(section.slopeTests.every((t) => t.test?.df === 1)).toBe(true);
    expect(section.groupSlopeTest!.df).toBe(2);
    expect(section.noBiasTest!.df).toBe(2);
    expect(section.verdict!.text).toMatch(/not evidence that there is none|differ between directions/);
    console.log(`results of 3 simulated sessions (${report.counts.trials} trials, 6 fit sets × 2,000 resamples): ready after ${Math.round(firstMs)} ms, ${report.computeMs} ms of fitting`);

    const again = performance.now();
    const second = await results();
    console.log(`cached read: ${Math.round(performance.now() - again)} ms`);
    expect(second.dataHash).toBe(first.dataHash);
    expect(second.report!.computedAt).toBe(report.computedAt);
    const rows = await getDb().selectFrom('study_results').select(['id']).where('study_id', '=', studyId).execute();
    expect(rows).toHaveLength(1);
  });

  it('records manual decisions with their reason, and they change the results', { timeout: 60_000 }, async () => {
    const before = await results();
    const third = sessions[2]!;
    const keep = await callRoute(api.createResultExclusionRoute, { params: S(), body: { sessionId: third.id, trialIndex: null, action: 'keep', reason: 'Catch trials were shown too briefly' }, cookie: as('experimenter') });
    expect(keep.status).toBe(201);
    const drop = await callRoute(api.createResultExclusionRoute, { params: S(), body: { sessionId: sessions[0]!.id, trialIndex: 3, action: 'exclude', reason: 'Noise in the room' }, cookie: as('experimenter') });
    expect(drop.status).toBe(201);
    const after = await results();
    expect(after.dataHash).not.toBe(before.dataHash);
    expect(after.report!.counts.participantsIncluded).toBe(3);
    expect(after.report!.exclusions.find((e) => e.rule === 'catch-accuracy')).toMatchObject({ isOverridden: true, manualId: (keep.body as { id: string }).id });
    expect(after.report!.exclusions.find((e) => e.rule === 'manual')).toMatchObject({ participant: sessions[0]!.participant, trialIndex: 3, reason: 'Noise in the room' });

    const removed = await callRoute(api.removeResultExclusionRoute, { params: { ...S(), exclusionId: (keep.body as { id: string }).id }, cookie: as('experimenter') });
    expect(removed.status).toBe(204);
    const list = await callRoute(api.listResultExclusionsRoute, { params: S(), cookie: as('reviewer') });
    const items = (list.body as { items: { id: string; reason: string; removedAt: string | null; createdBy: string | null }[] }).items;
    expect(items).toHaveLength(2);
    expect(items[0]).toMatchObject({ reason: 'Catch trials were shown too briefly' });
    expect(items[0]!.createdBy).not.toBeNull();
    expect(items[0]!.removedAt).not.toBeNull();
    const audit = await getDb().selectFrom('audit_events').select(['action']).where('subject_id', '=', studyId).where('action', 'like', 'results.%').execute();
    expect(audit.map((a) => a.action)).toEqual(expect.arrayContaining(['results.settings', 'results.keep', 'results.exclude', 'results.exclusion-removed']));
    // With the keep withdrawn the third participant is out again.
    expect((await results()).report!.counts.participantsIncluded).toBe(2);

    // A reviewer may read but not decide; a bad trial index is a field error and nothing is written.
    expect((await callRoute(api.createResultExclusionRoute, { params: S(), body: { sessionId: third.id, trialIndex: null, action: 'exclude', reason: 'x' }, cookie: as('reviewer') })).status).toBe(403);
    const bad = await callRoute(api.createResultExclusionRoute, { params: S(), body: { sessionId: third.id, trialIndex: 9999, action: 'exclude', reason: 'x' }, cookie: as('experimenter') });
    expect(bad.status).toBe(400);
    expect((bad.body as Problem).errors?.trialIndex).toBeDefined();
    expect((await callRoute(api.listResultExclusionsRoute, { params: S(), cookie: as('reviewer') })).body).toMatchObject({ items: { length: 2 } });
  });

  it('refuses bad settings field by field', async () => {
    const r = await callRoute(api.updateResultSettingsRoute, { params: S(), body: { ...SETTINGS, resamples: 10, lapseValue: 0.7 }, cookie: as('experimenter') });
    expect(r.status).toBe(400);
    expect(Object.keys((r.body as Problem).errors ?? {})).toEqual(expect.arrayContaining(['resamples', 'lapseValue']));
    expect((await callRoute(api.updateResultSettingsRoute, { params: S(), body: SETTINGS, cookie: as('reviewer') })).status).toBe(403);
  });

  it('exports trials.csv, fits.csv, report.json and the plots, each stamped with the study and the edition hash', { timeout: 60_000 }, async () => {
    const edition = await getDb().selectFrom('studies').innerJoin('editions', 'editions.id', 'studies.edition_id').select('editions.content_hash').where('studies.id', '=', studyId).executeTakeFirstOrThrow();
    const trials = await callRoute(api.downloadResultsTrialsCsvRoute, { params: S(), cookie: as('reviewer') });
    expect(trials.status).toBe(200);
    expect(trials.headers.get('content-disposition')).toContain('trials.csv');
    const trialRows = parseCsv(String(trials.body));
    const stored = await getDb().selectFrom('trial_responses as r').innerJoin('study_sessions as s', 's.id', 'r.session_id').select('r.trial_index').where('s.study_id', '=', studyId).execute();
    expect(trialRows).toHaveLength(stored.length);
    expect(trialRows.every((r) => r.studyId === studyId && r.editionHash === edition.content_hash)).toBe(true);
    const fitted = trialRows.filter((r) => r.inFits === 'true');
    expect(fitted.every((r) => r.isCatch === 'false' && r.isPractice === 'false' && (r.choseAnchor === 'A' || r.choseAnchor === 'B'))).toBe(true);
    expect(fitted.every((r) => Number(r.towardsB) === -Number(r.position))).toBe(true);
    const slow = trialRows.find((r) => r.participant === String(sessions[1]!.participant) && r.trialIndex === String(sessions[1]!.slowTrial))!;
    expect(slow.inFits).toBe('false');
    expect(slow.exclusion).toMatch(/scaled MADs/);

    const report = (await results()).report!;
    const fits = await callRoute(api.downloadResultsFitsCsvRoute, { params: S(), cookie: as('reviewer') });
    const fitRows = parseCsv(String(fits.body));
    expect(fitRows).toHaveLength(2 + 2 * 2);
    expect(fitRows.every((r) => r.studyId === studyId && r.editionHash === edition.content_hash && r.dataHash === report.dataHash)).toBe(true);
    const pooled0 = fitRows.find((r) => r.scope === 'pooled' && r.directionDeg === '0')!;
    expect(Number(pooled0.pse)).toBeCloseTo(report.sections.categorisation!.pooled[0]!.fit!.threshold, 10);
    expect(Number(pooled0.pseLow)).toBeLessThan(Number(pooled0.pse));

    const json = await callRoute(api.downloadResultsReportRoute, { params: S(), cookie: as('reviewer') });
    expect(json.headers.get('content-disposition')).toContain('report.json');
    const body = (typeof json.body === 'string' ? JSON.parse(json.body) : json.body) as StudyReportValue;
    expect(body).toMatchObject({ format: 'epicycle-study-report', study: { id: studyId }, edition: { contentHash: edition.content_hash }, dataHash: report.dataHash });

    for (const plot of ['curves', 'slopes', 'pse']) {
      const svg = await callRoute(api.downloadResultsPlotRoute, { params: { ...S(), plot }, cookie: as('reviewer') });
      expect(svg.status).toBe(200);
      expect(svg.headers.get('content-type')).toContain('image/svg+xml');
      expect(XMLValidator.validate(String(svg.body))).toBe(true);
      expect(String(svg.body)).toContain(edition.content_hash.slice(0, 12));
    }
    expect((String((await callRoute(api.downloadResultsPlotRoute, { params: { ...S(), plot: 'curves' }, cookie: as('reviewer') })).body).match(/class="curve"/g) ?? []).length).toBe(2);
  });

  it('computes a large analysis as a job, with its progress written as it goes', async () => {
    {
      expect((await callRoute(api.updateResultSettingsRoute, { params: S(), body: { ...SETTINGS, resamples: 8000, seed: 12 }, cookie: as('experimenter') })).status).toBe(200);
      const actor = await resolveLabActor(getDb(), { kind: 'user', userId: lab.members.reviewer.id }, lab.slug);
      const queued = await getStudyResults(getDb(), actor, studyId, { inlineFits: 0 });
      expect(queued.state).toBe('queued');
      expect(queued.report).toBeNull();
      const seen = new Set<number>();
      let last = queued;
      // The worker runs in this process, so the poll reads the row alone (one query between two fit sets).
      for (let i = 0; i < 600; i++) {
        await sleep(50);
        const row = await getDb().selectFrom('study_results').select(['state', 'progress']).where('data_hash', '=', queued.dataHash).executeTakeFirstOrThrow();
        if (row.state === 'running') seen.add(row.progress);
        expect(row.state).not.toBe('failed');
        if (row.state === 'ready') break;
      }
      last = await getStudyResults(getDb(), actor, studyId, { inlineFits: 0 });
      expect(last.state).toBe('ready');
      expect(last.progress).toBe(1);
      expect([...seen].some((p) => p > 0 && p < 1)).toBe(true);
      const row = await getDb().selectFrom('study_results').select(['job_id', 'compute_ms']).where('data_hash', '=', last.dataHash).executeTakeFirstOrThrow();
      expect(row.job_id).not.toBeNull();
      console.log(`job: 6 fit sets × 16,000 resamples in ${row.compute_ms} ms; progress seen ${[...seen].map((p) => p.toFixed(2)).join(', ')}`);
      expect(last.report!.sections.categorisation!.pooled[0]!.goodnessOfFit!.resamples).toBe(8000);
    }
  }, 120_000);
});
