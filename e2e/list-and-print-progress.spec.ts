import { expect, test, type Page } from '@playwright/test';
import { buildGardenGate } from '../projects/piecing/src/public-api';
import { AuthPage } from './pages/auth.page';
import { PatternsPage } from './pages/patterns.page';
import { PrintPage } from './pages/print.page';

/*
 * The pattern list draws every row from its one answer (picture, sections, finished size), and print
 * progress arrives over the server's event stream rather than by polling.
 */

const run = Date.now().toString(36);
const shot = (page: Page, name: string) => page.screenshot({ path: `e2e/artifacts/list-and-print-${name}.png`, fullPage: true });

test.use({ actionTimeout: 15_000, navigationTimeout: 20_000 });

test('pattern list rows come from one answer; a print set is followed over its event stream', async ({ page }) => {
  test.setTimeout(120_000);
  await page.setViewportSize({ width: 1366, height: 900 });
  await new AuthPage(page).signUp({ name: 'Mira List', email: `mira-list-${run}@example.test`, password: 'garden-gate-8in', role: 'designer' });
  await expect(page.getByRole('heading', { name: 'Patterns' })).toBeVisible();
  const { csrfToken } = (await (await page.request.get('/api/auth/csrf')).json()) as { csrfToken: string };
  const created = await page.request.post('/api/patterns', { data: { document: buildGardenGate() }, headers: { 'x-csrf-token': csrfToken } });
  expect(created.status()).toBe(201);
  const { pattern } = (await created.json()) as { pattern: { id: string; title: string } };

  // Every request to a single pattern, to see that the list asks for none.
  const patternReads: string[] = [];
  page.on('request', (r) => {
    if (r.method() === 'GET' && /\/api\/patterns\/[^/?]+$/.test(new URL(r.url()).pathname)) patternReads.push(r.url());
  });
  const list = new PatternsPage(page);
  const listed = page.waitForResponse((r) => new URL(r.url()).pathname === '/api/patterns' && r.ok());
  await list.goto();
  await listed;
  const row = list.row(pattern.title);
  // Garden Gate: roof, door and path on an 8 in. square.
  await expect(row.getByRole('cell').nth(2)).toHaveText('3');
  await expect(row.getByRole('cell').nth(3)).toHaveText('8 × 8 in.');
  const picture = row.getByRole('img', { name: `Preview of ${pattern.title}` });
  await expect(picture).toBeVisible();
  // The image decoded: an SVG 96 px wide in a 48 px box.
  expect(await picture.evaluate((img: HTMLImageElement) => [img.complete, img.naturalWidth, Math.round(img.getBoundingClientRect().width)])).toEqual([true, 96, 48]);
  await shot(page, 'pattern-list');
  expect(patternReads).toEqual([]);

  // Print: the set's progress comes over text/event-stream; no print set is polled.
  const polls: string[] = [];
  page.on('request', (r) => {
    if (/\/print-sets\/[^/]+$/.test(new URL(r.url()).pathname) && r.method() === 'GET') polls.push(r.url());
  });
  const stream = page.waitForRequest((r) => /\/api\/patterns\/[^/]+\/print-sets\/[^/]+\/events$/.test(new URL(r.url()).pathname));
  await page.goto(`/patterns/${pattern.id}/print`);
  const print = new PrintPage(page);
  await expect(print.sheetStatement()).toBeVisible();
  const making = print.make();
  const events = await stream;
  expect((await events.response())?.headers()['content-type']).toContain('text/event-stream');
  expect(await making).toBeGreaterThan(0);
  await shot(page, 'print-set-ready');
  expect(polls).toEqual([]);
});
