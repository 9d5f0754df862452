import { expect, test } from '@playwright/test';
import { SignInPage } from './pages/auth-pages';
import { ParticipantPages } from './pages/participant-pages';
import { ratePairs, SimilarityPage } from './pages/similarity-pages';
import { expectNoSeriousA11yViolations } from './support/axe';
import { DEMO_LAB_SLUG, DEMO_PASSWORD, demoUser } from './support/demo';

/** How the scripted participant (invented) sees the pebble pairs: Axis B differences loom 1.6 times larger. */
const B_WEIGHT = 1.6;

test('the pair-similarity demo study, rated by a scripted participant, shows the heatmaps and the MDS map; "equalise" creates a new space', async ({ page, browser }) => {
  test.setTimeout(240_000);
  await new SignInPage(page).signInAndLand(demoUser('experimenter').email, DEMO_PASSWORD, /\/labs\/halden-form/);
  const api = `/api/v1/labs/${DEMO_LAB_SLUG}`;
  const studies = (await (await page.request.get(`${api}/studies?limit=100`)).json()) as { items: { id: string; name: string; state: string; edition: { spaceId: string; number: number } }[] };
  const study = studies.items.find((s) => s.name === 'Pilot pair similarity')!;
  expect(study).toBeDefined();
  let inviteUrl: string;
  if (study.state === 'draft') {
    inviteUrl = ((await (await page.request.post(`${api}/studies/${study.id}/open`, { data: { confirmEthics: true } })).json()) as { inviteUrl: string }).inviteUrl;
  } else {
    inviteUrl = ((await (await page.request.get(`${api}/studies/${study.id}`)).json()) as { inviteUrl: string }).inviteUrl;
  }
  const snapshot = (await (await page.request.get(`${api}/spaces/${study.edition.spaceId}/editions/${study.edition.number}/snapshot`)).json()) as { stimuli: { id: string; position: { a: number; b: number } }[] };
  const positions = new Map(snapshot.stimuli.map((s) => [s.id, s.position]));

  // The participant takes the session; their plan (from the lab side) says which pair each trial shows.
  const context = await browser.newContext();
  const take = await context.newPage();
  const participant = new ParticipantPages(take);
  await take.goto(new URL(inviteUrl).pathname);
  await participant.consent();
  await participant.checkScreen(57);
  await expect(take.getByTestId('begin')).toBeVisible();
  const sessions = (await (await page.request.get(`${api}/studies/${study.id}/sessions`)).json()) as { items: { participant: number }[] };
  const index = sessions.items[0]!.participant;
  const plan = (await (await page.request.get(`${api}/studies/${study.id}/plan?participant=${index}`)).json()) as { trials: { task: string; first: string; second: string }[] };
  await participant.begin();
  await ratePairs(take, (i) => {
    const t = plan.trials[i]!;
    const p = positions.get(t.first)!, q = positions.get(t.second)!;
    const d = Math.hypot(p.a - q.a, B_WEIGHT * (p.b - q.b));
    return Math.max(1, Math.min(7, Math.round(7 - (6 * d) / (2 * B_WEIGHT))));
  });
  await expect(take.getByTestId('finish-code')).toHaveText(/^HALDEN/);
  await context.close();

  // The similarity page: four heatmaps on one scale, the map, the correlations, and the map-based suggestion.
  const similarity = new SimilarityPage(page);
  await similarity.open(DEMO_LAB_SLUG, study.id);
  await expect(similarity.heatmaps()).toBeVisible();
  await expect(similarity.heatmaps().locator('[data-part="legend"]')).toHaveCount(1);
  await expect(similarity.map()).toBeVisible();
  await expect(similarity.map().locator('circle')).toHaveCount(2 * 9 + 2);
  await expect(page.getByTestId('eigenvalues').locator('td')).toHaveCount(9);
  await expect(page.getByTestId('correlation-design')).toContainText('36');
  await expect(page.getByTestId('noise-ceiling')).not.toHaveText('—');
  await expect(page.getByTestId('suggestion-map')).toBeVisible();
  await expectNoSeriousA11yViolations(page);
  await page.screenshot({ path: 'test-results/screens/similarity.png', fullPage: true });

  // The exports download and carry the stamp.
  const csv = await page.request.get(`${api}/studies/${study.id}/similarity/csv`);
  const lines = (await csv.text()).trimEnd().split('\n');
  expect(lines[0]).toBe('study_id,edition_hash,first,second,ratings,mean_rating,perceptual,design,contour,silhouette');
  expect(lines.length).toBeGreaterThanOrEqual(1 + 36);
  expect(lines[1]!.startsWith(`${study.id},`)).toBe(true);
  const tsv = await (await page.request.get(`${api}/studies/${study.id}/similarity/rdms/perceptual`)).text();
  expect(tsv.split('\n')[0]).toContain(study.id);

  // "Equalise": a new space linked to the study.
  const name = `Pebble pairs equalised ${Date.now() % 100000}`;
  await similarity.equalise('map', name);
  await expect(page.getByTestId('space-origin')).toContainText('Pilot pair similarity');
  await expect(page.getByTestId('space-origin')).toContainText('MDS map');
  await expectNoSeriousA11yViolations(page);
  await page.screenshot({ path: 'test-results/screens/similarity-new-space.png', fullPage: true });
  await similarity.open(DEMO_LAB_SLUG, study.id);
  await expect(page.getByTestId('derived-spaces')).toContainText(name);
});
