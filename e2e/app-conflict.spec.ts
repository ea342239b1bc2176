import { expect, test, type Page } from '@playwright/test';
import { AuthPage } from './pages/auth.page';
import { PatternsPage } from './pages/patterns.page';
import { PatternPage } from './pages/pattern.page';
import { DraftingBoardPage } from './pages/drafting-board.page';


/*
 * Two editors of one pattern: the second one's autosave is stale (409). The app says someone else
 * saved, keeps the drawing, and keeping a copy makes a new pattern of it. Leaving with unsaved
 * changes asks first.
 */

const run = Date.now().toString(36);
const designer = { name: 'Cora Conflict', email: `cora-${run}@example.test`, password: 'two-tabs-one-pattern', role: 'designer' as const };
const shot = (page: Page, name: string) => page.screenshot({ path: `e2e/artifacts/app-${name}.png`, fullPage: true });

test.use({ actionTimeout: 15_000, navigationTimeout: 20_000 });

test('a stale save shows who saved, keeps the drawing and can keep it as a copy; leaving unsaved asks first', async ({ browser }) => {
  test.setTimeout(120_000);
  const ctx = await browser.newContext({ viewport: { width: 1366, height: 900 } });
  const first = await ctx.newPage();
  await new AuthPage(first).signUp(designer);
  await expect(first.getByRole('heading', { name: 'Patterns' })).toBeVisible();
  const id = await new PatternsPage(first).create('Gate Study', 'Two straight sections');

  // A second tab opens the same revision.
  const second = await ctx.newPage();
  await second.goto(`/patterns/${id}/board`);
  const board2 = new DraftingBoardPage(second);
  await board2.ready();

  // The first tab splits section A and autosaves revision 2.
  const board1 = new DraftingBoardPage(first);
  await board1.ready();
  await board1.tool('l');
  await board1.drag({ x: 0, y: 2 }, { x: 8, y: 2 });
  expect(await new PatternPage(first).waitForSaved()).toBe(2);

  // The second tab, still on revision 1, splits section B: its save is refused as stale.
  await board2.tool('l');
  await board2.drag({ x: 0, y: 6 }, { x: 8, y: 6 });
  const conflict = second.getByRole('alertdialog', { name: 'Someone else saved this pattern' });
  await expect(conflict).toBeVisible({ timeout: 20_000 });
  await expect(conflict).toContainText('Cora Conflict saved revision 2');
  await expect(second.getByRole('status').filter({ hasText: 'Not saved: someone else saved first' })).toBeVisible();
  await expect.poll(() => board2.counts()).toEqual({ sections: 2, patches: 3 });
  await shot(second, 'board-conflict');

  // Keep mine as a copy: a new pattern holding the second tab's drawing.
  await conflict.getByRole('button', { name: 'Keep mine as a copy' }).click();
  await expect(new PatternPage(second).heading()).toHaveText('Gate Study (my copy)');
  expect(new URL(second.url()).pathname).not.toContain(id);
  await board2.ready();
  await expect.poll(() => board2.counts()).toEqual({ sections: 2, patches: 3 });

  // Leaving with unsaved changes asks; dismissing stays on the board.
  await board1.tool('l');
  await board1.drag({ x: 0, y: 6 }, { x: 8, y: 6 });
  let asked = '';
  first.once('dialog', (d) => {
    asked = d.message();
    void d.dismiss();
  });
  await new PatternPage(first).parts().getByRole('tab').filter({ hasText: 'Cutting list' }).click();
  await expect.poll(() => asked).toContain('not saved yet');
  expect(new URL(first.url()).pathname).toMatch(/\/board$/);
  const latest = await new PatternPage(first).waitForSaved();

  // History: restore revision 1 as a new revision; the old ones stay.
  first.on('dialog', (d) => void d.accept());
  await new PatternPage(first).open('History');
  await first.getByRole('button', { name: 'Restore revision 1' }).click();
  await first.waitForURL(/\/board$/);
  await new PatternPage(first).open('History');
  const rows = first.getByRole('table', { name: 'Revisions', exact: true }).getByRole('row');
  // Header, the restore, this board's autosaves (revisions 2 to latest, one sitting) and revision 1.
  await expect(rows).toHaveCount(4);
  await expect(rows.nth(2)).toContainText(`Revisions 2–${latest}`);
  await expect(rows.nth(1)).toContainText('Restored from revision 1');
  await shot(first, 'history-restored');

  // The list: duplicate, move the copy to the trash, restore it from there.
  const list = new PatternsPage(first);
  await list.goto();
  await first.getByRole('button', { name: 'Actions for Gate Study', exact: true }).click();
  await first.getByRole('menuitem', { name: 'Duplicate' }).click();
  await expect(first.getByRole('link', { name: 'Gate Study (copy)' })).toBeVisible();
  await first.getByRole('button', { name: 'Actions for Gate Study (copy)' }).click();
  await first.getByRole('menuitem', { name: 'Move to trash' }).click();
  await expect(first.getByRole('link', { name: 'Gate Study (copy)' })).toHaveCount(0);
  await first.getByRole('radio', { name: 'Trash' }).click();
  await expect(first.getByRole('heading', { name: 'Trash' })).toBeVisible();
  await expect(first.getByRole('cell', { name: 'Gate Study (copy)', exact: true })).toBeVisible();
  await shot(first, 'patterns-trash');
  await first.getByRole('button', { name: 'Actions for Gate Study (copy)' }).click();
  await first.getByRole('menuitem', { name: 'Restore' }).click();
  await expect(first.getByText('The trash is empty.')).toBeVisible();
  await first.getByRole('radio', { name: 'All' }).click();
  await expect(first.getByRole('link', { name: 'Gate Study (copy)' })).toBeVisible();
  // Search narrows the list by title.
  await first.getByLabel('Search titles').fill('my copy');
  await expect(first.getByRole('link', { name: 'Gate Study (my copy)' })).toBeVisible();
  await expect(first.getByRole('link', { name: 'Gate Study', exact: true })).toHaveCount(0);
  await ctx.close();
});
