import { expect, test } from './fixtures';

test('an admin makes a warehouse account, which then signs in to the warehouse', async ({ page, signIn, browser }) => {
  await signIn('admin');
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Accounts' }).click();
  await expect(page.getByRole('heading', { name: 'Accounts' })).toBeVisible();
  await page.getByRole('button', { name: 'New account' }).click();
  const dialog = page.getByRole('dialog', { name: 'New account' });
  const email = `picker-${Date.now()}@example.test`;
  await dialog.getByLabel('Name').fill('Nell Ardwick');
  await dialog.getByLabel('E-mail').fill(email);
  await dialog.getByLabel('Role').click();
  await page.getByRole('option', { name: 'warehouse' }).click();
  await dialog.getByLabel('First password', { exact: true }).fill('short');
  await dialog.getByRole('button', { name: 'Create' }).click();
  await expect(dialog.getByText('A password has at least 10 characters.')).toBeVisible();
  await dialog.getByLabel('First password', { exact: true }).fill('warehouse-first-pw');
  await dialog.getByRole('button', { name: 'Create' }).click();
  await expect(page.getByRole('table', { name: 'Accounts' })).toContainText(email);

  // The new account signs in elsewhere and lands with the warehouse in its navigation.
  const other = await browser.newContext();
  const p2 = await other.newPage();
  await p2.goto('/sign-in');
  await p2.getByLabel('E-mail').fill(email);
  await p2.getByLabel('Password', { exact: true }).fill('warehouse-first-pw');
  await p2.getByRole('button', { name: 'Sign in' }).click();
  await expect(p2.getByTestId('signed-in-as')).toContainText('warehouse');
  await expect(p2.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Warehouse' })).toBeVisible();
  await other.close();
});

test('staff cannot open the accounts page', async ({ page, signIn }) => {
  await signIn('staff');
  await page.goto('/admin/users');
  await expect(page.getByRole('heading', { name: 'Not for this account' })).toBeVisible();
});
