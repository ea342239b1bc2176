import { expect, test, type Page } from '@playwright/test';
import { buildGardenGate, type PatternDocument } from '../projects/piecing/src/public-api';
import { AuthPage } from './pages/auth.page';
import { PatternPage } from './pages/pattern.page';

/*
 * Pattern settings on the Drafting board against the real server: name a strip set, set the block
 * count, add and rename a fabric, resize the design from 8 in. to 10 in., then read the cutting list
 * the app works out from the saved revision; shrink the drawing area and see the warning. The screen
 * goes to e2e/artifacts/.
 */

const run = Date.now().toString(36);
const shot = (page: Page, name: string) => page.screenshot({ path: `e2e/artifacts/pattern-settings-${name}.png`, fullPage: true });

test.use({ actionTimeout: 15_000, navigationTimeout: 20_000 });

/** Garden Gate with its path patch (C1) filled by an unnamed strip set of three 1 ¼ in. strips. */
function gateWithStrips(): PatternDocument {
  const doc = buildGardenGate();
  const path = doc.sections[2];
  const patches = path.patches.map((p) =>
    p.number === 1
      ? { number: 1, anchor: p.anchor, stripSet: { id: 't-e2e1', strips: [{ fabricId: 'cream', finishedWidthIn: 1.25 }, { fabricId: 'moss', finishedWidthIn: 1.25 }, { fabricId: 'cream', finishedWidthIn: 1.25 }], axisAngleDeg: 90, offsetIn: 0 } }
      : p,
  );
  return { ...doc, sections: [doc.sections[0], doc.sections[1], { ...path, patches }] };
}

test('pattern settings change the saved pattern, and the cutting list follows a resize', async ({ page }) => {
  test.setTimeout(120_000);
  await page.setViewportSize({ width: 1440, height: 1000 });
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await new AuthPage(page).signUp({ name: 'Sol Settings', email: `sol-${run}@example.test`, password: 'garden-gate-8in', role: 'designer' });
  await expect(page.getByRole('heading', { name: 'Patterns' })).toBeVisible();
  const { csrfToken } = (await (await page.request.get('/api/auth/csrf')).json()) as { csrfToken: string };
  const created = await page.request.post('/api/patterns', { data: { document: gateWithStrips() }, headers: { 'x-csrf-token': csrfToken } });
  expect(created.status()).toBe(201);
  const { pattern } = (await created.json()) as { pattern: { id: string } };
  const stored = async () => ((await (await page.request.get(`/api/patterns/${pattern.id}`)).json()) as { revision: { document: PatternDocument } }).revision.document;

  // Before: the cutting list calls the strip set by the patch it fills, not by its id.
  await page.goto(`/patterns/${pattern.id}/cutting`);
  await expect(page.getByRole('heading', { name: 'Strip set for C1' })).toBeVisible();
  await expect(page.getByText('t-e2e1')).toHaveCount(0);

  await new PatternPage(page).open('Drafting board');
  await page.getByRole('application', { name: 'Drafting board' }).waitFor();
  await page.getByText('Pattern settings', { exact: true }).click();
  const panel = page.getByRole('region', { name: 'Pattern settings' });
  await expect(panel).toBeVisible();

  const name = panel.getByLabel('Name of the strip set in C1');
  await expect(name).toHaveAttribute('placeholder', 'Strip set for C1');
  await name.fill('Path stripes');
  await name.press('Enter');
  const blocks = panel.getByLabel('Blocks in the quilt');
  await blocks.fill('6');
  await blocks.press('Enter');
  await panel.getByRole('button', { name: 'Add fabric' }).click();
  const fabricName = panel.getByLabel('Name of fabric Fabric 4');
  await fabricName.fill('Sky');
  await fabricName.press('Enter');
  await expect(panel.getByRole('button', { name: 'Remove fabric Moss' })).toHaveAttribute('aria-disabled', 'true');
  await expect(panel.getByText('In use by B1, C1, C2, C3')).toBeVisible();

  const width = panel.getByLabel('New finished width');
  await width.fill('10');
  await width.press('Enter');
  await expect(panel.getByLabel('New finished height')).toHaveValue('10');
  await expect(panel.getByTestId('resize-preview')).toContainText('k = 1.25');
  await shot(page, 'board');
  await panel.getByRole('button', { name: 'Apply new size' }).click();
  await expect(panel.getByText('Finished size now: 10 in. × 10 in.')).toBeVisible();

  // Autosave stores every step; the last one carries the new size.
  await expect.poll(async () => (await stored()).canvas, { timeout: 20_000 }).toEqual({ widthIn: 10, heightIn: 10 });
  const doc = await stored();
  expect(doc.blockCount).toBe(6);
  expect(doc.seamAllowanceIn).toBe(0.25);
  expect(doc.fabrics.map((f) => f.name)).toEqual(['Cream', 'Moss', 'Brick', 'Sky']);
  expect(doc.sections[2].patches.find((p) => p.number === 1)?.stripSet).toMatchObject({ name: 'Path stripes', strips: [{ finishedWidthIn: 1.5625 }, { finishedWidthIn: 1.5625 }, { finishedWidthIn: 1.5625 }] });

  // The cutting list from the saved revision: B1, a 2 ½ in. square, is 3 ⅛ in. now and is cut
  // 3 ⅛ + 2 × (¼ + ½) = 4 ⅝ in. square; strips finish 1 ⁹⁄₁₆ in. and are cut ½ in. wider.
  await new PatternPage(page).open('Cutting list');
  await expect(page.getByText(/6 blocks/)).toBeVisible();
  await expect(page.getByRole('region', { name: 'Moss' }).getByRole('cell', { name: '4 ⅝ in. × 4 ⅝ in.' })).toBeVisible();
  await expect(page.getByRole('heading', { name: 'Path stripes' })).toBeVisible();
  await expect(page.getByRole('cell', { name: 'Path stripes, strip 2' })).toBeVisible();
  await shot(page, 'cutting');

  // A drawing area made smaller than the design: the panel names the sections left outside.
  await new PatternPage(page).open('Drafting board');
  await page.getByRole('application', { name: 'Drafting board' }).waitFor();
  const drawingWidth = page.getByLabel('Drawing width');
  await drawingWidth.fill('8');
  await drawingWidth.press('Enter');
  await page.getByText('Pattern settings', { exact: true }).click();
  await expect(page.getByRole('status').filter({ hasText: 'Outside the drawing area' })).toHaveText(/sections A \(partly\), B \(partly\), C \(partly\)/);
  await shot(page, 'outside');
  expect(errors).toEqual([]);
});
