import type { BrowserContext, Locator, Page } from '@playwright/test';
import { expect, test, type DemoRole } from './fixtures';
import { FindSpringsPage } from './pages/find-springs.page';
import { SagCheckPage } from './pages/sag-check.page';
import { attachScreenshot, desktop, expectNoSeriousAxeViolations, expectNoSidewaysScroll, expectVerdictsInWords, phone, resize, tablet } from './support/page-checks';
import { readRouteTable, routeOf } from './support/route-table';
import { emptyCart, fillCart, signedInContext, tourBike, tourData, tourNickname, type TourData } from './support/tour-data';

type Role = DemoRole | 'guest';
interface Stop {
  /** The router's name for the page the stop lands on. */
  route: string;
  url: (d: TourData) => string;
  heading: string | RegExp | ((d: TourData) => string | RegExp);
  /** What shows once the page's data is in (and anything a person does on it first). */
  ready?: (page: Page, d: TourData) => Promise<unknown>;
  /** How many verdict chips the page shows at least. */
  verdicts?: number;
  /** The page swaps its layout between phone and desktop (tables become cards), so axe reads it at both widths. */
  bothLayouts?: boolean;
}

const main = (page: Page) => page.getByRole('main');
const firstRow = (page: Page): Locator => main(page).locator('tbody tr').first();
const visible = (l: Locator) => expect(l.first()).toBeVisible();

// Riders, guests and the warehouse use phones: their pages are checked at 390 px; staff and admins from 768 px.
const narrowFor: Record<Role, typeof phone | typeof tablet> = { guest: phone, rider: phone, warehouse: phone, staff: tablet, admin: tablet };

