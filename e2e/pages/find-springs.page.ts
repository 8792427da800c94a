import { expect, type Locator, type Page } from '@playwright/test';

export class FindSpringsPage {
  constructor(private readonly page: Page) {}

  async open() {
    await this.page.goto('/find');
  }

  private async choose(label: string, option: string | RegExp) {
    const box = this.page.getByLabel(label, { exact: true });
    const choice = this.page.getByRole('option', { name: option }).first();
    // Opening a list as it re-renders can miss; open it again until the choice shows, as a person would.
    await expect(async () => {
      if (!(await choice.isVisible())) await box.click();
      await expect(choice).toBeVisible({ timeout: 2_000 });
    }).toPass({ timeout: 15_000 });
    await choice.click();
  }

  async chooseBike(make: string, model: string, years: string | RegExp) {
    await this.choose('Make', make);
    await this.choose('Model', model);
    await this.choose('Years and version', years);
  }

  async enterLoad(load: { riderKg: number; gearKg?: number; passengerKg?: number; topCaseKg?: number }) {
    await this.page.getByLabel('Rider', { exact: true }).fill(String(load.riderKg));
    if (load.gearKg !== undefined) await this.page.getByLabel('Riding gear').fill(String(load.gearKg));
    if (load.passengerKg !== undefined) await this.page.getByLabel('Passenger, in gear').fill(String(load.passengerKg));
    if (load.topCaseKg !== undefined) await this.page.getByLabel('Top case').fill(String(load.topCaseKg));
  }

  /** The finder's kg / lb switch; lengths follow it (mm, or inches with mm beside them). */
  async useUnits(unit: 'kg' | 'lb') {
    await this.page.getByRole('radio', { name: unit, exact: true }).or(this.page.getByRole('button', { name: unit, exact: true })).first().click();
  }

  async workOut() {
    await this.page.getByRole('button', { name: 'Work out my springs' }).click();
  }

  candidates(end: 'Fork springs' | 'Shock spring') {
    return this.page.getByRole('table', { name: `${end}: candidates` });
  }

  rateBand(end: 'Fork springs' | 'Shock spring') {
    return this.page.getByTestId(`${end.toLowerCase().replace(/\W+/g, '-')}-rate-band`);
  }

  /** The sag targets the page states for an end, as figures. */
  async statedTargets(end: 'Fork springs' | 'Shock spring') {
    const dd = this.page.getByTestId(`${end.toLowerCase().replace(/\W+/g, '-')}-targets`);
    const read = async (name: string) => Number(await dd.getAttribute(name));
    return { staticSagMm: await read('data-static-target'), riderSagMm: await read('data-rider-target'), toleranceMm: await read('data-tolerance') };
  }

  /** The static and rider sag a candidate row predicts. */
  async predictedSags(row: Locator) {
    const cell = row.getByTestId(/-sags$/);
    return { staticSagMm: Number(await cell.getAttribute('data-static-sag')), riderSagMm: Number(await cell.getAttribute('data-rider-sag')) };
  }
}
