import { expect, test, type Page } from '@playwright/test';
import { derivePatches, parsePatternDocument, type PatternDocument } from '@seamwright/piecing';
import { exampleJson } from '../tests/fixtures/documents';
import { AuthPage } from './pages/auth.page';
import { DraftingBoardPage } from './pages/drafting-board.page';
import { PatternFilesPage } from './pages/pattern-files.page';
import { PatternsPage } from './pages/patterns.page';

/*
 * Pattern files in Chromium against the real server: a file with problems is refused with each problem
 * and its path listed and nothing saved; a good file (the documented example, format version 1) becomes
 * a pattern whose board opens; the front view downloads as a true-size SVG and a PNG, and the pattern
 * file downloads and reads back. Screens are saved under e2e/artifacts/.
 */

const run = Date.now().toString(36);
const designer = { name: 'Fen Files', email: `fen-${run}@example.test`, password: 'files-in-and-out-7', role: 'designer' as const };
const shot = (page: Page, name: string) => page.screenshot({ path: `e2e/artifacts/pattern-files-${name}.png` });

/** The documented example with a ring repeat and a strip set (docs/examples/). */
const example = exampleJson('arc-ring-with-strip-set') as Record<string, unknown>;
const good = { ...example, title: `Compass from a file ${run}` };
const broken = {
  ...example,
  title: `Broken ${run}`,
  fabrics: [{ id: 'rust', name: 'Rust', colour: 'rusty' }],
  sections: [{ id: 'a', label: 'a', geometry: { kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 250, y: 0 }, { x: 4, y: 4 }] } }],
};

/** Patches on the front of the block: every patch of every section, once per ring-repeat copy. */
function frontPatchCount(doc: PatternDocument): number {
  return doc.sections.reduce((n, s) => n + derivePatches(s).patches.length * (s.ringRepeat?.count ?? 1), 0);
}

async function patternTotal(page: Page): Promise<number> {
  const res = await page.request.get('/api/patterns?scope=all');
  expect(res.status()).toBe(200);
  return ((await res.json()) as { total: number }).total;
}

test('open a pattern file with problems and a good one, export the front view and download the file', async ({ page }) => {
  test.setTimeout(120_000);
  await page.setViewportSize({ width: 1440, height: 960 });
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));

  await new AuthPage(page).signUp(designer);
  await expect(page.getByRole('heading', { name: 'Patterns' })).toBeVisible();
  const files = new PatternFilesPage(page);
  const before = await patternTotal(page);

  // A file with problems: each is listed with its path; nothing is saved.
  await files.open('broken.seamwright.json', JSON.stringify(broken));
  expect(await files.problemLines()).toEqual([
    'fabrics[0].colour: must be a colour like #7a3b69',
    'sections[0].label: must be one to three capital letters',
    'sections[0].geometry.vertices[1].x: must be within ±200 in.',
  ]);
  await expect(files.problems().getByRole('heading')).toHaveText(/“broken\.seamwright\.json” was not opened: 3 problems\. Nothing was saved\./);
  await shot(page, 'problems');
  expect(await patternTotal(page)).toBe(before);
  await expect(new PatternsPage(page).row(broken.title)).toHaveCount(0);
  await expect(page).toHaveURL(/\/patterns$/);

  // A good file: the pattern is made and its board opens with the file's sections.
  await files.open('compass.seamwright.json', JSON.stringify(good));
  await page.waitForURL(/\/patterns\/[^/]+\/board$/);
  const id = new URL(page.url()).pathname.split('/')[2];
  const board = new DraftingBoardPage(page);
  await board.ready();
  expect((await board.counts()).sections).toBe(2);
  await expect.poll(() => board.boardLabels()).toEqual(['A1', 'A2', 'B1', 'B2', 'B3']);

  // The server holds the file's document as the library reads it (upgraded to the current version).
  const parsed = parsePatternDocument(good);
  if (!parsed.ok) throw new Error(`the example does not parse: ${JSON.stringify(parsed.issues)}`);
  const saved = (await (await page.request.get(`/api/patterns/${id}`)).json()) as { revision: { number: number; document: PatternDocument } };
  expect(saved.revision.number).toBe(1);
  expect(saved.revision.document).toEqual(parsed.document);
  expect(await patternTotal(page)).toBe(before + 1);

  // Export the front view as SVG: true size in inches, one path per patch on the front.
  const svg = await files.download('Front view as SVG');
  expect(svg.name).toBe(`${good.title}.svg`);
  const picture = await page.evaluate((text) => {
    const root = new DOMParser().parseFromString(text, 'image/svg+xml').documentElement;
    return {
      tag: root.tagName,
      parseError: root.getElementsByTagName('parsererror').length > 0,
      width: root.getAttribute('width'),
      height: root.getAttribute('height'),
      viewBox: root.getAttribute('viewBox'),
      patches: Array.from(root.querySelectorAll('path[data-patch]')).map((p) => p.getAttribute('data-patch')),
      paths: root.querySelectorAll('path').length,
    };
  }, svg.bytes.toString('utf8'));
  const { widthIn, heightIn } = parsed.document.canvas;
  expect(picture).toMatchObject({ tag: 'svg', parseError: false, width: `${widthIn}in`, height: `${heightIn}in`, viewBox: `0 0 ${widthIn} ${heightIn}` });
  // Compass Ring: A (wedge, 2 patches) and B (arc, 3 patches), each sewn 8 times round the ring.
  expect(frontPatchCount(parsed.document)).toBe(40);
  expect(picture.paths).toBe(40);
  expect(new Set(picture.patches)).toEqual(new Set(['A1', 'A2', 'B1', 'B2', 'B3']));

  // Export as PNG: 96 px per inch (the CSS inch), read from the PNG header (IHDR, ISO/IEC 15948).
  const png = await files.download('Front view as PNG');
  expect(png.name).toBe(`${good.title}.png`);
  expect(png.bytes.subarray(0, 8)).toEqual(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]));
  expect([png.bytes.readUInt32BE(16), png.bytes.readUInt32BE(20)]).toEqual([widthIn * 96, heightIn * 96]);

  // Download the pattern file and read it back with the library's parser.
  const file = await files.download('Pattern file (.seamwright.json)');
  expect(file.name).toBe(`${good.title}.seamwright.json`);
  const back = parsePatternDocument(JSON.parse(file.bytes.toString('utf8')));
  expect(back.ok).toBe(true);
  if (back.ok) expect(back.document).toEqual(saved.revision.document);

  await page.getByRole('button', { name: 'Download', exact: true }).click();
  await expect(page.getByRole('menuitem', { name: 'Front view as SVG' })).toBeVisible();
  await shot(page, 'download-menu');
  await page.keyboard.press('Escape');
  expect(errors).toEqual([]);
});
