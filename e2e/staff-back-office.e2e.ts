import { parse } from 'csv-parse/sync';
import { stringify } from 'csv-stringify/sync';
import type { Page as ListPage, FitmentSummaryDto, ProductDto } from '../shared/catalogue';
import { expect, test } from './fixtures';
import { StaffFitmentEditPage, StaffFitmentImportPage, StaffFitmentsPage, StaffProductEditPage } from './pages/staff.pages';
import { tinyPng } from './support/catalogue-data';

test.describe('staff keep the fitment table', () => {
  test('editing a fitment shows a refused value under its field, and saves once it is corrected', async ({ page, signIn, catalogue }) => {
    // A long journey through the form on a shared machine.
    test.slow();
    await signIn('staff');
    const fitment = await catalogue.createFitment();
    const list = new StaffFitmentsPage(page);
    await list.open();
    await list.search(fitment.model);
    await expect(list.table().getByRole('cell', { name: fitment.model, exact: true })).toBeVisible();
    await list.edit(fitment.model);

    const form = new StaffFitmentEditPage(page);
    await expect(page.getByRole('heading', { name: fitment.model, level: 1 })).toBeVisible();
    await expect(form.field('Wheelbase')).toHaveValue('1510');
    // 23 N·m is 16.96 ft·lbf (NIST SP 811: 1 ft·lbf = 1.355818 N·m), shown to one decimal.
    await expect(page.getByText(/^17\s?ft·lbf$/)).toBeVisible();

    // The browser's own check: a wheelbase outside the sane range.
    await form.field('Wheelbase').fill('2500');
    await form.save();
    await expect(await form.errorOf('Wheelbase')).toHaveText('Must be at most 2000 mm.');
    await form.field('Wheelbase').fill('1530');
    await expect(await form.errorOf('Wheelbase')).toHaveCount(0);

    // The shared check across fields (the form runs the server's rule): 190 mm of wheel travel at 2.5 : 1 asks 76 mm of the shock.
    await form.field('Shock stroke').fill('30');
    await form.save();
    await expect(await form.errorOf('Leverage ratio')).toHaveText(/moves the shock 76 mm, more than its 30 mm stroke/);
    // A stroke left a quarter unused is only worth a second look.
    await form.field('Shock stroke').fill('100');
    await expect(page.getByTestId('fitment-warnings')).toContainText('uses 76 of its 100 mm stroke');
    await expect(await form.errorOf('Leverage ratio')).toHaveCount(0);
    await expect(form.field('Rear static sag tolerance')).toHaveValue('3');
    await form.field('Shock stroke').fill('76');
    await expect(page.getByTestId('fitment-warnings')).toHaveCount(0);
    await form.save();
    await expect(page.getByText('Fitment saved')).toBeVisible();

    await page.reload();
    await expect(form.field('Wheelbase')).toHaveValue('1530');
    await expect(form.field('Shock stroke')).toHaveValue('76');
  });

  test('the fitment table downloads as CSV', async ({ page, signIn }) => {
    await signIn('staff');
    const list = new StaffFitmentsPage(page);
    await list.open();
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Export CSV' }).click()]);
    expect(download.suggestedFilename()).toMatch(/^fitments-\d{4}-\d{2}-\d{2}\.csv$/);
    const text = await (await download.createReadStream()).toArray();
    expect(Buffer.concat(text).toString('utf8').split('\n')[0]).toContain('wheelbaseMm');
  });

  test('a CSV with a bad row is refused with its line and column, and the fixed file imports', async ({ page, signIn, catalogue }) => {
    await signIn('staff');
    const source = await catalogue.createFitment();
    const exported = parse(await (await page.request.get('/api/staff/fitments/export.csv')).text()) as string[][];
    const header = exported[0]!;
    const col = (name: string) => header.indexOf(name);
    const row = exported.find((r) => r[col('model')] === source.model);
    expect(row, 'the exported file has the fitment the test made').toBeDefined();
    const model = `${source.model} imported`;
    const fileWith = (yearFrom: string) => {
      const copy = [...row!];
      copy[col('id')] = '';
      copy[col('model')] = model;
      copy[col('yearFrom')] = yearFrom;
      return stringify([header, copy]);
    };
    const findImported = async () =>
      (await (await page.request.get(`/api/staff/fitments?q=${encodeURIComponent(model)}`)).json()) as ListPage<FitmentSummaryDto>;

    const importer = new StaffFitmentImportPage(page);
    await importer.open();
    await importer.choose('fitments-bad.csv', fileWith('nineteen'));
    await expect(page.getByRole('heading', { name: 'Problems found' })).toBeVisible();
    const problem = importer.problems().getByRole('row').filter({ hasText: 'yearFrom' });
    await expect(problem).toHaveCount(1);
    await expect(problem.getByRole('cell').first()).toHaveText('2');
    await expect(page.getByRole('button', { name: /^Import \d+ rows?$/ })).toHaveCount(0);
    expect((await findImported()).total, 'a refused file writes nothing').toBe(0);

    await importer.choose('fitments-fixed.csv', fileWith('2018'));
    await expect(page.getByRole('heading', { name: 'Ready to import' })).toBeVisible();
    await expect(page.getByTestId('import-summary')).toContainText('1 new');
    await importer.commit();
    await expect(page.getByText(/Imported 1 row: 1 new/)).toBeVisible();

    const imported = await findImported();
    expect(imported.total).toBe(1);
    catalogue.forget('fitment', imported.items[0]!.id);
  });
});

