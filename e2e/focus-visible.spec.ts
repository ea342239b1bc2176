import { expect, test, type Browser, type Page } from '@playwright/test';
import { SCREENS, createSamplePattern, openScreen, signUpAs, useTheme, type Screen, type Theme } from './pages/screens';

/*
 * Visible focus (WCAG 2.4.7 and 1.4.11; 2.4.13's measure): for each Tab stop on the pattern list, the
 * board page (its header and toolbars, up to the board), the print page and the shop, the control is
 * photographed focused and unfocused. The pixels whose colours differ by 3:1 or more (WCAG's contrast
 * ratio of relative luminances) must be at least as many as the control's perimeter in CSS px, in the
 * light and the dark theme. Screenshots are decoded by a canvas in a blank page of the same browser.
 */

/** Screens whose Tab stops are checked: the list, the board page's header and toolbars, print and shop. */
const CHECKED: Screen[] = ['patterns', 'board', 'print', 'shop'].map((name) => SCREENS.designer.find((s) => s.name === name)!);
/** A bound on Tab presses per screen, so a focus trap fails the test instead of looping. */
const MAX_STOPS = 80;

interface Stop {
  name: string;
  box: { x: number; y: number; width: number; height: number };
}

/** Counts pixels whose two colours differ by a contrast ratio of 3 or more. */
async function contrastingPixels(decoder: Page, a: Buffer, b: Buffer): Promise<number> {
  return decoder.evaluate(
    async ([pa, pb]) => {
      const pixels = async (b64: string) => {
        const bitmap = await createImageBitmap(await (await fetch(`data:image/png;base64,${b64}`)).blob());
        const canvas = new OffscreenCanvas(bitmap.width, bitmap.height);
        const ctx = canvas.getContext('2d')!;
        ctx.drawImage(bitmap, 0, 0);
        return ctx.getImageData(0, 0, bitmap.width, bitmap.height).data;
      };
      // Relative luminance and contrast ratio as WCAG 2.2 defines them (Understanding SC 1.4.3).
      const channel = (v: number) => {
        const c = v / 255;
        return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
      };
      const luminance = (d: Uint8ClampedArray, i: number) => 0.2126 * channel(d[i]) + 0.7152 * channel(d[i + 1]) + 0.0722 * channel(d[i + 2]);
      const [x, y] = [await pixels(pa), await pixels(pb)];
      let count = 0;
      for (let i = 0; i < Math.min(x.length, y.length); i += 4) {
        const [l1, l2] = [luminance(x, i), luminance(y, i)].sort((p, q) => q - p);
        if ((l1 + 0.05) / (l2 + 0.05) >= 3) count++;
      }
      return count;
    },
    [a.toString('base64'), b.toString('base64')] as const,
  );
}

/** The focused element's accessible-ish name and box, or null when focus left the page or reached the board. */
async function focusedStop(page: Page): Promise<Stop | null> {
  return page.evaluate(() => {
    const el = document.activeElement as HTMLElement | null;
    if (!el || el === document.body || el.closest('[role=application]')) return null;
    (window as unknown as { swLastFocus: HTMLElement }).swLastFocus = el;
    // A field's control is the whole outlined field, whose outline is what shows focus.
    const r = (el.closest('.mat-mdc-text-field-wrapper') ?? el).getBoundingClientRect();
    const name = el.getAttribute('aria-label') ?? el.textContent?.trim().replace(/\s+/g, ' ').slice(0, 40) ?? el.tagName;
    return { name: `${el.tagName.toLowerCase()} “${name}”`, box: { x: r.x, y: r.y, width: r.width, height: r.height } };
  });
}

