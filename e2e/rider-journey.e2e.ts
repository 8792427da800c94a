import { readFile } from 'node:fs/promises';
import { unit } from 'mathjs';
import { PDFParse } from 'pdf-parse';
import { expect, test } from './fixtures';
import { FindSpringsPage } from './pages/find-springs.page';
import { SagCheckPage } from './pages/sag-check.page';
import { RegisterPage } from './pages/sign-in.page';

/** Every figure in a text, commas of thousands dropped. */
const figures = (text: string): number[] => [...text.matchAll(/\d[\d,]*(?:\.\d+)?/g)].map((m) => Number(m[0].replace(/,/g, '')));

/** "a in (b mm)" → [a, b]. */
function inchesAndMm(text: string): { inches: number; mm: number } {
  const m = text.match(/([\d.,]+)\s*in \(([\d.,]+)\s*mm\)/);
  expect(m, `"${text}" shows inches with mm beside them`).not.toBeNull();
  return { inches: Number(m![1]!.replace(/,/g, '')), mm: Number(m![2]!.replace(/,/g, '')) };
}

test('a new rider finds springs for a loaded demo bike, reads them in lb, covers two-up touring, buys the set, keeps the bike, follows a too-soft sag check to the cart and takes the setup sheet as a PDF', async ({ page }) => {
  test.setTimeout(180_000);
  await page.setViewportSize({ width: 1440, height: 900 });
  await page.goto('/');
  await page.evaluate(() => localStorage.removeItem('loadline.units'));

  // The bike and the load, as a rider types them: the springs follow without a button.
  const finder = new FindSpringsPage(page);
  await finder.open();
  await finder.chooseBike('Corvane', 'Ridgeline 800', /2019–2022/);
  await finder.enterLoad({ riderKg: 95, gearKg: 8 });
  await page.getByLabel('Panniers (both together)').fill('20');
  const shock = finder.candidates('Shock spring');
  await expect(shock).toBeVisible();
  await expect(finder.candidates('Fork springs')).toBeVisible();
  const firstShock = shock.getByRole('row').nth(1);
  // The verdict is in words beside its mark, never only a colour.
  await expect(firstShock.getByText('Suits your load')).toBeVisible();
  await expect(firstShock.getByRole('radio')).toBeChecked();

  // Figures in kg, N/mm and mm.
  const bandKg = await finder.rateBand('Shock spring').innerText();
  const [kgfLow, kgfHigh, nLow, nHigh] = figures(bandKg);
  // kgf/mm from N/mm through mathjs (1 kgf = 9.80665 N exactly: NIST SP 811, 2008, B.8); the N/mm shown are rounded to 0.1.
  expect(Math.abs(kgfLow! - unit(nLow!, 'N/mm').toNumber('kgf/mm'))).toBeLessThanOrEqual(0.05 / 9.80665 + 0.005);
  expect(Math.abs(kgfHigh! - unit(nHigh!, 'N/mm').toNumber('kgf/mm'))).toBeLessThanOrEqual(0.05 / 9.80665 + 0.005);
  const preloadCell = firstShock.locator('td[data-label="Preload"]');
  const preloadMmText = await preloadCell.innerText();
  const preloadMm = figures(preloadMmText)[0]!;
  expect(preloadMmText).toMatch(/^[\d.]+\s*mm/);
  const summary = page.getByTestId('shock-spring-chart-summary');
  await expect(summary).toContainText(/at your load of 123 kg/);

  // The same load in lb: every figure is the one before, converted; the springs chosen stay chosen.
  await finder.useUnits('lb');
  // 95 kg in lb by mathjs (1 lb = 0.45359237 kg exactly: NIST SP 811, 2008, B.8), shown to 0.1.
  await expect(page.getByLabel('Rider', { exact: true })).toHaveValue(String(Math.round(unit(95, 'kg').toNumber('lb') * 10) / 10));
  await expect(page.getByLabel('Panniers (both together)')).toHaveValue(String(Math.round(unit(20, 'kg').toNumber('lb') * 10) / 10));
  await expect(finder.rateBand('Shock spring')).toContainText('lbf/in');
  const [lbfLow, lbfHigh, nLowLb, nHighLb] = figures(await finder.rateBand('Shock spring').innerText());
  expect([nLowLb, nHighLb]).toEqual([nLow, nHigh]);
  // lbf/in through mathjs (1 lbf/in = 0.1751268 N/mm: NIST SP 811, 2008, B.8), shown whole; the N/mm beside are rounded to 0.1.
  const lbfSlack = 0.05 * unit(1, 'N/mm').toNumber('lbf/in') + 0.5;
  expect(Math.abs(lbfLow! - unit(nLow!, 'N/mm').toNumber('lbf/in'))).toBeLessThanOrEqual(lbfSlack);
  expect(Math.abs(lbfHigh! - unit(nHigh!, 'N/mm').toNumber('lbf/in'))).toBeLessThanOrEqual(lbfSlack);
  await expect(summary).toContainText(new RegExp(`at your load of ${Math.round(unit(123, 'kg').toNumber('lb'))} lb`));
  // A length in inches with the mm figure beside it: the same preload, 1 in = 25.4 mm exactly, inches shown to 0.01.
  await expect(preloadCell).toContainText(' in (');
  const preload = inchesAndMm(await preloadCell.innerText());
  expect(preload.mm).toBe(preloadMm);
  expect(Math.abs(preload.inches - unit(preloadMm, 'mm').toNumber('in'))).toBeLessThanOrEqual(0.005 + 0.05 / 25.4);
  await expect(firstShock.getByRole('radio')).toBeChecked();

  // Two-up touring as a second load: the fork springs that suit both loads are named, with the preload for each.
  await page.getByRole('button', { name: 'Add two-up touring' }).click();
  const covers = page.getByRole('list', { name: 'Fork springs that suit every load' });
  await expect(covers.getByRole('listitem').first()).toBeVisible();
  const coveringName = (await covers.getByRole('listitem').first().innerText()).trim();
  const perLoad = page.getByRole('table', { name: `${coveringName}: preload for each load` });
  await expect(perLoad.getByRole('row', { name: /two-up touring/ })).toContainText(/in \([\d.]+\s*mm\)/);
  await expect(perLoad.getByRole('row', { name: /the load entered above/ })).toBeVisible();
  // The covering fork spring is the one to buy: choose it in the fork list.
  await page.getByRole('radio', { name: `Choose ${coveringName}` }).check();

  // The set goes to the cart; the drawer shows it.
  await page.getByRole('button', { name: 'Add this set to the cart' }).click();
  await expect(page.getByText('The set is in your cart')).toBeVisible();
  const drawer = page.getByRole('dialog', { name: 'Your cart' });
  await expect(drawer).toContainText(coveringName);
  await page.keyboard.press('Escape');
  await expect(drawer).toBeHidden();

  // A new account keeps the cart, and the finder keeps the bike and load entered as a guest.
  const email = `journey-${Date.now().toString(36)}@example.test`;
  await page.getByRole('banner').getByRole('link', { name: 'Create account' }).click();
  await new RegisterPage(page).register({ name: 'Journey Rider', email, password: 'journey-password-1' });
  await expect(page.getByTestId('signed-in-as')).toContainText('Journey Rider');
  await expect(page.getByTestId('cart-button')).not.toContainText(/^\s*0\s*$/);
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Find springs' }).click();
  await expect(finder.candidates('Shock spring')).toBeVisible();
  const nickname = `Two-up tourer ${Date.now().toString(36)}`;
  await page.getByLabel('Nickname', { exact: true }).fill(nickname);
  await page.getByRole('button', { name: 'Save this bike' }).click();
  await expect(page.getByText(`Saved as “${nickname}”`)).toBeVisible();

  // The sag check reads too soft: far more sag than the targets. A stiffer spring that suits is named and goes to the cart.
  await page.getByRole('link', { name: 'Already fitted? Check your sag' }).click();
  const sag = new SagCheckPage(page);
  await sag.fill('Fully extended', 600);
  await sag.fill('On its own weight', 555);
  await sag.fill('With you aboard', 490);
  await expect(page.getByTestId('sag-spring-verdict')).toContainText(/too soft/i);
  // An lb rider reads the sags in inches with the mm beside them: 600 − 490 = 110 mm of rider sag (common practice).
  await expect(page.getByRole('region', { name: 'What to change' })).toContainText(`${Number(unit(110, 'mm').toNumber('in').toFixed(2))}\u202fin (110\u202fmm)`);
  await expect(page.getByRole('heading', { name: 'Stiffer springs that suit your load' })).toBeVisible();
  const add = page.getByRole('button', { name: /^Add .* to the cart$/ }).first();
  const stiffer = (await add.innerText()).replace(/^Add (.*) to the cart$/, '$1').trim();
  await add.click();
  // The cart drawer opens with the spring in it; its page lists it too.
  await expect(page.getByRole('dialog', { name: 'Your cart' })).toContainText(stiffer);
  await page.getByRole('dialog', { name: 'Your cart' }).getByRole('button', { name: 'View cart' }).click();
  await expect(page.getByRole('heading', { name: 'Your cart', level: 1 })).toBeVisible();
  await expect(page.getByRole('main')).toContainText(stiffer);

  // The bike is on the rider's list.
  await page.getByRole('banner').getByRole('link', { name: 'My bikes' }).click();
  await expect(page.getByRole('link', { name: nickname })).toBeVisible();

  // The setup sheet from the finder: the page's preload, turns and torques are the PDF's.
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Find springs' }).click();
  await page.getByRole('link', { name: 'Open the setup sheet' }).click();
  await expect(page.getByRole('heading', { name: 'Setup sheet', level: 1 })).toBeVisible();
  await expect(page.getByTestId('shock-preload')).toBeVisible();
  const onScreen: { preloads: { inches: number; mm: number }[]; turns: string[]; torques: string[] } = { preloads: [], turns: [], torques: [] };
  for (const end of ['fork', 'shock']) {
    const cell = page.getByTestId(`${end}-preload`);
    if (await cell.count()) onScreen.preloads.push(inchesAndMm(await cell.innerText()));
    const turns = page.getByTestId(`${end}-adjuster`);
    if (await turns.count()) onScreen.turns.push((await turns.innerText()).trim());
  }
  onScreen.torques = (await page.getByTestId('torque').allInnerTexts()).map((t) => t.trim());
  expect(onScreen.preloads.length).toBeGreaterThan(0);
  expect(onScreen.turns.some((t) => /turns from fully out/.test(t))).toBe(true);
  expect(onScreen.torques.length).toBeGreaterThan(0);

  const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Download PDF' }).click()]);
  expect(download.suggestedFilename()).toMatch(/^setup-sheet-.*\.pdf$/);
  const parser = new PDFParse({ data: new Uint8Array(await readFile((await download.path())!)) });
  const text = (await parser.getText()).text.replace(/\s+/g, ' ');
  await parser.destroy();
  // The PDF prints mm first with inches beside them; the page showed the same two figures the other way round.
  for (const p of onScreen.preloads) expect(text, `the PDF's preload ${p.mm} mm`).toContain(`${p.mm} mm (${p.inches} in)`);
  for (const t of [...onScreen.turns, ...onScreen.torques]) expect(text, `the PDF shows "${t}"`).toContain(t.replace(/\s+/g, ' '));
});
