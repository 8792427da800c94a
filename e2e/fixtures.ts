import { test as base, expect, type APIRequestContext, type Page } from '@playwright/test';
import type { FitmentDto, FitmentInputDto, ProductInputDto, StaffProductDto } from '../shared/catalogue';
import { SignInPage } from './pages/sign-in.page';
import { e2eFitment, e2eSpring } from './support/catalogue-data';

export const demoPassword = 'loadline-demo';
export const demo = {
  rider: 'rider@demo.test',
  staff: 'staff@demo.test',
  warehouse: 'warehouse@demo.test',
  admin: 'admin@demo.test',
} as const;
export type DemoRole = keyof typeof demo;

/** Records a test makes through the staff API; each is deleted after the test so the seeded data stays as it was. */
export interface Catalogue {
  createFitment: (overrides?: Partial<FitmentInputDto>) => Promise<FitmentDto>;
  createSpring: (overrides?: Partial<ProductInputDto>) => Promise<StaffProductDto>;
  /** A record the UI made, to be deleted after the test too. */
  forget: (kind: 'fitment' | 'product', id: string) => void;
}

type Fixtures = { signIn: (role: DemoRole) => Promise<Page>; catalogue: Catalogue; noPolicyViolations: void };

async function ok<T>(what: string, res: Awaited<ReturnType<APIRequestContext['post']>>): Promise<T> {
  if (!res.ok()) throw new Error(`${what}: ${res.status()} ${await res.text()}`);
  return (await res.json()) as T;
}

export const test = base.extend<Fixtures>({
  // Every journey doubles as a check of the Content-Security-Policy: the browser reports each refusal on the console.
  noPolicyViolations: [
    async ({ page }, use) => {
      const refused: string[] = [];
      page.on('console', (msg) => {
        if (msg.type() === 'error' && /Content Security Policy/i.test(msg.text())) refused.push(msg.text());
      });
      await use();
      expect(refused, 'the page broke its Content-Security-Policy').toEqual([]);
    },
    { auto: true },
  ],
  signIn: async ({ page }, use) => {
    await use(async (role) => {
      const signIn = new SignInPage(page);
      await signIn.open();
      await signIn.signIn(demo[role], demoPassword);
      await expect(page.getByTestId('signed-in-as')).toContainText(role);
      return page;
    });
  },
  // Uses the page's own request context, so it acts with whoever signed in (staff) and shares the cookie.
  catalogue: async ({ page }, use) => {
    const made: { kind: 'fitment' | 'product'; id: string }[] = [];
    const api = page.request;
    await use({
      createFitment: async (overrides) => {
        const f = await ok<FitmentDto>('create fitment', await api.post('/api/staff/fitments', { data: e2eFitment(overrides) }));
        made.push({ kind: 'fitment', id: f.id });
        return f;
      },
      createSpring: async (overrides) => {
        const p = await ok<StaffProductDto>('create spring', await api.post('/api/staff/products', { data: e2eSpring(overrides) }));
        made.push({ kind: 'product', id: p.id });
        return p;
      },
      forget: (kind, id) => made.push({ kind, id }),
    });
    for (const m of made.reverse()) {
      await api.delete(`/api/staff/${m.kind === 'fitment' ? 'fitments' : 'products'}/${m.id}`);
    }
  },
});
export { expect };