async function checkTabStops(page: Page, decoder: Page, where: string): Promise<{ stops: number; failures: string[] }> {
  const failures: string[] = [];
  const seen = new Set<string>();
  let stops = 0;
  await page.mouse.move(0, 0);
  for (let i = 0; i < MAX_STOPS; i++) {
    await page.keyboard.press('Tab');
    const stop = await focusedStop(page);
    if (!stop) break;
    const key = `${stop.name}@${Math.round(stop.box.x)},${Math.round(stop.box.y + (await page.evaluate(() => scrollY)))}`;
    if (seen.has(key)) break;
    seen.add(key);
    if (stop.box.width < 1 || stop.box.height < 1) continue;
    const viewport = page.viewportSize()!;
    const x = Math.max(0, Math.floor(stop.box.x - 8));
    const y = Math.max(0, Math.floor(stop.box.y - 8));
    const clip = { x, y, width: Math.min(viewport.width - x, Math.ceil(stop.box.width + 16)), height: Math.min(viewport.height - y, Math.ceil(stop.box.height + 16)) };
    if (clip.width < 1 || clip.height < 1) continue;
    await expect.poll(() => page.evaluate(() => document.activeElement?.matches(':focus-visible') ?? false)).toBe(true);
    const focused = await page.screenshot({ clip, animations: 'disabled' });
    await page.evaluate(() => (window as unknown as { swLastFocus: HTMLElement }).swLastFocus.blur());
    const unfocused = await page.screenshot({ clip, animations: 'disabled' });
    await page.evaluate(() => (window as unknown as { swLastFocus: HTMLElement }).swLastFocus.focus());
    stops++;
    const changed = await contrastingPixels(decoder, focused, unfocused);
    const perimeter = Math.round(2 * (stop.box.width + stop.box.height));
    if (changed < perimeter) failures.push(`${where}: ${stop.name} changed ${changed} px at 3:1, perimeter ${perimeter} px`);
  }
  return { stops, failures };
}

async function signedInDesigner(browser: Browser): Promise<{ page: Page; decoder: Page; patternId: string }> {
  const context = await browser.newContext({ viewport: { width: 1366, height: 900 }, reducedMotion: 'reduce' });
  const page = await context.newPage();
  await signUpAs(page, 'designer', 'focus');
  const patternId = await createSamplePattern(page, 'Focus sample');
  const decoder = await context.newPage();
  await decoder.goto('about:blank');
  return { page, decoder, patternId };
}

for (const theme of ['light', 'dark'] as Theme[]) {
  test(`every Tab stop on the list, the board page, print and shop shows a 3:1 focus indicator at least its perimeter in size (${theme})`, async ({ browser }) => {
    test.setTimeout(900_000);
    const { page, decoder, patternId } = await signedInDesigner(browser);
    await useTheme(page, theme);
    const all: string[] = [];
    for (const screen of CHECKED) {
      await openScreen(page, screen, patternId);
      const { stops, failures } = await checkTabStops(page, decoder, `${screen.name} (${theme})`);
      // Each screen has a header, its own controls and (but the board) a page full of them.
      expect(stops, `${screen.name}: Tab stops reached`).toBeGreaterThan(screen.board ? 8 : 5);
      all.push(...failures);
    }
    expect(all).toEqual([]);
  });
}

test('a focused control on the list and the print page, in both themes, looked at', async ({ browser }) => {
  test.setTimeout(300_000);
  const { page, patternId } = await signedInDesigner(browser);
  for (const theme of ['light', 'dark'] as Theme[]) {
    await useTheme(page, theme);
    await openScreen(page, SCREENS.designer[0]);
    await page.getByRole('button', { name: 'New pattern' }).focus();
    await page.keyboard.press('Shift+Tab');
    await page.keyboard.press('Tab');
    await expect(page.getByRole('button', { name: 'New pattern' })).toBeFocused();
    await page.screenshot({ path: `e2e/artifacts/focus-patterns-${theme}.png` });
    await openScreen(page, CHECKED[2], patternId);
    await page.getByRole('combobox', { name: 'Paper' }).focus();
    await page.keyboard.press('Tab');
    await page.screenshot({ path: `e2e/artifacts/focus-print-${theme}.png` });
    await expect(page.getByRole('spinbutton', { name: 'Margin (in.)' })).toBeFocused();
  }
});
