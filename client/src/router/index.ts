import { createRouter, createWebHistory, type LocationQueryRaw, type RouteLocationNormalized, type RouteLocationRaw, type RouteParamsRaw, type RouteRecordRaw } from 'vue-router';
import type { Area } from '@shared/roles';
import AppShell from '../layouts/AppShell.vue';
import HomePage from '../pages/shop/HomePage.vue';
import { useSessionStore } from '../stores/session';

export const routeNames = [
  'home',
  'find-springs',
  'products',
  'product',
  'setup-sheet',
  'sag-check',
  'cart',
  'checkout',
  'checkout-done',
  'my-orders',
  'order',
  'order-setup-sheet',
  'my-bikes',
  'bike',
  'exchange-request',
  'my-exchanges',
  'sign-in',
  'register',
  'forgot-password',
  'reset-password',
  'staff-home',
  'staff-fitments',
  'staff-fitment-new',
  'staff-fitment-edit',
  'staff-fitment-import',
  'staff-products',
  'staff-product-new',
  'staff-product-edit',
  'staff-stock',
  'staff-audit',
  'staff-orders',
  'staff-order',
  'staff-dashboard',
  'staff-exchanges',
  'warehouse-home',
  'warehouse-order',
  'warehouse-returns',
  'warehouse-receive',
  'admin-users',
  'admin-dev-mail',
  'admin-shop-settings',
  'forbidden',
  'not-found',
] as const;
export type RouteName = (typeof routeNames)[number];

/** A typed link target, so a link cannot name a route that does not exist. */
export function to(name: RouteName, extra: { params?: RouteParamsRaw; query?: LocationQueryRaw; hash?: string; replace?: boolean } = {}): RouteLocationRaw {
  return { ...extra, name } as RouteLocationRaw;
}

declare module 'vue-router' {
  interface RouteMeta {
    area?: Area;
    guestOnly?: boolean;
    title?: string;
  }
}

type NamedRoute = RouteRecordRaw & { name: RouteName };

