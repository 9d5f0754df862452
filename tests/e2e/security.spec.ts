import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { expect, test, type Page } from '@playwright/test';
import { SignInPage } from './pages/auth-pages';
import { SeedShapeEditorPage } from './pages/seed-shape-pages';
import { DEMO_LAB_SLUG, DEMO_PASSWORD, demoUser } from './support/demo';
import * as zips from '../fixtures/hostile/pack-zips';

const HOSTILE_SVGS = ['script.svg', 'event-attribute.svg', 'foreign-object.svg', 'external-href.svg', 'xxe.svg', 'css-url.svg', 'use-external.svg', 'javascript-href.svg', 'stylesheet-pi.svg'];
const HOSTILE_CSVS = ['formula.csv', 'nan.csv'];

/** Fails the test on any dialog, and records every request that leaves for a host other than the app's. */
function watch(page: Page): { outside: string[]; dialogs: string[] } {
  const seen = { outside: [] as string[], dialogs: [] as string[] };
  page.on('dialog', async (dialog) => {
    seen.dialogs.push(`${dialog.type()}: ${dialog.message()}`);
    await dialog.dismiss();
  });
  page.on('request', (request) => {
    const url = new URL(request.url());
    if (url.protocol === 'data:' || url.protocol === 'blob:') return;
    // The app is served from the loopback address; anything else is an outside host.
    if (!/^(127\.0\.0\.1|localhost)(:\d+)?$/.test(url.host)) seen.outside.push(request.url());
  });
  return seen;
}

test('hostile SVG and CSV outlines are refused in the editor: no dialog opens and no request leaves the site', async ({ page }) => {
  await new SignInPage(page).signInAndLand(demoUser('designer').email, DEMO_PASSWORD, /\/labs\/halden-form/);
  const seen = watch(page);
  const editor = new SeedShapeEditorPage(page);
  await editor.openNew(DEMO_LAB_SLUG);
  for (const file of [...HOSTILE_SVGS, ...HOSTILE_CSVS]) {
    await page.getByTestId('upload-file').setInputFiles(`tests/fixtures/hostile/${file}`);
    await page.getByTestId('upload-family').selectOption('elliptic');
    await page.getByTestId('upload-harmonics').fill('8');
    await page.getByTestId('upload-fit').click();
    await expect(page.getByTestId('upload-error'), file).toBeVisible();
    await expect(page.getByTestId('fit-result'), file).toHaveCount(0);
  }
  await page.screenshot({ path: 'test-results/screens/hostile-upload.png', fullPage: true });
  // Give anything that was going to fire a moment to do so.
  await page.waitForTimeout(500);
  expect(seen.dialogs).toEqual([]);
  expect(seen.outside).toEqual([]);
});

test('hostile zips are refused by the pack check: no dialog, no outside request', async ({ page }, info) => {
  await new SignInPage(page).signInAndLand(demoUser('experimenter').email, DEMO_PASSWORD, /\/labs\/halden-form/);
  const seen = watch(page);
  await page.goto(`/labs/${DEMO_LAB_SLUG}/packs`);
  await page.getByTestId('check-pack-link').click();
  await page.getByTestId('check-mode-zip').check();
  const dir = info.outputPath('hostile');
  mkdirSync(dir, { recursive: true });
  const cases: [string, Buffer][] = [['traversal.zip', zips.traversalZip('../evil.txt')], ['symlink.zip', zips.symlinkZip()], ['nested.zip', zips.nestedZip()]];
  for (const [name, bytes] of cases) {
    const file = join(dir, name);
    writeFileSync(file, bytes);
    await page.getByTestId('check-zip').setInputFiles(file);
    await page.getByTestId('check-run').click();
    await expect(page.getByTestId('check-error'), name).toBeVisible({ timeout: 30_000 });
  }
  expect(seen.dialogs).toEqual([]);
  expect(seen.outside).toEqual([]);
});

test('the session cookie is HttpOnly and SameSite=Lax, and a change sent from another Origin is refused', async ({ page }) => {
  await new SignInPage(page).signInAndLand(demoUser('designer').email, DEMO_PASSWORD, /\/labs\/halden-form/);
  const session = (await page.context().cookies()).find((c) => c.name.endsWith('next-auth.session-token'));
  expect(session, 'the session cookie').toBeDefined();
  expect(session!.httpOnly).toBe(true);
  expect(session!.sameSite).toBe('Lax');
  expect(session!.path).toBe('/');
  // Served over http here; over https the cookie is __Secure- prefixed and Secure (lib/server/auth/session.ts).
  expect(session!.secure).toBe(false);
  expect(await page.evaluate(() => document.cookie)).not.toContain('session-token');

  const body = { name: `Cross-site ${Date.now().toString(36)}`, descriptor: { family: 'radial', baseRadius: 1, terms: [] } };
  const foreign = await page.request.post(`/api/v1/labs/${DEMO_LAB_SLUG}/seed-shapes`, { data: body, headers: { origin: 'https://evil.example' } });
  expect(foreign.status()).toBe(403);
  expect((await foreign.json()).code).toBe('forbidden:origin');
  // The app's own pages still make changes (their Origin is the app's).
  const own = await page.request.post(`/api/v1/labs/${DEMO_LAB_SLUG}/seed-shapes`, { data: body, headers: { origin: new URL(page.url()).origin } });
  expect(own.status()).toBe(201);
});
