import type { Page } from '@playwright/test';

export class SignInPage {
  constructor(private readonly page: Page) {}

  async open() {
    await this.page.goto('/sign-in');
  }

  async signIn(email: string, password: string) {
    await this.page.getByLabel('E-mail').fill(email);
    await this.page.getByLabel('Password', { exact: true }).fill(password);
    await this.page.getByRole('button', { name: 'Sign in' }).click();
  }
}

/** A new rider's registration form. */
export class RegisterPage {
  constructor(private readonly page: Page) {}

  async register(a: { name: string; email: string; password: string }) {
    await this.page.getByLabel('Your name').fill(a.name);
    await this.page.getByLabel('E-mail').fill(a.email);
    await this.page.getByLabel('Password', { exact: true }).fill(a.password);
    await this.page.getByRole('button', { name: 'Create account' }).click();
  }
}
