/**
 * Drafting board first draw and frame times: a 2,000-patch pattern (500 square sections, each split
 * into 4 patches by three seams) drawn by the board's Konva renderer in headless Chromium, then a
 * vertex of one section dragged. Each animation frame moves the pointer one step (through the editor,
 * as the board component does) and draws; the work per frame is the pointer move plus the draw, the
 * frame interval the gap between requestAnimationFrame timestamps. Each round opens a fresh page.
 *
 * Targets (issue 16): first draw of the 2,000 patches ≤ 500 ms; work per frame p95 ≤ 8 ms.
 *
 * BOARD_BENCH_BASELINE=<git revision> runs that revision's board beside this one in the same browser,
 * in interleaved rounds (baseline, this, baseline, this, …) with per-round ratios; its piecing and
 * template-editor sources are taken with `git archive` into the system's temporary folder. BOARD_BENCH_ROUNDS sets the
 * rounds (default 5). BOARD_BENCH_SCREENSHOT=<file.png> keeps a picture of this board after the drag.
 */
import { execFileSync } from 'node:child_process';
import { existsSync, mkdirSync } from 'node:fs';
import os from 'node:os';
import { fileURLToPath } from 'node:url';
import { build } from 'esbuild';
import { chromium, type Browser } from 'playwright-core';
import { ms, quantile, type BenchSection } from './bench-kit';

const root = fileURLToPath(new URL('..', import.meta.url));
const FRAMES = 240;
const ROUNDS = Number(process.env['BOARD_BENCH_ROUNDS'] ?? 5);

const HARNESS = `
import { BoardEditor } from '@seamwright/template-editor-core';
import { BoardRenderer } from '@seamwright/template-editor/testing';
import { readPatternDocument } from '@seamwright/piecing';

(async () => {
const COLS = 25, ROWS = 20, SIZE = 1;
// 500 sections × 4 patches = 2,000 patches.
const fabrics = [
  { id: 'plum', name: 'Plum', colour: '#6b2d5c' },
  { id: 'oat', name: 'Oat', colour: '#e8dcc0' },
  { id: 'sage', name: 'Sage', colour: '#8fa382' },
  { id: 'marigold', name: 'Marigold', colour: '#e0a526' },
];
const sections = [];
const letters = (i) => { let n = i, s = ''; do { s = String.fromCharCode(65 + (n % 26)) + s; n = Math.floor(n / 26) - 1; } while (n >= 0); return s; };
for (let r = 0; r < ROWS; r++) for (let c = 0; c < COLS; c++) {
  const x = 0.5 + c * SIZE, y = 0.5 + r * SIZE, i = r * COLS + c;
  sections.push({
    id: 's' + i, label: letters(i),
    geometry: { kind: 'straight', vertices: [{ x, y }, { x: x + SIZE, y }, { x: x + SIZE, y: y + SIZE }, { x, y: y + SIZE }] },
    // Four strips side by side: sewable in order from left to right.
    seams: [0.25, 0.5, 0.75].map((f, k) => ({ id: 'm' + i + 'x' + k, a: { x: x + SIZE * f, y }, b: { x: x + SIZE * f, y: y + SIZE } })),
    patches: [0.125, 0.375, 0.625, 0.875].map((f, k) => ({ number: k + 1, anchor: { x: x + SIZE * f, y: y + SIZE / 2 }, fabricId: fabrics[(i + k) % 4].id })),
  });
}
const doc = readPatternDocument({ formatVersion: 1, title: 'Bench', canvas: { widthIn: 26, heightIn: 21 }, fabrics, sections });
const container = document.getElementById('board');
const editor = new BoardEditor(doc);
editor.setSize(1280, 900);
const t0 = performance.now();
const renderer = new BoardRenderer(container, editor);
editor.fitToContent(30);
renderer.renderNow();
const firstDrawMs = performance.now() - t0;
// The frame after the one that showed the first draw: the canvas has been painted by then.
const firstFrameMs = await new Promise((resolve) => requestAnimationFrame(() => requestAnimationFrame(() => resolve(performance.now() - t0))));
const patchCount = doc.sections.reduce((n, s) => n + editor.analysis.patches(s).length, 0);

window.runDrag = (frames) => new Promise((resolve) => {
  const target = doc.sections[Math.floor(sections.length / 2) + 12];
  editor.setTool('select');
  const v0 = target.geometry.vertices[2];
  const toScreen = (p) => ({ x: editor.viewport.originX + p.x * editor.viewport.scale, y: editor.viewport.originY + p.y * editor.viewport.scale });
  const inside = toScreen({ x: v0.x - 0.1, y: v0.y - 0.1 });
  editor.pointerDown(inside, { button: 0 });
  editor.pointerUp(inside, { button: 0 });
  renderer.renderNow();
  const start = toScreen(v0);
  editor.pointerDown(start, { button: 0 });
  const stamps = [];
  const work = [];
  const moves = [];
  const draws = [];
  const draws0 = { ...renderer.draws };
  const depth0 = editor.store.undoDepth;
  let i = 0;
  const step = (ts) => {
    stamps.push(ts);
    if (i >= frames) {
      editor.pointerUp(start, { button: 0 });
      resolve({ stamps, work, moves, drawsMs: draws, draws: { static: renderer.draws.static - draws0.static, active: renderer.draws.active - draws0.active }, undoSteps: editor.store.undoDepth - depth0 });
      return;
    }
    const w0 = performance.now();
    const a = (i / 60) * Math.PI * 2;
    editor.pointerMove({ x: start.x + Math.cos(a) * 60, y: start.y + Math.sin(a) * 40 }, {});
    const w1 = performance.now();
    renderer.renderNow();
    const w2 = performance.now();
    work.push(w2 - w0);
    moves.push(w1 - w0);
    draws.push(w2 - w1);
    i++;
    requestAnimationFrame(step);
  };
  requestAnimationFrame(step);
});
const unsewable = doc.sections.filter((s) => !editor.analysis.sewability(s).ok).length;
window.benchInfo = { firstDrawMs, firstFrameMs, patchCount, sectionCount: doc.sections.length, unsewable };
window.benchReady = true;
})();
`;

