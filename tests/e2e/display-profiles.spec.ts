import { randomUUID } from 'node:crypto';
import { expect, test } from '@playwright/test';
import { SignInPage } from './pages/auth-pages';
import { expectNoSeriousA11yViolations } from './support/axe';
import { DEMO_LAB_SLUG, DEMO_PASSWORD, demoUser } from './support/demo';

test('an Experimenter adds a display profile and sees pixels per degree and nominal contrast live', async ({ page }) => {
  await new SignInPage(page).signInAndLand(demoUser('experimenter').email, DEMO_PASSWORD, /\/labs\/halden-form/);
  await page.getByTestId('nav-display-profiles').click();
  await expect(page.getByTestId('profile-Testing room B monitor')).toBeVisible();

  const name = `Scanner projector ${randomUUID().slice(0, 4)}`;
  await page.getByTestId('profile-name').fill(name);
  await page.getByTestId('profile-width').fill('1024');
  await page.getByTestId('profile-height').fill('768');
  await page.getByTestId('profile-pitch-density').check();
  await page.getByTestId('profile-px-per-cm').fill('25');
  await page.getByTestId('profile-distance').fill('0');
  await expect(page.getByTestId('profile-derived')).toContainText('viewing distance must be above 0');
  await page.getByTestId('save-profile').click();
  await expect(page.getByTestId('profile-error')).toContainText('viewing distance');

  // 1° at 60 cm spans 2·60·tan(0.5°) = 1.0472 cm, so 26.18 px at 25 px/cm.
  await page.getByTestId('profile-distance').fill('60');
  await expect(page.getByTestId('profile-derived')).toContainText('26.18 pixels per degree');
  await expect(page.getByTestId('render-sizes')).toContainText('26.18 px/°');
  await page.getByTestId('render-fill').fill('128');
  await page.getByTestId('render-background').fill('128');
  await expect(page.getByTestId('render-warning')).toBeVisible();
  await page.getByTestId('render-fill').fill('0');
  await expect(page.getByTestId('render-contrast')).toContainText('Nominal sRGB values');
  await page.getByTestId('save-profile').click();
  await expect(page.getByTestId(`profile-${name}`)).toBeVisible();
  await expectNoSeriousA11yViolations(page);
  await page.screenshot({ path: 'test-results/screens/display-profiles.png', fullPage: true });
});

test('a Reviewer reads display profiles but cannot change them', async ({ page }) => {
  await new SignInPage(page).signInAndLand(demoUser('reviewer').email, DEMO_PASSWORD, /\/labs\/halden-form/);
  await page.goto(`/labs/${DEMO_LAB_SLUG}/display-profiles`);
  await expect(page.getByTestId('save-profile')).toHaveCount(0);
  await expect(page.getByTestId('profile-name')).toBeDisabled();
  const r = await page.request.post(`/api/v1/labs/${DEMO_LAB_SLUG}/display-profiles`, { data: { name: 'x', resolutionPx: { width: 10, height: 10 }, widthCm: 1, pixelsPerCm: null, viewingDistanceCm: 50 } });
  expect(r.status()).toBe(403);
});
