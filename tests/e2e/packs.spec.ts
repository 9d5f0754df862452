import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { expect, test } from '@playwright/test';
import { SignInPage } from './pages/auth-pages';
import { expectNoSeriousA11yViolations } from './support/axe';
import { DEMO_LAB_SLUG as LAB, DEMO_PASSWORD, demoUser } from './support/demo';

test('an Experimenter makes a pack of the demo edition, watches it build, and downloads it', async ({ page }) => {
  test.setTimeout(180_000);
  await new SignInPage(page).signInAndLand(demoUser('experimenter').email, DEMO_PASSWORD, /\/labs\/halden-form/);
  await page.goto(`/labs/${LAB}/spaces`);
  await page.getByTestId('space-link-Pebble rings (demo)').click();
  await page.getByTestId('editions-link').click();
  await page.getByTestId('edition-link-1').click();

  // A size of its own, so every run asks for a new pack (identical requests share one).
  const size = (3 + Math.floor(Math.random() * 90) / 100).toFixed(2);
  await page.getByTestId('render-size').fill(size);
  await expect(page.getByTestId('pack-estimate')).toContainText('83 stimuli');
  await expectNoSeriousA11yViolations(page);
  await page.getByTestId('make-pack').click();
  await expect(page).toHaveURL(/\/packs\?pack=/);
  const packId = new URL(page.url()).searchParams.get('pack')!;
  const row = page.getByTestId(`pack-row-${packId}`);
  await expect(row).toBeVisible();
  // The table follows the job without a reload: the bar appears, then the pack is ready.
  await expect(row.getByTestId('pack-progress')).toBeVisible({ timeout: 30_000 });
  await page.screenshot({ path: 'test-results/screens/packs-building.png', fullPage: true });
  await expect(row).toHaveAttribute('data-state', 'succeeded', { timeout: 120_000 });
  await expectNoSeriousA11yViolations(page);

  const expected = await row.getByTitle(/^[0-9a-f]{64}$/).getAttribute('title');
  const downloading = page.waitForEvent('download');
  await row.getByTestId('pack-download').click();
  const download = await downloading;
  const path = `test-results/downloads/${download.suggestedFilename()}`;
  await download.saveAs(path);
  expect(download.suggestedFilename()).toMatch(/^pebble-rings-demo-edition-1-[0-9a-f]{8}\.zip$/);
  expect(createHash('sha256').update(readFileSync(path)).digest('hex')).toBe(expected);

  await row.getByTestId('pack-manifest-link').click();
  await expect(page.getByTestId('manifest-stimulus-count')).toContainText('83');
  await page.screenshot({ path: 'test-results/screens/pack-manifest.png', fullPage: true });
});

test('an expired or broken download link answers 403 with a clear page', async ({ page }) => {
  const r = await page.request.get('/packs/download/not-a-real-token.abc', { maxRedirects: 0 });
  expect(r.status()).toBe(403);
  expect(await r.text()).toContain('This download link is not valid');
});
