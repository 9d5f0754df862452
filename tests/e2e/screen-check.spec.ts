import { expect, test } from '@playwright/test';
import { SignInPage } from './pages/auth-pages';
import { ParticipantPages } from './pages/participant-pages';
import { DEMO_LAB_SLUG, DEMO_PASSWORD, demoUser } from './support/demo';

// D = s / tan 15.5° = 3.605884·s (Rohrschneider 2004, as in REFERENCES.md).
const BLIND_SPOT_FACTOR = 3.605884;

test('the blind-spot sweep estimates the viewing distance from three sweeps, and the session records it', async ({ page, browser }) => {
  test.setTimeout(120_000);
  await new SignInPage(page).signInAndLand(demoUser('experimenter').email, DEMO_PASSWORD, /\/labs\/halden-form/);
  const api = `/api/v1/labs/${DEMO_LAB_SLUG}`;
  const editions = (await (await page.request.get(`${api}/editions?state=approved`)).json()) as { items: { id: string }[] };
  const made = await page.request.post(`${api}/studies`, {
    data: {
      name: `Screen check ${Date.now() % 100000}`,
      editionId: editions.items[0]!.id,
      consentText: 'I agree to take part in this short test.',
      finishCodePrefix: 'SC-',
      targetParticipants: 2,
      design: {
        stimulusSizeDeg: 3,
        categorisation: { directionsDeg: [0], steps: 7, extent: 0.8, repetitions: 2, blocking: 'interleaved', practiceTrials: 2, catchRate: 0.1, timing: { fixationMs: 60, probeMs: 50, blankMs: 40, responseMs: 5000, itiMs: 60 }, keys: ['f', 'j'] },
        similarity: null,
      },
    },
  });
  expect(made.status(), await made.text()).toBe(201);
  const study = (await made.json()) as { id: string };
  const opened = (await (await page.request.post(`${api}/studies/${study.id}/open`, { data: { confirmEthics: true } })).json()) as { inviteUrl: string };

  const context = await browser.newContext();
  const take = await context.newPage();
  await take.goto(new URL(opened.inviteUrl).pathname);
  await new ParticipantPages(take).consent();
  await take.getByTestId('distance-blind-spot').check();
  // Continuing before three sweeps is refused with the reason.
  await expect(take.getByTestId('refresh')).toHaveText(/Hz/);
  await take.getByTestId('screen-done').click();
  await expect(take.getByText('Do the sweep 3 times first.')).toBeVisible();

  const sweep = take.getByTestId('sweep');
  for (let i = 1; i <= 3; i++) {
    await expect(sweep).toHaveText(`Start sweep ${i} of 3`);
    await sweep.click();
    await expect(sweep).toHaveText('The dot vanished');
    // 30 mm/s for at least 4 s: 120 mm or more, i.e. 43 cm or more away (a busy machine presses later).
    await take.waitForTimeout(4000);
    await take.keyboard.press(' ');
  }
  const estimate = take.getByTestId('sweep-estimate');
  await expect(estimate).toBeVisible();
  const separations = ((await estimate.getAttribute('data-separations-px')) ?? '').split(' ').map(Number);
  const pxPerMm = Number(await estimate.getAttribute('data-px-per-mm'));
  expect(separations).toHaveLength(3);
  for (const s of separations) expect(s).toBeGreaterThan(0);
  const expectedCm = (BLIND_SPOT_FACTOR * (separations.reduce((a, b) => a + b, 0) / 3 / pxPerMm)) / 10;
  expect(expectedCm).toBeGreaterThan(40);
  expect(expectedCm).toBeLessThan(200);
  await expect(estimate).toHaveText(`Estimated distance so far: ${expectedCm.toFixed(0)} cm`);
  await expect(sweep).toHaveText('Sweep once more');
  await expect(take.getByText('Do the sweep 3 times first.')).toHaveCount(0);
  await take.screenshot({ path: 'test-results/screens/join-blind-spot.png', fullPage: true });
  await take.getByTestId('screen-done').click();
  await expect(take.getByTestId('begin')).toBeVisible();
  await take.getByTestId('begin').click();
  await expect(take.getByTestId('stage')).toBeVisible();

  // The lab sees the session's screen check: the blind-spot method and that distance.
  await expect
    .poll(async () => {
      const sessions = (await (await page.request.get(`${api}/studies/${study.id}/sessions`)).json()) as { items: { screen: { distanceMethod: string; viewingDistanceCm: number } | null }[] };
      return sessions.items[0]?.screen ?? null;
    })
    .toMatchObject({ distanceMethod: 'blind-spot' });
  const sessions = (await (await page.request.get(`${api}/studies/${study.id}/sessions`)).json()) as { items: { screen: { viewingDistanceCm: number; pxPerMm: number } }[] };
  expect(sessions.items[0]!.screen.viewingDistanceCm).toBeCloseTo(expectedCm, 3);
  expect(sessions.items[0]!.screen.pxPerMm).toBeCloseTo(pxPerMm, 6);
  await context.close();
});
