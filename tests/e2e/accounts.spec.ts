import { expect, test } from '@playwright/test';
import { MembersPage, SignInPage, SignUpPage } from './pages/auth-pages';
import { expectNoSeriousA11yViolations } from './support/axe';
import { DEMO_LAB_SLUG, DEMO_PASSWORD, demoUser } from './support/demo';
import { waitForMailLink } from './support/mail';

const unique = () => `${Date.now().toString(36)}${Math.floor(Math.random() * 1e4)}`;

test('a new Owner signs up, invites a Reviewer by e-mail; the Reviewer joins, cannot invite, and the API says 403', async ({ page, browser }) => {
  const id = unique();
  const owner = { name: 'Maren Olsen', email: `maren-${id}@e2e.example`, password: 'a sturdy passphrase', lab: `Contour Lab ${id}` };
  await new SignUpPage(page).signUp(owner);
  await expect(page).toHaveURL(/\/labs\/contour-lab-/);
  const lab = new URL(page.url()).pathname.split('/')[2]!;
  await expect(page.getByTestId('my-role')).toHaveText('Owner');

  const members = new MembersPage(page);
  await members.open(lab);
  const colleague = `jonas-${id}@e2e.example`;
  await members.invite(colleague, 'reviewer');
  await expect(page.getByTestId(`invitation-${colleague}`)).toBeVisible();

  const link = await waitForMailLink(colleague);
  const other = await browser.newContext();
  const theirs = await other.newPage();
  await theirs.goto(link);
  await expect(theirs.getByTestId('invite-summary')).toContainText('Reviewer');
  await theirs.getByTestId('accept-name').fill('Jonas Berg');
  await theirs.getByTestId('accept-password').fill('another sturdy passphrase');
  await theirs.getByTestId('accept-submit').click();
  await expect(theirs).toHaveURL(new RegExp(`/labs/${lab}$`));
  await expect(theirs.getByTestId('lab-title')).toBeVisible();
  await expect(theirs.getByTestId('my-role')).toHaveText('Reviewer');

  const theirMembers = new MembersPage(theirs);
  await theirMembers.open(lab);
  await expect(theirs.getByTestId(`member-row-${owner.email}`)).toBeVisible();
  await expect(theirMembers.inviteSection()).toHaveCount(0);
  const api = await theirs.request.post(`/api/v1/labs/${lab}/invitations`, { data: { email: `x-${id}@e2e.example`, role: 'designer' } });
  expect(api.status()).toBe(403);
  expect(api.headers()['content-type']).toContain('application/problem+json');

  // The link worked once.
  await theirs.goto(link);
  await expect(theirs.getByTestId('invite-unusable')).toContainText('already used');
  await other.close();
});

test('the Owner demotes a Designer, whose very next request already has the new role', async ({ page, browser }) => {
  const owner = demoUser('owner');
  const designer = demoUser('designer');
  await new SignInPage(page).signInAndLand(owner.email, DEMO_PASSWORD, /\/labs\/halden-form/);

  const theirContext = await browser.newContext();
  const theirs = await theirContext.newPage();
  await new SignInPage(theirs).signInAndLand(designer.email, DEMO_PASSWORD, /\/labs\/halden-form/);
  const roleOf = async () => {
    const res = await theirs.request.get('/api/v1/labs');
    const body = (await res.json()) as { items: { slug: string; role: string }[] };
    return body.items.find((l) => l.slug === DEMO_LAB_SLUG)?.role;
  };
  expect(await roleOf()).toBe('designer');

  const members = new MembersPage(page);
  await members.open(DEMO_LAB_SLUG);
  const patched = page.waitForResponse((r) => r.request().method() === 'PATCH' && r.url().includes('/members/'));
  await members.roleSelect(designer.email).selectOption('reviewer');
  expect((await patched).status()).toBe(200);
  expect(await roleOf()).toBe('reviewer');
  await theirs.goto(`/labs/${DEMO_LAB_SLUG}`);
  await expect(theirs.getByTestId('my-role')).toHaveText('Reviewer');

  // Put the demo back as it was.
  const restored = page.waitForResponse((r) => r.request().method() === 'PATCH' && r.url().includes('/members/'));
  await members.roleSelect(designer.email).selectOption('designer');
  expect((await restored).status()).toBe(200);
  expect(await roleOf()).toBe('designer');
  await theirContext.close();
});

test('a wrong password and an unknown e-mail read the same', async ({ page }) => {
  const signIn = new SignInPage(page);
  await signIn.open();
  await signIn.signIn(demoUser('reviewer').email, 'not the right one');
  const wrong = await page.getByTestId('sign-in-error').textContent();
  await signIn.open();
  await signIn.signIn(`nobody-${unique()}@e2e.example`, 'not the right one');
  await expect(page.getByTestId('sign-in-error')).toHaveText(wrong!);
});

test('the sign-in and members pages pass an axe scan', async ({ page }) => {
  await page.goto('/sign-in');
  await expect(page.getByTestId('sign-in-form')).toBeVisible();
  await expectNoSeriousA11yViolations(page);
  await page.screenshot({ path: 'test-results/screens/sign-in.png', fullPage: true });

  await new SignInPage(page).signInAndLand(demoUser('owner').email, DEMO_PASSWORD, /\/labs\/halden-form/);
  await new MembersPage(page).open(DEMO_LAB_SLUG);
  await expect(page.getByTestId(`member-row-${demoUser('reviewer').email}`)).toBeVisible();
  await expectNoSeriousA11yViolations(page);
  await page.screenshot({ path: 'test-results/screens/members.png', fullPage: true });
});

test('a sign-in link by e-mail signs in an existing account; an unknown address sees the same page', async ({ page }) => {
  const reviewer = demoUser('reviewer');
  await page.goto('/sign-in');
  await page.getByRole('tab', { name: 'E-mail me a link' }).click();
  const form = page.getByTestId('sign-in-link-form');
  await form.getByLabel('E-mail').fill(reviewer.email);
  const before = Date.now();
  await form.getByRole('button').click();
  await expect(page.getByTestId('check-email')).toBeVisible();

  const link = await waitForMailLink(reviewer.email, { after: 0, timeoutMs: 15_000, sentAfter: before });
  await page.goto(link);
  await expect(page).toHaveURL(/\/labs\/halden-form/);
  await expect(page.getByTestId('my-role')).toHaveText('Reviewer');

  const ghost = `ghost-${unique()}@e2e.example`;
  await page.context().clearCookies();
  await page.goto('/sign-in');
  await page.getByRole('tab', { name: 'E-mail me a link' }).click();
  await page.getByTestId('sign-in-link-form').getByLabel('E-mail').fill(ghost);
  await page.getByTestId('sign-in-link-form').getByRole('button').click();
  await expect(page.getByTestId('check-email')).toBeVisible();
});
