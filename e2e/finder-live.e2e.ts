import { expect, test } from './fixtures';
import { FindSpringsPage } from './pages/find-springs.page';
import { SagCheckPage } from './pages/sag-check.page';

const shots = 'test-results/screenshots';

test('the finder answers as the rider types, in kg or lb, with a sag chart per end and the spring that covers two-up touring too', async ({ page }) => {
  await page.setViewportSize({ width: 1440, height: 900 });
  const finder = new FindSpringsPage(page);
  await finder.open();
  await finder.chooseBike('Corvane', 'Ridgeline 800', /2019–2022/);
  // The answer worked out in the browser is counted for the dashboard once the rider pauses.
  const shown = page.waitForRequest((r) => r.method() === 'POST' && r.url().endsWith('/api/recommendations/shown'), { timeout: 20_000 });
  await page.getByLabel('Rider', { exact: true }).fill('95');
  await page.getByLabel('Riding gear').fill('8');
  await page.getByLabel('Panniers (both together)').fill('20');

  // No button pressed: the springs follow the load typed.
  const shock = finder.candidates('Shock spring');
  await expect(shock).toBeVisible();
  await expect(finder.candidates('Fork springs')).toBeVisible();
  const firstShock = shock.getByRole('row').nth(1);
  await expect(firstShock.getByText('Suits your load')).toBeVisible();
  await expect(firstShock.getByRole('radio')).toBeChecked();
  await expect(firstShock.getByTestId(/-adapters$/)).toContainText(/Needs|No adapter needed/);
  expect(((await shown).postDataJSON() as { fitmentId: string }).fitmentId).toMatch(/^[0-9a-f-]{36}$/);
  const bandKg = await finder.rateBand('Shock spring').innerText();
  const bandNPerMm = bandKg.match(/\(([\d.]+)–([\d.]+) N\/mm\)/)!;
  expect(bandKg).toMatch(/kgf\/mm/);

  // A chart per end with its text alternative.
  await expect(page.getByRole('figure', { name: /Rider sag against added load — shock spring/ })).toBeVisible();
  await expect(page.getByRole('figure', { name: /fork springs/ })).toBeVisible();
  const summary = page.getByTestId('shock-spring-chart-summary');
  await expect(summary).toContainText(/at your load of 123 kg it is [\d.]+ mm/);
  await page.screenshot({ path: `${shots}/finder-1440.png`, fullPage: true });
  await page.getByRole('figure', { name: /shock spring/ }).screenshot({ path: `${shots}/finder-chart-1440.png` });

  // The same load in pounds: the fields show it converted, the rate band and the answer stay the same.
  await page.getByRole('radio', { name: 'lb' }).or(page.getByRole('button', { name: 'lb', exact: true })).first().click();
  await expect(page.getByLabel('Rider', { exact: true })).toHaveValue('209.4');
  await expect(page.getByLabel('Panniers (both together)')).toHaveValue('44.1');
  const bandLb = await finder.rateBand('Shock spring').innerText();
  expect(bandLb).toMatch(/lbf\/in/);
  // The N/mm figures beside the rider's units are the same in both: the same load, only shown in other units.
  expect(bandLb).toContain(`(${bandNPerMm[1]}–${bandNPerMm[2]} N/mm)`);
  // 123 kg = 271 lb (1 lb = 0.45359237 kg, by definition: NIST SP 811, 2008, appendix B.8).
  await expect(summary).toContainText(/at your load of 271 lb/);
  await expect(firstShock.getByRole('radio')).toBeChecked();
  await page.getByRole('radio', { name: 'kg' }).or(page.getByRole('button', { name: 'kg', exact: true })).first().click();

  // Two-up touring as a second load: the fork springs that suit both are named, with the preload and turns for each.
  await page.getByRole('button', { name: 'Add two-up touring' }).click();
  const covers = page.getByRole('list', { name: 'Fork springs that suit every load' });
  await expect(covers.getByRole('listitem').first()).toBeVisible();
  const coveringName = (await covers.getByRole('listitem').first().innerText()).trim();
  const perLoad = page.getByRole('table', { name: `${coveringName}: preload for each load` });
  await expect(perLoad.getByRole('row', { name: /two-up touring/ })).toContainText(/mm.*turns/);
  await expect(perLoad.getByRole('row', { name: /the load entered above/ })).toContainText(/mm.*turns/);
  // On this demo bike no shock spring's preload range spans 123 kg solo and two-up with 95 kg more: the page says so,
  // and names the load that rules each spring out.
  const shockAcross = page.getByRole('region', { name: 'Shock spring across your loads' });
  await expect(shockAcross.getByRole('list', { name: 'Shock spring ruled out' })).toContainText('is ruled out by “two-up touring”');
  await page.getByRole('region', { name: 'Other loads you ride with' }).screenshot({ path: `${shots}/finder-cases-1440.png` });
});

