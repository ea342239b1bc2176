import { expect, test } from '@playwright/test';
import { AuthPage } from './pages/auth.page';

/*
 * A section not sewable as numbered (issue 14): the print page says why and makes no print set until
 * "Print anyway" is ticked; then the set is made and every page of that section says so.
 */

const run = Date.now().toString(36);

/** Three patches in a row numbered left (1), right (2), middle (3): patch 2 shares no seam with patch 1. Invented. */
const MISNUMBERED = {
  formatVersion: 2,
  title: 'Misnumbered strip',
  canvas: { widthIn: 4, heightIn: 2 },
  fabrics: [{ id: 'plum', name: 'Plum', colour: '#6b2d5c' }],
  sections: [
    {
      id: 'a',
      label: 'A',
      geometry: { kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 3, y: 0 }, { x: 3, y: 1 }, { x: 0, y: 1 }] },
      seams: [
        { id: 's1', a: { x: 1, y: -1 }, b: { x: 1, y: 2 } },
        { id: 's2', a: { x: 2, y: -1 }, b: { x: 2, y: 2 } },
      ],
      patches: [
        { number: 1, anchor: { x: 0.5, y: 0.5 }, fabricId: 'plum' },
        { number: 2, anchor: { x: 2.5, y: 0.5 }, fabricId: 'plum' },
        { number: 3, anchor: { x: 1.5, y: 0.5 }, fabricId: 'plum' },
      ],
    },
  ],
};

test('a pattern not sewable as numbered prints only after "Print anyway"', async ({ page }, info) => {
  test.setTimeout(120_000);
  await page.setViewportSize({ width: 1280, height: 900 });
  await new AuthPage(page).signUp({ name: 'Una Unsewn', email: `una-${run}@example.test`, password: 'orchard-wheel-26', role: 'designer' });
  await expect(page.getByRole('heading', { name: 'Patterns' })).toBeVisible();
  const { csrfToken } = (await (await page.request.get('/api/auth/csrf')).json()) as { csrfToken: string };
  const created = await page.request.post('/api/patterns', { data: { document: MISNUMBERED }, headers: { 'x-csrf-token': csrfToken } });
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
