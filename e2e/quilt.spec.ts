import { expect, test, type Page } from '@playwright/test';
import { readFileSync } from 'node:fs';
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';
import { AuthPage } from './pages/auth.page';
import { PatternPage } from './pages/pattern.page';
import { PrintPage } from './pages/print.page';
import { SharePage } from './pages/share.page';
import { linkIn, waitForMail } from './pages/mail-inbox';
import { createSamplePattern } from './pages/screens';

/*
 * From a block to a quilt (issue 21) against the real server: the designer sets the 8 in. sample block
 * into a 4 × 5 quilt with 2 in. sashing and two borders, adds a second colourway and names sizes; the
 * quilter, invited, picks a size and a colourway and makes a print set whose cover names that size.
 * Screens are saved under e2e/artifacts/ to be looked at.
 */

const run = Date.now().toString(36);
const designer = { name: 'Della Designer', email: `della-quilt-${run}@example.test`, password: 'sashing-and-borders-4', role: 'designer' as const };
const quilter = { name: 'Quentin Quilter', email: `quentin-quilt-${run}@example.test`, password: 'throw-in-dusk-9', role: 'quilter' as const };
const title = `Quilt of ${run}`;
const shot = (page: Page, name: string) => page.screenshot({ path: `e2e/artifacts/quilt-${name}.png`, fullPage: true });

/** The text of each page of a PDF, read by Mozilla's pdf.js (an independent reader). */
async function pdfPageTexts(file: string): Promise<string[]> {
  const pdf = await getDocument({ data: new Uint8Array(readFileSync(file)), useSystemFonts: false, isEvalSupported: false }).promise;
  const texts: string[] = [];
  for (let i = 1; i <= Math.min(pdf.numPages, 3); i++) {
    const content = await (await pdf.getPage(i)).getTextContent();
    texts.push(content.items.map((item) => ('str' in item ? item.str : '')).join(' '));
  }
  await pdf.destroy();
  return texts;
}

test.use({ actionTimeout: 15_000, navigationTimeout: 30_000 });

