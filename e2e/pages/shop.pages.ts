import { expect, type Page } from '@playwright/test';
import { FindSpringsPage } from './find-springs.page';

/** The finder up to a set in the cart, for a demo bike and load. */
export async function addDemoSetToCart(page: Page) {
  const finder = new FindSpringsPage(page);
  await finder.open();
  await finder.chooseBike('Corvane', 'Strada 650', /2017–2020/);
  await finder.enterLoad({ riderKg: 85, gearKg: 8 });
  await finder.workOut();
  await expect(finder.candidates('Shock spring')).toBeVisible();
  await page.getByRole('button', { name: 'Add this set to the cart' }).click();
  await expect(page.getByText('The set is in your cart')).toBeVisible();
}

export class CheckoutPage {
  constructor(private readonly page: Page) {}

  async fill(a: { email: string; name: string; line1: string; postalCode: string; city: string }) {
    await this.page.getByLabel('E-mail').fill(a.email);
    await this.page.getByLabel('Name', { exact: true }).fill(a.name);
    await this.page.getByLabel('Street and number').fill(a.line1);
    await this.page.getByLabel('Postal code').fill(a.postalCode);
    await this.page.getByLabel('City').fill(a.city);
  }

  async continueToPayment() {
    await this.page.getByRole('button', { name: 'Continue to payment' }).click();
  }
}

/** The payment stand-in's page: a plain form, as a hosted payment page would be. */
export class PaymentStandinPage {
  constructor(private readonly page: Page) {}

  async pay(card: string) {
    await expect(this.page.getByRole('heading', { name: 'Pay for your order' })).toBeVisible();
    await this.page.getByLabel('Card number').fill(card);
    await this.page.getByRole('button', { name: /^Pay / }).click();
  }
}

export const guestAddress = { email: 'guest.buyer@example.test', name: 'Guest Buyer', line1: '9 Coil Road', postalCode: '10115', city: 'Eastbrook' };
