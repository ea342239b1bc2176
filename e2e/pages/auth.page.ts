import { expect, type Page } from '@playwright/test';

/** Sign-up, sign-in and sign-out through the app's forms. */
export class AuthPage {
  constructor(private readonly page: Page) {}

  async signUp(user: { name: string; email: string; password: string; role: 'designer' | 'quilter' }, next?: string): Promise<void> {
    await this.page.goto(next ? `/sign-up?next=${encodeURIComponent(next)}` : '/sign-up');
    await this.page.getByLabel('Your name').fill(user.name);
    await this.page.getByLabel('E-mail').fill(user.email);
    await this.page.getByLabel('Password', { exact: true }).fill(user.password);
    await this.page.getByLabel('Password again').fill(user.password);
    await this.page.getByRole('radio', { name: user.role === 'designer' ? /design patterns/ : /sew patterns/ }).check();
    await this.page.getByRole('button', { name: 'Create account' }).click();
  }

  async signIn(email: string, password: string): Promise<void> {
    await this.page.goto('/sign-in');
    await this.page.getByLabel('E-mail').fill(email);
    await this.page.getByLabel('Password').fill(password);
    await this.page.getByRole('button', { name: 'Sign in' }).click();
    await expect(this.page.getByRole('button', { name: 'Account menu' })).toBeVisible();
  }

  async signOut(): Promise<void> {
    await this.page.getByRole('button', { name: 'Account menu' }).click();
    await this.page.getByRole('menuitem', { name: 'Sign out' }).click();
    await expect(this.page.getByRole('heading', { name: 'Sign in' })).toBeVisible();
  }
}
