import { request as apiRequest } from '@playwright/test';
import { demo, demoPassword, expect, test } from './fixtures';
import { addDemoSetToCart, CheckoutPage, guestAddress, PaymentStandinPage } from './pages/shop.pages';
import { SignInPage } from './pages/sign-in.page';

interface CapturedMail {
  to: string;
  subject: string;
  text: string;
  html: string;
}

/** What the mail stand-in caught, read as the admin through the dev mailbox. */
async function mailTo(baseURL: string, to: string): Promise<CapturedMail[]> {
  const admin = await apiRequest.newContext({ baseURL });
  await admin.post('/api/auth/login', { data: { email: demo.admin, password: demoPassword } });
  const mails = (await (await admin.get('/api/dev/mail')).json()) as CapturedMail[];
  await admin.dispose();
  return mails.filter((m) => m.to.includes(to));
}

test('a new rider finds springs for a demo bike, adds the set, checks out as a guest, pays with the test card, and gets the confirmation', async ({ page, baseURL }) => {
  const email = `guest-${Date.now()}@example.test`;
  await addDemoSetToCart(page);
  await page.getByRole('button', { name: 'Check out' }).click();

  const checkout = new CheckoutPage(page);
  await checkout.fill({ ...guestAddress, email });
  const total = await page.locator('#main').getByTestId('cart-total').textContent();
  const bought = (await (await page.request.get('/api/cart')).json()) as { lines: { sku: string; quantity: number }[]; sets: { setup: { preloadMm: number }[] }[] };
  await checkout.continueToPayment();

  await new PaymentStandinPage(page).pay('4242 4242 4242 4242');
  await expect(page.getByText('Thank you — your payment is in.')).toBeVisible({ timeout: 20_000 });
  await expect(page.getByTestId('order-states')).toContainText('Paid');
  await expect(page.getByTestId('cart-button')).toContainText('0');

  // The confirmation lists the lines, the totals and the setup figures kept with the order.
  await expect.poll(async () => (await mailTo(baseURL!, email)).length, { timeout: 20_000 }).toBe(1);
  const [mail] = await mailTo(baseURL!, email);
  expect(mail!.subject).toMatch(/^Order LL-\d+ is confirmed$/);
  expect(mail!.text).toContain(total!.replace(/\u00a0/g, ' ').trim());
  for (const line of bought.lines) expect(mail!.text).toContain(line.sku);
  expect(bought.sets[0]!.setup.length).toBeGreaterThan(0);
  expect(mail!.text).toMatch(/preload/i);
  expect(mail!.text).toMatch(/sag/i);

  await page.getByRole('link', { name: 'Open the order' }).click();
  await page.getByRole('link', { name: 'Open the setup sheet' }).click();
  await expect(page.getByRole('heading', { name: /Setup sheet · order LL-/ })).toBeVisible();
  await expect(page.getByText('Preload').first()).toBeVisible();

  // Before packing the buyer may cancel: the payment is refunded and the parts go back on the shelf.
  await page.goBack();
  page.once('dialog', (d) => void d.accept());
  await page.getByRole('button', { name: 'Cancel order' }).click();
  await expect(page.getByTestId('order-states')).toContainText('Cancelled');
  await expect(page.getByTestId('order-states')).toContainText('Refunded');
});

test('a declined card leaves the payment failed with a clear message, and the cart is kept', async ({ page }) => {
  await addDemoSetToCart(page);
  const count = (await page.getByTestId('cart-button').textContent())!.trim();
  await page.getByRole('button', { name: 'Check out' }).click();
  const checkout = new CheckoutPage(page);
  await checkout.fill({ ...guestAddress, email: `declined-${Date.now()}@example.test` });
  await checkout.continueToPayment();
  await new PaymentStandinPage(page).pay('4000 0000 0000 0002');
  await expect(page.getByRole('alert')).toContainText('Your card was declined');

  await page.getByRole('link', { name: 'Cancel and go back to the shop' }).click();
  await expect(page.getByTestId('payment-failed')).toContainText('Your payment did not go through', { timeout: 20_000 });
  await expect(page.getByTestId('payment-failed')).toContainText('your cart is kept');
  await expect(page.getByTestId('order-states')).toContainText('Payment failed');
  await expect(page.getByTestId('cart-button')).toContainText(count);

  // The buyer gives up on this order; its parts go back on the shelf at once rather than when the hold expires.
  const url = new URL(page.url());
  const cancelled = await page.request.post(`/api/orders/${url.searchParams.get('order')}/cancel?token=${url.searchParams.get('token')}`);
  expect(cancelled.status()).toBe(200);
});

test('the checkout form names each field that needs attention', async ({ page }) => {
  await addDemoSetToCart(page);
  await page.goto('/checkout');
  await new CheckoutPage(page).continueToPayment();
  await expect(page.locator('#co-email-error')).toBeVisible();
  await expect(page.locator('#co-line1-error')).toBeVisible();
  await expect(page.locator('#co-postal-error')).toBeVisible();
});

test('a guest cart joins the rider’s own cart on sign-in', async ({ page }) => {
  await addDemoSetToCart(page);
  await page.goto('/cart');
  await expect(page.locator('[data-testid^="cart-line-"]').first()).toBeVisible();
  const skus = await page.locator('[data-testid^="cart-line-"]').evaluateAll((els) => els.map((e) => e.getAttribute('data-testid')));
  expect(skus.length).toBeGreaterThan(0);
  const signIn = new SignInPage(page);
  await signIn.open();
  await signIn.signIn(demo.rider, demoPassword);
  await expect(page.getByTestId('signed-in-as')).toBeVisible();
  await page.goto('/cart');
  for (const sku of skus) await expect(page.getByTestId(sku!).first()).toBeVisible();
});

test('at phone width the cart and checkout fit the screen', async ({ page }) => {
  await page.setViewportSize({ width: 390, height: 844 });
  await addDemoSetToCart(page);
  await page.goto('/checkout');
  await expect(page.getByRole('button', { name: 'Continue to payment' })).toBeVisible();
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
  expect(overflow).toBeLessThanOrEqual(0);
});
