import { readFileSync } from 'node:fs';
import { expect, test } from '@playwright/test';
import JSZip from 'jszip';
import { SignInPage } from './pages/auth-pages';
import { RunOrdersPage } from './pages/run-order-pages';
import { expectNoSeriousA11yViolations } from './support/axe';
import { DEMO_LAB_SLUG as LAB, DEMO_PASSWORD, demoUser } from './support/demo';

test('an Experimenter builds a run order for the demo edition and downloads its BIDS events files', async ({ page }) => {
  test.setTimeout(120_000);
  await new SignInPage(page).signInAndLand(demoUser('experimenter').email, DEMO_PASSWORD, /\/labs\/halden-form/);
  await page.goto(`/labs/${LAB}/spaces`);
  await page.getByTestId('space-link-Pebble rings (demo)').click();
  await page.getByTestId('editions-link').click();
  await page.getByTestId('edition-link-1').click();
  const orders = new RunOrdersPage(page);
  await orders.openFromEdition();
  // The demo seed's invented run order is listed.
  await expect(page.getByTestId('run-order-list')).toContainText('Pilot scan, ring 3');

  // Spoke 0 without the centre: its 5 ring stimuli. No type-1 index-1 sequence exists for 5 (Nonyane & Theobald 2007).
  await orders.chooseSpokes([0], false);
  await orders.chooseSequence('type1-index1');
  await expect(page.getByTestId('preview-error')).toContainText('No type-1 index-1 sequence exists for 5 conditions');
  await expect(page.getByTestId('use-de-bruijn')).toBeVisible();
  await expect(page.getByTestId('save-run-order')).toBeDisabled();

  // With the centre: 6 conditions, 37 trials per run, every ordered pair once per run → a flat heatmap.
  await page.getByTestId('include-centre').check();
  await expect(page.getByTestId('condition-count')).toHaveText('6 conditions');
  await page.getByTestId('runs').fill('2');
  await orders.setTiming({ trial: 0.2, iti: 0.05, tr: 2 });
  // 4 onsets per second exceed WCAG 2.3.1's three flashes.
  await expect(page.getByTestId('flash-warning')).toContainText('3 per second');
  await orders.setTiming({ trial: 1, iti: 2, tr: 2 });
  await expect(page.getByTestId('flash-ok')).toBeVisible();
  const preview = orders.preview();
  await expect(preview.getByTestId('summary-trials')).toHaveText('74');
  await expect(preview.getByTestId('transition-flatness')).toHaveText('Flat: every ordered pair follows 2 times.');
  // 37 trials × 3 s = 111 s per run → 56 volumes of 2 s, two runs.
  await expect(preview.getByTestId('summary-volumes')).toHaveText('112');

  // A bad TR is named at its field.
  await page.getByTestId('tr').fill('0');
  await expect(page.getByText('The TR must be more than 0 s')).toBeVisible();
  await page.getByTestId('tr').fill('2');
  await expectNoSeriousA11yViolations(page);
  await page.screenshot({ path: 'test-results/screens/run-order-form.png', fullPage: true });

  const name = `Spoke 0 session ${Date.now() % 100000}`;
  await orders.save(name);
  await expect(page.getByTestId('run-order-summary').getByTestId('summary-trials')).toHaveText('74');
  await expectNoSeriousA11yViolations(page);
  await page.screenshot({ path: 'test-results/screens/run-order.png', fullPage: true });

  const downloading = page.waitForEvent('download');
  await page.getByTestId('download-run-order').click();
  const download = await downloading;
  const path = `test-results/downloads/${download.suggestedFilename()}`;
  await download.saveAs(path);
  expect(download.suggestedFilename()).toMatch(/^spoke-0-session-\d+-[0-9a-f]{8}\.zip$/);
  const zip = await JSZip.loadAsync(readFileSync(path));
  expect(Object.keys(zip.files).sort()).toEqual(['sub-01_task-shapes_run-1_events.json', 'sub-01_task-shapes_run-1_events.tsv', 'sub-01_task-shapes_run-2_events.json', 'sub-01_task-shapes_run-2_events.tsv']);
  const tsv = await zip.file('sub-01_task-shapes_run-2_events.tsv')!.async('string');
  const lines = tsv.trimEnd().split('\n');
  // BIDS "Task events": tab-separated, onset and duration in seconds first, stim_file relative to stimuli/.
  expect(lines[0]).toBe('onset\tduration\ttrial_type\tstim_file');
  expect(lines).toHaveLength(38);
  expect(lines[1]).toMatch(/^0\.000\t1\.000\t(c|r0[1-5]-s00)\tsvg\/(c|r0[1-5]-s00)\.svg$/);
  expect(lines[2]!.split('\t')[0]).toBe('3.000');
  const types = new Set(lines.slice(1).map((l) => l.split('\t')[2]));
  expect([...types].sort()).toEqual(['c', 'r01-s00', 'r02-s00', 'r03-s00', 'r04-s00', 'r05-s00']);
  const sidecar = JSON.parse(await zip.file('sub-01_task-shapes_run-2_events.json')!.async('string')) as { onset: { Units: string } };
  expect(sidecar.onset.Units).toBe('s');
});

