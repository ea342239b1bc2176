import { expect, type Page } from '@playwright/test';
import { sampleBlock } from '../../tests/fixtures/documents';

/** The two looks of the app. */
export type Theme = 'light' | 'dark';
/** Who is looking. */
export type Viewer = 'signed out' | 'designer' | 'quilter';

/** A main screen: where it is and what shows once it has loaded. */
export interface Screen {
  name: string;
  path: string;
  /** Whether the screen is the drafting board (exempt from the reflow check: a two-dimensional drawing). */
  board?: boolean;
}

/** The main screens each viewer can reach; `{id}` is a pattern of the viewer (designers only). */
export const SCREENS: Record<Viewer, Screen[]> = {
  'signed out': [
    { name: 'home', path: '/' },
    { name: 'sign in', path: '/sign-in' },
    { name: 'sign up', path: '/sign-up' },
    { name: 'reset password', path: '/reset-password' },
    { name: 'scale check', path: '/scale-check' },
    { name: 'not found', path: '/no-such-page' },
  ],
  designer: [
    { name: 'patterns', path: '/patterns' },
    { name: 'board', path: '/patterns/{id}/board', board: true },
    { name: 'cutting list', path: '/patterns/{id}/cutting' },
    { name: 'print', path: '/patterns/{id}/print' },
    { name: 'quilt', path: '/patterns/{id}/quilt' },
    { name: 'sewing log', path: '/patterns/{id}/sewing-log' },
    { name: 'history', path: '/patterns/{id}/history' },
    { name: 'share', path: '/patterns/{id}/share' },
    { name: 'shop', path: '/shop' },
    { name: 'purchases', path: '/shop/purchases' },
    { name: 'sales', path: '/shop/sales' },
    { name: 'publish', path: '/shop/publish' },
    { name: 'change password', path: '/account/password' },
    { name: 'scale check', path: '/scale-check' },
  ],
  quilter: [
    { name: 'patterns', path: '/patterns' },
    { name: 'shop', path: '/shop' },
    { name: 'purchases', path: '/shop/purchases' },
    { name: 'change password', path: '/account/password' },
    { name: 'scale check', path: '/scale-check' },
  ],
};

/** Creates an account through the sign-up form and waits until the app shows it signed in. */
export async function signUpAs(page: Page, role: 'designer' | 'quilter', tag: string): Promise<void> {
  const run = `${Date.now().toString(36)}-${Math.floor(Math.random() * 1e6).toString(36)}`;
  await page.goto('/sign-up');
  await page.getByLabel('Your name').fill(`${role === 'designer' ? 'Dora' : 'Quin'} ${tag}`);
  await page.getByLabel('E-mail').fill(`${role}-${tag}-${run}@example.test`);
  await page.getByLabel('Password', { exact: true }).fill('seen-by-everyone-7');
  await page.getByLabel('Password again').fill('seen-by-everyone-7');
  await page.getByRole('radio', { name: role === 'designer' ? /design patterns/ : /sew patterns/ }).check();
  await page.getByRole('button', { name: 'Create account' }).click();
  await expect(page.getByRole('button', { name: 'Account menu' })).toBeVisible();
}

/** Creates the 8 in. sample block (two sections, A and B) as the signed-in user; returns its id. */
export async function createSamplePattern(page: Page, title: string): Promise<string> {
  const { csrfToken } = (await (await page.request.get('/api/auth/csrf')).json()) as { csrfToken: string };
  const res = await page.request.post('/api/patterns', { data: { document: sampleBlock(title, 8) }, headers: { 'x-csrf-token': csrfToken } });
  expect(res.status()).toBe(201);
  return ((await res.json()) as { pattern: { id: string } }).pattern.id;
}

/** Picks the theme the app starts in (the app keeps the choice in local storage). */
export async function useTheme(page: Page, theme: Theme): Promise<void> {
  await page.evaluate((t) => localStorage.setItem('sw-theme', t), theme);
}

/** Opens a screen and waits until it has loaded: its heading shown, no loading bar, no preview being planned. */
export async function openScreen(page: Page, screen: Screen, patternId = ''): Promise<void> {
  await page.goto(screen.path.replace('{id}', patternId));
  // Generous waits: the machine running the suite may be busy; these are states, not pauses.
  await expect(page.locator('main h1').first()).toBeVisible({ timeout: 30_000 });
  await expect(page.locator('mat-progress-bar[mode=indeterminate]')).toHaveCount(0, { timeout: 30_000 });
  await expect(page.locator('[aria-busy=true]')).toHaveCount(0, { timeout: 30_000 });
  if (screen.board) {
    await expect(page.getByRole('application', { name: 'Drafting board' }).locator('canvas').first()).toBeVisible({ timeout: 30_000 });
    await expect(page.getByRole('tree', { name: 'Sections' })).toBeVisible();
  }
  const theme = await page.evaluate(() => (document.documentElement.classList.contains('sw-dark') ? 'dark' : 'light'));
  await expect(page.getByRole('button', { name: theme === 'dark' ? 'Use light theme' : 'Use dark theme' })).toBeVisible();
}
