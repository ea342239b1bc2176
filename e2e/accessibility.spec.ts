import AxeBuilder from '@axe-core/playwright';
import { expect, test, type Page } from '@playwright/test';
import { buildOrchardWheel } from '../projects/piecing/src/public-api';
import { AuthPage } from './pages/auth.page';
import { DraftingBoardPage } from './pages/drafting-board.page';
import { PatternPage } from './pages/pattern.page';
import { PatternsPage } from './pages/patterns.page';
import { SCREENS, createSamplePattern, openScreen, signUpAs, useTheme } from './pages/screens';

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
  test.setTimeout(400_000);
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
    // The Quilt tab with a layout (set up once, in the first theme; saved before leaving).
    await new PatternPage(page).parts().getByRole('tab').filter({ hasText: 'Quilt' }).click();
    if (theme === 'light') await page.getByRole('button', { name: 'Set the block into a quilt' }).click();
    await expect(page.getByTestId('finished-size')).toBeVisible();
    await expect(page.getByRole('status').filter({ hasText: 'All changes saved' })).toBeVisible({ timeout: 30_000 });
    expect(await seriousFindings(page), `quilt, ${theme}`).toEqual([]);
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

/*
 * Every main screen, signed out and as a designer and a quilter, in both themes; the board with a
 * section selected; each dialog open (New pattern, Save as version, the board's keyboard help, the
 * folded header menu at a narrow width). Target: no serious or critical axe finding anywhere.
 */
async function expectNoSeriousFindings(page: Page, where: string): Promise<void> {
  expect(await seriousFindings(page), where).toEqual([]);
}

async function selectSectionA(page: Page): Promise<void> {
  const item = page.getByRole('tree', { name: 'Sections' }).getByRole('treeitem', { name: /^A, straight section/ });
  await item.focus();
  await page.keyboard.press('Enter');
  await expect(page.getByTestId('sewability')).toBeVisible();
}

for (const viewer of ['signed out', 'designer', 'quilter'] as const) {
  test(`every main screen ${viewer === 'signed out' ? 'signed out' : `as a ${viewer}`} has no serious or critical axe findings in either theme`, async ({ page }) => {
    test.setTimeout(900_000);
    await page.setViewportSize({ width: 1366, height: 1000 });
    let patternId = '';
    if (viewer !== 'signed out') await signUpAs(page, viewer, 'axe');
    else await page.goto('/');
    if (viewer === 'designer') patternId = await createSamplePattern(page, 'Axe sample');
    for (const theme of ['light', 'dark'] as const) {
      await useTheme(page, theme);
      for (const screen of SCREENS[viewer]) {
        await openScreen(page, screen, patternId);
        if (screen.board) {
          await selectSectionA(page);
          await page.locator('sw-piecing-order').screenshot({ path: `e2e/artifacts/piecing-order-${theme}.png` });
        }
        await expectNoSeriousFindings(page, `${screen.name}, ${viewer}, ${theme}`);
      }
    }
  });
}

test('each dialog, open, has no serious or critical axe findings in either theme', async ({ page }) => {
  test.setTimeout(600_000);
  await page.setViewportSize({ width: 1366, height: 1000 });
  await signUpAs(page, 'designer', 'dialogs');
  const patternId = await createSamplePattern(page, 'Dialog sample');
  for (const theme of ['light', 'dark'] as const) {
    await useTheme(page, theme);
    await openScreen(page, SCREENS.designer[0]);
    await page.getByRole('button', { name: 'New pattern' }).click();
    await expect(page.getByRole('dialog', { name: 'New pattern' }).getByLabel('Title')).toBeFocused();
    await expectNoSeriousFindings(page, `New pattern dialog, ${theme}`);
    await page.keyboard.press('Escape');
    await expect(page.getByRole('button', { name: 'New pattern' })).toBeFocused();

    await openScreen(page, SCREENS.designer[1], patternId);
    await selectSectionA(page);
    await page.getByRole('button', { name: 'Save as version' }).click();
    await expect(page.getByRole('dialog')).toBeVisible();
    await expectNoSeriousFindings(page, `Save as version dialog, ${theme}`);
    await page.keyboard.press('Escape');
    await expect(page.getByRole('button', { name: 'Save as version' })).toBeFocused();

    await page.getByRole('application', { name: 'Drafting board' }).focus();
    await page.keyboard.press('?');
    await expect(page.getByRole('dialog')).toBeVisible();
    await expectNoSeriousFindings(page, `keyboard help, ${theme}`);
    await page.keyboard.press('Escape');
    await expect(page.getByRole('application', { name: 'Drafting board' })).toBeFocused();

    // The header folded into its menu at 320 px, the menu open.
    await page.setViewportSize({ width: 320, height: 800 });
    await openScreen(page, SCREENS.designer[0]);
    await page.getByRole('button', { name: 'Main menu' }).click();
    await expect(page.getByRole('menuitem', { name: 'Shop' })).toBeVisible();
    await expectNoSeriousFindings(page, `folded main menu, ${theme}`);
    await page.keyboard.press('Escape');
    await page.setViewportSize({ width: 1366, height: 1000 });
  }
});

