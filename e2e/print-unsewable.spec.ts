import { expect, test } from '@playwright/test';
import { misnumberedStrip } from '../tests/fixtures/documents';
import { AuthPage } from './pages/auth.page';

/*
 * A section not sewable as numbered (issue 14): the print page says why and makes no print set until
 * "Print anyway" is ticked; then the set is made and every page of that section says so.
 */

const run = Date.now().toString(36);


test('a pattern not sewable as numbered prints only after "Print anyway"', async ({ page }, info) => {
  test.setTimeout(120_000);
  await page.setViewportSize({ width: 1280, height: 900 });
  await new AuthPage(page).signUp({ name: 'Una Unsewn', email: `una-${run}@example.test`, password: 'orchard-wheel-26', role: 'designer' });
  await expect(page.getByRole('heading', { name: 'Patterns' })).toBeVisible();
  const { csrfToken } = (await (await page.request.get('/api/auth/csrf')).json()) as { csrfToken: string };
  const created = await page.request.post('/api/patterns', { data: { document: misnumberedStrip() }, headers: { 'x-csrf-token': csrfToken } });
  expect(created.status()).toBe(201);
  const { pattern } = (await created.json()) as { pattern: { id: string } };

  await page.goto(`/patterns/${pattern.id}/print`);
  const alert = page.getByRole('alert').filter({ hasText: 'Not sewable as numbered' });
  await expect(alert).toContainText('Section A: A2 shares no seam with the patches sewn before it (A1)');
  const make = page.getByRole('button', { name: 'Make print set' });
  await expect(make).toBeDisabled();
  await page.screenshot({ path: info.outputPath('print-unsewable-refused.png'), fullPage: true });

  await page.getByRole('checkbox', { name: /Print anyway/ }).check();
  await expect(make).toBeEnabled();
  await make.click();
  await expect(page.getByText(/Ready: \d+ pages\./)).toBeVisible({ timeout: 60_000 });
  await page.screenshot({ path: info.outputPath('print-unsewable-made.png'), fullPage: true });
});