/** What one page reports: the first draw, then one measured drag. */
interface PageRun {
  firstDrawMs: number;
  firstFrameMs: number;
  patchCount: number;
  sectionCount: number;
  unsewable: number;
  stamps: number[];
  work: number[];
  moves: number[];
  drawsMs: number[];
  draws: { static: number; active: number };
  undoSteps: number;
}

/** The board under test: this checkout, or an archived revision. */
interface Variant {
  name: string;
  script: string;
  runs: PageRun[];
}

/** Bundles the harness against the board and piecing sources under `tree` (a folder ending in /). */
async function bundle(tree: string): Promise<string> {
  const out = await build({
    stdin: { contents: HARNESS, resolveDir: root, loader: 'ts', sourcefile: 'board-bench-harness.ts' },
    bundle: true,
    write: false,
    format: 'iife',
    platform: 'browser',
    target: 'es2022',
    minify: true,
    logLevel: 'silent',
    // An archived revision has no node_modules of its own.
    nodePaths: [`${root}node_modules`],
    // Settings read from the environment in shared code (a Node habit) read nothing in the page.
    define: { 'process.env': '{}' },
    alias: {
      '@seamwright/piecing': `${tree}projects/piecing/src/public-api.ts`,
      '@seamwright/template-editor-core': `${tree}projects/template-editor/src/lib/core/public-api.ts`,
      '@seamwright/template-editor/testing': `${tree}projects/template-editor/src/testing.ts`,
    },
  });
  return out.outputFiles[0].text;
}

/** The piecing and template-editor sources of `revision`, extracted once into the temporary folder (outside the type-checked tree). */
function archivedTree(revision: string): { tree: string; commit: string } {
  const commit = execFileSync('git', ['rev-parse', '--short', revision], { cwd: root, encoding: 'utf8' }).trim();
  const tree = `${os.tmpdir()}/seamwright-board-${commit}/`;
  if (!existsSync(`${tree}projects/template-editor`)) {
    mkdirSync(tree, { recursive: true });
    execFileSync('bash', ['-c', `git archive ${commit} projects/piecing projects/template-editor | tar -x -C '${tree}'`], { cwd: root });
  }
  return { tree, commit };
}

/** One fresh page: loads the harness (timing the first draw), drags 30 frames to warm up, then FRAMES measured frames. */
async function pageRun(browser: Browser, script: string, screenshot?: string): Promise<PageRun> {
  const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
  try {
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    await page.setContent('<!doctype html><html><body style="margin:0"><div id="board" style="width:1280px;height:900px"></div></body></html>');
    await page.addScriptTag({ content: script });
    await page.waitForFunction(() => (window as unknown as { benchReady?: boolean }).benchReady === true, null, { timeout: 120_000 }).catch(() => {
      throw new Error(`harness did not start: ${errors.join('; ')}`);
    });
    const info = await page.evaluate(() => (window as unknown as { benchInfo: Pick<PageRun, 'firstDrawMs' | 'firstFrameMs' | 'patchCount' | 'sectionCount' | 'unsewable'> }).benchInfo);
    await page.evaluate(() => (window as unknown as { runDrag: (n: number) => Promise<unknown> }).runDrag(30));
    const drag = await page.evaluate((n) => (window as unknown as { runDrag: (n: number) => Promise<Omit<PageRun, keyof typeof info>> }).runDrag(n), FRAMES);
    if (screenshot) await page.screenshot({ path: screenshot });
    if (errors.length > 0) throw new Error(`page errors: ${errors.join('; ')}`);
    return { ...info, ...drag };
  } finally {
    await page.close();
  }
}

/** Median and min–max of per-round values, and of their ratios to the baseline's in the same round. */
function perRound(values: number[], base: number[] | null): { median: string; range: string; ratio: string; ratioRange: string } {
  const ratios = base ? values.map((v, i) => v / base[i]) : [];
  return {
    median: ms(quantile(values, 0.5)),
    range: `${ms(Math.min(...values))}–${ms(Math.max(...values))}`,
    ratio: ratios.length ? `${quantile(ratios, 0.5).toFixed(2)}×` : '',
    ratioRange: ratios.length ? `${Math.min(...ratios).toFixed(2)}–${Math.max(...ratios).toFixed(2)}` : '',
  };
}

