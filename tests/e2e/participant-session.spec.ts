import { expect, test } from '@playwright/test';
import { SignInPage } from './pages/auth-pages';
import { ParticipantPages } from './pages/participant-pages';
import { expectNoSeriousA11yViolations } from './support/axe';
import { DEMO_LAB_SLUG, DEMO_PASSWORD, demoUser } from './support/demo';
import { categorisation, QUICK_TIMING } from '../support/study-designs';

// A small study on the demo lab's approved edition, with short timing so the run is quick:
// 1 diameter × 7 levels × 3 repetitions, 2 practice trials, a few catch trials.
const CATEGORISATION = categorisation({ repetitions: 3, practiceTrials: 2, catchRate: 0.1, timing: QUICK_TIMING });

test('a participant completes a study through a network cut and a reload; every trial is stored once, and the monitor shows it', async ({ page, browser }) => {
  test.setTimeout(180_000);
  await new SignInPage(page).signInAndLand(demoUser('experimenter').email, DEMO_PASSWORD, /\/labs\/halden-form/);
  const api = `/api/v1/labs/${DEMO_LAB_SLUG}`;
  const editions = (await (await page.request.get(`${api}/editions?state=approved`)).json()) as { items: { id: string }[] };
  const made = await page.request.post(`${api}/studies`, {
    data: { name: `Session run ${Date.now() % 100000}`, editionId: editions.items[0]!.id, consentText: 'I agree to take part in this short test.', finishCodePrefix: 'HF-', targetParticipants: 3, design: { stimulusSizeDeg: 3, categorisation: CATEGORISATION, similarity: null } },
  });
  expect(made.status()).toBe(201);
  const study = (await made.json()) as { id: string; plannedTrials: { total: number } };
  const opened = (await (await page.request.post(`${api}/studies/${study.id}/open`, { data: { confirmEthics: true } })).json()) as { inviteUrl: string };
  const planned = study.plannedTrials.total;
  expect(planned).toBeGreaterThanOrEqual(20);

  const context = await browser.newContext();
  const take = await context.newPage();
  const participant = new ParticipantPages(take);
  // The participant page's JavaScript, as the browser fetches it (uncompressed bytes).
  const scripts = new Map<string, number>();
  take.on('response', async (r) => {
    if (r.request().resourceType() === 'script') scripts.set(r.url(), (await r.body().catch(() => Buffer.alloc(0))).length);
  });
  await take.goto(new URL(opened.inviteUrl).pathname);
  await expect(take.getByTestId('consent-agree')).toBeVisible();
  await take.waitForLoadState('load');
  const jsBytes = [...scripts.values()].reduce((a, b) => a + b, 0);
  console.log(`participant page JS: ${scripts.size} files, ${(jsBytes / 1024).toFixed(1)} KiB`);
  // No lab UI comes along: no lab navigation, and the scripts stay within the budget (measured 494 KiB, almost all
  // of it the Next and React runtime every page shares; the page's own chunk is about 21 KiB).
  await expect(take.getByTestId('nav-norming-studies')).toHaveCount(0);
  expect(jsBytes).toBeLessThan(560 * 1024);
  await expectNoSeriousA11yViolations(take);
  await take.screenshot({ path: 'test-results/screens/join-consent.png', fullPage: true });
  await participant.consent();
  await expect(take.getByTestId('card-outline')).toBeVisible();
  await expectNoSeriousA11yViolations(take);
  await take.screenshot({ path: 'test-results/screens/join-screen-check.png', fullPage: true });
  await participant.checkScreen(57);
  await participant.begin();

  // Midway the network to the responses endpoint is cut for 10 trials, then restored.
  await expect(take.getByTestId('answer-left')).toBeVisible();
  await take.screenshot({ path: 'test-results/screens/join-trial.png' });
  await participant.answerWith('f', (pos) => pos >= 4);
  let refused = 0;
  await take.route('**/responses', (route) => {
    refused += 1;
    return route.abort('internetdisconnected');
  });
  const cutAt = await participant.position();
  await participant.answerWith('f', (pos) => pos >= cutAt + 10);
  await take.unroute('**/responses');
  expect(refused).toBeGreaterThanOrEqual(10);

  // A reload midway resumes at the next unanswered trial.
  await participant.answerWith('f', (pos) => pos >= cutAt + 12);
  const before = await participant.position();
  await take.reload();
  await expect(take.getByTestId('resumed')).toContainText(`trial ${before + 1} of ${planned}`);
  await participant.begin();
  expect(await participant.answerWith('f')).toBe(true);
  await expect(take.getByTestId('finish-code')).toHaveText(/^HF-[0-9A-Z]{8}$/);
  await expectNoSeriousA11yViolations(take);
  await take.screenshot({ path: 'test-results/screens/join-done.png', fullPage: true });

  // Every planned trial is stored exactly once.
  const trials = (await (await page.request.get(`${api}/studies/${study.id}/trials`)).json()) as { items: { trialIndex: number; achievedMs: number }[] };
  expect(trials.items).toHaveLength(planned);
  expect(new Set(trials.items.map((t) => t.trialIndex)).size).toBe(planned);
  expect(trials.items.every((t) => t.achievedMs > 0)).toBe(true);

  await page.goto(`/labs/${DEMO_LAB_SLUG}/studies/${study.id}`);
  await expect(page.getByTestId('sessions-table').getByTestId('session-stored')).toHaveText(`${planned} / ${planned}`);
  await expect(page.getByTestId('sessions-table').getByTestId('session-status')).toContainText('Yes');
  await expect(page.getByTestId('sessions-summary')).toContainText('1 started · 1 complete');
  await expectNoSeriousA11yViolations(page);
  await page.screenshot({ path: 'test-results/screens/study-monitor.png', fullPage: true });

  // Afterwards, withdrawal with the session code deletes every answer.
  const code = (await take.getByTestId('session-code').textContent())!;
  await take.goto('/withdraw');
  await expectNoSeriousA11yViolations(take);
  await take.getByTestId('withdraw-code').fill(code);
  await take.getByTestId('withdraw-submit').click();
  await expect(take.getByTestId('withdraw-done')).toContainText(`${planned} answers were deleted`);
  const left = (await (await page.request.get(`${api}/studies/${study.id}/trials`)).json()) as { items: unknown[] };
  expect(left.items).toHaveLength(0);
  await page.reload();
  await expect(page.getByTestId('sessions-table').getByTestId('session-status')).toHaveText('Withdrawn');
  await context.close();
});
