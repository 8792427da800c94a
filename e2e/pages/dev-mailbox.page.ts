import { expect, type Locator, type Page } from '@playwright/test';

/** The admin's development mailbox: what the local mail stand-in caught. */
export class DevMailboxPage {
  constructor(private readonly page: Page) {}

  async openFromAccounts() {
    await this.page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Accounts' }).click();
    await this.page.getByRole('link', { name: 'development mailbox' }).click();
    await expect(this.page.getByRole('heading', { name: 'Development mailbox' })).toBeVisible();
  }

  /**
   * The mail worker sends within a few seconds, longer on a loaded machine: ask the mail stand-in (through the signed-in
   * admin's API) until the mail is caught, then refresh the page until it lists it. Give `containing` (a tracking
   * number, a one-off address) where an earlier run's mail may carry the same subject: the newest match, listed first, is then this one.
   */
  async waitForMail(subject: string, to: string, containing?: string): Promise<Locator> {
    await expect
      .poll(
        async () => {
          const res = await this.page.request.get('/api/dev/mail');
          if (!res.ok()) return 0;
          const mails = (await res.json()) as { to: string; subject: string; text: string }[];
          const ours = mails.filter((m) => m.subject.includes(subject) && m.to.includes(to));
          // Newest first: the first match must be the mail this journey caused.
          return containing === undefined ? ours.length : Number(ours[0]?.text.includes(containing) ?? false);
        },
        { message: `the mail "${subject}" to ${to} reaches the mail stand-in`, timeout: 60_000, intervals: [500, 1_000, 2_000] },
      )
      .toBeGreaterThan(0);
    const item = this.page.getByRole('navigation', { name: 'Captured mail' }).getByRole('button').filter({ hasText: subject }).filter({ hasText: to });
    await expect(async () => {
      await this.page.getByRole('button', { name: 'Refresh' }).click();
      await expect(item.first()).toBeVisible({ timeout: 1000 });
    }).toPass({ timeout: 20_000 });
    if (containing === undefined) await expect(item).toHaveCount(1);
    return item.first();
  }

  mail(subject: string): Locator {
    return this.page.getByRole('article', { name: subject });
  }

  async showText() {
    await this.page.getByRole('tab', { name: 'Text part' }).click();
  }
}
