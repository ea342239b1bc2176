import { expect, test, type Page } from '@playwright/test';
import { AuthPage } from './pages/auth.page';

/*
 * Changing the password from the account menu: a wrong current password is shown on its field and
 * keeps the user signed in; the right one changes it, another signed-in browser is signed out, and
 * only the new password signs in afterwards.
 */

const run = Date.now().toString(36);
const user = { name: 'Ada Account', email: `ada-${run}@example.test`, password: 'first-secret-phrase', role: 'quilter' as const };
const shot = (page: Page, name: string) => page.screenshot({ path: `e2e/artifacts/app-${name}.png`, fullPage: true });

test.use({ actionTimeout: 15_000, navigationTimeout: 20_000 });

test('changes the password from the account menu and signs out the other browser', async ({ browser }) => {
  const here = await (await browser.newContext({ viewport: { width: 1280, height: 860 } })).newPage();
  await new AuthPage(here).signUp(user);
  await expect(here.getByRole('button', { name: 'Account menu' })).toBeVisible();
  // A second browser signed in to the same account.
  const there = await (await browser.newContext()).newPage();
  await new AuthPage(there).signIn(user.email, user.password);

  await here.getByRole('button', { name: 'Account menu' }).click();
  await expect(here.getByRole('menuitem', { name: 'Change password' })).toBeVisible();
  await shot(here, 'account-menu');
  await here.getByRole('menuitem', { name: 'Change password' }).click();
  await expect(here.getByRole('heading', { name: 'Change your password' })).toBeVisible();

  await here.getByLabel('Current password').fill('not-the-password');
  await here.getByLabel('New password', { exact: true }).fill('second-secret-phrase');
  await here.getByLabel('New password again').fill('second-secret-phrase');
  await here.getByRole('button', { name: 'Change password' }).click();
  await expect(here.getByText('does not match')).toBeVisible();
  await expect(here).toHaveURL(/\/account\/password$/);
  await shot(here, 'change-password-wrong');

  await here.getByLabel('Current password').fill(user.password);
  await here.getByRole('button', { name: 'Change password' }).click();
  await expect(here.getByRole('status')).toContainText('Your password is changed');
  await shot(here, 'change-password-done');

  // The other browser's session ended: its next call sends it to sign-in.
  await there.goto('/patterns');
  await expect(there.getByRole('heading', { name: 'Sign in' })).toBeVisible();

  await new AuthPage(here).signOut();
  await here.getByLabel('E-mail').fill(user.email);
  await here.getByLabel('Password').fill(user.password);
  await here.getByRole('button', { name: 'Sign in' }).click();
  await expect(here.getByRole('alert')).toContainText('do not match an account');
  await new AuthPage(here).signIn(user.email, 'second-secret-phrase');
});