/*
 * Issue 21's screens with a real quilt (the demo Orchard Wheel: a layout, two colourways, three sizes),
 * in both themes: the board shown in a colourway with the four-blocks panel open and the fabric list's
 * note, the Quilt tab (layout form, quilt picture, colourways side by side, size chart, exports), and the
 * quilt choice bar on the cutting list and the print page.
 */
test('the quilt screens of a pattern with a layout, colourways and sizes have no serious or critical axe findings in either theme', async ({ page }) => {
  test.setTimeout(600_000);
  await page.setViewportSize({ width: 1366, height: 1000 });
  await signUpAs(page, 'designer', 'quilt-axe');
  const { csrfToken } = (await (await page.request.get('/api/auth/csrf')).json()) as { csrfToken: string };
  const created = await page.request.post('/api/patterns', { data: { document: { ...buildOrchardWheel(), title: `Axe quilt ${run}` } }, headers: { 'x-csrf-token': csrfToken } });
  expect(created.status()).toBe(201);
  const patternId = ((await created.json()) as { pattern: { id: string } }).pattern.id;
  const screen = (name: string) => ({ name, path: `/patterns/{id}/${name}`, board: name === 'board' });
  for (const theme of ['light', 'dark'] as const) {
    await useTheme(page, theme);
    await openScreen(page, screen('board'), patternId);
    await page.getByRole('combobox', { name: 'Board colourway' }).click();
    await page.getByRole('option', { name: 'Frost' }).click();
    await expect(page.getByRole('application', { name: 'Drafting board' })).toHaveAttribute('data-colourway', 'frost');
    await page.getByRole('button', { name: 'Four blocks' }).click();
    await expect(page.getByRole('img', { name: /Four copies of the block/ })).toBeVisible();
    await page.getByText('Pattern settings', { exact: true }).click();
    await expect(page.getByTestId('fabrics-colourway-note')).toBeVisible();
    await expectNoSeriousFindings(page, `board in a colourway, ${theme}`);

    await openScreen(page, screen('quilt'), patternId);
    await expect(page.getByTestId('finished-size')).toBeVisible();
    await expect(page.getByRole('list', { name: 'Colourways side by side' }).getByRole('listitem')).toHaveCount(3);
    await expect(page.getByRole('table')).toBeVisible();
    await page.locator('sw-quilt-picture').first().screenshot({ path: `e2e/artifacts/a11y-quilt-picture-${theme}.png` });
    await page.screenshot({ path: `e2e/artifacts/a11y-quilt-${theme}.png`, fullPage: true });
    await expectNoSeriousFindings(page, `quilt tab, ${theme}`);

    for (const part of ['cutting', 'print']) {
      await openScreen(page, screen(part), patternId);
      await expect(page.getByRole('combobox', { name: 'Quilt size' })).toBeVisible();
      await expect(page.getByRole('combobox', { name: 'Colourway' })).toBeVisible();
      await expectNoSeriousFindings(page, `${part} with the quilt choice bar, ${theme}`);
    }
  }
});
