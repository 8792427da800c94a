import { createRouter, createWebHistory, type RouteLocationRaw, type RouteRecordRaw } from 'vue-router';
import type { Area } from '@shared/roles';
import AppShell from '../layouts/AppShell.vue';
import HomePage from '../pages/shop/HomePage.vue';
import { useSessionStore } from '../stores/session';

export const routeNames = [
  'home',
  'find-springs',
  'setup-sheet',
  'sag-check',
  'sign-in',
  'register',
  'forgot-password',
  'reset-password',
  'staff-home',
  'warehouse-home',
  'admin-users',
  'forbidden',
  'not-found',
] as const;
export type RouteName = (typeof routeNames)[number];

/** A typed link target, so a link cannot name a route that does not exist. */
export function to(name: RouteName, extra: Omit<Exclude<RouteLocationRaw, string>, 'name'> = {}): RouteLocationRaw {
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

const children: NamedRoute[] = [
  { path: '', name: 'home', component: HomePage, meta: { title: 'Springs for the way you ride' } },
  { path: 'find', name: 'find-springs', component: () => import('../pages/shop/FindSpringsPage.vue'), meta: { title: 'Find your springs' } },
  { path: 'setup-sheet', name: 'setup-sheet', component: () => import('../pages/shop/SetupSheetPage.vue'), meta: { title: 'Setup sheet' } },
  { path: 'sag-check', name: 'sag-check', component: () => import('../pages/shop/SagCheckPage.vue'), meta: { title: 'Check your sag' } },
  { path: 'sign-in', name: 'sign-in', component: () => import('../pages/account/SignInPage.vue'), meta: { guestOnly: true, title: 'Sign in' } },
  { path: 'register', name: 'register', component: () => import('../pages/account/RegisterPage.vue'), meta: { guestOnly: true, title: 'Create an account' } },
  { path: 'forgot-password', name: 'forgot-password', component: () => import('../pages/account/ForgotPasswordPage.vue'), meta: { title: 'Forgot password' } },
  { path: 'reset-password', name: 'reset-password', component: () => import('../pages/account/ResetPasswordPage.vue'), meta: { title: 'Choose a new password' } },
  { path: 'staff', name: 'staff-home', component: () => import('../pages/staff/StaffHomePage.vue'), meta: { area: 'staff', title: 'Back office' } },
  { path: 'warehouse', name: 'warehouse-home', component: () => import('../pages/warehouse/WarehouseHomePage.vue'), meta: { area: 'warehouse', title: 'Warehouse' } },
  { path: 'admin/users', name: 'admin-users', component: () => import('../pages/admin/UsersPage.vue'), meta: { area: 'admin', title: 'Accounts' } },
  { path: 'forbidden', name: 'forbidden', component: () => import('../pages/ForbiddenPage.vue'), meta: { title: 'Not for this account' } },
  { path: ':rest(.*)*', name: 'not-found', component: () => import('../pages/NotFoundPage.vue'), meta: { title: 'Page not found' } },
];

const routes: RouteRecordRaw[] = [{ path: '/', component: AppShell, children }];

export const router = createRouter({
  history: createWebHistory(),
  routes,
  scrollBehavior: () => ({ top: 0 }),
});

router.beforeEach(async (target) => {
  const session = useSessionStore();
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
