import AxeBuilder from '@axe-core/playwright';
import { expect, test, type Page } from '@playwright/test';
import { AuthPage } from './pages/auth.page';
import { DraftingBoardPage } from './pages/drafting-board.page';
import { PatternPage } from './pages/pattern.page';
import { PatternsPage } from './pages/patterns.page';

/*
 * axe (WCAG 2.0–2.2 A and AA rules) over the screens this work changed, in the light and the dark
 * theme: the pattern list, the drafting board with its pattern settings and a selected section's
 * seams, History, and Print. Serious and critical findings fail the test; each is listed with its rule
 * and the elements it found.
 */

const run = Date.now().toString(36);
const designer = { name: 'Ada Axe', email: `ada-axe-${run}@example.test`, password: 'checked-by-axe-2', role: 'designer' as const };

async function seriousFindings(page: Page): Promise<string[]> {
  const result = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa']).analyze();
  return result.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => `${v.id} (${v.impact}): ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`);
}

test('the changed screens have no serious or critical axe findings in either theme', async ({ page }) => {
  test.setTimeout(180_000);
  await page.setViewportSize({ width: 1366, height: 1000 });
  await new AuthPage(page).signUp(designer);
  await expect(page.getByRole('heading', { name: 'Patterns' })).toBeVisible();
  await new PatternsPage(page).create(`Axe check ${run}`, 'Two straight sections');
  const board = new DraftingBoardPage(page);
  await board.ready();
  // A seam, so the selected section lists typed seam ends; then the pattern settings opened.
  await board.tool('l');
  await board.drag({ x: 0, y: 2 }, { x: 8, y: 2 });
  // One seam across one of the two sections: three patches.
  await expect.poll(() => board.counts()).toEqual({ sections: 2, patches: 3 });
  await new PatternPage(page).waitForSaved();
  await page.getByText('Pattern settings', { exact: true }).click();
  await expect(page.getByText('Sewing', { exact: true })).toBeVisible();

  for (const theme of ['light', 'dark'] as const) {
    if (theme === 'dark') await page.getByRole('button', { name: 'Use dark theme' }).click();
    expect(await seriousFindings(page), `board, ${theme}`).toEqual([]);
    await new PatternPage(page).open('History');
    await expect(page.getByRole('table', { name: 'Revisions', exact: true })).toBeVisible();
    expect(await seriousFindings(page), `history, ${theme}`).toEqual([]);
    await new PatternPage(page).open('Print');
    await expect(page.getByRole('heading', { level: 1 })).toBeVisible();
    expect(await seriousFindings(page), `print, ${theme}`).toEqual([]);
    await page.getByRole('link', { name: 'Patterns' }).first().click();
    await expect(page.getByRole('heading', { name: 'Patterns' })).toBeVisible();
    expect(await seriousFindings(page), `patterns, ${theme}`).toEqual([]);
    if (theme === 'light') {
      await new PatternsPage(page).row(`Axe check ${run}`).getByRole('link', { name: `Axe check ${run}`, exact: true }).click();
      await board.ready();
      await page.getByText('Pattern settings', { exact: true }).click();
      await expect(page.getByText('Sewing', { exact: true })).toBeVisible();
    }
  }
});