const tour: Record<Role, Stop[]> = {
  guest: [
    { route: 'home', url: () => '/', heading: 'Springs for the way you ride' },
    {
      route: 'find-springs',
      url: () => '/find',
      heading: 'Find your springs',
      ready: async (page) => {
        const finder = new FindSpringsPage(page);
        await finder.chooseBike(tourBike.make, tourBike.model, tourBike.years);
        await finder.enterLoad({ riderKg: 95, gearKg: 8 });
        await finder.workOut();
        await visible(finder.candidates('Shock spring'));
        await visible(finder.candidates('Fork springs'));
      },
      verdicts: 2,
      bothLayouts: true,
    },
    {
      // Reached as a rider would: from the finder's answer for the bike, so the check knows its figures.
      route: 'sag-check',
      url: () => '/find',
      heading: 'Find your springs',
      ready: async (page) => {
        const finder = new FindSpringsPage(page);
        await finder.chooseBike(tourBike.make, tourBike.model, tourBike.years);
        await finder.enterLoad({ riderKg: 95, gearKg: 8 });
        await finder.workOut();
        await page.getByRole('link', { name: 'Already fitted? Check your sag' }).click();
        await expect(page.getByRole('heading', { level: 1, name: 'Check your sag' })).toBeVisible();
        const sag = new SagCheckPage(page);
        await sag.fill('Fully extended', 600);
        await sag.fill('On its own weight', 575);
        await sag.fill('With you aboard', 520);
        await visible(sag.advice());
        await visible(page.getByTestId('sag-spring-verdict'));
      },
      verdicts: 1,
    },
    { route: 'products', url: () => '/parts', heading: 'Springs & parts', ready: (page) => visible(main(page).getByText(/N\/mm/)) },
    { route: 'product', url: (d) => `/parts/${d.shockId}`, heading: (d) => d.shockName, ready: (page) => visible(main(page).getByText(/lbf\/in/)) },
    {
      route: 'cart',
      url: () => '/cart',
      heading: 'Your cart',
      // The guest's cart holds the set the finder chose.
      ready: (page, d) => visible(main(page).getByText(d.shockName)),
    },
    { route: 'checkout', url: () => '/checkout', heading: 'Check out', ready: (page) => visible(page.getByLabel('Street and number')) },
    { route: 'sign-in', url: () => '/sign-in', heading: 'Sign in', ready: (page) => visible(page.getByLabel('Password', { exact: true })) },
    { route: 'register', url: () => '/register', heading: 'Create an account', ready: (page) => visible(page.getByLabel('E-mail')) },
    { route: 'forgot-password', url: () => '/forgot-password', heading: 'Forgot your password?', ready: (page) => visible(page.getByLabel('E-mail')) },
    { route: 'reset-password', url: () => '/reset-password?token=tour-link-token', heading: 'Choose a new password' },
    { route: 'not-found', url: () => '/no-such-page-on-the-tour', heading: 'Page not found' },
  ],
  rider: [
    { route: 'my-bikes', url: () => '/bikes', heading: 'My bikes', ready: (page) => visible(main(page).getByText(tourNickname)), verdicts: 1 },
    { route: 'bike', url: (d) => `/bikes/${d.bikeId}`, heading: tourNickname, ready: (page) => visible(page.getByTestId('sag-history-row')), verdicts: 1, bothLayouts: true },
    { route: 'setup-sheet', url: (d) => `/setup-sheet?${d.setupSheetQuery}`, heading: 'Setup sheet', ready: (page) => visible(main(page).getByText(/N·m/)) },
    { route: 'my-orders', url: () => '/orders', heading: 'My orders', ready: (page, d) => visible(main(page).getByText(d.orderNumber)) },
    { route: 'order', url: (d) => `/orders/${d.orderId}`, heading: (d) => `Order ${d.orderNumber}`, ready: (page) => visible(page.getByTestId('order-parcels')) },
    { route: 'order-setup-sheet', url: (d) => `/orders/${d.orderId}/setup-sheet`, heading: (d) => `Setup sheet · order ${d.orderNumber}`, ready: (page) => visible(main(page).getByText(/N·m/)) },
    { route: 'checkout-done', url: (d) => `/checkout/done?order=${d.orderId}`, heading: 'Your order', ready: (page, d) => visible(main(page).getByText(d.orderNumber)) },
    {
      route: 'exchange-request',
      url: (d) => `/orders/${d.orderId}/exchange?line=${d.openLineId}`,
      heading: 'Exchange or return a spring',
      ready: (page) => visible(page.getByRole('heading', { name: 'The rate we propose' })),
      verdicts: 1,
    },
    { route: 'my-exchanges', url: () => '/exchanges', heading: 'My exchanges and returns', ready: (page, d) => visible(main(page).getByText(d.exchangeNumber)), verdicts: 1 },
    { route: 'cart', url: () => '/cart', heading: 'Your cart', ready: (page, d) => visible(main(page).getByText(d.shockName)) },
    { route: 'forbidden', url: () => '/staff', heading: 'Not for this account' },
  ],
  staff: [
    { route: 'staff-home', url: () => '/staff', heading: 'Back office', ready: (page) => visible(main(page).getByRole('heading', { level: 2 })) },
    { route: 'staff-fitments', url: () => '/staff/fitments', heading: 'Fitments', ready: (page) => visible(main(page).getByText(tourBike.model)) },
    { route: 'staff-fitment-new', url: () => '/staff/fitments/new', heading: 'New fitment', ready: (page) => visible(page.getByLabel('Make', { exact: true })) },
    {
      route: 'staff-fitment-edit',
      url: (d) => `/staff/fitments/${d.fitmentId}`,
      heading: /Meridian 700/,
      // The compatibility section lists the springs judged for this bike.
      ready: (page, d) => visible(main(page).getByText(d.shockName)),
    },
    { route: 'staff-fitment-import', url: () => '/staff/fitments/import', heading: 'Import fitments' },
    { route: 'staff-products', url: () => '/staff/products', heading: 'Products', ready: (page) => visible(firstRow(page)) },
    { route: 'staff-product-new', url: () => '/staff/products/new', heading: 'New product', ready: (page) => visible(page.getByLabel('SKU', { exact: true })) },
    { route: 'staff-product-edit', url: (d) => `/staff/products/${d.shockId}`, heading: (d) => new RegExp(d.shockName.replace(/[()]/g, '.')), ready: (page) => visible(page.getByLabel('SKU', { exact: true })) },
    { route: 'staff-stock', url: () => '/staff/stock', heading: 'Stock', ready: (page) => visible(firstRow(page)) },
    { route: 'staff-orders', url: () => '/staff/orders', heading: 'Orders', ready: (page, d) => visible(main(page).getByText(d.orderNumber)) },
    { route: 'staff-order', url: (d) => `/staff/orders/${d.orderId}`, heading: (d) => `Order ${d.orderNumber}`, ready: (page) => visible(page.getByRole('heading', { name: 'Refund' })) },
    {
      route: 'staff-exchanges',
      url: () => '/staff/exchanges',
      heading: 'Exchanges and returns',
      // The list opens on requests waiting for a decision; the tour's exchange is already approved.
      ready: async (page, d) => {
        await page.getByLabel('State').selectOption({ label: 'All' });
        await visible(main(page).getByText(d.exchangeNumber));
      },
      verdicts: 1,
    },
    { route: 'staff-dashboard', url: () => '/staff/dashboard', heading: 'Dashboard', ready: (page) => visible(page.getByRole('table', { name: 'Springs sold most' })) },
    { route: 'staff-audit', url: () => '/staff/audit', heading: 'Audit log', ready: (page) => visible(firstRow(page)) },
  ],
  warehouse: [
    { route: 'warehouse-home', url: () => '/warehouse', heading: 'Orders to pick', ready: (page) => visible(page.getByTestId('count-unfulfilled')) },
    {
      route: 'warehouse-order',
      url: (d) => `/warehouse/orders/${d.pickOrderId}`,
      heading: /^Pick list · order /,
      ready: (page) => visible(page.getByRole('list', { name: 'Lines to pick' }).getByRole('img', { name: /^Barcode / })),
    },
    { route: 'warehouse-returns', url: () => '/warehouse/returns', heading: 'Returned springs', ready: (page, d) => visible(main(page).getByText(d.exchangeNumber)) },
    { route: 'warehouse-receive', url: () => '/warehouse/deliveries', heading: 'Receive a delivery', ready: (page) => visible(page.getByRole('heading', { name: 'Running low' })) },
  ],
  admin: [
    { route: 'admin-users', url: () => '/admin/users', heading: 'Accounts', ready: (page) => visible(main(page).getByText('rider@demo.test')) },
    { route: 'admin-shop-settings', url: () => '/admin/settings', heading: 'Shop settings', ready: (page) => visible(page.getByRole('button', { name: /^Save/ })) },
    {
      route: 'admin-dev-mail',
      url: () => '/admin/dev-mail',
      heading: 'Development mailbox',
      // The outbox sends the tour's mails a moment after each step; a person would refresh until they show.
      ready: (page) => expect(async () => {
        await page.reload();
        await expect(page.getByRole('navigation', { name: 'Captured mail' }).getByRole('button').first()).toBeVisible({ timeout: 2_000 });
      }).toPass({ timeout: 20_000 }),
    },
  ],
};

