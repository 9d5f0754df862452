import { expect, type Page } from '@playwright/test';

/** A study's similarity page: heatmaps, the MDS map, the equalisation suggestions and their "create space" action. */
export class SimilarityPage {
  constructor(private readonly page: Page) {}

  async open(lab: string, studyId: string) {
    await this.page.goto(`/labs/${lab}/studies/${studyId}/similarity`);
    await expect(this.page.getByTestId('similarity-title')).toBeVisible();
  }

  heatmaps() {
    return this.page.getByTestId('rdm-heatmaps').locator('svg');
  }

  map() {
    return this.page.getByTestId('mds-map').locator('svg');
  }

  /** Creates the space of a suggestion under `name` and waits for its page. */
  async equalise(basis: 'slopes' | 'map', name: string) {
    await this.page.getByTestId(`equalize-name-${basis}`).fill(name);
    await this.page.getByTestId(`equalize-${basis}`).click();
    await expect(this.page).toHaveURL(/\/spaces\/[0-9a-f-]{36}$/);
  }
}

/** Rates every pair-similarity trial of a participant session with `rate(trialIndex)`; breaks are passed. */
export async function ratePairs(page: Page, rate: (trialIndex: number) => number): Promise<void> {
  for (;;) {
    if (await page.getByTestId('finish-code').isVisible()) return;
    if (await page.getByTestId('rate-1').isVisible()) {
      const position = Number(await page.getByTestId('stage').getAttribute('data-position'));
      await page.keyboard.press(String(rate(position)));
      await expect(page.getByTestId('rate-1')).toBeHidden();
    } else if (await page.getByTestId('continue').isVisible()) {
      await page.getByTestId('continue').click();
    } else {
      await page.waitForTimeout(20);
    }
  }
}