test('a type-1 index-1 order of 16 conditions is searched by the worker, and the page follows it', async ({ page }) => {
  test.setTimeout(90_000);
  await new SignInPage(page).signInAndLand(demoUser('owner').email, DEMO_PASSWORD, /\/labs\/halden-form/);
  await page.goto(`/labs/${LAB}/spaces`);
  await page.getByTestId('space-link-Pebble rings (demo)').click();
  await page.getByTestId('editions-link').click();
  await page.getByTestId('edition-link-1').click();
  const orders = new RunOrdersPage(page);
  await orders.openFromEdition();
  await page.getByTestId('selection-rings').check();
  await page.getByTestId('choice-2').check();
  await page.getByTestId('include-centre').uncheck();
  await orders.chooseSequence('type1-index1');
  await expect(page.getByTestId('condition-count')).toHaveText('16 conditions');
  await expect(page.getByTestId('background-note')).toContainText('searched for in the background');
  await orders.save(`Ring 2 search ${Date.now() % 100000}`);
  // 16² + 1 trials once the worker has found the sequence.
  await expect(page.getByTestId('run-order-summary').getByTestId('summary-trials')).toHaveText('257', { timeout: 30_000 });
  await expect(page.getByTestId('transition-flatness')).toHaveText('Flat: every ordered pair follows 1 time.');
  await expect(page.getByTestId('download-run-order')).toBeVisible();
});

test('a Reviewer reads the seeded run order and downloads it, but gets no form', async ({ page }) => {
  await new SignInPage(page).signInAndLand(demoUser('reviewer').email, DEMO_PASSWORD, /\/labs\/halden-form/);
  await page.goto(`/labs/${LAB}/spaces`);
  await page.getByTestId('space-link-Pebble rings (demo)').click();
  await page.getByTestId('editions-link').click();
  await page.getByTestId('edition-link-1').click();
  await page.getByTestId('edition-run-orders').click();
  await expect(page.getByTestId('run-order-form')).toHaveCount(0);
  await page.getByRole('link', { name: 'Pilot scan, ring 3' }).click();
  // Ring 3 (16 stimuli) + null events = 17 conditions, de Bruijn: 2 runs × 290 trials.
  await expect(page.getByTestId('run-order-summary').getByTestId('summary-trials')).toHaveText('580');
  await expect(page.getByTestId('transition-flatness')).toHaveText('Flat: every ordered pair follows 2 times.');
  await expect(page.getByTestId('delete-run-order')).toHaveCount(0);
  await expectNoSeriousA11yViolations(page);
  const r = await page.request.get(page.url().replace(/\/labs\/.*$/, '') + `/api/v1/labs/${LAB}/run-orders/${page.url().split('/').pop()}/download`);
  expect(r.status()).toBe(200);
  const zip = await JSZip.loadAsync(await r.body());
  const tsv = await zip.file('sub-pilot01_task-shapes_run-1_events.tsv')!.async('string');
  // Null events have no stimulus file: n/a (BIDS).
  expect(tsv).toMatch(/\tnull\tn\/a\n/);
});

test('the make-pack form sends the chosen run orders with the pack request', async ({ page }) => {
  await new SignInPage(page).signInAndLand(demoUser('experimenter').email, DEMO_PASSWORD, /\/labs\/halden-form/);
  await page.goto(`/labs/${LAB}/spaces`);
  await page.getByTestId('space-link-Pebble rings (demo)').click();
  await page.getByTestId('editions-link').click();
  await page.getByTestId('edition-link-1').click();
  const box = page.getByRole('checkbox', { name: 'Pilot scan, ring 3' });
  await expect(box).toBeVisible();
  const id = (await box.getAttribute('value'))!;
  await box.check();
  // The request is answered here, so no pack is built: only what the form sends is checked.
  let sent: { runOrderIds?: string[] } | null = null;
  await page.route('**/editions/1/packs', async (route) => {
    sent = route.request().postDataJSON() as { runOrderIds?: string[] };
    await route.fulfill({ status: 400, contentType: 'application/problem+json', body: JSON.stringify({ type: '/problems/validation/pack', title: 'The request is not valid', status: 400, detail: 'Stopped by the test.', code: 'validation:pack' }) });
  });
  await page.getByTestId('make-pack').click();
  await expect(page.getByTestId('make-pack-error')).toContainText('Stopped by the test.');
  expect(sent).toEqual(expect.objectContaining({ runOrderIds: [id] }));
  await expectNoSeriousA11yViolations(page);
});
