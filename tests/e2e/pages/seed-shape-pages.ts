import { expect, type Page } from '@playwright/test';

export class SeedShapeEditorPage {
  constructor(private readonly page: Page) {}

  async openNew(lab: string) {
    await this.page.goto(`/labs/${lab}/seed-shapes`);
    await this.page.getByTestId('new-seed-shape').click();
    await expect(this.page.getByTestId('seed-shape-editor')).toBeVisible();
  }

  async uploadAndFit(file: string, family: 'elliptic' | 'radial', harmonics: number) {
    await this.page.getByTestId('upload-file').setInputFiles(file);
    await this.page.getByTestId('upload-family').selectOption(family);
    await this.page.getByTestId('upload-harmonics').fill(String(harmonics));
    await this.page.getByTestId('upload-fit').click();
    await expect(this.page.getByTestId('fit-result')).toBeVisible();
  }

  metric(name: string) {
    return this.page.getByTestId(`metric-${name}`);
  }

  previewPath() {
    return this.page.getByTestId('preview-path');
  }

  async save() {
    await this.page.getByTestId('save-seed').click();
    await expect(this.page.getByTestId('save-seed')).toHaveText('Saved');
  }
}
