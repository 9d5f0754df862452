import { createHash } from 'node:crypto';
import { readFileSync, writeFileSync } from 'node:fs';
import { expect, test, type Page } from '@playwright/test';
import JSZip from 'jszip';
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

  // The pack as downloaded checks intact, and is matched to the edition it came from.
  await page.goto(`/labs/${LAB}/packs`);
  await page.getByTestId('check-pack-link').click();
  await expectNoSeriousA11yViolations(page);
  await checkZip(page, path);
  await expect(page.getByTestId('check-report')).toHaveAttribute('data-verdict', 'intact');
  await expect(page.getByTestId('check-edition')).toHaveAttribute('data-status', 'matches');
  await expect(page.getByTestId('check-count-listed')).not.toHaveText('0');
  await expect(page.getByTestId('check-count-altered')).toHaveText('0');
  await expectNoSeriousA11yViolations(page);
  await page.screenshot({ path: 'test-results/screens/pack-check-intact.png', fullPage: true });

  // One PNG changed by a single byte: the check names it, with both hashes.
  const zip = await JSZip.loadAsync(readFileSync(path));
  const victim = Object.keys(zip.files).find((name) => /stimuli\/png\/.+\.png$/.test(name))!;
  const bytes = await zip.file(victim)!.async('uint8array');
  bytes[bytes.length - 20] = (bytes[bytes.length - 20]! + 1) % 256;
  zip.file(victim, bytes);
  const tampered = path.replace(/\.zip$/, '-tampered.zip');
  writeFileSync(tampered, await zip.generateAsync({ type: 'nodebuffer', compression: 'DEFLATE' }));
  await checkZip(page, tampered);
  await expect(page.getByTestId('check-report')).toHaveAttribute('data-verdict', 'altered');
  await expect(page.getByTestId('check-count-altered')).toHaveText('1');
  const alteredRow = page.getByTestId('check-altered').locator('tbody tr');
  await expect(alteredRow).toHaveCount(1);
  await expect(alteredRow).toContainText(victim.slice(victim.indexOf('stimuli/')));
  await expect(alteredRow).toContainText(createHash('sha256').update(bytes).digest('hex'));
  await page.screenshot({ path: 'test-results/screens/pack-check-altered.png', fullPage: true });
});

async function checkZip(page: Page, file: string) {
  await page.getByTestId('check-mode-zip').check();
  await page.getByTestId('check-zip').setInputFiles(file);
  await page.getByTestId('check-run').click();
  await expect(page.getByTestId('check-report')).toBeVisible({ timeout: 60_000 });
}

test('an expired or broken download link answers 403 with a clear page', async ({ page }) => {
  const r = await page.request.get('/packs/download/not-a-real-token.abc', { maxRedirects: 0 });
  expect(r.status()).toBe(403);
  expect(await r.text()).toContain('This download link is not valid');
});
