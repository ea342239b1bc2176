import { expect, test, type Page } from '@playwright/test';
import { AuthPage } from './pages/auth.page';
import { PatternsPage } from './pages/patterns.page';
import { PatternPage } from './pages/pattern.page';
import { DraftingBoardPage } from './pages/drafting-board.page';

/*
 * History in runs of saves: several autosaves of one sitting at the board share one row; "Save as
 * version" with a note makes a named revision that stands on a row of its own (docs/api.md, "Revisions").
 */

const run = Date.now().toString(36);
const designer = { name: 'Vera Version', email: `vera-${run}@example.test`, password: 'runs-and-versions', role: 'designer' as const };
const shot = (page: Page, name: string) => page.screenshot({ path: `e2e/artifacts/${name}.png`, fullPage: true });

test.use({ actionTimeout: 15_000, navigationTimeout: 20_000 });

test('autosaves of one sitting share a History row; a named version with a note stands apart', async ({ page }) => {
  test.setTimeout(120_000);
  await page.setViewportSize({ width: 1366, height: 1000 });
  await new AuthPage(page).signUp(designer);
  await expect(page.getByRole('heading', { name: 'Patterns' })).toBeVisible();
  await new PatternsPage(page).create('Lantern Study', 'Two straight sections');
  const patternPage = new PatternPage(page);
  const board = new DraftingBoardPage(page);
  await board.ready();

  // Three seams, each left to autosave: revisions 2, 3 and 4 of this board's one editing session.
  const savedAs = (n: number) => page.getByRole('status').filter({ hasText: `All changes saved · revision ${n}` });
  await board.tool('l');
  for (const [i, y] of [2, 6, 1].entries()) {
    await board.drag({ x: 0, y }, { x: 8, y });
    await expect(savedAs(i + 2)).toBeVisible({ timeout: 20_000 });
  }
  // Three seams, each splitting one patch of the two sections: five patches.
  await expect.poll(() => board.counts()).toEqual({ sections: 2, patches: 5 });

  // Save as version: the drawing as it stands becomes revision 5, named.
  await page.getByRole('button', { name: 'Save as version' }).click();
  const dialog = page.getByRole('dialog', { name: 'Save as version' });
  await dialog.getByRole('button', { name: 'Save version' }).click();
  await expect(dialog.getByText('The name is required')).toBeVisible();
  await dialog.getByLabel('Version name').fill('Ready for a test block');
  await dialog.getByLabel('Note (optional)').fill('Three seams; strips cut 1 in. and 2 in.');
  await shot(page, 'history-save-version-dialog');
  await dialog.getByRole('button', { name: 'Save version' }).click();
  await expect(dialog).toBeHidden();
  await expect(page.getByText('Saved as version “Ready for a test block” (revision 5)')).toBeVisible();
  await expect(savedAs(5)).toBeVisible();

  // Drawing on after the version starts a new run.
  await board.drag({ x: 0, y: 3 }, { x: 8, y: 3 });
  await expect(savedAs(6)).toBeVisible({ timeout: 20_000 });

  await patternPage.open('History');
  const table = page.getByRole('table', { name: 'Revisions', exact: true });
  const rows = table.locator(':scope > tbody > tr');
  await expect(rows).toHaveCount(4);
  await expect(rows.nth(0)).toContainText('Revision 6');
  await expect(rows.nth(0)).toContainText('latest');
  const version = rows.nth(1);
  await expect(version).toContainText('Revision 5');
  await expect(version).toContainText('Version');
  await expect(version).toContainText('Ready for a test block');
  await expect(version).toContainText('Three seams; strips cut 1 in. and 2 in.');
  await expect(version.getByText('bookmark')).toHaveAttribute('aria-hidden', 'true');
  const sitting = rows.nth(2);
  await expect(sitting).toContainText('Revisions 2–4');
  await expect(sitting).toContainText('3 saves in one sitting');
  await expect(sitting).toContainText('Vera Version');
  await expect(rows.nth(3)).toContainText('Revision 1');
  await shot(page, 'history-versions');

  // Opening the run lists each of its saves.
  const show = page.getByRole('button', { name: 'Show 3 saves of revisions 2–4' });
  await expect(show).toHaveAttribute('aria-expanded', 'false');
  await show.focus();
  await page.keyboard.press('Enter');
  const saves = page.getByRole('table', { name: 'Saves of revisions 2–4' });
  await expect(saves.locator('tbody tr')).toHaveCount(3);
  await expect(saves.locator('tbody tr td:first-child')).toHaveText(['4', '3', '2']);
  await expect(page.getByRole('button', { name: 'Hide 3 saves of revisions 2–4' })).toHaveAttribute('aria-expanded', 'true');
  await expect(page.getByRole('button', { name: 'Hide 3 saves of revisions 2–4' })).toBeFocused();
  await shot(page, 'history-versions-open');
  await page.getByRole('button', { name: 'Use dark theme' }).click();
  await shot(page, 'history-versions-dark');

  // The version read-only says what it is.
  await page.getByRole('link', { name: 'Open revision 5 read-only' }).click();
  const named = page.getByRole('region', { name: 'Named version' });
  await expect(named).toContainText('Ready for a test block');
  await expect(named).toContainText('Three seams; strips cut 1 in. and 2 in.');
  await shot(page, 'history-version-view');
});
