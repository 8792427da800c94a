import { readFile } from 'node:fs/promises';
import { PDFParse } from 'pdf-parse';
import type { Page, TestInfo } from '@playwright/test';
import { expect, test } from './fixtures';
import { CataloguePage } from './pages/catalogue.page';
import { FindSpringsPage } from './pages/find-springs.page';

const sizes = [
  { name: 'phone', width: 390, height: 844 },
  { name: 'desktop', width: 1440, height: 900 },
] as const;

/** Screenshots of the page at phone and desktop width, attached to the report; at 390 px nothing may scroll sideways. */
async function shoot(page: Page, info: TestInfo, what: string) {
  for (const s of sizes) {
    await page.setViewportSize({ width: s.width, height: s.height });
    await page.waitForTimeout(150);
    const wider = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(wider, `${what} at ${s.width} px is wider than the viewport`).toBeLessThanOrEqual(0);
    await info.attach(`${what} ${s.width}x${s.height}`, { body: await page.screenshot({ fullPage: true, animations: 'disabled' }), contentType: 'image/png' });
  }
}

test('a rider browses the catalogue, narrows it to their bike and a rate range, opens a spring and adds it to the cart', async ({ page }, info) => {
  const shop = new CataloguePage(page);
  await page.goto('/');
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Springs & parts' }).click();
  await expect(page.getByRole('heading', { name: 'Springs & parts' })).toBeVisible();
  const everything = await shop.total();

  await shop.show('Shock springs');
  await expect.poll(() => shop.total()).toBeLessThan(everything);
  const shocks = await shop.total();
  await shop.onlyFor('Corvane', 'Strada 650', /2017–2020/);
  await expect.poll(() => shop.total()).toBeLessThan(shocks);
  await expect(page).toHaveURL(/fitmentId=/);
  const fitting = await shop.total();
  expect(fitting).toBeGreaterThan(0);

  // A rate range narrows it again, and every card's rate sits in it.
  await page.getByLabel('Rate from (N/mm)').fill('40');
  await page.getByLabel('Rate up to (N/mm)').fill('80');
  await page.getByRole('button', { name: 'Apply' }).click();
  await expect(page).toHaveURL(/maxRate=80/);
  await expect(shop.cards().first()).toBeVisible();
  for (const text of await shop.cards().allTextContents()) {
    const rate = Number(text.match(/([\d.]+) N\/mm per spring/)![1]);
    expect(rate).toBeGreaterThanOrEqual(40);
    expect(rate).toBeLessThanOrEqual(80);
  }
  await shoot(page, info, 'product list');

  await shop.cards().first().click();
  await expect(page.getByRole('heading', { level: 1 })).toContainText('Shock spring');
  const specs = page.getByRole('table', { name: 'Specifications' });
  await expect(specs).toContainText('kgf/mm');
  await expect(specs).toContainText('lbf/in');
  await expect(specs.getByRole('row', { name: /Free length/ })).toContainText(/ mm.* in/);
  // The bike chosen in the list is among the bikes it fits.
  await expect(page.getByRole('list').filter({ hasText: 'Corvane Strada 650' })).toBeVisible();
  await expect(page.getByText(/per spring/).first()).toBeVisible();
  await shoot(page, info, 'product page');

  const before = Number((await page.getByTestId('cart-button').textContent())!.trim());
  await page.setViewportSize({ width: 1440, height: 900 });
  await page.getByRole('button', { name: 'Add to cart' }).click();
  await expect(page.getByText('Added to your cart.')).toBeVisible();
  await expect(page.getByTestId('cart-button')).toContainText(String(before + 1));
});

test('from the finder, the setup sheet PDF carries the same preload, turns and torque figures as the page', async ({ page }, info) => {
  const finder = new FindSpringsPage(page);
  await finder.open();
  await finder.chooseBike('Corvane', 'Strada 650', /2017–2020/);
  await finder.enterLoad({ riderKg: 95, gearKg: 8 });
  await finder.workOut();
  await page.getByRole('link', { name: 'Open the setup sheet' }).click();
  await expect(page.getByRole('heading', { name: 'Setup sheet' })).toBeVisible();
  await expect(page).toHaveURL(/setup-sheet\?fitmentId=.*riderKg=95/);
  // The sheet is on screen once the server's figures are.
  await expect(page.getByTestId('fork-preload')).toBeVisible();
  await expect(page.getByTestId('shock-preload')).toBeVisible();

  const shown: string[] = [];
  for (const id of ['fork-preload', 'fork-adjuster', 'fork-spacer', 'shock-preload', 'shock-adjuster', 'fork-static-sag', 'shock-rider-sag']) {
    const cell = page.getByTestId(id);
    if (await cell.count()) shown.push((await cell.textContent())!.trim());
  }
  expect(shown.some((t) => /turns from fully out/.test(t))).toBe(true);
  const torques = (await page.getByTestId('torque').allTextContents()).map((t) => t.trim());
  expect(torques.length).toBeGreaterThan(0);
  expect(torques.every((t) => /N·m \([\d.]+ ft·lbf\)/.test(t))).toBe(true);
  await expect(page.getByText(/oil level \(or air gap\)/)).toBeVisible();
  await shoot(page, info, 'setup sheet');

  const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Download PDF' }).click()]);
  expect(download.suggestedFilename()).toMatch(/^setup-sheet-.*\.pdf$/);
  const bytes = await readFile((await download.path())!);
  const parser = new PDFParse({ data: new Uint8Array(bytes) });
  const text = (await parser.getText()).text.replace(/\s+/g, ' ');
  await parser.destroy();
  for (const figure of [...shown, ...torques]) expect(text, `the PDF shows "${figure}"`).toContain(figure.replace(/\s+/g, ' '));
});
