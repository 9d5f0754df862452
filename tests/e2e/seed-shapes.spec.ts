import { expect, test } from '@playwright/test';
import { SignInPage } from './pages/auth-pages';
import { SeedShapeEditorPage } from './pages/seed-shape-pages';
import { expectNoSeriousA11yViolations } from './support/axe';
import { DEMO_LAB_SLUG, DEMO_PASSWORD, demoUser } from './support/demo';

const BLOB_SVG = 'tests/fixtures/outlines/blob.svg';

test.describe.configure({ mode: 'serial' });
let savedUrl = '';

test('a Designer uploads an SVG outline, sees the overlay and the error, and saves the fit', async ({ page }) => {
  await new SignInPage(page).signInAndLand(demoUser('designer').email, DEMO_PASSWORD, /\/labs\/halden-form/);
  const editor = new SeedShapeEditorPage(page);
  await editor.openNew(DEMO_LAB_SLUG);
  await editor.uploadAndFit(BLOB_SVG, 'elliptic', 10);
  await expect(page.getByTestId('fit-path')).toHaveAttribute('d', /^M/);
  await expect(page.getByTestId('outline-path')).toHaveAttribute('d', /^M/);
  await expect(page.getByTestId('fit-note')).toContainText('largest closed one');
  const mean = Number(await page.getByTestId('fit-mean-error').textContent());
  expect(mean).toBeGreaterThan(0);
  expect(mean).toBeLessThan(0.02);
  await expectNoSeriousA11yViolations(page);
  await page.screenshot({ path: 'test-results/screens/seed-upload.png', fullPage: true });

  await page.getByTestId('use-fit').click();
  await page.getByTestId('seed-name').fill(`Uploaded blob ${Date.now().toString(36)}`);
  await expect(page.getByTestId('metric-isSimple')).toHaveText('yes');
  await page.getByTestId('save-seed').click();
  await expect(page).toHaveURL(/\/seed-shapes\/[0-9a-f-]{36}$/);
  await expect(page.getByTestId('save-seed')).toHaveText('Saved');
  savedUrl = page.url();
});

test('the Designer edits a harmonic with the keyboard; the preview and metrics follow, and undo brings them back', async ({ page }) => {
  await new SignInPage(page).signInAndLand(demoUser('designer').email, DEMO_PASSWORD, /\/labs\/halden-form/);
  await page.goto(savedUrl);
  const editor = new SeedShapeEditorPage(page);
  const areaBefore = await editor.metric('area').textContent();
  const pathBefore = await editor.previewPath().getAttribute('d');

  const slider = page.getByTestId('h2-a-slider');
  await slider.focus();
  for (let i = 0; i < 8; i++) await page.keyboard.press('ArrowRight');
  await expect(editor.metric('area')).not.toHaveText(areaBefore!);
  expect(await editor.previewPath().getAttribute('d')).not.toBe(pathBefore);
  await expect(page.getByTestId('save-seed')).toHaveText('Save');

  await page.keyboard.press('Control+z');
  await expect(editor.metric('area')).toHaveText(areaBefore!);

  await page.keyboard.press('?');
  await expect(page.getByTestId('shortcut-help')).toBeVisible();
  await expect(page.getByTestId('shortcut-help')).toContainText('Undo');
  await page.keyboard.press('Escape');
  await expectNoSeriousA11yViolations(page);
  await page.screenshot({ path: 'test-results/screens/seed-editor.png', fullPage: true });
});

test('a Reviewer sees the editor read-only, with no edit controls, and the API answers 403', async ({ page }) => {
  await new SignInPage(page).signInAndLand(demoUser('reviewer').email, DEMO_PASSWORD, /\/labs\/halden-form/);
  await page.goto(`/labs/${DEMO_LAB_SLUG}/seed-shapes`);
  await expect(page.getByTestId('seed-shape-table')).toBeVisible();
  await expect(page.getByTestId('new-seed-shape')).toHaveCount(0);
  await expectNoSeriousA11yViolations(page);
  await page.screenshot({ path: 'test-results/screens/seed-list.png', fullPage: true });

  await page.getByTestId('seed-link-Harbour pebble').click();
  await expect(page.getByTestId('seed-shape-editor')).toHaveAttribute('data-readonly', 'true');
  await expect(page.getByTestId('read-only-note')).toBeVisible();
  await expect(page.getByTestId('save-seed')).toHaveCount(0);
  await expect(page.locator('input[type=range]')).toHaveCount(0);
  await expect(page.getByTestId('upload-panel')).toHaveCount(0);
  await expect(page.getByTestId('metric-area')).not.toHaveText('—');

  const id = page.url().split('/').pop()!;
  const res = await page.request.patch(`/api/v1/labs/${DEMO_LAB_SLUG}/seed-shapes/${id}`, { data: { name: 'Hijacked', version: 1 } });
  expect(res.status()).toBe(403);
  const fit = await page.request.post(`/api/v1/labs/${DEMO_LAB_SLUG}/seed-shapes/fit?family=radial&harmonics=4`, {
    headers: { 'content-type': 'image/svg+xml' },
    data: '<svg xmlns="http://www.w3.org/2000/svg"><path d="M0 0 L1 0 L0 1 Z"/></svg>',
  });
  expect(fit.status()).toBe(403);
});
