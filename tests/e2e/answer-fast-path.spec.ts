import { expect, request as newRequest, test } from '@playwright/test';
import { SignInPage } from './pages/auth-pages';
import { DEMO_LAB_SLUG, DEMO_PASSWORD, demoUser } from './support/demo';
import { categorisation, QUICK_TIMING, SCREEN } from '../support/study-designs';

// The production server (server/serve.ts) serves a participant's answer on its fast path, and every other request
// through Next. Both kinds of answer carry the same security and caching headers, and the fast path answers as the
// route does: stored, stored once on a resend, and problem details for a bad body or an unknown session.
const CATEGORISATION = categorisation({ timing: QUICK_TIMING });
const SHARED_HEADERS = ['x-content-type-options', 'referrer-policy', 'x-frame-options', 'permissions-policy', 'cross-origin-opener-policy', 'strict-transport-security', 'content-security-policy', 'cache-control', 'content-type'];

test('answers on the fast path carry the headers Next gives the API, and the route answers', async ({ page, baseURL }) => {
  await new SignInPage(page).signInAndLand(demoUser('experimenter').email, DEMO_PASSWORD, /\/labs\/halden-form/);
  const api = `/api/v1/labs/${DEMO_LAB_SLUG}`;
  const editions = (await (await page.request.get(`${api}/editions?state=approved`)).json()) as { items: { id: string }[] };
  const made = await page.request.post(`${api}/studies`, {
    data: { name: `Fast path ${Date.now() % 100000}`, editionId: editions.items[0]!.id, consentText: 'I agree.', finishCodePrefix: 'FP-', targetParticipants: 2, design: { stimulusSizeDeg: 3, categorisation: CATEGORISATION, similarity: null } },
  });
  expect(made.status()).toBe(201);
  const study = (await made.json()) as { id: string };
  const opened = (await (await page.request.post(`${api}/studies/${study.id}/open`, { data: { confirmEthics: true } })).json()) as { inviteUrl: string };
  const token = new URL(opened.inviteUrl).pathname.split('/').pop()!;

  // A participant: no cookie.
  const participant = await newRequest.newContext({ baseURL });
  const started = await participant.post(`/api/v1/join/${token}/sessions`, { data: { screen: SCREEN } });
  expect(started.status()).toBe(201);
  const session = (await started.json()) as { sessionCode: string; trials: { index: number; correctKey?: string | null }[] };
  const trial = session.trials[0]!;
  const answer = { clientTrialId: crypto.randomUUID(), trialIndex: trial.index, responseKey: trial.correctKey ?? 'f', rating: null, rtMs: 420, achievedMs: 50.1, onsetMs: 1000, offsetMs: 1050.1, wasTabHidden: false, leftFullScreen: false };
  const path = `/api/v1/join/${token}/sessions/${session.sessionCode}/responses`;

  const stored = await participant.post(path, { data: answer });
  expect(stored.status()).toBe(200);
  expect(await stored.json()).toEqual({ stored: 1, planned: session.trials.length, isComplete: false, isNew: true });
  // Next marks every answer of its router with a Vary header; the fast path's answers have none.
  expect(started.headers()['vary']).toBeTruthy();
  expect(stored.headers()['vary']).toBeUndefined();
  for (const name of SHARED_HEADERS) expect(stored.headers()[name], name).toBe(started.headers()[name]);

  const resent = await participant.post(path, { data: answer });
  expect(await resent.json()).toEqual({ stored: 1, planned: session.trials.length, isComplete: false, isNew: false });

  const malformed = await participant.post(path, { data: Buffer.from('{"trialIndex": '), headers: { 'content-type': 'application/json' } });
  expect(malformed.status()).toBe(400);
  expect(malformed.headers()['content-type']).toBe('application/problem+json');
  expect(await malformed.json()).toMatchObject({ status: 400, code: 'validation:request', detail: 'The body is not valid JSON.', instance: path });

  // An unknown session: the same problem as Next's own route for that session (resume) gives.
  const unknown = 'ABCDE-FGHJK-MNPQR-STVWX';
  const viaFast = await participant.post(`/api/v1/join/${token}/sessions/${unknown}/responses`, { data: answer });
  const viaNext = await participant.get(`/api/v1/join/${token}/sessions/${unknown}`);
  expect(viaFast.status()).toBe(404);
  expect(viaNext.status()).toBe(404);
  const { instance: _a, ...fastProblem } = (await viaFast.json()) as Record<string, unknown>;
  const { instance: _b, ...nextProblem } = (await viaNext.json()) as Record<string, unknown>;
  expect(fastProblem).toEqual(nextProblem);
  for (const name of SHARED_HEADERS) expect(viaFast.headers()[name], name).toBe(viaNext.headers()[name]);
  await participant.dispose();
});
