import type { Locator, Page } from '@playwright/test';
import { expect, test } from './fixtures';
import { guestAddress } from './pages/shop.pages';

// Only the keys a keyboard user has: Tab, Shift+Tab, Enter, Space, arrows, Escape and typing. No clicks.

const focused = (target: Locator) => target.evaluate((el) => el === document.activeElement || el.contains(document.activeElement)).catch(() => false);

/** Presses Tab (or Shift+Tab) until the target holds the focus, as a person would; fails when it cannot be reached. */
async function tabTo(page: Page, target: Locator, { back = false, max = 120 } = {}): Promise<void> {
  await expect(target).toBeVisible();
  for (let i = 0; i < max; i++) {
    if (await focused(target)) return;
    await page.keyboard.press(back ? 'Shift+Tab' : 'Tab');
  }
  throw new Error(`${target} cannot be reached with ${back ? 'Shift+Tab' : 'Tab'}`);
}

/** The focused control shows it: an outline or a ring, not only a colour change a person may miss. */
async function expectFocusShown(page: Page) {
  const ring = await page.evaluate(() => {
    const el = document.activeElement as HTMLElement;
    const cs = getComputedStyle(el);
    return { outline: cs.outlineStyle !== 'none' && parseFloat(cs.outlineWidth) > 0, shadow: cs.boxShadow !== 'none', what: el.outerHTML.slice(0, 120) };
  });
  expect(ring.outline || ring.shadow, `focus is visible on ${ring.what}`).toBe(true);
}

/** Opens a select list with the keyboard and picks the option typed. */
async function chooseByKeyboard(page: Page, select: Locator, typed: string, option: RegExp) {
  await tabTo(page, select);
  await page.keyboard.press('Enter');
  await expect(page.getByRole('listbox')).toBeVisible();
  await page.keyboard.type(typed);
  const wanted = page.getByRole('option', { name: option }).first();
  // Arrow keys move through the list to the option wanted.
  for (let i = 0; i < 20 && !(await wanted.evaluate((el) => el.getAttribute('data-p-focused') === 'true' || el.classList.contains('p-focus')).catch(() => false)); i++) {
    await page.keyboard.press('ArrowDown');
  }
  await page.keyboard.press('Enter');
  await expect(page.getByRole('listbox')).toBeHidden();
  await expect(select).toContainText(option);
}

