import { expect, test, type Page } from '@playwright/test';
import { buildOrchardWheel, derivePatches, type PatternDocument, type Point } from '../projects/piecing/src/public-api';
import { AuthPage } from './pages/auth.page';
import { DraftingBoardPage } from './pages/drafting-board.page';

/*
 * Colourways on the Drafting board against the real server: the demo Orchard Wheel opens, the board is
 * shown in the colourway Frost from the toolbar (by keys), a patch's fill on the board's canvas turns from
 * its pattern fabric's colour to Frost's, the four-blocks panel follows, the fabric list says which
 * colourway shows, and the stored pattern keeps its revision (a view, not an edit). Screens of the board
 * in both themes go to e2e/artifacts/.
 */

const run = Date.now().toString(36);
const shot = (page: Page, name: string) => page.screenshot({ path: `e2e/artifacts/board-colourway-${name}.png` });

test.use({ actionTimeout: 20_000, navigationTimeout: 30_000 });

/** "#rrggbb" → [r, g, b]. */
function rgb(hex: string): [number, number, number] {
  return [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16)) as [number, number, number];
}

/**
 * The colour a user sees at a screen point of the board: the topmost opaque pixel of the board's layer
 * canvases there (the fills are drawn opaque; the overlay and rulers leave a patch's inside clear).
 */
async function boardPixel(page: Page, at: Point): Promise<[number, number, number]> {
  return page.getByRole('application', { name: 'Drafting board' }).evaluate((host, p) => {
    let seen: [number, number, number] = [-1, -1, -1];
    for (const canvas of host.querySelectorAll('canvas')) {
      const box = canvas.getBoundingClientRect();
      if (canvas.width === 0 || box.width === 0) continue;
      const ratio = canvas.width / box.width;
      const data = canvas.getContext('2d')!.getImageData(Math.floor((p.x - box.left) * ratio), Math.floor((p.y - box.top) * ratio), 1, 1).data;
      if (data[3] === 255) seen = [data[0], data[1], data[2]];
    }
    return seen;
  }, at);
}

test('the board shows the Orchard Wheel in the colourway Frost without changing the pattern', async ({ page }) => {
  test.setTimeout(180_000);
  await page.setViewportSize({ width: 1440, height: 1000 });
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await new AuthPage(page).signUp({ name: 'Cora Colourway', email: `cora-${run}@example.test`, password: 'frost-on-the-board-7', role: 'designer' });
  await expect(page.getByRole('heading', { name: 'Patterns' })).toBeVisible();
  const { csrfToken } = (await (await page.request.get('/api/auth/csrf')).json()) as { csrfToken: string };
  const wheel = { ...buildOrchardWheel(), title: `Orchard Wheel ${run}` };
  const created = await page.request.post('/api/patterns', { data: { document: wheel }, headers: { 'x-csrf-token': csrfToken } });
  expect(created.status()).toBe(201);
  const { pattern } = (await created.json()) as { pattern: { id: string } };
  const stored = async () => (await (await page.request.get(`/api/patterns/${pattern.id}`)).json()) as { revision: { number: number; document: PatternDocument } };
  const revisionBefore = (await stored()).revision.number;

  // The first plain patch of section A: its fabric in the pattern and in Frost.
  const target = derivePatches(wheel.sections[0])
    .patches.filter((p) => p.fabricId && !p.stripSet)
    .sort((a, b) => a.number - b.number)[0];
  const own = wheel.fabrics.find((f) => f.id === target.fabricId)!;
  const frost = wheel.colourways!.find((c) => c.name === 'Frost')!;
  const inFrost = frost.fabrics[own.id];
  expect(inFrost.colour).not.toBe(own.colour);

  await page.goto(`/patterns/${pattern.id}/board`);
  const board = new DraftingBoardPage(page);
  await board.ready();
  // A point inside the patch, well away from its number (at the label point) and from its seams:
  // 60 % of the way from the label point to the vertex farthest from it, on screen.
  const label = await board.screen(target.labelPoint);
  const corners = await Promise.all(target.polygon.map((v) => board.screen(v)));
  const far = corners.reduce((a, b) => (Math.hypot(b.x - label.x, b.y - label.y) > Math.hypot(a.x - label.x, a.y - label.y) ? b : a));
  const probe = { x: label.x + 0.6 * (far.x - label.x), y: label.y + 0.6 * (far.y - label.y) };
  expect(Math.hypot(probe.x - label.x, probe.y - label.y)).toBeGreaterThan(16);

  const near = (want: string) => async () => {
    const got = await boardPixel(page, probe);
    return got.every((c, i) => Math.abs(c - rgb(want)[i]) <= 2) ? want : `rgb(${got.join(', ')})`;
  };
  await expect.poll(near(own.colour)).toBe(own.colour);

  // The four blocks open first, to see them follow the board.
  await page.getByRole('button', { name: 'Four blocks' }).click();
  const fourBlocks = page.getByRole('combobox', { name: 'Four blocks colourway' });
  await expect(fourBlocks).toHaveText(/Pattern fabrics/);

  // Frost chosen by keys: the toolbar's choice, opened with Enter, the option picked with the arrows.
  const choice = page.getByRole('combobox', { name: 'Board colourway' });
  await expect(choice).toHaveText(/Pattern fabrics/);
  await choice.focus();
  await page.keyboard.press('Enter');
  await expect(page.getByRole('listbox')).toBeVisible();
  await expect(page.getByRole('option')).toHaveText(['Pattern fabrics', 'Dusk', 'Frost']);
  while ((await page.getByRole('option', { name: 'Frost' }).getAttribute('class'))?.includes('mat-mdc-option-active') !== true) await page.keyboard.press('ArrowDown');
  await page.keyboard.press('Enter');
  await expect(page.getByRole('listbox')).toBeHidden();
  await expect(choice).toHaveText(/Frost/);
  await expect(choice).toBeFocused();

  // The patch's fill is Frost's fabric now; the four blocks follow; the fabric list says what shows.
  await expect.poll(near(inFrost.colour)).toBe(inFrost.colour);
  await expect(board.board()).toHaveAttribute('data-colourway', frost.id);
  await expect(fourBlocks).toHaveText(/Frost/);
  await page.getByText('Pattern settings', { exact: true }).click();
  await expect(page.getByTestId('fabrics-colourway-note')).toHaveText(/The board shows the colourway Frost\. These are the pattern's own fabrics/);
  await shot(page, 'frost-light');

  // A view, not an edit: nothing to undo, nothing to save, the stored revision unchanged.
  await expect(page.getByRole('button', { name: 'Undo' })).toBeDisabled();
  const after = await stored();
  expect(after.revision.number).toBe(revisionBefore);
  expect(after.revision.document.fabrics.find((f) => f.id === own.id)!.colour).toBe(own.colour);

  // Back to the pattern's own fabrics: the fill returns.
  await choice.click();
  await page.getByRole('option', { name: 'Pattern fabrics' }).click();
  await expect.poll(near(own.colour)).toBe(own.colour);
  await expect(board.board()).not.toHaveAttribute('data-colourway', /.+/);

  await page.getByRole('button', { name: 'Use dark theme' }).click();
  await choice.click();
  await page.getByRole('option', { name: 'Dusk' }).click();
  await expect.poll(near(wheel.colourways!.find((c) => c.id === 'dusk')!.fabrics[own.id].colour)).toBe(wheel.colourways!.find((c) => c.id === 'dusk')!.fabrics[own.id].colour);
  await shot(page, 'dusk-dark');
  expect((await stored()).revision.number).toBe(revisionBefore);
  expect(errors).toEqual([]);
});
