import { expect, test, type Page } from '@playwright/test';
import { AuthPage } from './pages/auth.page';
import { DraftingBoardPage } from './pages/drafting-board.page';

/*
 * The order search runs in a Web Worker (issue 16): on a 300-strip section numbered out of order,
 * "Find a sewable order" keeps the page responsive while the worker searches — no main-thread task
 * over the bound from the click until the found order shows. The same action with workers taken away
 * (the main-thread fallback) is measured alongside, for comparison; it is not asserted.
 */

const run = Date.now().toString(36);
const STRIPS = 300;

/** One section of `count` upright strips, numbered out of order (7 is prime to 300): sewable only from an end. */
function stripsPattern(count: number) {
  const w = 0.5;
  const right = 1 + count * w;
  return {
    formatVersion: 2,
    title: `Strips ${run}`,
    canvas: { widthIn: right + 1, heightIn: 12 },
    sections: [
      {
        id: 'strips',
        label: 'A',
        geometry: { kind: 'straight', vertices: [{ x: 1, y: 1 }, { x: right, y: 1 }, { x: right, y: 11 }, { x: 1, y: 11 }] },
        seams: Array.from({ length: count - 1 }, (_, i) => ({ id: `s${i + 1}`, a: { x: 1 + (i + 1) * w, y: 0.5 }, b: { x: 1 + (i + 1) * w, y: 11.5 } })),
        patches: Array.from({ length: count }, (_, i) => ({ number: ((i * 7) % count) + 1, anchor: { x: 1 + (i + 0.5) * w, y: 6 } })),
      },
    ],
  };
}

/** Starts recording the page's long tasks (over 50 ms, as Chromium reports them). */
async function watchLongTasks(page: Page): Promise<void> {
  await page.evaluate(() => {
    const w = window as unknown as { longTasks: Array<{ start: number; ms: number }> };
    w.longTasks = [];
    new PerformanceObserver((list) => {
      for (const e of list.getEntries()) w.longTasks.push({ start: e.startTime, ms: e.duration });
    }).observe({ type: 'longtask' });
  });
}

/** Records when each answer of a Web Worker reaches the page (before the page handles it). */
function stampWorkerAnswers(): void {
  const w = window as unknown as { Worker: typeof Worker; answers: number[] };
  const Native = w.Worker;
  w.answers = [];
  w.Worker = class extends Native {
    override addEventListener(type: string, listener: EventListenerOrEventListenerObject, options?: boolean | AddEventListenerOptions): void {
      if (type !== 'message' || typeof listener !== 'function') return super.addEventListener(type, listener, options);
      super.addEventListener(type, (event) => {
        w.answers.push(performance.now());
        listener(event);
      }, options);
    }
  };
}

interface Measured {
  /** Longest long task from the click until the search's answer reached the page (ms; 0 when none). */
  searchingMs: number;
  /** Longest long task from the click until the found order shows (answer handled, section redrawn). */
  wholeMs: number;
  tasks: number;
  /** Every long task from the click on: [start after the click, duration] in ms; and when the answer came. */
  timeline: string;
}

/** Opens the board on the pattern, selects the section, finds an order; measures the long tasks. */
async function findOrderMeasured(page: Page, patternId: string): Promise<Measured> {
  await page.goto(`/patterns/${patternId}/board`);
  const board = new DraftingBoardPage(page);
  await board.ready();
  await watchLongTasks(page);
  await board.sectionItems().first().click();
  await expect(board.verdict()).toHaveText(/cannot be sewn in this order/, { timeout: 60_000 });
  // Let the page settle after selecting 300 patches (list, board highlight): one quiet second with no long task.
  await page.waitForFunction(
    () => {
      const tasks = (window as unknown as { longTasks: Array<{ start: number; ms: number }> }).longTasks;
      const last = tasks.length ? tasks[tasks.length - 1].start + tasks[tasks.length - 1].ms : 0;
      return performance.now() - last > 1000;
    },
    undefined,
    { timeout: 60_000, polling: 250 },
  );
  const t0 = await page.evaluate(() => performance.now());
  await page.getByRole('button', { name: 'Find a sewable order' }).click();
  await expect(board.verdict()).toHaveText(/Section A can be sewn in this order/, { timeout: 60_000 });
  return page.evaluate((start) => {
    const w = window as unknown as { longTasks: Array<{ start: number; ms: number }>; answers?: number[] };
    const tasks = w.longTasks.filter((t) => t.start + t.ms >= start);
    const answered = w.answers?.find((a) => a >= start) ?? Infinity;
    const before = tasks.filter((t) => t.start < answered);
    const timeline = `${tasks.map((t) => `[${(t.start - start).toFixed(0)}, ${t.ms.toFixed(0)}]`).join(' ')}; answer at ${(answered - start).toFixed(0)}`;
    return { searchingMs: Math.max(0, ...before.map((t) => t.ms)), wholeMs: Math.max(0, ...tasks.map((t) => t.ms)), tasks: tasks.length, timeline };
  }, t0);
}

test('the order search of a 300-strip section runs off the main thread', async ({ page }, info) => {
  test.setTimeout(240_000);
  await page.setViewportSize({ width: 1280, height: 900 });
  await new AuthPage(page).signUp({ name: 'Wren Worker', email: `wren-${run}@example.test`, password: 'strips-three-hundred', role: 'designer' });
  await expect(page.getByRole('heading', { name: 'Patterns' })).toBeVisible();
  const { csrfToken } = (await (await page.request.get('/api/auth/csrf')).json()) as { csrfToken: string };
  const create = async () => {
    const created = await page.request.post('/api/patterns', { data: { document: stripsPattern(STRIPS) }, headers: { 'x-csrf-token': csrfToken } });
    expect(created.status()).toBe(201);
    return ((await created.json()) as { pattern: { id: string } }).pattern;
  };
  const pattern = await create();
  const twin = await create();

  await page.addInitScript(stampWorkerAnswers);
  const inWorker = await findOrderMeasured(page, pattern.id);
  await page.screenshot({ path: info.outputPath('order-search-found.png') });

  // The same search on the main thread, on a twin pattern: a page with no Worker (the fallback), same session.
  const noWorker = await page.context().newPage();
  await noWorker.setViewportSize({ width: 1280, height: 900 });
  await noWorker.addInitScript(() => {
    delete (window as unknown as { Worker?: unknown }).Worker;
  });
  const onPage = await findOrderMeasured(noWorker, twin.id);

  const said = `longest main-thread task — search in the worker: ${inWorker.searchingMs.toFixed(0)} ms while it searched, ${inWorker.wholeMs.toFixed(0)} ms until the order showed (${inWorker.tasks} long tasks); search on the page: ${onPage.wholeMs.toFixed(0)} ms (${onPage.tasks} long tasks)`;
  info.annotations.push({ type: 'long tasks', description: said });
  console.log(said);
  console.log(`worker page: ${inWorker.timeline}`);
  console.log(`fallback page: ${onPage.timeline}`);
  // While the worker searches the page stays free. Generous bound: CI is a busy 2-core machine where
  // every task runs slower, and the click itself starts the worker. (Applying the order found — the
  // section re-derived, checked and redrawn — is main-thread work after the answer, reported above.)
  expect(inWorker.searchingMs).toBeLessThan(200);
});
