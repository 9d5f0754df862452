import { expect, type Page } from '@playwright/test';

/** The space view's boundary and freeze controls. */
export class SpaceViewPage {
  constructor(private readonly page: Page) {}

  async open(lab: string, spaceId: string) {
    await this.page.goto(`/labs/${lab}/spaces/${spaceId}`);
    await expect(this.page.getByTestId('space-canvas')).toBeVisible();
  }

  async addBoundary(label: string) {
    await this.page.getByTestId('add-boundary').click();
    const last = this.page.getByTestId('boundary-panel').locator('li').last();
    await last.getByLabel('Name').fill(label);
  }

  /** Turns the shown boundary with the keyboard on its handle: +1° per ArrowLeft, −1° per ArrowRight. */
  async turnBoundary(key: string, degrees: number) {
    const handle = this.page.getByTestId(`boundary-handle-${key}`);
    await handle.focus();
    for (let i = 0; i < Math.abs(degrees); i++) await this.page.keyboard.press(degrees > 0 ? 'ArrowLeft' : 'ArrowRight');
  }

  async saveBoundaries() {
    await this.page.getByTestId('save-boundaries').click();
    await expect(this.page.getByTestId('save-boundaries')).toHaveText('Boundaries saved');
  }

  async freeze(note: string) {
    await this.page.getByTestId('change-note').fill(note);
    await this.page.getByTestId('freeze-edition').click();
    await expect(this.page.getByTestId('edition-review')).toBeVisible();
  }
}

/** One edition's review page. */
export class EditionReviewPage {
  constructor(private readonly page: Page) {}

  async open(lab: string, spaceId: string, number: number) {
    await this.page.goto(`/labs/${lab}/spaces/${spaceId}/editions/${number}`);
    await expect(this.page.getByTestId('edition-review')).toBeVisible();
  }

  state() {
    return this.page.getByTestId('edition-state');
  }

  async submit() {
    await this.page.getByTestId('submit-edition').click();
    await expect(this.state()).toHaveAttribute('data-state', 'in_review');
  }

  async commentOn(stimulusId: string, text: string) {
    await this.page.getByTestId(`grid-stimulus-${stimulusId}`).click();
    await expect(this.page.getByTestId('edition-inspector-id')).toHaveText(stimulusId);
    await this.page.getByTestId('comment-body').fill(text);
    await this.page.getByTestId('post-comment').click();
    await expect(this.page.getByTestId('comment').filter({ hasText: text })).toContainText(`on ${stimulusId}`);
  }

  async returnWith(note: string) {
    await this.page.getByTestId('decision-note-input').fill(note);
    await this.page.getByTestId('return-edition').click();
    await expect(this.state()).toHaveAttribute('data-state', 'returned');
  }

  async approve(note: string) {
    await this.page.getByTestId('decision-note-input').fill(note);
    await this.page.getByTestId('approve-edition').click();
    await expect(this.state()).toHaveAttribute('data-state', 'approved');
  }
}
