import type { APIRequestContext } from '@playwright/test';
import type { RecommendationDto, ShockRecommendationDto } from '../shared/catalogue';
import { expect, test } from './fixtures';
import { StaffFitmentCompatibility } from './pages/staff.pages';

/** The shock springs a guest rider of 80 kg in 8 kg of gear is offered for a bike, by product id. */
async function offeredShockSprings(request: APIRequestContext, fitmentId: string): Promise<string[]> {
  const res = await request.post('/api/recommendations', { data: { fitmentId, ridingStyle: 'road', rider: { massKg: 80, gearKg: 8 }, luggage: [] } });
  expect(res.status(), await res.text()).toBe(200);
  const shock = ((await res.json()) as RecommendationDto).shock as ShockRecommendationDto;
  return shock.candidates.map((c) => c.id);
}

test('staff rule a spring out for a bike, riders are no longer offered it, and following the rule again brings it back', async ({ page, request, signIn, catalogue }) => {
  await signIn('staff');
  // Our own bike and spring, made to fit by the rule (58 mm bore, 180–200 mm window), so the seeded catalogue is untouched.
  const fitment = await catalogue.createFitment({ shockSpringInnerDiameterMm: 58 });
  const spring = await catalogue.createSpring();
  expect(await offeredShockSprings(request, fitment.id)).toContain(spring.id);

  await page.goto(`/staff/fitments/${fitment.id}`);
  const compat = new StaffFitmentCompatibility(page);
  const row = compat.row('Shock', spring.sku);
  await expect(row.getByRole('cell').nth(2)).toContainText('Fits');
  await expect(row).toContainText('Follows the rule');

  await compat.decide(spring.sku, 'Force no fit', 'bottom mount too narrow on this variant');
  await expect(page.getByText('Fit decision saved')).toBeVisible();
  await expect(row).toContainText('Excluded by staff');
  await expect(row).toContainText('Forced not to fit');
  await expect(row).toContainText('bottom mount too narrow on this variant');
  expect(await offeredShockSprings(request, fitment.id)).not.toContain(spring.id);

  // The decision is the server's: it is still there after a reload.
  await page.reload();
  await expect(compat.row('Shock', spring.sku)).toContainText('Excluded by staff');

  // Narrowed to what riders are offered, the excluded spring leaves the table; every row left is offered.
  await compat.showOfferedOnly(true);
  await expect(compat.row('Shock', spring.sku)).toHaveCount(0);
  await expect(compat.section().getByText(/of \d+ shock springs shown|None of the \d+ shock springs is offered/)).toBeVisible();
  await expect(compat.table('Shock').getByRole('row').filter({ hasText: /Not offered|Excluded by staff/ })).toHaveCount(0);
  await compat.showOfferedOnly(false);
  await expect(compat.row('Shock', spring.sku)).toHaveCount(1);

  await compat.decide(spring.sku, 'Follow the rule');
  await expect(compat.row('Shock', spring.sku)).toContainText('Follows the rule');
  await expect(compat.row('Shock', spring.sku)).not.toContainText('Excluded by staff');
  expect(await offeredShockSprings(request, fitment.id)).toContain(spring.id);
});

test('staff give a spring the adapter kit it needs on a bike, and the rider’s recommendation carries it', async ({ page, request, signIn, catalogue }) => {
  await signIn('staff');
  const fitment = await catalogue.createFitment({ shockSpringInnerDiameterMm: 58 });
  // Made before the spring, so the clean-up removes the spring (and its adapter need) first.
  const adapter = await catalogue.createSpring({ kind: 'adapter', name: `E2E adapter ${Date.now()}`, sku: `E2E-ADP-${Date.now()}`, spring: undefined });
  const spring = await catalogue.createSpring();

  await page.goto(`/staff/fitments/${fitment.id}`);
  const compat = new StaffFitmentCompatibility(page);
  await compat.section().getByRole('button', { name: `Change the adapters of ${spring.sku}` }).click();
  const dialog = page.getByRole('dialog', { name: `Adapters on this bike: ${spring.sku}` });
  await dialog.getByRole('button', { name: 'Add an adapter' }).click();
  // Saving without a choice names the field that needs one.
  await dialog.getByRole('button', { name: 'Save adapters' }).click();
  await expect(dialog.getByText('Choose an adapter kit.')).toBeVisible();
  await dialog.getByRole('combobox', { name: 'Adapter 1' }).click();
  await page.getByRole('option', { name: new RegExp(adapter.sku) }).click();
  await dialog.getByLabel('Quantity of adapter 1').fill('2');
  await dialog.getByRole('button', { name: 'Save adapters' }).click();
  await expect(dialog).toBeHidden();
  await expect(compat.row('Shock', spring.sku)).toContainText(`2 × ${adapter.name}`);

  const res = await request.post('/api/recommendations', { data: { fitmentId: fitment.id, ridingStyle: 'road', rider: { massKg: 80, gearKg: 8 }, luggage: [] } });
  const offered = (((await res.json()) as RecommendationDto).shock as ShockRecommendationDto).candidates.find((c) => c.id === spring.id);
  expect(offered?.adapters).toMatchObject([{ id: adapter.id, quantity: 2 }]);
});