test.describe('staff keep the catalogue', () => {
  test('editing a spring computes its rate as staff type, flags a disagreeing rate, and refuses a bad value until corrected', async ({ page, signIn, catalogue }) => {
    await signIn('staff');
    const spring = await catalogue.createSpring();
    const form = new StaffProductEditPage(page);
    await form.open(spring.id);
    const rate = form.geometry().getByTestId('computed-rate');
    await expect(rate).toHaveText(/^85\.11\s?N\/mm$/);
    await expect(form.geometry().getByTestId('rate-agrees')).toBeVisible();
    // Closed to solid: τ = K_B·8·F·D/(π·d³) ≈ 651 MPa against 65 % of Sut = 1974/12.5^0.108 MPa ≈ 977 (Shigley 10th ed. Tables 10-4, 10-6).
    await expect(form.geometry().getByTestId('solid-stress-ok')).toContainText('651');
    // 60 mm longer, the same coils close through 126 mm: about 1240 MPa, so it would take a set.
    await form.field('Free length').fill('250');
    await expect(form.geometry().getByTestId('solid-stress-flag')).toContainText('takes a set');
    await form.field('Free length').fill('190');
    await expect(form.geometry().getByTestId('solid-stress-flag')).toHaveCount(0);

    // Thicker wire: k grows with d⁴, so the stated 85 N/mm is now about 16 % soft of the geometry.
    await form.field('Wire diameter').fill('13');
    await expect(rate).toHaveText(/^101\.71\s?N\/mm$/);
    await expect(form.geometry().getByTestId('rate-flag')).toContainText('−16.4');

    await form.field('Wire diameter').fill('30');
    await form.save();
    await expect(await form.errorOf('Wire diameter')).toHaveText('Wire diameter is at most 25 mm.');

    await form.field('Wire diameter').fill('12.5');
    await expect(form.geometry().getByTestId('rate-flag')).toHaveCount(0);
    await form.field('Stated rate').fill('86');
    await form.save();
    await expect(page.getByText('Product saved')).toBeVisible();
    await page.reload();
    await expect(form.field('Stated rate')).toHaveValue('86');
    await expect(form.field('Wire diameter')).toHaveValue('12.5');
  });

  test('uploaded images show on the product, can be reordered and deleted', async ({ page, signIn, catalogue }) => {
    await signIn('staff');
    const spring = await catalogue.createSpring();
    const form = new StaffProductEditPage(page);
    await form.open(spring.id);

    await form.upload({ name: 'side.png', mimeType: 'image/png', buffer: tinyPng });
    await expect(form.images()).toHaveCount(1);
    const first = form.images().first();
    await expect(first).toHaveAttribute('alt', `${spring.name}, image 1`);
    await expect.poll(() => first.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth)).toBe(1);

    await form.upload({ name: 'top.png', mimeType: 'image/png', buffer: tinyPng });
    await expect(form.images()).toHaveCount(2);
    const secondSrc = await form.images().nth(1).getAttribute('src');
    await page.getByRole('button', { name: 'Move image 2 earlier' }).click();
    await expect(form.images().first()).toHaveAttribute('src', secondSrc!);

    await page.getByRole('button', { name: 'Delete image 2' }).click();
    await expect(form.images()).toHaveCount(1);
    await page.reload();
    await expect(form.images()).toHaveCount(1);
    await expect(form.images().first()).toHaveAttribute('src', secondSrc!);

    // Riders see the same image on the product.
    const shown = (await (await page.request.get(`/api/products/${spring.id}`)).json()) as ProductDto;
    expect(shown.images.map((i) => i.url)).toEqual([secondSrc]);
  });
});

test.describe('the back office is for staff only', () => {
  for (const role of ['rider', 'warehouse'] as const) {
    test(`a ${role} is shown "Not for this account" on back-office pages`, async ({ page, signIn }) => {
      await signIn(role);
      for (const path of ['/staff/fitments', '/staff/products/new', '/staff/fitments/import', '/staff/stock']) {
        await page.goto(path);
        await expect(page.getByRole('heading', { name: 'Not for this account' })).toBeVisible();
      }
      await expect(page.getByRole('navigation', { name: 'Back office' })).toHaveCount(0);
    });
  }

  test('a guest is sent to sign in and lands on the page asked for', async ({ page }) => {
    await page.goto('/staff/fitments/import');
    await expect(page.getByRole('heading', { name: 'Sign in' })).toBeVisible();
    await page.getByLabel('E-mail').fill('staff@demo.test');
    await page.getByLabel('Password', { exact: true }).fill('loadline-demo');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect(page.getByRole('heading', { name: 'Import fitments' })).toBeVisible();
  });
});
