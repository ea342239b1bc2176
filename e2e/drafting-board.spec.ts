import { expect, test, type Page } from '@playwright/test';
import { derivePatches, locatePoint, readPatternDocument, type PatternDocumentInput } from '../projects/piecing/src/public-api';
import { AuthPage } from './pages/auth.page';
import { DraftingBoardPage, type InchPoint } from './pages/drafting-board.page';
import { PatternPage } from './pages/pattern.page';
import { PatternsPage } from './pages/patterns.page';

/*
 * The Drafting board in Chromium against the real server: draw an arc section, split it into four
 * patches, read their numbers and the sewability verdict, renumber to an order that cannot be sewn
 * (clicking patches on the board, then dragging in the piecing-order list) and see the warning, undo,
 * reload and find the same drawing. Screens are saved under e2e/artifacts/.
 */

const run = Date.now().toString(36);
const designer = { name: 'Bea Board', email: `bea-${run}@example.test`, password: 'arc-split-four-4', role: 'designer' as const };
const shot = (page: Page, name: string) => page.screenshot({ path: `e2e/artifacts/board-${name}.png` });

test('draw an arc section, split it into four patches, renumber, undo and reload', async ({ page }) => {
  test.setTimeout(240_000);
  await page.setViewportSize({ width: 1440, height: 960 });
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));

  await new AuthPage(page).signUp(designer);
  await expect(page.getByRole('heading', { name: 'Patterns' })).toBeVisible();
  await new PatternsPage(page).create(`Board test ${run}`, 'Blank block');
  const board = new DraftingBoardPage(page);
  await board.ready();
  await shot(page, 'empty');

  // The arc goes round the middle of the drawing area, in whole inches so the ⅛ in. snap keeps them.
  const area = await board.canvas();
  const m = Math.min(area.widthIn, area.heightIn);
  const C: InchPoint = { x: Math.round(area.widthIn / 2), y: Math.round(area.heightIn / 2) };
  const outer = Math.floor(0.45 * m);
  const inner = Math.floor(0.25 * m);
  const mid = (inner + outer) / 2;
  const polar = (r: number, deg: number): InchPoint => ({ x: C.x + r * Math.cos((deg * Math.PI) / 180), y: C.y + r * Math.sin((deg * Math.PI) / 180) });

  // Arc section: press at the centre, drag out to the outer radius along 0°, release; click the
  // inner radius; click the end angle (90°). The ⅛ in. grid snap makes the numbers exact.
  await board.tool('a');
  await expect(board.liveRegion()).toHaveText(/^Arc section tool/);
  await board.drag(C, polar(outer, 0));
  await expect(board.hint()).toHaveText('Click at the inner radius');
  await board.click(polar(inner, 0));
  await board.click(polar(mid, 90));
  await expect(board.hint()).toHaveText('Press at the centre and drag out to the outer radius');
  await expect(page.getByLabel('Inner radius')).toHaveValue(String(inner));
  await expect(page.getByLabel('Outer radius')).toHaveValue(String(outer));
  await expect(page.getByLabel('Sweep (°)')).toHaveValue('90');
  await shot(page, 'arc');

  // Split: three radial seams from the inner to the outer arc.
  await board.tool('l');
  for (const deg of [22.5, 45, 67.5]) await board.drag(polar(inner, deg), polar(outer, deg));
  // Three seams across one section: four patches in the Sections outline.
  await expect.poll(() => board.counts()).toEqual({ sections: 1, patches: 4 });
  await expect.poll(() => board.boardLabels()).toEqual(['A1', 'A2', 'A3', 'A4']);
  await expect.poll(() => board.orderLabels()).toEqual(['A1', 'A2', 'A3', 'A4']);

  // Renumber along the arc: a sewable order.
  await board.tool('n');
  for (const deg of [10, 30, 55, 80]) await board.click(polar(mid, deg));
  await expect(board.verdict()).toHaveText(/Section A can be sewn in this order/);
  await shot(page, 'split-four');

  // Renumber to an order that jumps across the arc: A2 (at 55°) shares no seam with A1 (at 10°).
  for (const deg of [10, 55, 30, 80]) await board.click(polar(mid, deg));
  await expect(board.verdict()).toHaveText(/cannot be sewn in this order at A2: A2 shares no seam/);
  await expect(board.verdict()).toHaveAttribute('role', 'alert');
  await expect(page.locator('li.failing')).toHaveAttribute('data-label', 'A2');
  await shot(page, 'bad-order');

  // Undo: the whole renumbering was one step.
  await board.board().focus();
  await page.keyboard.press('Control+z');
  await expect(board.verdict()).toHaveText(/Section A can be sewn in this order/);
  await shot(page, 'undone');

  // Reorder in the list instead: A4 dragged up to second place cannot be sewn there either.
  await board.dragInList(3, 1);
  await expect.poll(() => board.orderLabels()).toEqual(['A1', 'A2', 'A3', 'A4']);
  await expect(board.verdict()).toHaveText(/cannot be sewn in this order at A2/);
  await shot(page, 'list-reorder');
  await board.board().focus();
  await page.keyboard.press('Control+z');
  await expect(board.verdict()).toHaveText(/Section A can be sewn in this order/);

  // Autosave stores it; a reload brings back the same drawing.
  await new PatternPage(page).waitForSaved();
  await page.reload();
  await board.ready();
  await expect.poll(() => board.counts()).toEqual({ sections: 1, patches: 4 });
  await expect.poll(() => board.boardLabels()).toEqual(['A1', 'A2', 'A3', 'A4']);
  await board.tool('v');
  await board.click(polar(mid, 33));
  await expect(board.verdict()).toHaveText(/Section A can be sewn in this order/);
  await expect(page.getByLabel('Outer radius')).toHaveValue(String(outer));
  await shot(page, 'reloaded');
  expect(errors).toEqual([]);
});

