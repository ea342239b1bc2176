import { expect, test } from '@playwright/test';
import { buildOrchardWheel } from '@seamwright/piecing';
import { AuthPage } from './pages/auth.page';

/*
 * A quilt in the shop (issue 21): the demo Orchard Wheel, with a quilt layout, two colourways and three
 * sizes, is published through the API; its listing page shows a quilt picture per colourway and the
 * size chart, as stored with the listing. The screen is saved under e2e/artifacts/ to be looked at.
 */

const run = Date.now().toString(36);
const designer = { name: 'Orla Designer', email: `orla-${run}@example.test`, password: 'wheel-in-frost-7', role: 'designer' as const };

test('a published quilt pattern shows its colourways and sizes on its listing page', async ({ browser }) => {
  test.setTimeout(120_000);
  const ctx = await browser.newContext({ viewport: { width: 1280, height: 1000 } });
  const page = await ctx.newPage();
  await new AuthPage(page).signUp(designer);
  await expect(page.getByRole('button', { name: 'Account menu' })).toBeVisible();
  const { csrfToken } = (await (await page.request.get('/api/auth/csrf')).json()) as { csrfToken: string };
  const headers = { 'x-csrf-token': csrfToken };
  const created = await page.request.post('/api/patterns', { data: { document: buildOrchardWheel() }, headers });
  expect(created.status()).toBe(201);
  const id = ((await created.json()) as { pattern: { id: string } }).pattern.id;
  expect((await page.request.put('/api/shop/mine', { data: { currency: 'usd' }, headers })).status()).toBe(200);
  const put = await page.request.put(`/api/shop/listings/${id}`, { data: { priceMinor: 2400, description: 'A wheel quilt in three sizes.', published: true }, headers });
  expect(put.status()).toBe(200);

  await page.goto(`/shop/patterns/${id}`);
  const quilt = page.getByRole('region', { name: 'The quilt' });
  await expect(quilt.getByRole('img', { name: 'Orchard Wheel quilt in the Frost colourway' })).toBeVisible();
  await expect(quilt.locator('figcaption')).toHaveText(['Pattern fabrics', 'Dusk', 'Frost']);
  // Every picture has loaded as an image (the server's SVG decodes).
  for (const img of await quilt.getByRole('img').all()) {
    expect(await img.evaluate((el: HTMLImageElement) => el.complete && el.naturalWidth)).toBe(320);
  }
  const rows = quilt.getByRole('table', { name: 'Sizes' }).locator('tbody tr');
  await expect(rows).toHaveCount(3);
  await expect(rows.first().getByRole('rowheader')).toHaveText('Wall 1 × 1');
  await page.screenshot({ path: 'e2e/artifacts/shop-quilt-listing.png', fullPage: true });
  await ctx.close();
});
