import { expect, test } from '@playwright/test';
import { evaluatePsychometric, seededRandom } from '@/lib/stats';
import { parseCsv } from '../support/csv';
import { SignInPage } from './pages/auth-pages';
import { ParticipantPages } from './pages/participant-pages';
import { ResultsPage } from './pages/results-pages';
import { expectNoSeriousA11yViolations } from './support/axe';
import { DEMO_LAB_SLUG, DEMO_PASSWORD, demoUser } from './support/demo';
import { categorisation, QUICK_TIMING, SCREEN } from '../support/study-designs';

// A small study on the demo lab's approved edition: 2 diameters × 7 levels × 2 repetitions, short timing.
const CATEGORISATION = categorisation({ directionsDeg: [0, 90], repetitions: 2, practiceTrials: 2, catchRate: 0.1, timing: QUICK_TIMING });
type PlannedTrial = { index: number; task: string; isPractice: boolean; isCatch: boolean; position: number; leftAnchor: 'A' | 'B'; correctKey: string | null };

test('after a participant session, the results page shows a curve for every direction and its CSV downloads parse', async ({ page, browser }) => {
  test.setTimeout(240_000);
  await new SignInPage(page).signInAndLand(demoUser('experimenter').email, DEMO_PASSWORD, /\/labs\/halden-form/);
  const api = `/api/v1/labs/${DEMO_LAB_SLUG}`;
  const editions = (await (await page.request.get(`${api}/editions?state=approved`)).json()) as { items: { id: string }[] };
  const made = await page.request.post(`${api}/studies`, {
    data: { name: `Results run ${Date.now() % 100000}`, editionId: editions.items[0]!.id, consentText: 'I agree to take part in this short test.', finishCodePrefix: 'HR-', targetParticipants: 3, design: { stimulusSizeDeg: 3, categorisation: CATEGORISATION, similarity: null } },
  });
  expect(made.status()).toBe(201);
  const study = (await made.json()) as { id: string };
  const opened = (await (await page.request.post(`${api}/studies/${study.id}/open`, { data: { confirmEthics: true } })).json()) as { inviteUrl: string };
  const joinPath = new URL(opened.inviteUrl).pathname;
  const token = joinPath.split('/').pop()!;

  // One participant takes the session in the browser, pressing the same key throughout.
  const context = await browser.newContext();
  const take = await context.newPage();
  const participant = new ParticipantPages(take);
  await take.goto(joinPath);
  await participant.consent();
  await participant.checkScreen(57);
  await participant.begin();
  expect(await participant.answerWith('f')).toBe(true);
  await context.close();

  // Two more answer through the join API as invented observers (PSE 0, spread 0.15 of ρmax, seeded).
  for (const seed of [1, 2]) {
    const s = (await (await page.request.post(`/api/v1/join/${token}/sessions`, { data: { screen: SCREEN } })).json()) as { sessionCode: string; participant: number; trials: PlannedTrial[] };
    const keys = s.participant % 2 === 0 ? { left: 'f', right: 'j' } : { left: 'j', right: 'f' };
    const random = seededRandom(seed);
    for (const t of s.trials) {
      const choseB = random() < evaluatePsychometric('logit', { threshold: 0, spread: 0.15, lapse: 0.01 }, -t.position);
      const key = t.isPractice || t.isCatch ? (t.correctKey ?? 'f') : (choseB ? 'B' : 'A') === t.leftAnchor ? keys.left : keys.right;
      const r = await page.request.post(`/api/v1/join/${token}/sessions/${s.sessionCode}/responses`, {
        data: { clientTrialId: crypto.randomUUID(), trialIndex: t.index, responseKey: key, rating: null, rtMs: 500 + Math.round(200 * random()), achievedMs: 50, onsetMs: 1000, offsetMs: 1050, wasTabHidden: false, leftFullScreen: false },
      });
      expect(r.status()).toBe(200);
    }
  }

  await page.goto(`/labs/${DEMO_LAB_SLUG}/studies/${study.id}`);
  await page.getByTestId('study-results-link').click();
  const results = new ResultsPage(page);
  await expect(page.getByTestId('results-title')).toBeVisible();
  const started = Date.now();
  await results.waitUntilReady();
  console.log(`results page ready after ${Date.now() - started} ms (3 sessions, 2 directions)`);
  expect((await results.curveDirections()).sort()).toEqual(['0', '90']);
  await expect(page.getByTestId('pooled-fits').getByTestId('fit-row')).toHaveCount(2);
  await expect(page.getByTestId('results-caution')).toContainText('not proof of equality');
  await expect(page.getByTestId('plot-slopes').locator('circle.estimate')).toHaveCount(4);
  await page.screenshot({ path: 'test-results/screens/study-results.png', fullPage: true });
  await page.getByTestId('plot-curves').screenshot({ path: 'test-results/screens/study-results-curves.png' });
  await expectNoSeriousA11yViolations(page);

  const stamp = (await (await page.request.get(`${api}/studies/${study.id}/results`)).json()) as { report: { edition: { contentHash: string }; counts: { trials: number } } };
  const trials = await results.download('download-trials');
  expect(trials.name).toBe('trials.csv');
  const trialRows = parseCsv(trials.text);
  expect(trialRows.length).toBeGreaterThanOrEqual(3 * 28);
  expect(trialRows.every((r) => r.studyId === study.id && r.editionHash === stamp.report.edition.contentHash)).toBe(true);
  const fits = await results.download('download-fits');
  expect(fits.name).toBe('fits.csv');
  const fitRows = parseCsv(fits.text);
  expect(fitRows.filter((r) => r.scope === 'pooled').map((r) => r.directionDeg)).toEqual(['0', '90']);
  expect(fitRows.every((r) => r.studyId === study.id && Number.isFinite(Number(r.pse)))).toBe(true);
});