test('designer sets a block into a 4 × 5 quilt with colourways and sizes; the quilter prints the Throw in Dusk', async ({ browser }) => {
  test.setTimeout(300_000);
  const designerCtx = await browser.newContext({ viewport: { width: 1366, height: 1000 } });
  const page = await designerCtx.newPage();
  await new AuthPage(page).signUp(designer);
  await expect(page.getByRole('button', { name: 'Account menu' })).toBeVisible();
  const id = await createSamplePattern(page, title);

  // --- The Quilt tab: one block until the designer sets it into a quilt.
  await page.goto(`/patterns/${id}/quilt`);
  await page.getByRole('button', { name: 'Set the block into a quilt' }).click();
  const size = page.getByTestId('finished-size');
  // 3 × 3 of the 8 in. block, nothing between: 24 in. square (design §11).
  await expect(size).toHaveText('24 in. × 24 in.');
  await page.getByLabel('Columns').fill('4');
  await page.getByLabel('Rows').fill('5');
  await expect(size).toHaveText('32 in. × 40 in.');
  await page.getByRole('checkbox', { name: 'Sashing between blocks' }).check();
  // 2 in. sashing between blocks: 4·8 + 3·2 = 38 across, 5·8 + 4·2 = 48 down.
  await expect(size).toHaveText('38 in. × 48 in.');
  await page.getByRole('button', { name: 'Add a border' }).click();
  await page.getByRole('button', { name: 'Add a border' }).click();
  await page.getByLabel('Border 2 width').fill('3');
  // Borders 2 + 3 in. on each side: 38 + 10 = 48 across, 48 + 10 = 58 down.
  await expect(size).toHaveText('48 in. × 58 in.');
  await expect(page.getByRole('status').filter({ hasText: 'All changes saved' })).toBeVisible({ timeout: 30_000 });

  // --- A block turned by keys on the picture.
  const picture = page.getByRole('group', { name: /Quilt picture/ });
  await picture.focus();
  await page.keyboard.press('ArrowRight');
  await expect(page.getByText('Chosen block: row 1, position 2')).toBeVisible();
  await page.getByRole('button', { name: 'Turn a quarter' }).click();

  // --- A second colourway: a copy of the pattern's fabrics, renamed and recoloured.
  await page.getByRole('button', { name: 'Add a colourway' }).click();
  await page.getByLabel('Colourway name').fill('Dusk');
  await page.getByLabel('Colourway name').press('Enter');
  await page.getByLabel('Colour for Plum').fill('#1d3557');
  await expect(page.getByRole('button', { name: 'Dusk', pressed: true })).toBeVisible();
  await expect(page.getByRole('list', { name: 'Colourways side by side' }).getByRole('listitem')).toHaveCount(2);

  // --- The size chart: a throw as laid out and a wall hanging.
  await page.getByRole('button', { name: 'Add a size' }).click();
  await page.getByLabel('Size 1 name').fill('Throw');
  await page.getByLabel('Size 1 name').press('Enter');
  await page.getByRole('button', { name: 'Add a size' }).click();
  await page.getByLabel('Size 2 name').fill('Wall');
  await page.getByLabel('Size 2 name').press('Enter');
  await page.getByLabel('Size 2 columns').fill('2');
  await page.getByLabel('Size 2 rows').fill('2');
  const chart = page.getByRole('table');
  await expect(chart.getByRole('row', { name: /^Throw/ })).toContainText('48 in. × 58 in.');
  // 2 × 2: 16 + 2 + 10 = 28 in. square, 4 blocks.
  await expect(chart.getByRole('row', { name: /^Wall/ })).toContainText('28 in. × 28 in.');
  await expect(page.getByRole('status').filter({ hasText: 'All changes saved' })).toBeVisible({ timeout: 30_000 });
  await shot(page, 'designer');
  await page.locator('sw-quilt-picture').first().screenshot({ path: 'e2e/artifacts/quilt-picture.png' });

  // --- The board's four blocks, in the new colourway.
  await new PatternPage(page).open('Drafting board');
  await page.getByRole('button', { name: 'Four blocks' }).click();
  await expect(page.getByRole('img', { name: /Four copies of the block/ })).toBeVisible();
  await page.locator('sw-four-block-view').screenshot({ path: 'e2e/artifacts/quilt-four-blocks.png' });

  // --- Share with the quilter.
  await page.goto(`/patterns/${id}/share`);
  await new SharePage(page).invite(quilter.email, 'Quilter');
  const invitation = await waitForMail(quilter.email, new RegExp(`shared "${title}" with you`));
  const acceptLink = linkIn(invitation, 'http');

  // --- The quilter accepts, sees the quilt read-only, picks the Throw in Dusk and prints.
  const quilterCtx = await browser.newContext({ viewport: { width: 1280, height: 1000 }, acceptDownloads: true });
  const q = await quilterCtx.newPage();
  await q.goto(acceptLink);
  await q.getByRole('link', { name: 'Create an account' }).click();
  await new AuthPage(q).signUp(quilter, new URL(acceptLink).pathname + new URL(acceptLink).search);
  await expect(q.getByRole('button', { name: 'Accept and open the pattern' })).toBeVisible();
  await q.getByRole('button', { name: 'Accept and open the pattern' }).click();
  await q.waitForURL(new RegExp(`/patterns/${id}/board$`));
  await q.goto(`/patterns/${id}/quilt`);
  await expect(q.getByTestId('finished-size')).toHaveText('48 in. × 58 in.');
  await expect(q.getByLabel('Columns')).toHaveCount(0);
  await q.getByRole('radio', { name: 'Wall' }).check();
  await expect(q.getByTestId('finished-size')).toHaveText('28 in. × 28 in.');
  await shot(q, 'quilter');

  await new PatternPage(q).open('Print');
  await q.getByRole('combobox', { name: 'Quilt size' }).click();
  await q.getByRole('option', { name: /^Throw/ }).click();
  await q.getByRole('combobox', { name: 'Colourway' }).click();
  await q.getByRole('option', { name: 'Dusk' }).click();
  const print = new PrintPage(q);
  const made = q.waitForRequest((r) => r.method() === 'POST' && /\/print-sets$/.test(r.url()));
  await print.make();
  const body = (await made).postDataJSON() as { options: { quiltSize?: string; colourwayId?: string } };
  expect(body.options.quiltSize).toBe('Throw');
  expect(body.options.colourwayId).toBeTruthy();
  const download = await print.downloadLatest();
  const file = await download.path();
  const [cover] = await pdfPageTexts(file);
  expect(cover).toContain('Throw');
  // The cover carries the finished quilt size of the Throw: 48 × 58 in.
  expect(cover).toMatch(/48\D{1,12}58/);
  await designerCtx.close();
  await quilterCtx.close();
});
