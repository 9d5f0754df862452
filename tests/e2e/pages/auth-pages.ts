import { expect, type Page } from '@playwright/test';

export class SignInPage {
  constructor(private readonly page: Page) {}

  async open(callbackUrl?: string) {
    await this.page.goto(callbackUrl ? `/sign-in?callbackUrl=${encodeURIComponent(callbackUrl)}` : '/sign-in');
  }

  async signIn(email: string, password: string) {
    await this.page.getByTestId('sign-in-email').fill(email);
    await this.page.getByTestId('sign-in-password').fill(password);
    await this.page.getByTestId('sign-in-submit').click();
  }

  async signInAndLand(email: string, password: string, urlPattern: RegExp) {
    await this.open();
    await this.signIn(email, password);
    await expect(this.page).toHaveURL(urlPattern);
  }
}

export class SignUpPage {
  constructor(private readonly page: Page) {}

  async signUp(v: { name: string; email: string; password: string; lab: string }) {
    await this.page.goto('/sign-up');
    await this.page.getByTestId('sign-up-name').fill(v.name);
    await this.page.getByTestId('sign-up-email').fill(v.email);
    await this.page.getByTestId('sign-up-password').fill(v.password);
    await this.page.getByTestId('sign-up-lab').fill(v.lab);
    await this.page.getByTestId('sign-up-submit').click();
  }
}

export class MembersPage {
  constructor(private readonly page: Page) {}

  async open(lab: string) {
    await this.page.goto(`/labs/${lab}/settings/members`);
    await expect(this.page.getByTestId('members-table')).toBeVisible();
  }

  async invite(email: string, role: string) {
    await this.page.getByTestId('invite-email').fill(email);
    await this.page.getByTestId('invite-role').selectOption(role);
    await this.page.getByTestId('invite-submit').click();
    await expect(this.page.getByTestId('invite-sent')).toContainText(email);
  }

  roleSelect(email: string) {
    return this.page.getByTestId(`role-select-${email}`);
  }

  inviteSection() {
    return this.page.getByTestId('invite-section');
  }
}
