import { expect, test, type Page } from '@playwright/test';
import { buildOrchardWheel } from '../projects/piecing/src/public-api';
import { AuthPage } from './pages/auth.page';
import { PatternPage } from './pages/pattern.page';

/*
 * The invented demo medallion (docs/design-notes.md#demo-data, built by the piecing library) through the app's
 * cutting list, strip-set diagrams, print preview and sewing log. Screens go to e2e/artifacts/.
 */

const run = Date.now().toString(36);
const shot = (page: Page, name: string) => page.screenshot({ path: `e2e/artifacts/app-demo-${name}.png`, fullPage: true });

test.use({ actionTimeout: 15_000, navigationTimeout: 20_000 });

test('the demo medallion: cutting list with strip sets drawn, print preview, sewing log', async ({ page }) => {
  test.setTimeout(120_000);
  await page.setViewportSize({ width: 1366, height: 900 });
  await new AuthPage(page).signUp({ name: 'Mira Demo', email: `mira-${run}@example.test`, password: 'orchard-wheel-26', role: 'designer' });
  await expect(page.getByRole('heading', { name: 'Patterns' })).toBeVisible();

  // The same calls the app makes: a CSRF token, then the document as revision 1.
  const { csrfToken } = (await (await page.request.get('/api/auth/csrf')).json()) as { csrfToken: string };
  const created = await page.request.post('/api/patterns', { data: { document: buildOrchardWheel() }, headers: { 'x-csrf-token': csrfToken } });
  expect(created.status()).toBe(201);
  const { pattern } = (await created.json()) as { pattern: { id: string; title: string } };

  await page.goto(`/patterns/${pattern.id}/cutting`);
  await expect(new PatternPage(page).heading()).toHaveText(pattern.title);
  // Strip sets: each drawn with svg.js, one rect per strip; the centre stripe set has three strips.
  const diagrams = page.locator('sw-strip-diagram svg');
  await expect(diagrams.first()).toBeVisible();
  expect(await diagrams.first().locator('rect').count()).toBeGreaterThanOrEqual(3);
  await expect(page.getByRole('region', { name: 'Plum' })).toContainText('Buy');
  await shot(page, 'cutting-list');

  await page.emulateMedia({ media: 'print' });
  await shot(page, 'cutting-list-print');
  await page.emulateMedia({ media: 'screen' });

  await new PatternPage(page).open('Print');
  await expect(page.getByRole('region', { name: 'Sheets' }).locator('p strong').first()).toHaveText(/\d+ sheets \(at least \d+ by area\)/);
  await shot(page, 'print');

  await new PatternPage(page).open('Sewing log');
  await expect(page.getByRole('list', { name: 'Sections' }).getByRole('listitem').first()).toBeVisible();
  await shot(page, 'sewing-log');

  await new PatternPage(page).open('Drafting board');
  await page.getByRole('application', { name: 'Drafting board' }).waitFor();
  await shot(page, 'board');

  // A reference image to trace: uploaded, then named by the document (autosaved as a new revision).
  // A 1 × 1 PNG (PNG signature and chunks per ISO/IEC 15948), built inline.
  const png = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==', 'base64');
  await page.getByLabel('Image to trace').setInputFiles({ name: 'sketch.png', mimeType: 'image/png', buffer: png });
  await expect(page.getByText('Tracing “sketch.png”')).toBeVisible();
  expect(await new PatternPage(page).waitForSaved()).toBe(2);
  const stored = (await (await page.request.get(`/api/patterns/${pattern.id}`)).json()) as {
    revision: { document: { referenceImage?: { uploadId: string; widthIn: number } } };
  };
  expect(stored.revision.document.referenceImage?.widthIn).toBe(26);
  const image = await page.request.get(`/api/patterns/${pattern.id}/uploads/${stored.revision.document.referenceImage!.uploadId}/file`);
  expect(image.headers()['content-type']).toBe('image/png');

  // The dark theme on the busiest screens.
  await page.getByRole('button', { name: 'Use dark theme' }).click();
  await expect(page.locator('html')).toHaveClass(/sw-dark/);
  await shot(page, 'board-dark');
  await new PatternPage(page).open('Cutting list');
  await expect(page.locator('sw-strip-diagram svg').first()).toBeVisible();
  await shot(page, 'cutting-list-dark');
});