// A named page, or a nameless layout whose children are named pages.
const children: (NamedRoute | (RouteRecordRaw & { children: NamedRoute[] }))[] = [
  { path: '', name: 'home', component: HomePage, meta: { title: 'Springs for the way you ride' } },
  { path: 'find', name: 'find-springs', component: () => import('../pages/shop/FindSpringsPage.vue'), meta: { title: 'Find your springs' } },
  { path: 'parts', name: 'products', component: () => import('../pages/shop/ProductsPage.vue'), meta: { title: 'Springs & parts' } },
  { path: 'parts/:id', name: 'product', component: () => import('../pages/shop/ProductPage.vue'), props: true, meta: { title: 'Product' } },
  { path: 'setup-sheet', name: 'setup-sheet', component: () => import('../pages/shop/SetupSheetPage.vue'), meta: { title: 'Setup sheet' } },
  { path: 'sag-check', name: 'sag-check', component: () => import('../pages/shop/SagCheckPage.vue'), meta: { title: 'Check your sag' } },
  { path: 'cart', name: 'cart', component: () => import('../pages/shop/CartPage.vue'), meta: { title: 'Your cart' } },
  { path: 'checkout', name: 'checkout', component: () => import('../pages/shop/CheckoutPage.vue'), meta: { title: 'Check out' } },
  { path: 'checkout/done', name: 'checkout-done', component: () => import('../pages/shop/CheckoutDonePage.vue'), meta: { title: 'Your order' } },
  { path: 'orders', name: 'my-orders', component: () => import('../pages/account/MyOrdersPage.vue'), meta: { area: 'account', title: 'My orders' } },
  // Open to guests too: the order's link carries its token.
  { path: 'orders/:id', name: 'order', component: () => import('../pages/account/OrderPage.vue'), props: true, meta: { title: 'Order' } },
  { path: 'orders/:id/setup-sheet', name: 'order-setup-sheet', component: () => import('../pages/account/OrderSetupSheetPage.vue'), props: true, meta: { title: 'Setup sheet' } },
  { path: 'bikes', name: 'my-bikes', component: () => import('../pages/account/MyBikesPage.vue'), meta: { area: 'account', title: 'My bikes' } },
  { path: 'bikes/:id', name: 'bike', component: () => import('../pages/account/BikePage.vue'), props: true, meta: { area: 'account', title: 'My bike' } },
  { path: 'orders/:id/exchange', name: 'exchange-request', component: () => import('../pages/account/ExchangeRequestPage.vue'), props: true, meta: { area: 'account', title: 'Exchange or return' } },
  { path: 'exchanges', name: 'my-exchanges', component: () => import('../pages/account/MyExchangesPage.vue'), meta: { area: 'account', title: 'My exchanges' } },
  { path: 'sign-in', name: 'sign-in', component: () => import('../pages/account/SignInPage.vue'), meta: { guestOnly: true, title: 'Sign in' } },
  { path: 'register', name: 'register', component: () => import('../pages/account/RegisterPage.vue'), meta: { guestOnly: true, title: 'Create an account' } },
  { path: 'forgot-password', name: 'forgot-password', component: () => import('../pages/account/ForgotPasswordPage.vue'), meta: { title: 'Forgot password' } },
  { path: 'reset-password', name: 'reset-password', component: () => import('../pages/account/ResetPasswordPage.vue'), meta: { title: 'Choose a new password' } },
  // The back office is one lazy chunk behind its own layout, so a rider's first page never carries its tables and editors.
  {
    path: 'staff',
    component: () => import('../layouts/StaffLayout.vue'),
    meta: { area: 'staff' },
    children: [
      { path: '', name: 'staff-home', component: () => import('../pages/staff/StaffHomePage.vue'), meta: { title: 'Back office' } },
      { path: 'fitments', name: 'staff-fitments', component: () => import('../pages/staff/StaffFitmentsPage.vue'), meta: { title: 'Fitments' } },
      { path: 'fitments/new', name: 'staff-fitment-new', component: () => import('../pages/staff/StaffFitmentEditPage.vue'), meta: { title: 'New fitment' } },
      { path: 'fitments/import', name: 'staff-fitment-import', component: () => import('../pages/staff/StaffFitmentImportPage.vue'), meta: { title: 'Import fitments' } },
      { path: 'fitments/:id', name: 'staff-fitment-edit', component: () => import('../pages/staff/StaffFitmentEditPage.vue'), props: true, meta: { title: 'Edit fitment' } },
      { path: 'products', name: 'staff-products', component: () => import('../pages/staff/StaffProductsPage.vue'), meta: { title: 'Products' } },
      { path: 'products/new', name: 'staff-product-new', component: () => import('../pages/staff/StaffProductEditPage.vue'), meta: { title: 'New product' } },
      { path: 'products/:id', name: 'staff-product-edit', component: () => import('../pages/staff/StaffProductEditPage.vue'), props: true, meta: { title: 'Edit product' } },
      { path: 'stock', name: 'staff-stock', component: () => import('../pages/staff/StaffStockPage.vue'), meta: { title: 'Stock' } },
      { path: 'orders', name: 'staff-orders', component: () => import('../pages/staff/StaffOrdersPage.vue'), meta: { title: 'Orders' } },
      { path: 'orders/:id', name: 'staff-order', component: () => import('../pages/staff/StaffOrderPage.vue'), props: true, meta: { title: 'Order' } },
      { path: 'dashboard', name: 'staff-dashboard', component: () => import('../pages/staff/StaffDashboardPage.vue'), meta: { title: 'Dashboard' } },
      { path: 'exchanges', name: 'staff-exchanges', component: () => import('../pages/staff/StaffExchangesPage.vue'), meta: { title: 'Exchanges' } },
      { path: 'audit', name: 'staff-audit', component: () => import('../pages/staff/StaffAuditPage.vue'), meta: { title: 'Audit log' } },
    ] satisfies NamedRoute[],
  },
  { path: 'warehouse', name: 'warehouse-home', component: () => import('../pages/warehouse/WarehouseHomePage.vue'), meta: { area: 'warehouse', title: 'Warehouse' } },
  { path: 'warehouse/deliveries', name: 'warehouse-receive', component: () => import('../pages/warehouse/WarehouseReceivePage.vue'), meta: { area: 'warehouse', title: 'Receive a delivery' } },
  { path: 'warehouse/orders/:id', name: 'warehouse-order', component: () => import('../pages/warehouse/WarehouseOrderPage.vue'), props: true, meta: { area: 'warehouse', title: 'Pick list' } },
  { path: 'warehouse/returns', name: 'warehouse-returns', component: () => import('../pages/warehouse/WarehouseReturnsPage.vue'), meta: { area: 'warehouse', title: 'Returned springs' } },
  { path: 'admin/users', name: 'admin-users', component: () => import('../pages/admin/UsersPage.vue'), meta: { area: 'admin', title: 'Accounts' } },
  { path: 'admin/settings', name: 'admin-shop-settings', component: () => import('../pages/admin/ShopSettingsPage.vue'), meta: { area: 'admin', title: 'Shop settings' } },
  { path: 'admin/dev-mail', name: 'admin-dev-mail', component: () => import('../pages/admin/DevMailboxPage.vue'), meta: { area: 'admin', title: 'Development mailbox' } },
  { path: 'forbidden', name: 'forbidden', component: () => import('../pages/ForbiddenPage.vue'), meta: { title: 'Not for this account' } },
  { path: ':rest(.*)*', name: 'not-found', component: () => import('../pages/NotFoundPage.vue'), meta: { title: 'Page not found' } },
];

const routes: RouteRecordRaw[] = [{ path: '/', component: AppShell, children }];

export const router = createRouter({
  history: createWebHistory(),
  routes,
  scrollBehavior: () => ({ top: 0 }),
});

/** Starts fetching a public page's lazy chunks, so they download while the session is read rather than after. */
function startLoading(target: RouteLocationNormalized): void {
  if (target.matched.some((r) => r.meta.area)) return;
  for (const record of target.matched) {
    const view = record.components?.default;
    // vue-router's own test: a lazy view is a function that is not a functional or class component. Its failure is the router's to report.
    if (typeof view === 'function' && !('displayName' in view) && !('props' in view) && !('__vccOpts' in view)) (view as () => Promise<unknown>)().catch(() => undefined);
  }
}

router.beforeEach(async (target) => {
  const session = useSessionStore();
  startLoading(target);
  await session.restore();
  if (target.meta.guestOnly && session.user) return to('home');
  const area = target.meta.area;
  if (area && !session.may(area)) {
    if (!session.user) return to('sign-in', { query: { redirect: target.fullPath } });
    return to('forbidden', { query: { from: target.fullPath } });
  }
  return true;
});

router.afterEach((target) => {
  document.title = target.meta.title ? `${target.meta.title} · Loadline` : 'Loadline';
});
