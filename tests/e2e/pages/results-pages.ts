import { readFile } from 'node:fs/promises';
import { expect, type Page } from '@playwright/test';

/** A study's results page: verdict, curves and tables, exclusions, settings and the exports. */
export class ResultsPage {
  constructor(private readonly page: Page) {}

  async open(lab: string, studyId: string) {
    await this.page.goto(`/labs/${lab}/studies/${studyId}/results`);
    await expect(this.page.getByTestId('results-title')).toBeVisible();
  }

  /** Waits until the results are ready (a background job may compute them first, with its progress bar). */
  async waitUntilReady() {
    await expect(this.page.getByTestId('results-computing')).toHaveCount(0, { timeout: 90_000 });
    await expect(this.page.getByTestId('results-verdict')).toBeVisible();
  }

  /** The directions that have a fitted curve in the inline plot. */
  async curveDirections(): Promise<string[]> {
    return this.page.getByTestId('plot-curves').locator('path.curve').evaluateAll((paths) => paths.map((p) => p.getAttribute('data-curve') ?? ''));
  }

  /** Clicks an export link and returns the downloaded file's text. */
  async download(testId: string): Promise<{ name: string; text: string }> {
    const [download] = await Promise.all([this.page.waitForEvent('download'), this.page.getByTestId(testId).click()]);
    const path = await download.path();
    return { name: download.suggestedFilename(), text: await readFile(path, 'utf8') };
  }
}
