import { expect, test, type Page } from '@playwright/test';
import { SCREENS, createSamplePattern, openScreen, signUpAs, useTheme, type Viewer } from './pages/screens';

/*
 * Reflow (WCAG 1.4.10): at 320 CSS px wide — a 1280 px window at 400 % zoom — every page but the
 * drafting board (a two-dimensional drawing, which the criterion exempts) fits without sideways
 * scrolling; wide tables scroll inside their own box. 640 px is the same window at 200 %. Readable
 * drawings: every label of the print page's sheet previews renders at 9 px or more.
 */

async function sidewaysOverflow(page: Page): Promise<number> {
  return page.evaluate(() => {
    const root = document.scrollingElement!;
    return root.scrollWidth - root.clientWidth;
  });
}

/** What sticks out past the right edge, to name in a failure. */
async function widest(page: Page): Promise<string> {
  return page.evaluate(() => {
    const w = document.documentElement.clientWidth;
    const out = [...document.querySelectorAll<HTMLElement>('body *')]
      .filter((e) => e.getBoundingClientRect().right > w + 1 && e.getClientRects().length > 0)
      .map((e) => `${e.tagName.toLowerCase()}.${[...e.classList].join('.')} → ${Math.round(e.getBoundingClientRect().right)}`);
    return out.slice(-6).join('; ');
  });
}

for (const viewer of ['signed out', 'designer', 'quilter'] as Viewer[]) {
  test(`at 320 and 640 CSS px every page but the board fits without sideways scrolling (${viewer})`, async ({ page }) => {
    test.setTimeout(600_000);
    let patternId = '';
    if (viewer === 'signed out') await page.goto('/');
    else await signUpAs(page, viewer, 'reflow');
    if (viewer === 'designer') patternId = await createSamplePattern(page, 'Reflow sample');
    await useTheme(page, 'light');
    const failures: string[] = [];
    for (const width of [320, 640]) {
      await page.setViewportSize({ width, height: 800 });
      for (const screen of SCREENS[viewer].filter((s) => !s.board)) {
        await openScreen(page, screen, patternId);
        const over = await sidewaysOverflow(page);
        if (over > 0) failures.push(`${screen.name} at ${width} px scrolls ${over} px sideways: ${await widest(page)}`);
      }
    }
    expect(failures).toEqual([]);
  });
}

test('the header folds into a named menu at 320 px that reaches every main link', async ({ page }) => {
  test.setTimeout(300_000);
  await signUpAs(page, 'designer', 'fold');
  await page.setViewportSize({ width: 320, height: 700 });
  for (const theme of ['light', 'dark'] as const) {
    await useTheme(page, theme);
    await openScreen(page, SCREENS.designer[0]);
    const banner = page.getByRole('banner');
    await expect(banner.getByRole('link', { name: 'Shop' })).toBeHidden();
    await banner.screenshot({ path: `e2e/artifacts/header-320-${theme}-closed.png` });
    await page.getByRole('button', { name: 'Main menu' }).click();
    const items = page.getByRole('menu').getByRole('menuitem');
    await expect(items).toHaveText(['Patterns', 'Shop', 'Scale check']);
    await page.screenshot({ path: `e2e/artifacts/header-320-${theme}-open.png` });
    await page.keyboard.press('Escape');
    await expect(page.getByRole('button', { name: 'Main menu' })).toBeFocused();
    expect(await sidewaysOverflow(page)).toBe(0);
  }
  await page.setViewportSize({ width: 1280, height: 700 });
  await expect(page.getByRole('button', { name: 'Main menu' })).toBeHidden();
  await expect(page.getByRole('banner').getByRole('link', { name: 'Shop' })).toBeVisible();
});

test('sheet preview labels render at 9 px or more, wide and narrow', async ({ page }) => {
  test.setTimeout(300_000);
  await signUpAs(page, 'designer', 'labels');
  const patternId = await createSamplePattern(page, 'Label sample');
  for (const width of [1366, 320]) {
    await page.setViewportSize({ width, height: 900 });
    await openScreen(page, SCREENS.designer.find((s) => s.name === 'print')!, patternId);
    await expect(page.locator('sw-sheet-preview').first()).toBeVisible();
    const sizes = await page.locator('sw-sheet-preview text.label').evaluateAll((texts) =>
      texts.map((t) => {
        const ctm = (t as SVGGraphicsElement).getScreenCTM()!;
        return Number(t.getAttribute('font-size')) * Math.hypot(ctm.a, ctm.b);
      }),
    );
    expect(sizes.length).toBeGreaterThan(0);
    expect(Math.min(...sizes), `smallest label at ${width} px`).toBeGreaterThanOrEqual(9);
  }
  await page.setViewportSize({ width: 1366, height: 900 });
  await page.locator('sw-sheet-preview').first().scrollIntoViewIfNeeded();
  await page.screenshot({ path: 'e2e/artifacts/print-preview-labels.png' });
});
