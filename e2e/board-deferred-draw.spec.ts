import { expect, test, type Page } from '@playwright/test';
import { build } from 'esbuild';
import { fileURLToPath } from 'node:url';

/*
 * The drafting board's first draw leaves work for later (issue 16): sewability checks past the
 * renderer's time budget run between frames, and sections off screen derive nothing until they come
 * into view. These tests drive the board's Konva renderer without the app (as bench/board-frames does)
 * and read the pixels it drew: after the deferred work, every section that fails its check shows the
 * failing patch's red outline and no other does; sections panned into view are drawn in their fabrics.
 */

const root = fileURLToPath(new URL('..', import.meta.url));

/** Columns × rows of 1.5-inch sections, four upright strips each; every third section is numbered 1, 3, 2, 4 (unsewable: strip 2 does not touch strip 1). */
const COLS = 12;
const ROWS = 10;
const SIZE = 1.5;

const HARNESS = `
import { BoardEditor } from '@seamwright/template-editor-core';
import { BoardRenderer } from '@seamwright/template-editor/testing';
import { readPatternDocument } from '@seamwright/piecing';

const COLS = ${COLS}, ROWS = ${ROWS}, SIZE = ${SIZE};
const fabrics = [
  { id: 'navy', name: 'Navy', colour: '#1d3557' },
  { id: 'sky', name: 'Sky', colour: '#a8dadc' },
];
const sections = [];
for (let r = 0; r < ROWS; r++) for (let c = 0; c < COLS; c++) {
  const x = 0.5 + c * SIZE, y = 0.5 + r * SIZE, i = r * COLS + c;
  const numbers = i % 3 === 0 ? [1, 3, 2, 4] : [1, 2, 3, 4];
  sections.push({
    id: 's' + i, label: String.fromCharCode(65 + Math.floor(i / 26) % 26) + String.fromCharCode(65 + (i % 26)),
    geometry: { kind: 'straight', vertices: [{ x, y }, { x: x + SIZE, y }, { x: x + SIZE, y: y + SIZE }, { x, y: y + SIZE }] },
    seams: [0.25, 0.5, 0.75].map((f, k) => ({ id: 'm' + i + 'x' + k, a: { x: x + SIZE * f, y }, b: { x: x + SIZE * f, y: y + SIZE } })),
    patches: [0.125, 0.375, 0.625, 0.875].map((f, k) => ({ number: numbers[k], anchor: { x: x + SIZE * f, y: y + SIZE / 2 }, fabricId: fabrics[k % 2].id })),
  });
}
const doc = readPatternDocument({ formatVersion: 1, title: 'Deferred', canvas: { widthIn: COLS * SIZE + 1, heightIn: ROWS * SIZE + 1 }, fabrics, sections });

/** Counts, per section, the pixels of the base layer inside it (inset 2 px) that are the failing red or a fabric colour. */
function census(editor, renderer) {
  const canvas = renderer.stage.getLayers()[0].getCanvas()._canvas;
  const ctx = canvas.getContext('2d');
  const { width, height } = canvas;
  const data = ctx.getImageData(0, 0, width, height).data;
  const ratio = width / editor.sizePx.width;
  const near = (k, [r, g, b]) => Math.abs(data[k] - r) + Math.abs(data[k + 1] - g) + Math.abs(data[k + 2] - b) < 40;
  const v = editor.viewport;
  return doc.sections.map((s) => {
    const p = s.geometry.vertices;
    const x0 = Math.ceil((v.originX + p[0].x * v.scale + 2) * ratio), x1 = Math.floor((v.originX + p[2].x * v.scale - 2) * ratio);
    const y0 = Math.ceil((v.originY + p[0].y * v.scale + 2) * ratio), y1 = Math.floor((v.originY + p[2].y * v.scale - 2) * ratio);
    let red = 0, fabric = 0;
    for (let y = Math.max(0, y0); y < Math.min(height, y1); y++) for (let x = Math.max(0, x0); x < Math.min(width, x1); x++) {
      const k = (y * width + x) * 4;
      if (near(k, [0xc2, 0x3b, 0x22])) red++;
      if (near(k, [0x1d, 0x35, 0x57]) || near(k, [0xa8, 0xda, 0xdc])) fabric++;
    }
    return { id: s.id, red, fabric };
  });
}

window.runDeferred = async () => {
  const editor = new BoardEditor(doc);
  editor.setSize(1000, 800);
  // A budget of 0: every sewability check waits until after the first draw.
  const renderer = new BoardRenderer(document.getElementById('board'), editor, 0);
  editor.fitToContent(30);
  renderer.renderNow();
  const pendingAfterFirstDraw = renderer.pendingChecks;
  const first = census(editor, renderer);
  await renderer.settled();
  const settled = census(editor, renderer);
  const unsewable = doc.sections.filter((s) => !editor.analysis.sewability(s).ok).map((s) => s.id);
  renderer.destroy();
  return { pendingAfterFirstDraw, first, settled, unsewable, sectionCount: doc.sections.length };
};

window.runPan = async () => {
  const editor = new BoardEditor(doc);
  editor.setSize(1000, 800);
  // No check before drawing: what the first draw derives is what it draws.
  const renderer = new BoardRenderer(document.getElementById('board'), editor, 0);
  // Zoomed in on the top-left corner: about three columns and three rows show.
  editor.setViewport({ scale: 200, originX: 0, originY: 0, mirrored: false, mirrorWidthIn: doc.canvas.widthIn });
  renderer.renderNow();
  const splitsAtFirstDraw = editor.analysis.splitsMade;
  const first = census(editor, renderer);
  await renderer.settled();
  // Pan to the bottom-right corner.
  editor.setViewport({ scale: 200, originX: 1000 - (doc.canvas.widthIn) * 200, originY: 800 - (doc.canvas.heightIn) * 200, mirrored: false, mirrorWidthIn: doc.canvas.widthIn });
  renderer.renderNow();
  const panned = census(editor, renderer);
  await renderer.settled();
  renderer.destroy();
  return { splitsAtFirstDraw, first, panned, sectionCount: doc.sections.length };
};
window.harnessReady = true;
`;