test('a rider finds springs, fills the cart, changes a quantity and reaches the payment page with the keyboard alone', async ({ page }) => {
  test.setTimeout(150_000);
  await page.setViewportSize({ width: 1280, height: 900 });
  await page.goto('/find');
  await expect(page.getByRole('heading', { name: 'Find your springs', level: 1 })).toBeVisible();

  // The first Tab reaches the skip link; Enter takes the focus past the header to the page.
  await page.keyboard.press('Tab');
  await expect(page.getByRole('link', { name: 'Skip to main content' })).toBeFocused();
  await expectFocusShown(page);
  await page.keyboard.press('Enter');
  await expect(page.getByRole('main')).toBeFocused();

  await chooseByKeyboard(page, page.getByLabel('Make', { exact: true }), 'Corvane', /^Corvane$/);
  await chooseByKeyboard(page, page.getByLabel('Model', { exact: true }), 'Ridgeline', /^Ridgeline 800$/);
  await chooseByKeyboard(page, page.getByLabel('Years and version', { exact: true }), '2019', /2019–2022/);

  await tabTo(page, page.getByLabel('Rider', { exact: true }));
  await page.keyboard.type('95');
  await tabTo(page, page.getByLabel('Riding gear'));
  await page.keyboard.type('8');
  await tabTo(page, page.getByLabel('Panniers (both together)'));
  await page.keyboard.type('20');
  // Enter in the form works the springs out and takes the focus to the answer.
  await page.keyboard.press('Enter');
  await expect(page.getByRole('heading', { name: '3 · Springs for this load' })).toBeFocused();
  await expect(page.getByRole('table', { name: 'Shock spring: candidates' })).toBeVisible();

  // The set goes to the cart; the drawer takes the focus, keeps it inside, and gives it back on Escape.
  const addSet = page.getByRole('button', { name: 'Add this set to the cart' });
  await tabTo(page, addSet, { max: 200 });
  await expectFocusShown(page);
  await page.keyboard.press('Enter');
  const drawer = page.getByRole('dialog', { name: 'Your cart' });
  await expect(drawer).toBeVisible();
  await expect.poll(() => focused(drawer)).toBe(true);
  for (let i = 0; i < 12; i++) {
    await page.keyboard.press('Tab');
    expect(await focused(drawer), 'Tab stays inside the open cart').toBe(true);
  }
  await page.keyboard.press('Escape');
  await expect(drawer).toBeHidden();
  await expect(addSet).toBeFocused();

  // Back up to the header's cart button, open it, and go on to the cart page.
  await tabTo(page, page.getByRole('button', { name: /^Cart, \d+ items$/ }), { back: true, max: 250 });
  await expectFocusShown(page);
  await page.keyboard.press('Enter');
  await expect(drawer).toBeVisible();
  await tabTo(page, drawer.getByRole('button', { name: 'View cart' }), { max: 20 });
  await page.keyboard.press('Enter');
  await expect(page.getByRole('heading', { name: 'Your cart', level: 1 })).toBeVisible();

  // One more shock spring, with Space on its button; the focus stays on it.
  const main = page.getByRole('main');
  const more = main.getByRole('button', { name: /^One more Shock spring/ }).first();
  const shockName = ((await more.getAttribute('aria-label')) ?? '').replace(/^One more /, '');
  const quantity = main.getByLabel(`Quantity of ${shockName}`).first();
  await expect(quantity).toHaveText('1');
  await tabTo(page, more);
  await expectFocusShown(page);
  await page.keyboard.press('Space');
  await expect(quantity).toHaveText('2');
  await expect(more).toBeFocused();

  await tabTo(page, main.getByRole('link', { name: 'Check out' }));
  await expectFocusShown(page);
  await page.keyboard.press('Enter');
  await expect(page.getByRole('heading', { name: 'Check out', level: 1 })).toBeVisible();

  // Sent empty, the form takes the focus to the first field to mend.
  await tabTo(page, page.getByRole('button', { name: 'Continue to payment' }));
  await page.keyboard.press('Enter');
  await expect(page.getByLabel('E-mail', { exact: true })).toBeFocused();
  await expect(page.getByLabel('E-mail', { exact: true })).toHaveAttribute('aria-invalid', 'true');

  // The address typed field by field.
  for (const [label, value] of [
    ['E-mail', `keys-${Date.now()}@example.test`],
    ['Name', guestAddress.name],
    ['Street and number', guestAddress.line1],
    ['Postal code', guestAddress.postalCode],
    ['City', guestAddress.city],
  ] as const) {
    await tabTo(page, page.getByLabel(label, { exact: true }));
    await page.keyboard.type(value);
  }
  await tabTo(page, page.getByRole('button', { name: 'Continue to payment' }));
  await expectFocusShown(page);
  await page.keyboard.press('Enter');
  await expect(page.getByRole('heading', { name: 'Pay for your order' })).toBeVisible({ timeout: 20_000 });
  // Paying is shop-checkout.e2e.ts's journey: here the rider goes back to the shop from the payment page.
  await tabTo(page, page.getByRole('link', { name: 'Cancel and go back to the shop' }), { max: 20 });
  await page.keyboard.press('Enter');
  await expect(page.getByText('You left the payment page without paying.')).toBeVisible({ timeout: 20_000 });
  // Tidy-up, not part of the journey: the unpaid order is cancelled so its stock hold ends now and the demo data stays as it was.
  const back = new URL(page.url());
  const cancelled = await page.request.post(`/api/orders/${back.searchParams.get('order')}/cancel?token=${encodeURIComponent(back.searchParams.get('token') ?? '')}`);
  expect(cancelled.ok()).toBe(true);
});

test('at phone width the header folds its links behind a menu button that opens, closes on Escape and gives the focus back', async ({ page }, testInfo) => {
  await page.setViewportSize({ width: 390, height: 844 });
  await page.goto('/');
  const banner = page.getByRole('banner');
  const menu = banner.getByRole('button', { name: 'Menu' });
  const nav = page.getByRole('navigation', { name: 'Main' });
  await expect(menu).toHaveAttribute('aria-expanded', 'false');
  await expect(nav).toBeHidden();
  // Closed, the header is one line: brand, menu and cart.
  expect((await banner.boundingBox())!.height).toBeLessThan(80);
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);

  await tabTo(page, menu);
  await expectFocusShown(page);
  await page.keyboard.press('Enter');
  await expect(menu).toHaveAttribute('aria-expanded', 'true');
  await expect(nav.getByRole('link', { name: 'Find springs' })).toBeVisible();
  await expect(banner.getByRole('link', { name: 'Sign in' })).toBeVisible();
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
  await testInfo.attach('header menu open 390×844', { body: await page.screenshot({ animations: 'disabled' }), contentType: 'image/png' });
  // The next Tab goes into the menu just opened.
  await page.keyboard.press('Tab');
  expect(await focused(nav)).toBe(true);
  await page.keyboard.press('Escape');
  await expect(menu).toHaveAttribute('aria-expanded', 'false');
  await expect(nav).toBeHidden();
  await expect(menu).toBeFocused();

  // A link followed from the menu closes it.
  await page.keyboard.press('Space');
  await expect(nav).toBeVisible();
  await tabTo(page, nav.getByRole('link', { name: 'Springs & parts' }));
  await page.keyboard.press('Enter');
  await expect(page.getByRole('heading', { name: 'Springs & parts', level: 1 })).toBeVisible();
  await expect(menu).toHaveAttribute('aria-expanded', 'false');
  await expect(nav).toBeHidden();

  // At desktop width there is no menu button; the links stand in the header as before.
  await page.setViewportSize({ width: 1440, height: 900 });
  await expect(menu).toBeHidden();
  await expect(nav.getByRole('link', { name: 'Find springs' })).toBeVisible();
});
