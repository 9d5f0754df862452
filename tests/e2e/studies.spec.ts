import { randomUUID } from 'node:crypto';
import { expect, test } from '@playwright/test';
import { SignInPage } from './pages/auth-pages';
import { StudyPages } from './pages/study-pages';
import { expectNoSeriousA11yViolations } from './support/axe';
import { DEMO_LAB_SLUG, DEMO_PASSWORD, demoUser } from './support/demo';

test('an Experimenter sets up a categorisation study on the demo edition, previews a plan and opens it', async ({ page }) => {
  await new SignInPage(page).signInAndLand(demoUser('experimenter').email, DEMO_PASSWORD, /\/labs\/halden-form/);
  await page.getByTestId('nav-norming-studies').click();
  const studies = new StudyPages(page);
  await expect(page.getByTestId('study-Pilot diameter norming')).toBeVisible();
  await expectNoSeriousA11yViolations(page);
  await studies.startNew();
  await expect(page.getByTestId('ethics-notice')).toContainText('ethics board');
  await expect(page.getByTestId('study-edition')).toContainText('Approved');

  const name = `Diameter check ${randomUUID().slice(0, 4)}`;
  await studies.fillCategorisation({ name, spacing: 45, steps: 8, repetitions: 2, consent: 'I agree to take part in this study.' });
  // An even step count is refused, on its field.
  await page.getByTestId('save-study').click();
  await expect(page.getByText('Steps per direction must be odd', { exact: false }).first()).toBeVisible();
  await page.getByTestId('study-steps').fill('7');
  // 4 directions × (7 × 2 = 14 + 2 catch) + 8 practice = 72 trials.
  await expect(page.getByTestId('study-estimate')).toContainText('72 trials per participant');
  await expect(page.getByTestId('photosensitivity-notice')).toBeVisible();
  await expectNoSeriousA11yViolations(page);
  await page.screenshot({ path: 'test-results/screens/study-new.png', fullPage: true });
  await studies.create();

  await expect(page.getByTestId('study-state')).toHaveText('Draft');
  await expect(page.getByTestId('plan-summary')).toContainText('72 trials');
  await expect(page.getByTestId('plan-counts').locator('tbody tr')).toHaveCount(4);
  // Every cell: 2 ordinary trials; the endpoints also carry the catch trials.
  await expect(page.getByTestId('plan-row-45')).toContainText('16');
  await expect(page.getByTestId('plan-summary')).toContainText('“f” for the left');
  await studies.previewParticipant(1);
  await expect(page.getByTestId('plan-summary')).toContainText('“j” for the left');
  await expect(page.getByTestId('first-trials').locator('tbody tr')).toHaveCount(12);
  await expect(page.getByTestId('flash-ok')).toBeVisible();

  await studies.open();
  await expect(page.getByTestId('invite-url')).toHaveValue(/\/join\/[A-Za-z0-9_-]{43}$/);
  await expect(page.getByTestId('design-fixed')).toBeVisible();
  await expect(page.getByTestId('study-steps')).toBeDisabled();
  await expectNoSeriousA11yViolations(page);
  await page.screenshot({ path: 'test-results/screens/study-open.png', fullPage: true });

  const first = await page.getByTestId('invite-url').inputValue();
  await page.getByTestId('rotate-invite').click();
  await expect(page.getByTestId('invite-url')).not.toHaveValue(first);
});

test('fast timing raises the flash warning; a Reviewer reads a study but cannot change it', async ({ page }) => {
  await new SignInPage(page).signInAndLand(demoUser('experimenter').email, DEMO_PASSWORD, /\/labs\/halden-form/);
  await page.goto(`/labs/${DEMO_LAB_SLUG}/studies/new`);
  for (const id of ['timing-fixation', 'timing-probe', 'timing-blank', 'timing-iti']) await page.getByTestId(id).fill('100');
  await expect(page.getByTestId('flash-warning')).toContainText('WCAG 2.3.1');
  await page.getByTestId('timing-probe').fill('0');
  await page.getByTestId('save-study').click();
  await expect(page.getByText('The probe must be above 0 ms')).toBeVisible();

  await page.context().clearCookies();
  await new SignInPage(page).signInAndLand(demoUser('reviewer').email, DEMO_PASSWORD, /\/labs\/halden-form/);
  await page.goto(`/labs/${DEMO_LAB_SLUG}/studies`);
  await expect(page.getByTestId('new-study')).toHaveCount(0);
  await page.getByTestId('study-Pilot diameter norming').click();
  await expect(page.getByTestId('plan-counts')).toBeVisible();
  await expect(page.getByTestId('save-study')).toHaveCount(0);
  await expect(page.getByTestId('open-study')).toHaveCount(0);
  await expect(page.getByTestId('study-name')).toBeDisabled();
  await expectNoSeriousA11yViolations(page);
  await page.screenshot({ path: 'test-results/screens/study-reviewer.png', fullPage: true });
});
