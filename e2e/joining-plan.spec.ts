import { expect, test, type Page } from '@playwright/test';
import { buildOrchardWheel, derivePatches, type PatternDocument } from '../projects/piecing/src/public-api';
import { AuthPage } from './pages/auth.page';
import { DraftingBoardPage } from './pages/drafting-board.page';
import { PatternPage } from './pages/pattern.page';

/*
 * The designer sets a rough cut and a joining plan on the Drafting board against the real server:
 * Orchard Wheel opens, one patch gets a 3 × 3 in. rough cut, the proposed joining plan becomes the
 * designer's, a ring is moved first and pressed the other way round, and the saved revision (read back
 * through the API) holds all of it; the cutting list shows the set piece. Screens of the board with the
 * panel open and a join pointed at, in both themes, go to e2e/artifacts/.
 */

const run = Date.now().toString(36);
const shot = (page: Page, name: string) => page.screenshot({ path: `e2e/artifacts/joining-plan-${name}.png` });

test.use({ actionTimeout: 20_000, navigationTimeout: 20_000 });

test('the designer sets a rough cut and a joining plan, and the saved pattern holds them', async ({ page }) => {
  test.setTimeout(180_000);
  await page.setViewportSize({ width: 1440, height: 1000 });
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await new AuthPage(page).signUp({ name: 'Jo Joiner', email: `jo-${run}@example.test`, password: 'orchard-wheel-24', role: 'designer' });
  await expect(page.getByRole('heading', { name: 'Patterns' })).toBeVisible();
  const { csrfToken } = (await (await page.request.get('/api/auth/csrf')).json()) as { csrfToken: string };
  const wheel = { ...buildOrchardWheel(), title: `Orchard Wheel ${run}` };
  const created = await page.request.post('/api/patterns', { data: { document: wheel }, headers: { 'x-csrf-token': csrfToken } });
  expect(created.status()).toBe(201);
  const { pattern } = (await created.json()) as { pattern: { id: string } };
  const stored = async () => ((await (await page.request.get(`/api/patterns/${pattern.id}`)).json()) as { revision: { document: PatternDocument } }).revision.document;

  // The first plain patch of section A (fabric, no strip set), clicked at its label point.
  const star = wheel.sections[0];
  const target = derivePatches(star).patches.filter((p) => p.fabricId && !p.stripSet).sort((a, b) => a.number - b.number)[0];
  const fabricName = wheel.fabrics.find((f) => f.id === target.fabricId)!.name;

  await page.goto(`/patterns/${pattern.id}/board`);
  const board = new DraftingBoardPage(page);
  await board.ready();
  await board.click(target.labelPoint);
  await expect(page.getByRole('heading', { name: `Patch ${target.label}` })).toBeVisible();

  // A 3 in. square typed the way a designer writes it: width then length.
  const width = page.getByLabel('Rough-cut width');
  await width.fill('3');
  await width.press('Enter');
  const length = page.getByLabel('Rough-cut length');
  await expect(length).toHaveValue('3');
  await length.fill('3');
  await length.press('Enter');
  await expect(page.getByTestId('rough-cut-state')).toContainText('Set by you: 3 in. square.');

  // The joining plan: the proposal (rings first), taken as the designer's own.
  await page.getByRole('button', { name: 'Joining plan' }).click();
  const joins = page.getByRole('list', { name: 'Joins in sewing order' });
  await expect(joins.getByRole('listitem')).toHaveCount(7);
  await expect(joins.getByRole('listitem').first()).toContainText('Join the 8 copies of A into a ring');
  await page.getByRole('button', { name: 'Use this plan' }).click();
  await expect(page.getByTestId('plan-source')).toHaveText('Your joining plan.');

  // The B ring sewn first, its seams pressed anticlockwise.
  await page.getByRole('button', { name: 'Move join 2 up' }).click();
  await expect(joins.getByRole('listitem').first()).toContainText('Join the 8 copies of B into a ring');
  // Its Move up button is gone (it is first now): focus is on the join itself.
  await expect(page.getByRole('button', { name: /^1 Join the 8 copies of B into a ring/ })).toBeFocused();
  await page.getByRole('combobox', { name: 'Pressing of join 1' }).click();
  await page.getByRole('option', { name: 'All one way, anticlockwise' }).click();
  await expect(joins.getByRole('listitem').first()).toContainText('anticlockwise');

  // The saved revision holds the rough cut and the plan.
  await expect
    .poll(async () => {
      const doc = await stored();
      return [doc.joiningPlan?.steps.map((s) => `${s.id}:${s.press}`).slice(0, 2), doc.sections[0].patches.find((p) => p.number === target.number)?.roughCut];
    }, { timeout: 30_000 })
    .toEqual([['ring-stripe-band:anticlockwise', 'ring-star:clockwise'], { widthIn: 3, lengthIn: 3 }]);
  const doc = await stored();
  expect(doc.joiningPlan!.steps).toHaveLength(7);
  // Nothing else about the patch changed.
  expect(doc.sections[0].patches.find((p) => p.number === target.number)?.fabricId).toBe(target.fabricId);

  // Choosing a join points at its seam on the board: the curved seam between the A and B rings, drawn in
  // the highlight's blue (#1d4fd8), which nothing else on the board uses: counted on the board's canvases.
  const highlightPixels = () =>
    page.evaluate(() => {
      let n = 0;
      for (const c of document.querySelectorAll<HTMLCanvasElement>('[role="application"][aria-label="Drafting board"] canvas')) {
        const d = c.getContext('2d')!.getImageData(0, 0, c.width, c.height).data;
        for (let i = 0; i < d.length; i += 4) if (Math.abs(d[i] - 29) < 10 && Math.abs(d[i + 1] - 79) < 10 && Math.abs(d[i + 2] - 216) < 10 && d[i + 3] > 200) n++;
      }
      return n;
    });
  expect(await highlightPixels()).toBe(0);
  const join = page.getByRole('button', { name: /Join the A ring to the B ring/ });
  await join.click();
  await expect(join).toHaveAttribute('aria-pressed', 'true');
  await expect.poll(highlightPixels).toBeGreaterThan(300);
  await page.getByRole('list', { name: 'Joins in sewing order' }).scrollIntoViewIfNeeded();
  await shot(page, 'board-light');
  await page.getByRole('button', { name: 'Use dark theme' }).click();
  await expect(page.locator('html')).toHaveClass(/sw-dark/);
  await expect.poll(highlightPixels).toBeGreaterThan(300);
  await shot(page, 'board-dark');
  // Chosen again, the join is let go and the board shows the drawing alone.
  await join.click();
  await expect(join).toHaveAttribute('aria-pressed', 'false');
  await expect.poll(highlightPixels).toBe(0);

  // The cutting list from the saved revision lists the designer's piece for the patch.
  await new PatternPage(page).open('Cutting list');
  const pieces = page.getByRole('table', { name: `Pieces of ${fabricName}` });
  await expect(pieces.getByRole('row').filter({ hasText: target.label }).getByRole('cell', { name: '3 in. × 3 in.' })).toBeVisible();
  expect(errors).toEqual([]);
});