export default async function boardFrames(): Promise<BenchSection> {
  const loadBefore = os.loadavg()[0];
  const variants: Variant[] = [];
  const baseline = process.env['BOARD_BENCH_BASELINE'];
  if (baseline) {
    const { tree, commit } = archivedTree(baseline);
    variants.push({ name: `before (${commit})`, script: await bundle(tree), runs: [] });
  }
  variants.push({ name: baseline ? 'this build' : 'board', script: await bundle(root), runs: [] });
  const browser = await chromium.launch({
    executablePath: '/usr/bin/chromium',
    args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
  try {
    for (let round = 0; round < ROUNDS; round++) {
      for (const v of variants) {
        const last = round === ROUNDS - 1 && v === variants[variants.length - 1];
        v.runs.push(await pageRun(browser, v.script, last ? process.env['BOARD_BENCH_SCREENSHOT'] : undefined));
      }
    }
  } finally {
    await browser.close();
  }

  const base = variants.length > 1 ? variants[0] : null;
  const rows: BenchSection['rows'] = [];
  const measure = (label: string, pick: (r: PageRun) => number) => {
    for (const v of variants) {
      const values = v.runs.map(pick);
      const r = perRound(values, base && v !== base ? base.runs.map(pick) : null);
      rows.push({ measure: label, board: v.name, rounds: values.length, 'median ms': r.median, 'min–max ms': r.range, ...(base ? { [`÷ ${base.name} (median)`]: r.ratio, [`÷ ${base.name} (min–max per round)`]: r.ratioRange } : {}) });
    }
  };
  const intervals = (r: PageRun) => r.stamps.slice(1).map((t, i) => t - r.stamps[i]);
  measure('first draw, script (new renderer to the first draw done)', (r) => r.firstDrawMs);
  measure('first draw, to the next frame (painted)', (r) => r.firstFrameMs);
  measure(`drag: work per frame p50 (${FRAMES} frames a round)`, (r) => quantile(r.work, 0.5));
  measure('drag: work per frame p95', (r) => quantile(r.work, 0.95));
  measure('… editor core: pointer move p95 (snap, command, patches)', (r) => quantile(r.moves, 0.95));
  measure('… Konva: draw the active layer and overlay p95', (r) => quantile(r.drawsMs, 0.95));
  measure('drag: frame interval p95 (rAF timestamps)', (r) => quantile(intervals(r), 0.95));

  const now = variants[variants.length - 1];
  const info = now.runs[0];
  const firstDraw = quantile(now.runs.map((r) => r.firstDrawMs), 0.5);
  const workP95 = quantile(now.runs.map((r) => quantile(r.work, 0.95)), 0.5);
  const pooled = now.runs.flatMap((r) => r.work);
  const last = now.runs[now.runs.length - 1];
  return {
    title: 'Drafting board: first draw and frame work while dragging a vertex (headless Chromium, Konva 10.9.1)',
    rows,
    notes: [
      `${info.patchCount} patches in ${info.sectionCount} sections (${info.unsewable} failing the sewability check); ${ROUNDS} rounds, each a fresh page${base ? `, the boards interleaved (${variants.map((v) => v.name).join(', ')}, …)` : ''}.`,
      `Targets: first draw ≤ 500 ms — median ${ms(firstDraw)} ms: ${firstDraw <= 500 ? 'met' : 'NOT met'}; work per frame p95 ≤ 8 ms — median of the rounds' p95 ${ms(workP95)} ms (all ${pooled.length} frames pooled: p50 ${ms(quantile(pooled, 0.5))} ms, p95 ${ms(quantile(pooled, 0.95))} ms): ${workP95 <= 8 ? 'met' : 'NOT met'}.`,
      `During the last drag the static layer was drawn ${last.draws.static} times and the active layer ${last.draws.active} times; the whole drag made ${last.undoSteps === 1 ? 'one undo step' : `${last.undoSteps} undo steps`}.`,
      'First draw, script: from creating the renderer (the editor already holds the document) to the end of the first draw: making the stage\'s canvases, deriving the patches of every section in view, and drawing them (this build makes one canvas, the active section\'s and the overlay\'s only once something is on them, draws the static sections through one shape, checks sewability for up to 25 ms first and the remaining sections between frames; the earlier one makes six canvases and checks every section first). To the next frame: until the second animation frame after it, when the canvas has been painted.',
      `Machine load average (1 min) ${loadBefore.toFixed(1)} before and ${os.loadavg()[0].toFixed(1)} after the run on ${os.cpus().length} cores; other work on the machine lengthens every figure, alike for interleaved boards.`,
      'Headless Chromium with --disable-gpu (software canvas); rAF runs at about 60 Hz, so 16.7 ms is the floor of the frame interval.',
    ],
  };
}
