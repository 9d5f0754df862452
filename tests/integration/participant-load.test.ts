import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as api from '@/lib/server/api';
import { getDb } from '@/lib/server/db';
import type { AnyRouteSpec } from '@/lib/server/http';
import { countSessionTrials } from '@/lib/server/services/participant-sessions';
import { runParticipantLoad } from '@/scripts/lib/participant-load';
import { callRoute, createLabWithEveryRole, type TestLab } from '../support/actors';
import { makeEdition } from '../support/editions';
import { RouteServer } from '../support/route-server';
import { categorisation } from '../support/study-designs';

// The small version of `npm run load` (counts only, no timing): participants answer over real HTTP through the
// page's outbox while the server loses answers after storing them, and is killed and restarted in the middle.
// 1 direction × 7 levels × 4 repetitions + 2 practice trials: over the 20 trials each participant answers here.
const CATEGORISATION = categorisation({ repetitions: 4, practiceTrials: 2 });
const SESSIONS = 10;
const TRIALS = 20;

describe('participant load (small): every answer is stored exactly once', () => {
  let lab: TestLab;
  let token: string;
  const server = new RouteServer([api.startSessionRoute, api.submitResponseRoute] as unknown as AnyRouteSpec[]);

  beforeAll(async () => {
    lab = await createLabWithEveryRole(getDb());
    const { editionId } = await makeEdition(lab, 'Load space', true);
    const made = await callRoute(api.createStudyRoute, {
      params: { lab: lab.slug },
      body: { name: 'Load study', editionId, consentText: 'I agree.', finishCodePrefix: 'LD-', targetParticipants: SESSIONS, design: { stimulusSizeDeg: 4, categorisation: CATEGORISATION, similarity: null } },
      cookie: lab.members.experimenter.cookie,
    });
    const studyId = (made.body as { id: string }).id;
    const opened = await callRoute(api.openStudyRoute, { params: { lab: lab.slug, studyId }, body: { confirmEthics: true }, cookie: lab.members.experimenter.cookie });
    token = new URL((opened.body as { inviteUrl: string }).inviteUrl).pathname.split('/').pop()!;
    await server.start();
  }, 60_000);
  afterAll(async () => {
    await server.stop();
    await getDb().destroy();
  });

  it('with answers lost after the write and the server down for a second, the outboxes drain and the counts agree', async () => {
    let ticks = 0;
    let downtime: Promise<void> | null = null;
    const report = await runParticipantLoad({
      baseUrl: server.url,
      token,
      sessions: SESSIONS,
      trialsPerSession: TRIALS,
      intervalMs: 100,
      drainTimeoutMs: 120_000,
      onTick: () => {
        ticks += 1;
        // From the first second on, one successful answer in twenty never reaches its participant.
        server.loseAnswers = 0.05;
        if (ticks === 1) {
          downtime = (async () => {
            await server.stop();
            await new Promise((r) => setTimeout(r, 1000));
            await server.start();
          })();
        }
      },
    });
    await downtime;
    server.loseAnswers = 0;

    expect(report.sessions).toBe(SESSIONS);
    expect(report.trialsSent).toBe(SESSIONS * TRIALS);
    expect(report.trialsPending, JSON.stringify({ ...report, sessionCodes: undefined })).toBe(0);
    expect(report.trialsRefused).toBe(0);
    expect(report.trialsConfirmed).toBe(SESSIONS * TRIALS);
    // The faults happened: requests failed, and answers stored but not heard of were sent again and absorbed.
    expect(report.failedRequests).toBeGreaterThan(0);
    expect(server.answersLost).toBeGreaterThan(0);
    expect(report.duplicatesAbsorbed).toBeGreaterThan(0);

    const held = await countSessionTrials(getDb(), report.sessionCodes);
    expect(held).toEqual({ rows: SESSIONS * TRIALS, distinctTrials: SESSIONS * TRIALS, sessionCounters: SESSIONS * TRIALS });
  }, 180_000);
});
