import { expect, test } from './fixtures';
import { FindSpringsPage } from './pages/find-springs.page';
import { SagCheckPage } from './pages/sag-check.page';

const viewports = [
  { name: 'phone', width: 390, height: 844 },
  { name: 'desktop', width: 1440, height: 900 },
] as const;

const nicknamePrefix = 'Long-trip bike';

// The demo rider's bikes made here are removed after each test, even a failed one, so the seeded data stays as it was.
test.afterEach(async ({ page }) => {
  const res = await page.request.get('/api/bikes');
  if (!res.ok()) return;
  for (const b of ((await res.json()) as { items: { id: string; nickname: string }[] }).items) {
    if (b.nickname.startsWith(nicknamePrefix)) await page.request.delete(`/api/bikes/${b.id}`);
  }
});

test('a rider saves the bike from the finder, keeps a sag check in its history and reopens the finder from it', async ({ page, signIn }, testInfo) => {
  await signIn('rider');
  const nickname = `${nicknamePrefix} ${Date.now().toString(36)}`;
  const finder = new FindSpringsPage(page);
  await finder.open();
  await finder.chooseBike('Haldris', 'Nomad 1200', /2018–2023$/);
  await finder.enterLoad({ riderKg: 85, gearKg: 8 });
  await finder.workOut();
  await expect(finder.candidates('Shock spring')).toBeVisible();

  await page.getByLabel('Nickname', { exact: true }).fill(nickname);
  await page.getByRole('button', { name: 'Save this bike' }).click();
  await expect(page.getByText(`Saved as “${nickname}”`)).toBeVisible();

  await page.getByRole('link', { name: 'Already fitted? Check your sag' }).click();
  const sag = new SagCheckPage(page);
  await sag.fill('Fully extended', 600);
  await sag.fill('On its own weight', 570);
  await sag.fill('With you aboard', 530);
  await expect(sag.advice()).toBeVisible();
  const shownVerdict = (await page.getByTestId('sag-spring-verdict').innerText()).trim();
  await expect(page.getByLabel('Bike', { exact: true })).toContainText(nickname);
  await page.getByRole('button', { name: 'Save to my bike’s history' }).click();
  // The server works the check out again from the readings and the saved bike: it agrees with what the page showed.
  await expect(page.getByTestId('sag-saved')).toContainText(shownVerdict);
  await page.getByRole('link', { name: 'See the bike’s history' }).click();

  await expect(page.getByRole('heading', { level: 1, name: nickname })).toBeVisible();
  const rows = page.getByTestId('sag-history-row');
  await expect(rows).toHaveCount(1);
  await expect(rows.first()).toContainText('Rear');
  await expect(rows.first()).toContainText('600 mm · 570 mm · 530 mm');
  // Sag is the fully extended length less the loaded one (common practice): 600 − 570 = 30 mm, 600 − 530 = 70 mm.
  await expect(rows.first()).toContainText(/30 \(\d+\) · 70 \(\d+\) mm/);
  await expect(rows.first()).toContainText(shownVerdict);
  const bikeUrl = page.url();

  for (const v of viewports) {
    await page.setViewportSize({ width: v.width, height: v.height });
    for (const [what, url] of [['bike', bikeUrl], ['my-bikes', '/bikes']] as const) {
      await page.goto(url);
      await expect(page.getByRole('heading', { level: 1 })).toBeVisible();
      await expect(page.getByText(nickname).first()).toBeVisible();
      const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
      expect(overflow, `${what} at ${v.width} px is wider than the screen`).toBeLessThanOrEqual(0);
      const shot = await page.screenshot({ fullPage: true, path: testInfo.outputPath(`${what}-${v.width}x${v.height}.png`) });
      await testInfo.attach(`${what} ${v.width}×${v.height}`, { body: shot, contentType: 'image/png' });
    }
  }
  await page.setViewportSize({ width: 1440, height: 900 });

  // The list shows the bike as a card with its last check; its page reopens the finder with what was saved.
  await page.goto('/bikes');
  await page.getByRole('link', { name: nickname }).click();
  await page.getByRole('button', { name: 'Reopen in the finder' }).click();
  await expect(page).toHaveURL(/\/find$/);
  await expect(page.getByLabel('Rider', { exact: true })).toHaveValue('85');
  await expect(finder.candidates('Shock spring')).toBeVisible();
  await expect(page.getByRole('button', { name: `Update ${nickname}` })).toBeVisible();
});

test('a guest is invited to sign in to save the bike, and My bikes asks for a sign-in', async ({ page }) => {
  const finder = new FindSpringsPage(page);
  await finder.open();
  await finder.chooseBike('Haldris', 'Nomad 1200', /2018–2023$/);
  await finder.enterLoad({ riderKg: 85, gearKg: 8 });
  await finder.workOut();
  await expect(page.getByRole('region', { name: 'Keep this bike' }).getByRole('link', { name: 'Sign in' })).toBeVisible();
  await page.goto('/bikes');
  await expect(page).toHaveURL(/\/sign-in\?redirect=(%2F|\/)bikes$/);
});