async function openHarness(page: Page): Promise<void> {
  const out = await build({
    stdin: { contents: HARNESS, resolveDir: root, loader: 'ts', sourcefile: 'board-deferred-harness.ts' },
    bundle: true,
    write: false,
    format: 'iife',
    platform: 'browser',
    target: 'es2022',
    logLevel: 'silent',
    define: { 'process.env': '{}' },
    alias: {
      '@seamwright/piecing': `${root}projects/piecing/src/public-api.ts`,
      '@seamwright/template-editor-core': `${root}projects/template-editor/src/lib/core/public-api.ts`,
      '@seamwright/template-editor/testing': `${root}projects/template-editor/src/testing.ts`,
    },
  });
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await page.setViewportSize({ width: 1000, height: 800 });
  await page.setContent('<!doctype html><html><body style="margin:0"><div id="board" style="width:1000px;height:800px"></div></body></html>');
  await page.addScriptTag({ content: out.outputFiles[0].text });
  await page.waitForFunction(() => (window as unknown as { harnessReady?: boolean }).harnessReady === true, null, { timeout: 20_000 }).catch(() => {
    throw new Error(`the harness did not start: ${errors.join('; ')}`);
  });
  expect(errors).toEqual([]);
}

interface Census {
  id: string;
  red: number;
  fabric: number;
}

test('sewability checks left for later finish between frames and mark exactly the failing sections', async ({ page }) => {
  await openHarness(page);
  const r = await page.evaluate(() =>
    (window as unknown as { runDeferred: () => Promise<{ pendingAfterFirstDraw: number; first: Census[]; settled: Census[]; unsewable: string[]; sectionCount: number }> }).runDeferred(),
  );
  expect(r.sectionCount).toBe(COLS * ROWS);
  // Every third section is numbered out of order.
  expect(r.unsewable).toEqual(Array.from({ length: Math.ceil((COLS * ROWS) / 3) }, (_, k) => `s${k * 3}`));
  // The first draw shows every section in its fabrics, checked or not, and no failure yet.
  expect(r.pendingAfterFirstDraw).toBe(COLS * ROWS);
  expect(r.first.filter((c) => c.fabric < 100).map((c) => c.id)).toEqual([]);
  expect(r.first.filter((c) => c.red > 0).map((c) => c.id)).toEqual([]);
  // After the deferred checks: the red outline on every failing section and on no other.
  expect(r.settled.filter((c) => c.red > 20).map((c) => c.id)).toEqual(r.unsewable);
  expect(r.settled.filter((c) => c.red > 0 && !r.unsewable.includes(c.id)).map((c) => c.id)).toEqual([]);
});

test('sections off screen derive nothing at the first draw and are drawn in their fabrics once panned into view', async ({ page }) => {
  await openHarness(page);
  const r = await page.evaluate(() =>
    (window as unknown as { runPan: () => Promise<{ splitsAtFirstDraw: number; first: Census[]; panned: Census[]; sectionCount: number }> }).runPan(),
  );
  const shown = (list: Census[]) => list.filter((c) => c.fabric > 100).map((c) => c.id);
  const firstShown = shown(r.first);
  const pannedShown = shown(r.panned);
  // At 200 px per inch on 1000 × 800 px, three columns by two or three rows show at each corner.
  expect(firstShown).toContain('s0');
  expect(firstShown.length).toBeGreaterThanOrEqual(4);
  expect(firstShown.length).toBeLessThanOrEqual(12);
  // Derived: the sections in view (and those the culling margin touches), far fewer than all.
  expect(r.splitsAtFirstDraw).toBeGreaterThanOrEqual(firstShown.length);
  expect(r.splitsAtFirstDraw).toBeLessThanOrEqual(16);
  expect(pannedShown).toContain(`s${COLS * ROWS - 1}`);
  expect(pannedShown.length).toBeGreaterThanOrEqual(4);
  expect(pannedShown.filter((id) => firstShown.includes(id))).toEqual([]);
});
