import { expect, type Page } from '@playwright/test';

/** The participant session at /join/{token}: consent, screen check, instructions and the trials. */
export class ParticipantPages {
  constructor(private readonly page: Page) {}

  async consent() {
    await expect(this.page.getByTestId('photosensitivity')).toBeVisible();
    await this.page.getByTestId('consent-agree').click();
  }

  /** Types the viewing distance and waits for the refresh rate before going on. */
  async checkScreen(distanceCm: number) {
    await this.page.getByTestId('distance-cm').fill(String(distanceCm));
    await expect(this.page.getByTestId('refresh')).toHaveText(/Hz/);
    await this.page.getByTestId('screen-done').click();
  }

  async begin() {
    await this.page.getByTestId('begin').click();
  }

  /** The index of the trial being taken (the next to take). */
  async position(): Promise<number> {
    return Number(await this.page.getByTestId('stage').getAttribute('data-position'));
  }

  /**
   * Answers trials with the key until `until` returns true or the finish code shows; breaks are passed with the
   * space bar. Returns whether the session finished.
   */
  async answerWith(key: string, until: (position: number) => boolean = () => false): Promise<boolean> {
    const p = this.page;
    for (;;) {
      if (await p.getByTestId('finish-code').isVisible()) return true;
      if (until(await this.position())) return false;
      if (await p.getByTestId('answer-left').isVisible()) {
        await p.keyboard.press(key);
        await expect(p.getByTestId('answer-left')).toBeHidden();
      } else if (await p.getByTestId('continue').isVisible()) {
        await p.getByTestId('continue').click();
      } else {
        await p.waitForTimeout(20);
      }
    }
  }
}
