import { expect, test, type Locator, type Page } from '@playwright/test';
import { buildOrchardWheel, readPatternDocument, type PatternDocumentInput } from '../projects/piecing/src/public-api';
import { DraftingBoardPage } from './pages/drafting-board.page';
import { PatternPage } from './pages/pattern.page';

/*
 * The whole path a keyboard user takes, without the mouse at any step (only page.keyboard): sign in,
 * create a pattern from a starter, select section B from the Sections outline, nudge it ⅛ in. right
 * (the saved document shows it), undo, open the cutting list, make a print set and download it. The
 * account itself is made through the API beforehand (signing up is not part of this path).
 */

const run = Date.now().toString(36);
const user = { displayName: 'Kay Keys', email: `kay-${run}@example.test`, password: 'no-mouse-today-8', role: 'designer' as const };

/** Whether `target` has focus. */
const hasFocus = (target: Locator) => target.evaluate((el) => el === document.activeElement || el.contains(document.activeElement));

/** Presses `key` (Tab by default) until `target` has focus, as a keyboard user moves through a page. */
async function pressUntilFocused(page: Page, target: Locator, key = 'Tab', max = 120): Promise<void> {
  await expect(target).toBeVisible();
  for (let i = 0; i < max; i++) {
    if (await hasFocus(target)) return;
    await page.keyboard.press(key);
  }
  throw new Error(`${key} × ${max} never reached ${String(target)}`);
}

/** The saved B section's first corner, read through the API. */
async function savedCornerOfB(page: Page, patternId: string): Promise<{ x: number; y: number }> {
  const stored = (await (await page.request.get(`/api/patterns/${patternId}`)).json()) as { revision: { document: PatternDocumentInput } };
  const b = readPatternDocument(stored.revision.document).sections.find((s) => s.label === 'B');
  if (!b || b.geometry.kind !== 'straight') throw new Error('no straight section B saved');
  return b.geometry.vertices[0];
}