const table = readRouteTable();

test('the page tour visits every page the router names, and only those', () => {
  const visited = Object.values(tour).flatMap((stops) => stops.map((s) => s.route));
  const missing = table.names.filter((n) => !visited.includes(n));
  expect(missing, 'pages with no visit in the tour').toEqual([]);
  expect(visited.filter((n) => !table.names.includes(n)), 'tour stops naming no route').toEqual([]);
  expect(table.names.filter((n) => !table.routes.some((r) => r.name === n)), 'route names without a route').toEqual([]);
});

test.describe('page tour', () => {
  // The tour's records are made once (or found from an earlier run) and every page reuses them; each role signs in once.
  let data: TourData;
  const contexts = new Map<Role, BrowserContext>();

  test.beforeAll(async ({ browser }, testInfo) => {
    testInfo.setTimeout(120_000);
    const baseURL = String(testInfo.project.use.baseURL);
    for (const role of ['guest', 'rider', 'staff', 'warehouse', 'admin'] as const) contexts.set(role, await signedInContext(browser, baseURL, role));
    const [rider, staff, warehouse] = (['rider', 'staff', 'warehouse'] as const).map((r) => contexts.get(r)!.request);
    data = await tourData(rider!, staff!, warehouse!);
    // The guest's and the rider's carts hold the tour's spring set.
    await fillCart(contexts.get('guest')!.request, data);
    await fillCart(rider!, data);
  });

  test.afterAll(async () => {
    if (contexts.has('rider')) await emptyCart(contexts.get('rider')!.request);
    for (const c of contexts.values()) await c.close();
  });

  for (const role of Object.keys(tour) as Role[]) {
    for (const stop of tour[role]) {
      test(`${role}: ${stop.route} passes axe, fits the screen and carries its verdicts in words`, async ({}, testInfo) => {
        // axe over a large editor takes tens of seconds when the machine is busy.
        test.setTimeout(120_000);
        const page = await contexts.get(role)!.newPage();
        const refused: string[] = [];
        page.on('console', (msg) => {
          if (msg.type() === 'error' && /Content Security Policy/i.test(msg.text())) refused.push(msg.text());
        });
        const narrow = narrowFor[role];
        await page.goto(stop.url(data));
        const heading = typeof stop.heading === 'function' ? stop.heading(data) : stop.heading;
        await expect(page.getByRole('heading', { level: 1, name: heading })).toBeVisible({ timeout: 15_000 });
        await stop.ready?.(page, data);
        expect(routeOf(table.routes, new URL(page.url()).pathname), `${page.url()} is the ${stop.route} page`).toBe(stop.route);
        const where = `${stop.route} (${role})`;
        if (stop.verdicts) await expectVerdictsInWords(page, where, stop.verdicts);

        // axe reads each page once, at the width its people use it (and at both where the layout swaps).
        if (narrow !== phone || stop.bothLayouts) await expectNoSeriousAxeViolations(page, `${where} at ${desktop.width} px`);
        await attachScreenshot(page, testInfo, `${role}-${stop.route}`, desktop);

        await resize(page, narrow);
        await expectNoSidewaysScroll(page, `${where} at ${narrow.width} px`);
        if (narrow === phone) {
          await expectNoSeriousAxeViolations(page, `${where} at ${phone.width} px`);
          if (stop.verdicts) await expectVerdictsInWords(page, `${where} at ${phone.width} px`, stop.verdicts);
        } else {
          await resize(page, phone);
        }
        await attachScreenshot(page, testInfo, `${role}-${stop.route}`, phone);
        expect(refused, 'the page broke its Content-Security-Policy').toEqual([]);
        await page.close();
      });
    }
  }
});
