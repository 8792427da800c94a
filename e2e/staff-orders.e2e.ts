import { expect, test } from './fixtures';
import { PaymentStandinPage } from './pages/shop.pages';

test('staff find a paid order and refund one unit that came back; the order shows it partly refunded', async ({ page, signIn }) => {
  // A guest's paid order of two units of a demo product, bought through the API and paid on the stand-in's page.
  const products = (await (await page.request.get('/api/products?pageSize=50&inStock=true')).json()) as { items: { id: string; kind: string; name: string }[] };
  const item = products.items.find((p) => p.kind !== 'spring')!;
  await page.request.post('/api/cart/lines', { data: { productId: item.id, quantity: 2 } });
  const email = `staff-refund-${Date.now()}@example.test`;
  const placed = (await (await page.request.post('/api/checkout', {
    data: { email, shippingAddress: { name: 'Refund Buyer', line1: '3 Rebound Way', postalCode: '10115', city: 'Eastbrook', country: 'DE' } },
  })).json()) as { orderNumber: string; paymentUrl: string };
  await page.goto(placed.paymentUrl);
  await new PaymentStandinPage(page).pay('4242424242424242');
  await expect(page.getByText('Thank you — your payment is in.')).toBeVisible({ timeout: 20_000 });

  await signIn('staff');
  await page.goto('/staff/orders');
  await page.getByLabel('Search orders').fill(email);
  await page.getByRole('link', { name: placed.orderNumber }).click();
  await expect(page.getByRole('heading', { name: `Order ${placed.orderNumber}` })).toBeVisible();
  await page.getByLabel(`Refund how many of ${item.name}`).fill('1');
  await page.getByLabel(`${item.name} came back`).check();
  await page.getByLabel('Reason (the buyer sees it)').fill('One came back unused');
  await page.getByRole('button', { name: /Refund the chosen lines/ }).click();
  await expect(page.getByTestId('order-states')).toContainText('Partly refunded');
  await expect(page.getByText('1 refunded')).toBeVisible();
});