test('a keyboard alone: sign in, select B in the outline, nudge it, undo, cutting list, print set downloaded', async ({ page, playwright, baseURL }) => {
  test.setTimeout(150_000);
  await page.setViewportSize({ width: 1366, height: 1000 });
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));

  // The account, made through the API in a context of its own (the browser is not signed in by it).
  const api = await playwright.request.newContext({ baseURL });
  const { csrfToken } = (await (await api.get('/api/auth/csrf')).json()) as { csrfToken: string };
  expect((await api.post('/api/auth/sign-up', { data: user, headers: { 'x-csrf-token': csrfToken } })).status()).toBe(201);
  await api.dispose();

  // Sign in: Tab to the fields, type, Enter.
  await page.goto('/sign-in');
  await pressUntilFocused(page, page.getByLabel('E-mail'));
  await page.keyboard.type(user.email);
  await pressUntilFocused(page, page.getByLabel('Password'));
  await page.keyboard.type(user.password);
  await page.keyboard.press('Enter');
  await expect(page.getByRole('heading', { name: 'Patterns' })).toBeVisible();

  // New pattern from the "Two straight sections" starter (A above B).
  await pressUntilFocused(page, page.getByRole('button', { name: 'New pattern' }));
  await page.keyboard.press('Enter');
  const dialog = page.getByRole('dialog', { name: 'New pattern' });
  await pressUntilFocused(page, dialog.getByLabel('Title'));
  await page.keyboard.type(`Keys only ${run}`);
  await pressUntilFocused(page, dialog.getByRole('radio', { checked: true }));
  await pressUntilFocused(page, dialog.getByRole('radio', { name: /Two straight sections/ }), 'ArrowDown', 6);
  await expect(dialog.getByRole('radio', { name: /Two straight sections/ })).toBeChecked();
  await pressUntilFocused(page, dialog.getByRole('button', { name: 'Create' }));
  await page.keyboard.press('Enter');
  await page.waitForURL(/\/patterns\/[^/]+\/board$/);
  const patternId = new URL(page.url()).pathname.split('/')[2];
  const board = new DraftingBoardPage(page);
  await board.ready();

  // The Sections outline: one Tab stop; Down, Down reaches section B; Enter selects it on the board.
  const itemB = board.sectionItems().filter({ has: page.getByText('B, straight section, 1 patch') });
  await pressUntilFocused(page, board.outline().getByRole('treeitem', { name: 'A, straight section, 1 patch' }));
  await page.keyboard.press('ArrowDown');
  await page.keyboard.press('ArrowDown');
  await expect(itemB).toBeFocused();
  await page.keyboard.press('Enter');
  await expect(board.liveRegion()).toHaveText('Section B selected: straight section, 1 patch');
  await expect(itemB).toHaveAttribute('aria-selected', 'true');
  await expect(itemB).toBeFocused();
  await expect(page.getByRole('heading', { name: /Section B/ })).toBeVisible();
  await page.screenshot({ path: 'e2e/artifacts/keyboard-outline-light.png' });

  // Back to the board (it comes before the side column), then one arrow press: ⅛ in. right.
  await pressUntilFocused(page, board.board(), 'Shift+Tab');
  await page.keyboard.press('ArrowRight');
  await expect(board.liveRegion()).toHaveText(/^Section B moved ⅛ in\. right\s*$/);
  await new PatternPage(page).waitForSaved();
  await expect.poll(() => savedCornerOfB(page, patternId), { timeout: 20_000 }).toEqual({ x: 0.125, y: 4 });

  // Undo: one step, and the saved document is back where it was.
  await page.keyboard.press('Control+z');
  await expect(board.liveRegion()).toHaveText(/^Undone: move section B\s*$/);
  await expect.poll(() => savedCornerOfB(page, patternId), { timeout: 20_000 }).toEqual({ x: 0, y: 4 });

  // The keyboard help: ? on the board opens it, Escape closes it and the board has focus again.
  await page.keyboard.press('?');
  const help = page.getByRole('dialog', { name: 'Keys of the Drafting board' });
  await expect(help.getByRole('rowheader', { name: 'Shift + arrow keys' })).toBeVisible();
  await page.keyboard.press('Escape');
  await expect(help).toBeHidden();
  await expect(board.board()).toBeFocused();

  // The same board in the dark theme (the header's theme button, reached backwards from the board).
  await pressUntilFocused(page, page.getByRole('button', { name: 'Use dark theme' }), 'Shift+Tab', 120);
  await page.keyboard.press('Enter');
  await expect(page.getByRole('button', { name: 'Use light theme' })).toBeVisible();
  await page.screenshot({ path: 'e2e/artifacts/keyboard-outline-dark.png' });

  // The cutting list: the parts of the pattern are tabs after the header (Tab reaches the current one,
  // arrows move).
  const parts = new PatternPage(page).parts();
  await pressUntilFocused(page, parts.getByRole('tab', { selected: true }), 'Tab', 120);
  await pressUntilFocused(page, parts.getByRole('tab').filter({ hasText: 'Cutting list' }), 'ArrowRight', 8);
  await page.keyboard.press('Enter');
  await page.waitForURL(/\/cutting$/);
  // A and B of the starter, one patch each.
  await expect(page.getByText(/2 patches per block/)).toBeVisible({ timeout: 20_000 });
  await expect(page.getByRole('button', { name: 'Print the cutting list' })).toBeVisible();

  // Print: make a print set and download it.
  await pressUntilFocused(page, parts.getByRole('tab', { selected: true }), 'Tab', 120);
  await pressUntilFocused(page, parts.getByRole('tab').filter({ hasText: 'Print' }), 'ArrowRight', 8);
  await page.keyboard.press('Enter');
  await page.waitForURL(/\/print$/);
  await pressUntilFocused(page, page.getByRole('button', { name: 'Make print set' }));
  await page.keyboard.press('Enter');
  const ready = page.getByRole('status').filter({ hasText: /Ready: \d+ pages/ });
  await expect(ready).toBeVisible({ timeout: 45_000 });
  const download = page.getByRole('status').getByRole('link', { name: 'Download' });
  await pressUntilFocused(page, download);
  const file = page.waitForEvent('download');
  await page.keyboard.press('Enter');
  const pdf = await (await file).createReadStream();
  const chunks: Buffer[] = [];
  for await (const c of pdf) chunks.push(c as Buffer);
  const bytes = Buffer.concat(chunks);
  // A PDF file starts with "%PDF-" (ISO 32000-1, 7.5.2 File Header).
  expect(bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-');
  expect(bytes.length).toBeGreaterThan(1000);
  expect(errors).toEqual([]);
});

