import { expect, type Page } from '@playwright/test';

/** The study list, the new-study form and one study's page. */
export class StudyPages {
  constructor(private readonly page: Page) {}

  async openList(lab: string) {
    await this.page.goto(`/labs/${lab}/studies`);
    await expect(this.page.getByRole('heading', { name: 'Norming studies' })).toBeVisible();
  }

  async startNew() {
    await this.page.getByTestId('new-study').click();
    await expect(this.page.getByTestId('study-form')).toBeVisible();
  }

  /** Fills the categorisation setup: directions every `spacing`°, steps, repetitions, consent. */
  async fillCategorisation(o: { name: string; spacing: number; steps: number; repetitions: number; consent: string }) {
    const p = this.page;
    await p.getByTestId('study-name').fill(o.name);
    await p.getByTestId('study-direction-spacing').fill(String(o.spacing));
    await p.getByTestId('fill-directions').click();
    await p.getByTestId('study-steps').fill(String(o.steps));
    await p.getByTestId('study-repetitions').fill(String(o.repetitions));
    await p.getByTestId('study-consent').fill(o.consent);
  }

  async create() {
    await this.page.getByTestId('save-study').click();
    await expect(this.page.getByTestId('study-title')).toBeVisible();
  }

  async previewParticipant(index: number) {
    await this.page.getByTestId('plan-participant').fill(String(index));
  }

  async open() {
    await this.page.getByTestId('open-study').click();
    await expect(this.page.getByTestId('ethics-notice-open')).toBeVisible();
    await expect(this.page.getByTestId('confirm-open-study')).toBeDisabled();
    await this.page.getByTestId('confirm-ethics').check();
    await this.page.getByTestId('confirm-open-study').click();
    await expect(this.page.getByTestId('study-state')).toHaveText('Open');
  }
}
