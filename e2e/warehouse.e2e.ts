import { mkdirSync } from 'node:fs';
import type { Page } from '@playwright/test';
import type { WarehouseQueueDto } from '../shared/warehouse/fulfilment.dto';
import { DevMailboxPage } from './pages/dev-mailbox.page';
import { SignInPage } from './pages/sign-in.page';
import { demo, demoPassword, expect, test } from './fixtures';

const shots = 'test-results/screenshots';
async function shoot(page: Page, name: string) {
  mkdirSync(shots, { recursive: true });
  for (const [w, h] of [[390, 844], [1440, 900]] as const) {
    await page.setViewportSize({ width: w, height: h });
    await page.screenshot({ path: `${shots}/${name}-${w}x${h}.png`, fullPage: true });
  }
}

test('the warehouse picks, packs and ships a paid demo order with a tracking number; the rider sees it shipped and the mail is caught', async ({ page, browser, signIn }) => {
  test.setTimeout(120_000);
  await signIn('warehouse');
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Warehouse' }).click();
  await expect(page.getByRole('heading', { name: 'Orders to pick' })).toBeVisible();
  // The oldest paid demo order still waiting to be picked (the seed places two for the demo rider).
  const queue = (await (await page.request.get('/api/warehouse/orders')).json()) as WarehouseQueueDto;
  const order = queue.items.find((o) => o.fulfilmentStatus === 'unfulfilled' && o.customerName === 'Mira Quenby')!;
  expect(order, 'a paid demo order waits in the queue').toBeTruthy();
  await expect(page.getByTestId('count-unfulfilled')).toContainText(String(queue.counts.unfulfilled));
  await shoot(page, 'warehouse-queue');

  await page.getByRole('link', { name: `Order ${order.number}` }).click();
  await expect(page.getByRole('heading', { name: `Pick list · order ${order.number}` })).toBeVisible();
  const lines = page.getByRole('list', { name: 'Lines to pick' }).getByRole('listitem');
  await expect(lines.first().getByRole('img', { name: /^Barcode / })).toBeVisible();
  await shoot(page, 'warehouse-pick-list');
  // Printed, the list keeps bins, SKUs, quantities and codes and drops the controls and the site's frame.
  await page.emulateMedia({ media: 'print' });
  await page.screenshot({ path: `${shots}/warehouse-pick-list-print.png`, fullPage: true });
  await expect(page.getByLabel('Scan or type a SKU')).toBeHidden();
  await expect(page.getByRole('navigation', { name: 'Main' })).toBeHidden();
  await page.emulateMedia({ media: 'screen' });
  await page.setViewportSize({ width: 390, height: 844 });

  // One unit by scanning its code (a scanner types it and presses Enter), the rest by ticking each line.
  const firstSku = (await lines.first().locator('.pick__sku').innerText()).trim();
  await page.getByLabel('Scan or type a SKU').fill(firstSku);
  await page.getByLabel('Scan or type a SKU').press('Enter');
  await expect(page.getByText(`Picked one ${firstSku}.`)).toBeVisible();
  await page.getByLabel('Scan or type a SKU').fill('LL-NOT-ON-THIS-ORDER');
  await page.getByRole('button', { name: 'Pick', exact: true }).click();
  await expect(page.getByRole('alert').filter({ hasText: 'LL-NOT-ON-THIS-ORDER is not on this order.' })).toBeVisible();
  for (const box of await page.getByRole('checkbox', { name: /^Picked / }).all()) {
    if (!(await box.isChecked())) {
      await box.check();
      await expect(box).toBeChecked();
    }
  }
  await page.getByRole('button', { name: 'Mark packed' }).click();
  await expect(page.getByText('Packed.', { exact: true })).toBeVisible();

  const tracking = `PC${Date.now()}`;
  await page.getByRole('button', { name: 'Ship', exact: true }).click();
  const dialog = page.getByRole('dialog', { name: `Ship order ${order.number}` });
  await dialog.getByLabel('Carrier').fill('Parcel Co');
  await dialog.getByLabel('Tracking number').fill(tracking);
  await dialog.getByRole('button', { name: 'Ship and mail the rider' }).click();
  await expect(page.getByText('Shipped; the rider has been mailed the tracking number.')).toBeVisible();
  await expect(page.getByRole('region', { name: 'Parcels sent' })).toContainText(tracking);

  // The rider sees the parcel on their order.
  const riderContext = await browser.newContext();
  const rider = await riderContext.newPage();
  const signInPage = new SignInPage(rider);
  await signInPage.open();
  await signInPage.signIn(demo.rider, demoPassword);
  await expect(rider.getByTestId('signed-in-as')).toContainText('rider');
  await rider.goto(`/orders/${order.id}`);
  await expect(rider.getByTestId('order-states')).toContainText('Shipped');
  await expect(rider.getByTestId('order-parcels')).toContainText(`Parcel Co, tracking number ${tracking}`);
  await riderContext.close();

  // The warehouse marks it delivered once the carrier says so.
  page.once('dialog', (d) => void d.accept());
  await page.getByRole('button', { name: 'Mark delivered' }).click();
  await expect(page.getByText('Marked as delivered.')).toBeVisible();

  // The shipped mail reached the mail stand-in.
  await page.setViewportSize({ width: 1440, height: 900 });
  await page.getByRole('button', { name: 'Sign out' }).click();
  await expect(page.getByRole('link', { name: 'Sign in' })).toBeVisible();
  await signIn('admin');
  const mailbox = new DevMailboxPage(page);
  await mailbox.openFromAccounts();
  await (await mailbox.waitForMail(`Order ${order.number} is on its way`, demo.rider, tracking)).click();
  await mailbox.showText();
  await expect(mailbox.mail(`Order ${order.number} is on its way`).getByTestId('mail-text')).toContainText(`Carrier: Parcel Co, tracking number ${tracking}.`);
});