/*
 * Issue 21's screens by the keyboard alone (the account and the demo Orchard Wheel, which has a quilt
 * layout, two colourways and three sizes, are made through the API): the board's colourway choice and
 * the four-blocks panel, then the Quilt tab's colourway, the quilt picture, the layout form, the size
 * chart, the colourways side by side and the exports, and the quilt choice bar of the cutting list.
 * Every control is reached with Tab, shows focus (:focus-visible) and keeps it after its choice.
 */
test('a keyboard alone: the board in a colourway, the four blocks, the Quilt tab and the quilt choice bar', async ({ page }) => {
  test.setTimeout(180_000);
  await page.setViewportSize({ width: 1366, height: 1000 });
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  // Signed up through the page's own request context, so the browser is signed in.
  const { csrfToken } = (await (await page.request.get('/api/auth/csrf')).json()) as { csrfToken: string };
  const quilter = { displayName: 'Kit Keys', email: `kit-${run}@example.test`, password: 'no-mouse-quilt-8', role: 'designer' as const };
  expect((await page.request.post('/api/auth/sign-up', { data: quilter, headers: { 'x-csrf-token': csrfToken } })).status()).toBe(201);
  const csrf = ((await (await page.request.get('/api/auth/csrf')).json()) as { csrfToken: string }).csrfToken;
  const created = await page.request.post('/api/patterns', { data: { document: { ...buildOrchardWheel(), title: `Keys quilt ${run}` } }, headers: { 'x-csrf-token': csrf } });
  expect(created.status()).toBe(201);
  const id = ((await created.json()) as { pattern: { id: string } }).pattern.id;
  const focusVisible = () => page.evaluate(() => document.activeElement?.matches(':focus-visible') ?? false);

  await page.goto(`/patterns/${id}/board`);
  const board = new DraftingBoardPage(page);
  await board.ready();

  // The board's colourway: reached by Tab, the arrow keys choose (Pattern fabrics → Dusk → Frost), focus stays.
  const boardChoice = page.getByRole('combobox', { name: 'Board colourway' });
  await pressUntilFocused(page, boardChoice);
  expect(await focusVisible()).toBe(true);
  await page.keyboard.press('ArrowDown');
  await page.keyboard.press('ArrowDown');
  await expect(boardChoice).toHaveText(/Frost/);
  await expect(boardChoice).toBeFocused();
  await expect(board.board()).toHaveAttribute('data-colourway', 'frost');
  await page.screenshot({ path: 'e2e/artifacts/keyboard-board-colourway.png' });

  // The four blocks: opened with Enter; their colourway follows the board's and is the next stop.
  const fourBlocks = page.getByRole('button', { name: 'Four blocks' });
  await pressUntilFocused(page, fourBlocks);
  await page.keyboard.press('Enter');
  await expect(fourBlocks).toHaveAttribute('aria-expanded', 'true');
  const fourChoice = page.getByRole('combobox', { name: 'Four blocks colourway' });
  await pressUntilFocused(page, fourChoice, 'Tab', 4);
  await expect(fourChoice).toHaveText(/Frost/);
  await page.keyboard.press('ArrowUp');
  await expect(fourChoice).toHaveText(/Dusk/);
  await expect(fourChoice).toBeFocused();
  await expect(boardChoice).toHaveText(/Frost/);

  // The Quilt tab: the bar's colourway, the picture (arrows choose a block), the layout form, the size
  // chart, the colourways side by side and the exports, each reached by Tab.
  await page.goto(`/patterns/${id}/quilt`);
  await expect(page.getByTestId('finished-size')).toBeVisible({ timeout: 30_000 });
  const quiltColourway = page.getByRole('combobox', { name: 'Colourway', exact: true });
  await pressUntilFocused(page, quiltColourway);
  expect(await focusVisible()).toBe(true);
  await page.keyboard.press('ArrowDown');
  await expect(quiltColourway).toHaveText(/Dusk/);
  await expect(quiltColourway).toBeFocused();
  await expect(page.getByRole('list', { name: 'Colourways side by side' }).getByRole('button', { name: 'Dusk' })).toHaveAttribute('aria-pressed', 'true');
  await pressUntilFocused(page, page.getByRole('button', { name: 'Quilt picture (SVG)' }));
  expect(await focusVisible()).toBe(true);
  await pressUntilFocused(page, page.getByRole('button', { name: 'Quilt picture (PNG)' }), 'Tab', 3);
  const picture = page.getByRole('group', { name: /Quilt picture/ });
  await pressUntilFocused(page, picture);
  await page.keyboard.press('ArrowRight');
  await expect(page.getByText('Chosen block: row 1, position 2')).toBeVisible();
  await pressUntilFocused(page, page.getByLabel('Columns', { exact: true }));
  expect(await focusVisible()).toBe(true);
  await pressUntilFocused(page, page.getByLabel('Size 1 name'));
  await pressUntilFocused(page, page.getByRole('radio', { name: 'As laid out' }));
  await pressUntilFocused(page, page.getByRole('radio', { name: 'Bed 3 × 3' }), 'ArrowRight', 4);
  await expect(page.getByRole('radio', { name: 'Bed 3 × 3' })).toBeChecked();
  await expect(page.getByRole('combobox', { name: 'Quilt size' })).toHaveText(/Bed 3 × 3/);
  const frostCard = page.getByRole('list', { name: 'Colourways side by side' }).getByRole('button', { name: 'Frost' });
  await pressUntilFocused(page, frostCard);
  expect(await focusVisible()).toBe(true);
  await page.keyboard.press('Enter');
  await expect(frostCard).toHaveAttribute('aria-pressed', 'true');
  await expect(frostCard).toBeFocused();
  await expect(quiltColourway).toHaveText(/Frost/);
  await page.screenshot({ path: 'e2e/artifacts/keyboard-quilt-colourways.png' });

  // The cutting list (through the pattern's tabs: the choice is kept for the open pattern): its quilt
  // choice bar shows the size and colourway chosen on the Quilt tab, and its controls are Tab stops.
  const parts = new PatternPage(page).parts();
  await pressUntilFocused(page, parts.getByRole('tab', { selected: true }), 'Shift+Tab', 160);
  await pressUntilFocused(page, parts.getByRole('tab').filter({ hasText: 'Cutting list' }), 'ArrowRight', 8);
  await page.keyboard.press('Enter');
  await page.waitForURL(/\/cutting$/);
  const size = page.getByRole('combobox', { name: 'Quilt size' });
  await pressUntilFocused(page, size);
  expect(await focusVisible()).toBe(true);
  await expect(size).toHaveText(/Bed 3 × 3/);
  await pressUntilFocused(page, page.getByRole('combobox', { name: 'Colourway', exact: true }));
  await expect(page.getByRole('combobox', { name: 'Colourway', exact: true })).toHaveText(/Frost/);
  expect(errors).toEqual([]);
});
