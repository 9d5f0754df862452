import AxeBuilder from '@axe-core/playwright';
import { expect, test } from '@playwright/test';
import { SignInPage } from './pages/auth-pages';
import { DEMO_PASSWORD, demoUser } from './support/demo';

test('the landing page says what Epicycle does and passes an axe scan', async ({ page }) => {
  const response = await page.goto('/');
  expect(response?.status()).toBe(200);
  await expect(page.getByRole('heading', { level: 1 })).toContainText('Novel shapes');
  await expect(page.getByTestId('brand')).toBeVisible();

  await page.screenshot({ path: 'test-results/screens/landing.png', fullPage: true });
  const results = await new AxeBuilder({ page }).analyze();
  const serious = results.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
  expect(serious.map((v) => `${v.id}: ${v.help}`)).toEqual([]);
});

test('every page response carries a nonce-based CSP and the security headers', async ({ page }) => {
  const first = await page.goto('/');
  const headers = first!.headers();
  const csp = headers['content-security-policy'] ?? '';
  expect(csp).toMatch(/script-src 'self' 'nonce-[A-Za-z0-9+/=]+'/);
  expect(csp).toContain("frame-ancestors 'none'");
  expect(headers['x-content-type-options']).toBe('nosniff');
  expect(headers['referrer-policy']).toBe('strict-origin-when-cross-origin');

  const nonce = /'nonce-([^']+)'/.exec(csp)?.[1];
  const scriptNonces = await page.locator('script[nonce]').evaluateAll((els) => els.map((e) => (e as HTMLScriptElement).nonce));
  expect(scriptNonces.length).toBeGreaterThan(0);
  expect(new Set(scriptNonces)).toEqual(new Set([nonce]));

  const second = await page.goto('/');
  expect(second!.headers()['content-security-policy']).not.toEqual(csp);
});

test('no script is blocked by the CSP', async ({ page }) => {
  await page.addInitScript(() => {
    const w = window as unknown as { __csp: string[] };
    w.__csp = [];
    document.addEventListener('securitypolicyviolation', (e) => w.__csp.push(`${e.violatedDirective} ${e.blockedURI}`));
  });
  await page.goto('/');
  await page.waitForLoadState('load');
  await page.waitForFunction(() => (window as unknown as { next?: unknown }).next !== undefined);
  expect(await page.evaluate(() => (window as unknown as { __csp: string[] }).__csp)).toEqual([]);
});

test('the health route checks the database', async ({ request }) => {
  const res = await request.get('/api/health');
  expect(res.status()).toBe(200);
  const body = await res.json();
  expect(body).toMatchObject({ status: 'ok', database: { ok: true } });
});

test('a lab page asks for sign-in, then opens the signed-in shell', async ({ page }) => {
  await page.goto('/labs/halden-form');
  await expect(page).toHaveURL(/\/sign-in\?callbackUrl=/);
  await new SignInPage(page).signIn(demoUser('owner').email, DEMO_PASSWORD);
  await expect(page).toHaveURL(/\/labs\/halden-form$/);
  await expect(page.getByTestId('lab-name')).toHaveText('Halden Form Perception Group');
  await expect(page.getByRole('navigation', { name: 'Lab sections' })).toBeVisible();
});
