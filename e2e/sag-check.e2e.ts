import { expect, test } from './fixtures';
import { FindSpringsPage } from './pages/find-springs.page';
import { SagCheckPage } from './pages/sag-check.page';

test('a rider enters sag readings and is told, as they type, how much preload to add', async ({ page }) => {
  const sag = new SagCheckPage(page);
  await sag.open();
  await sag.fill('Static sag target', 25);
  await sag.fill('Rider sag target', 66);
  await sag.fill('Leverage ratio', 2);
  await sag.fill('Adjuster pitch', 1);
  await sag.fill('Fully extended', 600);
  await sag.fill('On its own weight', 575);
  await sag.fill('With you aboard', 524);
  // Rider sag 76 mm against 66 mm at a 2:1 ratio: (76 − 66)/2 = 5 mm more preload.
  await expect(sag.advice()).toContainText('Add 5 mm of preload');
  await sag.fill('With you aboard', 540);
  // Rider sag 60 mm: (60 − 66)/2 = −3 mm, so take preload away.
  await expect(sag.advice()).toContainText('Remove 3 mm of preload');
});

test('push-down and let-up readings are averaged', async ({ page }) => {
  const sag = new SagCheckPage(page);
  await sag.open();
  await page.getByLabel('I took push-down and let-up readings').check();
  await sag.fill('Static sag target', 25);
  await sag.fill('Rider sag target', 66);
  await sag.fill('Leverage ratio', 2);
  await sag.fill('Adjuster pitch', 1);
  await sag.fill('Fully extended', 600);
  await sag.fill('Own weight, pushed down', 572);
  await sag.fill('Own weight, let up', 578);
  await sag.fill('Aboard, pushed down', 530);
  await sag.fill('Aboard, let up', 538);
  // Averages 575 and 534: static 25 mm, rider 66 mm — on target.
  await expect(sag.advice()).toContainText('no change is needed');
});

test('for a bike chosen in the finder, the check is exact on its curved linkage, and a bike topped out on its own weight gets a warning instead of a spring verdict', async ({ page }) => {
  const finder = new FindSpringsPage(page);
  await finder.open();
  // A bike with a curved linkage, where only the wheel loads make the check exact.
  await finder.chooseBike('Haldris', 'Nomad 1200', /2018–2023$/);
  await finder.enterLoad({ riderKg: 85, gearKg: 8 });
  await finder.workOut();
  await expect(page.getByRole('link', { name: 'Already fitted? Check your sag' })).toBeVisible();
  await page.getByRole('link', { name: 'Already fitted? Check your sag' }).click();
  const sag = new SagCheckPage(page);
  await expect(page.getByText(/Using the figures of your Haldris Nomad 1200/)).toBeVisible();
  await sag.fill('Fully extended', 600);
  await sag.fill('On its own weight', 570);
  await sag.fill('With you aboard', 530);
  await expect(sag.advice()).toBeVisible();
  // The wheel loads come from the finder, so the curved linkage is checked exactly, not approximately.
  await expect(page.getByText('Approximate: measure again after the change.')).toHaveCount(0);
  await sag.fill('On its own weight', 600);
  await expect(page.getByTestId('sag-warning')).toContainText('topped out');
  await expect(page.getByTestId('sag-spring-verdict')).toContainText('Cannot judge yet');
});
