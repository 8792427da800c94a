import { expect, type Page } from '@playwright/test';
import { FindSpringsPage } from './find-springs.page';

/** The rider's catalogue: the filtered list and one product. */
export class CataloguePage {
  constructor(private readonly page: Page) {}

  async open() {
    await this.page.goto('/parts');
    await expect(this.page.getByRole('heading', { name: 'Springs & parts' })).toBeVisible();
  }

  async show(part: 'Everything' | 'Fork springs' | 'Shock springs' | 'Adapters' | 'Tools') {
    await this.page.getByRole('group', { name: 'Show' }).getByRole('button', { name: part }).click();
  }

  async onlyFor(make: string, model: string, years: RegExp) {
    await this.page.getByText('Only what fits my bike').click();
    await new FindSpringsPage(this.page).chooseBike(make, model, years);
  }

  /** The number of products the list says it holds. */
  async total(): Promise<number> {
    const text = (await this.page.getByRole('status').filter({ hasText: /products?$/ }).textContent()) ?? '';
    return Number(text.match(/\d+/)![0]);
  }

  cards() {
    return this.page.getByRole('list', { name: 'Products' }).getByRole('link');
  }
}
