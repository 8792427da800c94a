import { expect, test } from './fixtures';
import { FindSpringsPage } from './pages/find-springs.page';

test('a rider picks a demo bike, enters the load and gets fork and shock springs that suit it, then a setup sheet', async ({ page }) => {
  const finder = new FindSpringsPage(page);
  await finder.open();
  await finder.chooseBike('Corvane', 'Strada 650', /2017–2020/);
  await finder.enterLoad({ riderKg: 85, gearKg: 8 });
  await finder.workOut();

  for (const end of ['Fork springs', 'Shock spring'] as const) {
    const table = finder.candidates(end);
    await expect(table).toBeVisible();
    // The best-placed candidate suits the load and is chosen for the rider.
    const first = table.getByRole('row').nth(1);
    await expect(first.getByText('Suits your load')).toBeVisible();
    await expect(first.getByRole('radio')).toBeChecked();
    // Its predicted sags sit inside the targets the page states: static within its tolerance, rider sag on target.
    const targets = await finder.statedTargets(end);
    const sags = await finder.predictedSags(first);
    expect(Math.abs(sags.staticSagMm - targets.staticSagMm)).toBeLessThanOrEqual(targets.toleranceMm);
    expect(Math.abs(sags.riderSagMm - targets.riderSagMm)).toBeLessThanOrEqual(0.05);
    await expect(finder.rateBand(end)).toContainText(/Rates from .* suit this load/);
  }

  await page.getByRole('link', { name: 'Open the setup sheet' }).click();
  await expect(page.getByRole('heading', { name: 'Setup sheet' })).toBeVisible();
  await expect(page.getByRole('complementary', { name: 'Before you start' })).toContainText('qualified technician');
  await expect(page.getByRole('region', { name: 'Fork' })).toContainText('Preload');
  await expect(page.getByRole('region', { name: 'Shock' })).toContainText('Installed length');
  await expect(page.getByRole('table', { name: 'Fastener torques' })).toContainText('ft·lbf');

  // The plan is kept in the browser: a reload rebuilds the same sheet.
  await page.reload();
  await expect(page.getByRole('region', { name: 'Shock' })).toContainText('Installed length');
});

test('a load over a station’s limit is refused with a readable message', async ({ page }) => {
  const finder = new FindSpringsPage(page);
  await finder.open();
  await finder.chooseBike('Corvane', 'Strada 650', /2017–2020/);
  await finder.enterLoad({ riderKg: 80, gearKg: 8, topCaseKg: 40 });
  await finder.workOut();
  await expect(page.getByRole('alert').first()).toBeVisible();
  await expect(finder.candidates('Shock spring')).toHaveCount(0);
});

test('a rider leaving the rider mass empty is told which field to fill', async ({ page }) => {
  const finder = new FindSpringsPage(page);
  await finder.open();
  await finder.chooseBike('Corvane', 'Strada 650', /2017–2020/);
  await finder.workOut();
  await expect(page.locator('#rider-mass-error')).toBeVisible();
  // The focus goes to the field to mend, so a keyboard or screen-reader user lands on it.
  await expect(page.getByLabel('Rider', { exact: true })).toBeFocused();
});
