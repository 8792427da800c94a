import type { Page } from '@playwright/test';

export class SagCheckPage {
  constructor(private readonly page: Page) {}

  async open() {
    await this.page.goto('/sag-check');
  }

  async chooseEnd(label: 'Rear (shock)' | 'Front (fork)') {
    await this.page.getByRole('radio', { name: label }).or(this.page.getByRole('button', { name: label })).first().click();
  }

  async fill(label: string, value: number) {
    await this.page.getByLabel(label, { exact: true }).fill(String(value));
  }

  advice() {
    return this.page.getByTestId('sag-advice');
  }
}
