import { expect, test, type Page } from '@playwright/test';
import { AuthPage } from './pages/auth.page';
import { DraftingBoardPage, type InchPoint } from './pages/drafting-board.page';
import { PatternPage } from './pages/pattern.page';
import { PatternsPage } from './pages/patterns.page';

/*
 * Tracing an image on the Drafting board (issue 13): uploading keeps the undo history (the upload is
 * itself one undo step), and opacity, moving, scale from two picked points and removal each reach the
 * saved document. Screens go to e2e/artifacts/.
 */

const run = Date.now().toString(36);
const designer = { name: 'Tess Trace', email: `tess-${run}@example.test`, password: 'trace-image-13', role: 'designer' as const };

interface StoredImage {
  uploadId: string;
  origin: { x: number; y: number };
  widthIn: number;
  opacity: number;
}

/** The trace image of the latest saved revision, read through the API. */
async function savedImage(page: Page, patternId: string): Promise<StoredImage | undefined> {
  const r = await page.request.get(`/api/patterns/${patternId}`);
  return ((await r.json()) as { revision: { document: { referenceImage?: StoredImage } } }).revision.document.referenceImage;
}

test('trace an image: upload keeps undo, then opacity, move, scale and remove are saved', async ({ page }) => {
  test.setTimeout(120_000);
  await page.setViewportSize({ width: 1440, height: 960 });
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));

  await new AuthPage(page).signUp(designer);
  await expect(page.getByRole('heading', { name: 'Patterns' })).toBeVisible();
  const patternId = await new PatternsPage(page).create(`Trace test ${run}`, 'Blank block');
  const board = new DraftingBoardPage(page);
  const pattern = new PatternPage(page);
  await board.ready();

  // Something to undo first: an arc section (press at the centre, drag to the outer radius, click
  // the inner radius, click the end angle), in whole inches so the ⅛ in. snap keeps them.
  const area = await board.canvas();
  const C: InchPoint = { x: Math.round(area.widthIn / 2), y: Math.round(area.heightIn / 2) };
  const polar = (r: number, deg: number): InchPoint => ({ x: C.x + r * Math.cos((deg * Math.PI) / 180), y: C.y + r * Math.sin((deg * Math.PI) / 180) });
  await board.tool('a');
  await board.drag(C, polar(4, 0));
  await board.click(polar(2, 0));
  await board.click(polar(3, 90));
  await expect(board.hint()).toHaveText('Press at the centre and drag out to the outer radius');
  await expect.poll(() => board.counts()).toEqual({ sections: 1, patches: 1 });
  const drawn = await pattern.waitForSaved();

  // A 1 × 1 PNG (PNG signature and chunks per ISO/IEC 15948), built inline.
  const png = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==', 'base64');
  await page.getByLabel('Image to trace').setInputFiles({ name: 'sketch.png', mimeType: 'image/png', buffer: png });
  await expect(page.getByText('Tracing “sketch.png”')).toBeVisible();
  const panel = page.getByRole('region', { name: 'Trace image' });
  await expect(panel).toBeVisible();
  await expect.poll(async () => (await savedImage(page, patternId))?.uploadId ?? null, { timeout: 20_000 }).not.toBeNull();
  expect(await pattern.waitForSaved()).toBeGreaterThan(drawn);
  expect(await savedImage(page, patternId)).toMatchObject({ origin: { x: 0, y: 0 }, widthIn: area.widthIn, opacity: 0.4 });

  // Undo still holds the drawing: Ctrl+Z takes the image away, a second Ctrl+Z the arc section.
  await board.board().focus();
  await page.keyboard.press('Control+z');
  await expect(panel).toBeHidden();
  await expect.poll(() => board.counts()).toEqual({ sections: 1, patches: 1 });
  await page.keyboard.press('Control+z');
  await expect.poll(() => board.counts()).toEqual({ sections: 0, patches: 0 });
  await page.keyboard.press('Control+Shift+z');
  await page.keyboard.press('Control+Shift+z');
  await expect.poll(() => board.counts()).toEqual({ sections: 1, patches: 1 });
  await expect(panel).toBeVisible();

  // Opacity from the labelled slider.
  await panel.getByLabel('Opacity').fill('70');
  await expect(panel.locator('output')).toHaveText('70 %');
  await expect.poll(async () => (await savedImage(page, patternId))?.opacity, { timeout: 20_000 }).toBe(0.7);

  // Move: the arrow keys on the move group nudge by ⅛ in.
  await panel.getByRole('group', { name: 'Move trace image' }).focus();
  await page.keyboard.press('ArrowRight');
  await page.keyboard.press('ArrowDown');
  await expect.poll(async () => (await savedImage(page, patternId))?.origin, { timeout: 20_000 }).toEqual({ x: 0.125, y: 0.125 });

  // Scale: two points picked on the board, 4 in. apart as the image shows them, are truly 8 in. apart.
  await panel.getByRole('button', { name: 'Set scale' }).click();
  await board.click({ x: 2, y: 2 });
  await expect(panel.getByText('Click the second point')).toBeVisible();
  await board.click({ x: 6, y: 2 });
  const distance = panel.getByLabel('True distance');
  await expect(distance).toBeVisible();
  expect(Math.abs(Number(await distance.inputValue()) - 4)).toBeLessThan(0.05);
  await distance.fill('8');
  await distance.press('Enter');
  await expect(panel.getByRole('button', { name: 'Set scale' })).toBeVisible();
  // The points are screen clicks, so |pq| is 4 in. to within a pixel: the width doubles to within 2 %.
  await expect.poll(async () => (await savedImage(page, patternId))?.widthIn ?? 0, { timeout: 20_000 }).toBeGreaterThan(area.widthIn * 2 * 0.98);
  const scaled = (await savedImage(page, patternId))!;
  expect(scaled.widthIn).toBeLessThan(area.widthIn * 2 * 1.02);
  // The first point stays put: origin' = p − (p − origin)·k with p ≈ (2, 2), origin (⅛, ⅛), k ≈ 2.
  expect(scaled.origin.x).toBeCloseTo(2 - (2 - 0.125) * 2, 0);
  expect(scaled.origin.y).toBeCloseTo(2 - (2 - 0.125) * 2, 0);
  await expect.poll(() => board.counts()).toEqual({ sections: 1, patches: 1 });
  await page.screenshot({ path: 'e2e/artifacts/trace-image-panel.png' });

  // Remove: the saved document has no image; the drawing stays.
  await panel.getByRole('button', { name: 'Remove image' }).click();
  await expect(panel).toBeHidden();
  await expect.poll(async () => (await savedImage(page, patternId)) === undefined, { timeout: 20_000 }).toBe(true);
  await expect.poll(() => board.counts()).toEqual({ sections: 1, patches: 1 });
  expect(errors).toEqual([]);
});
