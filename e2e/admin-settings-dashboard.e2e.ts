import { expect, test } from './fixtures';

const shots = process.env.SCREENSHOT_DIR;

test('an admin changes the exchange window: a missing figure is named before saving, the saved one shows in the audit log', async ({ page, signIn }) => {
  await signIn('admin');
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Settings' }).click();
  await expect(page.getByRole('heading', { name: 'Shop settings' })).toBeVisible();
  const form = page.getByRole('form', { name: 'Shop settings' });
  await expect(form.getByLabel('Shop name')).not.toHaveValue('');
  if (shots) {
    await page.setViewportSize({ width: 1440, height: 900 });
    await page.screenshot({ path: `${shots}/settings-1440.png`, fullPage: true });
    await page.setViewportSize({ width: 768, height: 1024 });
    await page.screenshot({ path: `${shots}/settings-768.png`, fullPage: true });
  }
  const window = form.getByLabel('Exchange window (days)');
  await window.fill('');
  await window.blur();
  await form.getByRole('button', { name: 'Save settings' }).click();
  await expect(form.getByText('Enter exchange window (days).')).toBeVisible();
  await window.fill('21');
  await window.blur();
  await form.getByRole('button', { name: 'Save settings' }).click();
  await expect(page.getByText('Settings saved')).toBeVisible();

  await page.goto('/staff/audit');
  const row = page.getByRole('row').filter({ hasText: 'Shop settings' }).first();
  await row.getByRole('button').click();
  const diff = page.getByRole('table', { name: 'Changes to Shop settings' });
  await expect(diff.getByRole('row').filter({ hasText: 'exchangeWindowDays' })).toContainText('21');
  // Put the window back, so a later run starts from the seeded figures.
  await page.goto('/admin/settings');
  await page.getByRole('form', { name: 'Shop settings' }).getByLabel('Exchange window (days)').fill('30');
  await page.getByRole('button', { name: 'Save settings' }).click();
  await expect(page.getByText('Settings saved')).toBeVisible();
});

test('staff see the dashboard with each chart’s figures in a table beside it, over a range they choose', async ({ page, signIn }) => {
  await signIn('staff');
  await page.goto('/staff');
  await page.getByRole('navigation', { name: 'Back office' }).getByRole('link', { name: 'Dashboard' }).click();
  await expect(page.getByRole('heading', { name: 'Dashboard' })).toBeVisible();
  for (const name of ['Orders and revenue per day', 'Springs sold most', 'Recommendations that ended in a purchase', 'Open exchanges and returns by reason', 'Low stock']) {
    await expect(page.getByRole('table', { name })).toBeVisible();
  }
  await expect(page.getByRole('img', { name: 'Orders and revenue per day' })).toBeVisible();
  if (shots) {
    await page.setViewportSize({ width: 1440, height: 900 });
    await page.screenshot({ path: `${shots}/dashboard-1440.png`, fullPage: true });
    await page.setViewportSize({ width: 768, height: 1024 });
    await page.screenshot({ path: `${shots}/dashboard-768.png`, fullPage: true });
  }
  await page.getByRole('textbox', { name: 'From', exact: true }).fill('2026-03-10');
  await page.getByRole('textbox', { name: 'To', exact: true }).fill('2026-03-01');
  await page.getByRole('button', { name: 'Show' }).click();
  await expect(page.getByText('The end day is on or after the start day.')).toBeVisible();
});

test('an admin changes an account’s role from the accounts table', async ({ page, signIn }) => {
  await signIn('admin');
  const email = `counter-${Date.now()}@example.test`;
  const made = await page.request.post('/api/admin/users', { data: { email, displayName: 'Ivo Castrell', password: 'counter-first-pw', role: 'staff' } });
  expect(made.status()).toBe(201);
  await page.goto('/admin/users');
  await page.getByLabel(`Role of ${email}`).click();
  await page.getByRole('option', { name: 'warehouse' }).click();
  await expect.poll(async () => ((await (await page.request.get('/api/admin/users')).json()) as { items: { email: string; role: string }[] }).items.find((u) => u.email === email)?.role).toBe('warehouse');
});