test('select, split twice at once from one corner, fill each patch, and find each fill saved on its own patch', async ({ page }) => {
  test.setTimeout(240_000);
  await page.setViewportSize({ width: 1440, height: 960 });
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  const fan = { name: 'Fen Fan', email: `fen-${run}@example.test`, password: 'fan-from-a-corner-2', role: 'designer' as const };
  await new AuthPage(page).signUp(fan);
  await expect(page.getByRole('heading', { name: 'Patterns' })).toBeVisible();
  await new PatternsPage(page).create(`Fan test ${run}`, 'Blank block');
  const board = new DraftingBoardPage(page);
  await board.ready();

  // An 8 in. square from (2, 2) to (10, 10), closed on its first corner.
  await board.tool('s');
  for (const p of [{ x: 2, y: 2 }, { x: 10, y: 2 }, { x: 10, y: 10 }, { x: 2, y: 10 }, { x: 2, y: 2 }]) await board.click(p);
  await expect.poll(() => board.counts()).toEqual({ sections: 1, patches: 1 });

  // Select it (the side panel grows with its corners), then at once two seams fanning from (2, 2).
  await board.tool('v');
  await board.click({ x: 6, y: 6 });
  await expect(page.getByRole('heading', { name: /Section A/ })).toBeVisible();
  const view = await board.viewport();
  await board.tool('l');
  await board.drag({ x: 2, y: 2 }, { x: 10, y: 4 });
  await board.drag({ x: 2, y: 2 }, { x: 10, y: 6 });
  await expect.poll(() => board.counts()).toEqual({ sections: 1, patches: 3 });
  await expect.poll(() => board.boardLabels()).toEqual(['A1', 'A2', 'A3']);
  // The view never moved while the panel changed.
  expect(await board.viewport()).toEqual(view);

  // Fill each patch with its own fabric: above the first seam, between the seams, below the second.
  const inside = { above: { x: 9, y: 2.8 }, between: { x: 9, y: 4.6 }, below: { x: 4, y: 8 } };
  const fabricOf = { above: 'plum', between: 'oat', below: 'sage' } as const;
  const names = { plum: 'Plum', oat: 'Oat', sage: 'Sage' } as const;
  await board.tool('f');
  for (const where of ['above', 'between', 'below'] as const) {
    await page.getByRole('combobox', { name: 'Fabric to fill with' }).click();
    await page.getByRole('option', { name: names[fabricOf[where]] }).click();
    await board.click(inside[where]);
  }
  // The Sections outline names each patch's fabric.
  await expect.poll(() => board.patchFabrics()).toEqual(['Oat', 'Plum', 'Sage']);

  // The saved document: each click point lies in the patch that carries its fabric (piecing derives them).
  await new PatternPage(page).waitForSaved();
  const id = /\/patterns\/([^/]+)\//.exec(page.url())![1];
  await expect
    .poll(async () => {
      const stored = (await (await page.request.get(`/api/patterns/${id}`)).json()) as { revision: { document: PatternDocumentInput } };
      const doc = readPatternDocument(stored.revision.document);
      const { patches } = derivePatches(doc.sections[0]);
      return Object.fromEntries(
        (Object.keys(inside) as Array<keyof typeof inside>).map((where) => [where, patches.find((p) => locatePoint(inside[where], p.polygon) === 'inside')?.fabricId ?? null]),
      );
    })
    .toEqual(fabricOf);
  await shot(page, 'fan-filled');
  expect(errors).toEqual([]);
});