test('a sag check that reads too soft names the stiffer springs that suit the load, and one goes to the cart', async ({ page }) => {
  const finder = new FindSpringsPage(page);
  await finder.open();
  await finder.chooseBike('Corvane', 'Ridgeline 800', /2019–2022/);
  await finder.enterLoad({ riderKg: 95, gearKg: 8 });
  await page.getByLabel('Panniers (both together)').fill('20');
  await expect(finder.candidates('Shock spring')).toBeVisible();
  await page.getByRole('link', { name: 'Already fitted? Check your sag' }).click();

  const sag = new SagCheckPage(page);
  await expect(page.getByText('How to measure')).toBeVisible();
  await expect(page.getByText(/feet on the pegs/)).toBeVisible();
  // Sinks 45 mm on its own weight and 110 mm aboard: far more than the targets, so the spring is too soft.
  await sag.fill('Fully extended', 600);
  await sag.fill('On its own weight', 555);
  await sag.fill('With you aboard', 490);
  await expect(page.getByTestId('sag-spring-verdict')).toContainText(/too soft/i);
  await expect(page.getByRole('heading', { name: 'Stiffer springs that suit your load' })).toBeVisible();
  await page.setViewportSize({ width: 1440, height: 900 });
  await page.screenshot({ path: `${shots}/sag-check-1440.png`, fullPage: true });
  await page.setViewportSize({ width: 390, height: 844 });
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
  await page.screenshot({ path: `${shots}/sag-check-390.png`, fullPage: true });

  const add = page.getByRole('button', { name: /^Add .* to the cart$/ }).first();
  const springName = (await add.innerText()).replace(/^Add (.*) to the cart$/, '$1');
  await add.click();
  // The cart drawer opens with the spring in it; the cart page lists it too.
  await page.getByRole('button', { name: 'View cart' }).click();
  await expect(page.getByRole('heading', { name: 'Your cart', level: 1 })).toBeVisible();
  await expect(page.getByRole('main')).toContainText(springName);
});

test('at phone width the finder fits the screen: candidates are cards and the form stacks', async ({ page }) => {
  await page.setViewportSize({ width: 390, height: 844 });
  const finder = new FindSpringsPage(page);
  await finder.open();
  await finder.chooseBike('Corvane', 'Ridgeline 800', /2019–2022/);
  await finder.enterLoad({ riderKg: 95, gearKg: 8 });
  await page.getByLabel('Panniers (both together)').fill('20');
  await expect(finder.candidates('Shock spring')).toBeVisible();
  await page.getByRole('button', { name: 'Add two-up touring' }).click();
  await expect(page.getByTestId('fork-covers-all')).toBeVisible();
  await expect(page.getByRole('figure', { name: /shock spring/ })).toBeVisible();
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
  // Only the springs that suit show until the rider asks for the rest.
  const shockRows = finder.candidates('Shock spring').getByRole('row');
  const suitedCount = await shockRows.count();
  await page.getByRole('button', { name: /Show the \d+ that do not suit/ }).last().click();
  await expect.poll(() => shockRows.count()).toBeGreaterThan(suitedCount);
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
  await page.getByRole('button', { name: 'Show only the springs that suit' }).click();
  await page.screenshot({ path: `${shots}/finder-390.png`, fullPage: true });
  await finder.candidates('Shock spring').screenshot({ path: `${shots}/finder-cards-390.png` });
  // What a phone shows at once: the results' first screen and the chart.
  await page.getByRole('heading', { name: 'Fork springs', level: 2 }).scrollIntoViewIfNeeded();
  await page.screenshot({ path: `${shots}/finder-390x844-results.png` });
  await page.getByRole('figure', { name: /shock spring/ }).scrollIntoViewIfNeeded();
  await page.screenshot({ path: `${shots}/finder-390x844-chart.png` });
});
