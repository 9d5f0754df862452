import { expect, type Page } from '@playwright/test';

/** An edition's run orders page: the list and the form with its live summary. */
export class RunOrdersPage {
  constructor(private readonly page: Page) {}

  async openFromEdition() {
    await this.page.getByTestId('edition-run-orders').click();
    await expect(this.page.getByTestId('run-order-form')).toBeVisible();
  }

  async chooseSpokes(spokes: number[], withCentre: boolean) {
    await this.page.getByTestId('selection-spokes').check();
    for (const s of spokes) await this.page.getByTestId(`choice-${s}`).check();
    const centre = this.page.getByTestId('include-centre');
    if (withCentre) await centre.check();
    else await centre.uncheck();
  }

  async chooseSequence(kind: 'de-bruijn' | 'type1-index1' | 'shuffled-blocks') {
    await this.page.getByTestId('sequence-kind').selectOption(kind);
  }

  async setTiming({ trial, iti, tr }: { trial: number; iti: number; tr: number }) {
    await this.page.getByTestId('trial-duration').fill(String(trial));
    await this.page.getByTestId('iti-kind').selectOption('fixed');
    await this.page.getByTestId('iti-duration').fill(String(iti));
    await this.page.getByTestId('tr').fill(String(tr));
  }

  preview() {
    return this.page.getByTestId('run-order-preview');
  }

  async save(name: string) {
    await this.page.getByTestId('run-order-name').fill(name);
    await this.page.getByTestId('save-run-order').click();
    await expect(this.page.getByTestId('run-order-title')).toHaveText(name);
  }
}
