import { expect, test, type Page } from '@playwright/test';
import { buildOrchardWheel, planPrintLayout, sheetCountStatement } from '../projects/piecing/src/public-api';
import { AuthPage } from './pages/auth.page';
import { PrintPage } from './pages/print.page';

/*
 * The print preview is planned off the page's main thread (issue 13): while the demo medallion's
 * sheets are planned again after form changes, the page keeps answering. Long tasks are read with
 * a PerformanceObserver ('longtask', Long Tasks API: main-thread tasks of 50 ms or more).
 */

/**
 * Longest main-thread task allowed during the changes, ms. The goal is 50 ms; the bound is generous
 * because the CI machine shares 2 cores with other jobs (a task stretches when the core is taken),
 * and long tasks also come from work that is not planning: Angular drawing the new sheets, the
 * browser's layout and paint, and garbage collection. Planning the medallion on the main thread
 * takes 300–1,100 ms per change, so a plan that came back to the page would still fail this check.
 */
const LONGEST_TASK_BOUND_MS = 250;

const run = Date.now().toString(36);

/** Starts recording the page's long tasks. */
async function recordLongTasks(page: Page): Promise<void> {
  await page.evaluate(() => {
    const w = window as unknown as { swLongTasks: number[]; swLongTaskObserver: PerformanceObserver };
    w.swLongTasks = [];
    w.swLongTaskObserver = new PerformanceObserver((list) => w.swLongTasks.push(...list.getEntries().map((e) => e.duration)));
    w.swLongTaskObserver.observe({ type: 'longtask' });
  });
}

/** The long tasks recorded so far (durations in ms), pending ones included. */
async function longTasks(page: Page): Promise<number[]> {
  return page.evaluate(() => {
    const w = window as unknown as { swLongTasks: number[]; swLongTaskObserver: PerformanceObserver };
    w.swLongTasks.push(...w.swLongTaskObserver.takeRecords().map((e) => e.duration));
    return w.swLongTasks;
  });
}

test('the demo medallion print preview is planned again after form changes without blocking the page', async ({ page }) => {
  test.setTimeout(120_000);
  await page.setViewportSize({ width: 1366, height: 900 });
  await new AuthPage(page).signUp({ name: 'Pia Preview', email: `pia-${run}@example.test`, password: 'orchard-wheel-26', role: 'designer' });
  await expect(page.getByRole('heading', { name: 'Patterns' })).toBeVisible();
  const { csrfToken } = (await (await page.request.get('/api/auth/csrf')).json()) as { csrfToken: string };
  const created = await page.request.post('/api/patterns', { data: { document: buildOrchardWheel() }, headers: { 'x-csrf-token': csrfToken } });
  expect(created.status()).toBe(201);
  const { pattern } = (await created.json()) as { pattern: { id: string } };

  await page.goto(`/patterns/${pattern.id}/print`);
  const print = new PrintPage(page);
  const planning = page.getByRole('region', { name: 'Sheets' }).getByRole('status');
  const letter = (marginIn: number) => sheetCountStatement(planPrintLayout(buildOrchardWheel(), { paper: 'letter', marginIn }));
  await expect(print.sheetStatement()).toHaveText(letter(0.5), { timeout: 30_000 });
  await expect(planning).toHaveText('');

  await recordLongTasks(page);
  const margin = page.getByLabel('Margin (in.)');
  for (const value of ['0.75', '1', '0.625', '1.25']) await margin.fill(value);
  await expect(planning).toContainText('Planning…');
  await expect(print.sheetStatement()).toHaveText(letter(1.25), { timeout: 30_000 });
  await expect(planning).toHaveText('');
  await expect(print.previewSheets().first()).toBeVisible();

  const tasks = await longTasks(page);
  const longest = Math.max(0, ...tasks);
  test.info().annotations.push({ type: 'longest main-thread task during the changes', description: `${Math.round(longest)} ms (${tasks.length} long tasks)` });
  expect(longest).toBeLessThan(LONGEST_TASK_BOUND_MS);
});
