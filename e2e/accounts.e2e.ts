import { expect, test } from './fixtures';

const nav = (page: import('@playwright/test').Page) => page.getByRole('navigation', { name: 'Main' });

test.describe('each role sees its own navigation', () => {
  const expected = {
    rider: { shows: ['Find springs'], hides: ['Back office', 'Warehouse', 'Accounts'] },
    staff: { shows: ['Find springs', 'Back office'], hides: ['Warehouse', 'Accounts'] },
    warehouse: { shows: ['Find springs', 'Warehouse'], hides: ['Back office', 'Accounts'] },
    admin: { shows: ['Find springs', 'Back office', 'Warehouse', 'Accounts'], hides: [] },
  } as const;

  for (const [role, { shows, hides }] of Object.entries(expected)) {
    test(`${role} signs in and sees what the role may use`, async ({ page, signIn }) => {
      await signIn(role as keyof typeof expected);
      for (const label of shows) await expect(nav(page).getByRole('link', { name: label })).toBeVisible();
      for (const label of hides) await expect(nav(page).getByRole('link', { name: label })).toHaveCount(0);
    });
  }
});

test('a rider is refused a staff page', async ({ page, signIn }) => {
  await signIn('rider');
  await page.goto('/staff');
  await expect(page.getByRole('heading', { name: 'Not for this account' })).toBeVisible();
});

test('a guest opening a staff page is sent to sign in, and comes back after', async ({ page }) => {
  await page.goto('/staff');
  await expect(page.getByRole('heading', { name: 'Sign in' })).toBeVisible();
  await page.getByLabel('E-mail').fill('staff@demo.test');
  await page.getByLabel('Password', { exact: true }).fill('loadline-demo');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('heading', { name: 'Back office' })).toBeVisible();
});

test('a wrong password shows a readable message', async ({ page }) => {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill('rider@demo.test');
  await page.getByLabel('Password', { exact: true }).fill('not-the-password');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByText('Wrong e-mail or password.')).toBeVisible();
});

test('registering shows field messages, then signs the new rider in', async ({ page }) => {
  await page.goto('/register');
  await page.getByLabel('Your name').fill('Pella Ranst');
  await page.getByLabel('E-mail').fill('not-an-email');
  await page.getByLabel('Password', { exact: true }).fill('short');
  await page.getByRole('button', { name: 'Create account' }).click();
  await expect(page.getByText('Enter a valid e-mail address.')).toBeVisible();
  await expect(page.getByText('A password has at least 10 characters.')).toBeVisible();
  await page.getByLabel('E-mail').fill(`pella-${Date.now()}@example.test`);
  await page.getByLabel('Password', { exact: true }).fill('long-enough-password');
  await page.getByRole('button', { name: 'Create account' }).click();
  await expect(page.getByTestId('signed-in-as')).toContainText('Pella Ranst');
});

test('an unknown address shows the not-found page', async ({ page }) => {
  await page.goto('/no/such/page');
  await expect(page.getByRole('heading', { name: 'Page not found' })).toBeVisible();
});
