import { DevMailboxPage } from './pages/dev-mailbox.page';
import { expect, test } from './fixtures';

test('a rider asks for a password reset; the admin finds the mail in the development mailbox and its link works', async ({ page, browser, signIn }) => {
  // Two people, a queued mail and a password change: longer than one page's journey, more so on a busy machine.
  test.setTimeout(120_000);
  // A rider of this run only, so the mail found is the one this journey caused.
  const email = `reset-${Date.now()}@example.test`;
  const rider = await browser.newContext({ baseURL: test.info().project.use.baseURL });
  const riderPage = await rider.newPage();
  await riderPage.goto('/register');
  await riderPage.getByLabel('Your name').fill('Vessa Thornquill');
  await riderPage.getByLabel('E-mail').fill(email);
  await riderPage.getByLabel('Password', { exact: true }).fill('first-password-123');
  await riderPage.getByRole('button', { name: 'Create account' }).click();
  await expect(riderPage.getByTestId('signed-in-as')).toContainText('Vessa Thornquill');
  await riderPage.getByRole('button', { name: 'Sign out' }).click();
  // Sign-out is a request; leaving the page before it answers would keep the rider signed in.
  await expect(riderPage.getByRole('banner').getByRole('link', { name: 'Sign in' })).toBeVisible();

  await riderPage.goto('/forgot-password');
  await riderPage.getByLabel('E-mail').fill(email);
  await riderPage.getByRole('button', { name: 'Send reset link' }).click();
  await expect(riderPage.getByText('If an account uses this e-mail, a reset link is on its way.')).toBeVisible();

  await signIn('admin');
  const mailbox = new DevMailboxPage(page);
  await mailbox.openFromAccounts();
  const subject = 'Choose a new password for Loadline';
  await (await mailbox.waitForMail(subject, email)).click();

  const mail = mailbox.mail(subject);
  await expect(mail.getByText(email)).toBeVisible();
  await expect(mail.getByTestId('mail-html').getByText('Hello Vessa Thornquill')).toBeVisible();
  const link = mail.getByTestId('mail-html').getByRole('link', { name: 'Choose a new password' });
  const href = await link.getAttribute('href');
  expect(href).toMatch(/\/reset-password\?token=[\w-]+$/);
  await mailbox.showText();
  await expect(mail.getByTestId('mail-text')).toContainText(`Choose a new password: ${href}`);

  // The rider follows the mailed link and signs in with the new password.
  await riderPage.goto(href!);
  await riderPage.getByLabel('New password', { exact: true }).fill('second-password-456');
  await riderPage.getByRole('button', { name: 'Set password' }).click();
  await expect(riderPage.getByText('Your password is changed.')).toBeVisible();
  await riderPage.getByRole('main').getByRole('link', { name: 'Sign in' }).click();
  await riderPage.getByLabel('E-mail').fill(email);
  await riderPage.getByLabel('Password', { exact: true }).fill('second-password-456');
  await riderPage.getByRole('button', { name: 'Sign in' }).click();
  await expect(riderPage.getByTestId('signed-in-as')).toContainText('Vessa Thornquill');
  await rider.close();
});
