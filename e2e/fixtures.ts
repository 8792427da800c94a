import { test as base, expect, type Page } from '@playwright/test';
import { SignInPage } from './pages/sign-in.page';

export const demoPassword = 'loadline-demo';
export const demo = {
  rider: 'rider@demo.test',
  staff: 'staff@demo.test',
  warehouse: 'warehouse@demo.test',
  admin: 'admin@demo.test',
} as const;
export type DemoRole = keyof typeof demo;

type Fixtures = { signIn: (role: DemoRole) => Promise<Page> };

export const test = base.extend<Fixtures>({
  signIn: async ({ page }, use) => {
    await use(async (role) => {
      const signIn = new SignInPage(page);
      await signIn.open();
      await signIn.signIn(demo[role], demoPassword);
      await expect(page.getByTestId('signed-in-as')).toContainText(role);
      return page;
    });
  },
});
export { expect };
