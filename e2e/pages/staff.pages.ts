import { expect, type Locator, type Page } from '@playwright/test';

/** The back-office fitment list. */
export class StaffFitmentsPage {
  constructor(private readonly page: Page) {}

  async open() {
    await this.page.goto('/staff/fitments');
    await expect(this.page.getByRole('heading', { name: 'Fitments', level: 1 })).toBeVisible();
  }

  table(): Locator {
    return this.page.getByRole('table', { name: 'Fitments' });
  }

  async search(text: string) {
    await this.page.getByLabel('Search fitments', { exact: true }).fill(text);
  }

  async edit(model: string) {
    await this.page.getByRole('link', { name: new RegExp(`^Edit .*${model}`) }).click();
  }
}

/** The fitment editor; labels are the ones staff read. */
export class StaffFitmentEditPage {
  constructor(private readonly page: Page) {}

  field(label: string): Locator {
    return this.page.getByLabel(label, { exact: true });
  }

  /** The message shown under a field, found through the field's aria-describedby. */
  async errorOf(label: string): Promise<Locator> {
    const id = await this.field(label).getAttribute('id');
    return this.page.locator(`[id="${id}-error"]`);
  }

  async save() {
    await this.page.getByRole('button', { name: /^(Save|Create) fitment$/ }).click();
  }
}

/** The product editor with its spring panel and images. */
export class StaffProductEditPage {
  constructor(private readonly page: Page) {}

  async open(id: string) {
    await this.page.goto(`/staff/products/${id}`);
    await expect(this.page.getByRole('form', { name: 'Product' })).toBeVisible();
  }

  field(label: string): Locator {
    return this.page.getByLabel(label, { exact: true });
  }

  async errorOf(label: string): Promise<Locator> {
    const id = await this.field(label).getAttribute('id');
    return this.page.locator(`[id="${id}-error"]`);
  }

  geometry(): Locator {
    return this.page.getByRole('region', { name: 'Computed from the geometry' });
  }

  async save() {
    await this.page.getByRole('button', { name: /^(Save|Create) product$/ }).click();
  }

  images(): Locator {
    return this.page.getByRole('list', { name: 'Product images' }).getByRole('img');
  }

  async upload(file: { name: string; mimeType: string; buffer: Buffer }) {
    await this.page.getByLabel('Add images').setInputFiles(file);
  }
}

/** The CSV import with its dry-run report. */
export class StaffFitmentImportPage {
  constructor(private readonly page: Page) {}

  async open() {
    await this.page.goto('/staff/fitments/import');
    await expect(this.page.getByRole('heading', { name: 'Import fitments' })).toBeVisible();
  }

  async choose(name: string, csv: string) {
    await this.page.getByLabel('Choose a CSV file').setInputFiles({ name, mimeType: 'text/csv', buffer: Buffer.from(csv, 'utf8') });
  }

  problems(): Locator {
    return this.page.getByRole('table', { name: 'Problems in the file' });
  }

  async commit() {
    await this.page.getByRole('button', { name: /^Import \d+ rows?$/ }).click();
  }
}

/** The fitment page's springs-and-adapters section: what fits this bike, staff decisions and adapters. */
export class StaffFitmentCompatibility {
  constructor(private readonly page: Page) {}

  section(): Locator {
    return this.page.getByRole('region', { name: 'Springs and adapters for this bike' });
  }

  table(end: 'Fork' | 'Shock'): Locator {
    return this.section().getByRole('table', { name: `${end} springs on this fitment` });
  }

  row(end: 'Fork' | 'Shock', sku: string): Locator {
    return this.table(end).getByRole('row').filter({ hasText: sku });
  }

  /** Narrows the tables to the springs riders are offered on this bike, or shows them all again. */
  async showOfferedOnly(on: boolean) {
    await this.section().getByRole('checkbox', { name: 'Show only the springs offered to riders' }).setChecked(on);
  }

  /** Opens the fit dialog of one spring, picks a decision and saves it. */
  async decide(sku: string, choice: 'Follow the rule' | 'Force a fit' | 'Force no fit', note?: string) {
    await this.section().getByRole('button', { name: `Change the fit of ${sku}` }).click();
    const dialog = this.page.getByRole('dialog', { name: `Fit on this bike: ${sku}` });
    await dialog.getByRole('radio', { name: choice }).check();
    if (note !== undefined) await dialog.getByLabel('Why (kept with the override)').fill(note);
    await dialog.getByRole('button', { name: 'Save decision' }).click();
    await expect(dialog).toBeHidden();
  }
}
