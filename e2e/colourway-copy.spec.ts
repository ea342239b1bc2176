import { expect, test, type Page } from '@playwright/test';
import { readFileSync } from 'node:fs';
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';
import { buildOrchardWheel } from '../projects/piecing/src/public-api';
import { AuthPage } from './pages/auth.page';
import { PatternPage } from './pages/pattern.page';
import { PrintPage } from './pages/print.page';
import { linkIn, waitForMail } from './pages/mail-inbox';

/*
 * A quilter's own colourway copy (issue 21) against the real server: the designer shares the demo
 * Orchard Wheel with a quilter; the quilter copies its colourway Dusk on the cutting list, renames the
 * Plum slot's fabric, sees the cutting list follow, and makes a print set in that copy whose fabric key,
 * read back with Mozilla's pdf.js, names the new fabric. The designer cannot reach the copy (404).
 * Screens go to e2e/artifacts/.
 */

const run = Date.now().toString(36);
const designer = { name: 'Dara Designer', email: `dara-copy-${run}@example.test`, password: 'orchard-wheel-copy-3', role: 'designer' as const };
const quilter = { name: 'Kit Quilter', email: `kit-copy-${run}@example.test`, password: 'aubergine-linen-5', role: 'quilter' as const };
const shot = (page: Page, name: string) => page.screenshot({ path: `e2e/artifacts/colourway-copy-${name}.png`, fullPage: true });

/** The text of every page of a PDF, read by Mozilla's pdf.js (an independent reader). */
async function pdfText(file: string): Promise<string> {
  const pdf = await getDocument({ data: new Uint8Array(readFileSync(file)), useSystemFonts: false, isEvalSupported: false }).promise;
  const texts: string[] = [];
  for (let i = 1; i <= pdf.numPages; i++) {
    const content = await (await pdf.getPage(i)).getTextContent();
    texts.push(content.items.map((item) => ('str' in item ? item.str : '')).join(' '));
  }
  await pdf.destroy();
  return texts.join('\n');
}

/** The page's CSRF token, for API calls made beside the app. */
async function csrf(page: Page): Promise<string> {
  return ((await (await page.request.get('/api/auth/csrf')).json()) as { csrfToken: string }).csrfToken;
}

test.use({ actionTimeout: 20_000, navigationTimeout: 30_000 });

test('a quilter copies Dusk, renames a fabric, and the print set and cutting list follow; the copy is theirs alone', async ({ browser }) => {
  test.setTimeout(300_000);
  // --- The designer puts the demo Orchard Wheel up and shares it with the quilter.
  const designerCtx = await browser.newContext();
  const d = await designerCtx.newPage();
  await new AuthPage(d).signUp(designer);
  await expect(d.getByRole('button', { name: 'Account menu' })).toBeVisible();
  const created = await d.request.post('/api/patterns', { data: { document: { ...buildOrchardWheel(), title: `Orchard Wheel ${run}` } }, headers: { 'x-csrf-token': await csrf(d) } });
  expect(created.status()).toBe(201);
  const id = ((await created.json()) as { pattern: { id: string } }).pattern.id;
  const invited = await d.request.post(`/api/patterns/${id}/invitations`, { data: { email: quilter.email, access: 'quilter' }, headers: { 'x-csrf-token': await csrf(d) } });
  expect(invited.status()).toBe(201);

  // --- The quilter signs up and accepts.
  const quilterCtx = await browser.newContext({ viewport: { width: 1280, height: 1000 }, acceptDownloads: true });
  const q = await quilterCtx.newPage();
  const errors: string[] = [];
  q.on('pageerror', (e) => errors.push(e.message));
  await new AuthPage(q).signUp(quilter);
  await expect(q.getByRole('button', { name: 'Account menu' })).toBeVisible();
  const mail = await waitForMail(quilter.email, /shared/);
  const token = new URL(linkIn(mail, 'http')).searchParams.get('token')!;
  expect((await q.request.post('/api/invitations/accept', { data: { token }, headers: { 'x-csrf-token': await csrf(q) } })).status()).toBe(200);

  // --- On the cutting list: choose Dusk, make my copy, rename the Plum slot's fabric, save.
  await q.goto(`/patterns/${id}/cutting`);
  await q.getByRole('combobox', { name: 'Colourway' }).click();
  await q.getByRole('option', { name: 'Dusk' }).click();
  await q.getByRole('button', { name: 'Make my copy' }).click();
  await expect(q.getByLabel('Name of my copy')).toHaveValue('My Dusk');
  const mine = (await (await q.request.get(`/api/patterns/${id}/colourway-copies`)).json()) as { items: { id: string; name: string; sourceColourwayId: string }[] };
  expect(mine.items.map((c) => [c.name, c.sourceColourwayId])).toEqual([['My Dusk', 'dusk']]);
  const copyId = mine.items[0].id;
  // Dusk's name for the Plum slot is Midnight (projects/piecing/src/lib/demo/orchard-wheel-quilt.ts).
  const plum = q.getByLabel('My fabric for Plum', { exact: true });
  await expect(plum).toHaveValue('Midnight');
  await plum.fill('Aubergine linen');
  await plum.press('Enter');
  await expect(q.getByRole('status').filter({ hasText: 'Saved “My Dusk”.' })).toBeVisible();
  await expect(q.getByRole('combobox', { name: 'Colourway' })).toContainText('My Dusk');
  // The cutting list names the fabric as the copy does.
  await expect(q.getByRole('heading', { level: 3, name: 'Aubergine linen' })).toBeVisible();
  await expect(q.getByRole('heading', { level: 3, name: 'Midnight' })).toHaveCount(0);
  await shot(q, 'cutting');

  // --- The print page keeps the copy chosen; a small size keeps the set quick.
  await new PatternPage(q).open('Print');
  await expect(q.getByRole('combobox', { name: 'Colourway' })).toContainText('My Dusk');
  await q.getByRole('combobox', { name: 'Quilt size' }).click();
  await q.getByRole('option', { name: /^Wall 1 × 1/ }).click();
  const asked = q.waitForRequest((r) => r.method() === 'POST' && /\/print-sets$/.test(r.url()));
  const print = new PrintPage(q);
  await print.make();
  const body = (await asked).postDataJSON() as { colourwayCopyId?: string; options: { colourwayId?: string; quiltSize?: string } };
  expect(body.colourwayCopyId).toBe(copyId);
  expect(body.options.colourwayId).toBeUndefined();
  expect(body.options.quiltSize).toBe('Wall 1 × 1');
  await shot(q, 'print');
  const text = await pdfText(await (await print.downloadLatest()).path());
  expect(text).toContain('Aubergine linen');
  expect(text).not.toContain('Midnight');
  // The other slots are Dusk's: Ink's fabric is Coal there.
  expect(text).toContain('Coal');

  // --- The copy is the quilter's alone: the designer, who owns the pattern, gets 404 and an empty list.
  expect((await d.request.get(`/api/patterns/${id}/colourway-copies/${copyId}`)).status()).toBe(404);
  expect(((await (await d.request.get(`/api/patterns/${id}/colourway-copies`)).json()) as { items: unknown[] }).items).toEqual([]);
  expect((await q.request.get(`/api/patterns/${id}/colourway-copies/${copyId}`)).status()).toBe(200);
  expect(errors).toEqual([]);
  await designerCtx.close();
  await quilterCtx.close();
});
