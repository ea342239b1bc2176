import { beforeAll, describe, expect, it } from 'vitest';
import { buildOrchardWheel } from '../../demo/index';
import type { PatternDocument } from '../../document/index';
import { PRINT_CAUTIONS } from '../cautions';
import { renderPrintSet, type PrintSetResult } from '../render-print-set';
import { buildPieceTemplates } from '../piece-templates/build-piece-templates';
import { inspectPdf, type PdfPageInfo, type PdfPath } from '../testing/pdf-inspect';
import { readShippedFonts, unsewableStrip } from '../testing/print-test-fixtures';
import { resolveJoiningPlan } from '../../joining/index';
import { TRIMMING_RULE } from './draw-trimming';
import { finishedBlockSize } from './finished-size';
import { UnsewablePatternError } from './unsewable-sections';

const fonts = readShippedFonts();
const NOTES = 'Choose a low-contrast background for the corners.\n\nPress the ring seams open to reduce bulk.';
// Centre line of a stripe on a piece template: 0.8 pt, dash 6 2 1.5 2 (draw-piece-templates.ts); guide lines 0.6 pt, dash 1.5 1.5.
const isCentreLine = (p: PdfPath) => p.kind === 'stroke' && Math.abs(p.lineWidth - 0.8) < 1e-6 && p.dash.join() === '6,2,1.5,2';
const isGuideLine = (p: PdfPath) => p.kind === 'stroke' && Math.abs(p.lineWidth - 0.6) < 1e-6 && p.dash.join() === '1.5,1.5';
const text = (pages: readonly PdfPageInfo[]) => pages.map((p) => p.text.join(' ')).join(' ');

describe('the booklet of "Orchard Wheel" with designer\'s notes', () => {
  let document: PatternDocument;
  let result: PrintSetResult;
  let pages: PdfPageInfo[];
  let booklet: string;

  beforeAll(async () => {
    document = { ...buildOrchardWheel(), notes: NOTES };
    result = await renderPrintSet(document, { paper: 'letter', createdAt: '2026-12-01T00:00:00Z', fonts });
    ({ pages } = await inspectPdf(result.pdf));
    booklet = text(pages.slice(0, result.bookletSheetCount));
  }, 30_000);

  it('puts the finished size of the block (its sections, 26 in. square) on the cover, not the drawing area', () => {
    // The demo squares the 22 in. circle to a 26 in. block (docs/design-notes.md#demo-data); 26 in. = 66.04 cm.
    expect(text(pages.slice(0, 1))).toContain('Finished size: 26 × 26 in. (66 × 66 cm)');
    const size = finishedBlockSize({ sections: document.sections })!;
    expect(size.widthIn).toBeCloseTo(26, 6);
    expect(size.heightIn).toBeCloseTo(26, 6);
  });

  it('writes the piecing steps with their pressing, and the strip-set pressing rule', () => {
    expect(booklet).toContain('Section B: piecing steps (sew 8)');
    expect(booklet).toContain('Press toward B2.');
    expect(booklet).toContain('Press toward B3.');
    expect(booklet).toContain('pre-trim the fabric ¼ in. beyond it');
    expect(booklet).toContain('Press each patch flat');
    // Plum (#6d3b5e) is darker than Oat (#e9dcc1): both seams of the centre stripe press toward Plum.
    expect(booklet).toContain('Seam 1: sew left to right; press toward Plum');
    expect(booklet).toContain('Seam 2: sew right to left; press toward Plum');
  });

  it('writes the joining steps of the default plan, with their pressing and matching marks', () => {
    const plan = resolveJoiningPlan(document);
    expect(plan.isDefault).toBe(true);
    expect(booklet).toContain('Joining the sections');
    // 8 stars, 8 stripe bands, 16 points, 4 corners (docs/design-notes.md#demo-data): four rings, then three joins outward.
    expect(plan.steps.length).toBe(7);
    expect(booklet).toContain('1. Join the 8 copies of A into a ring (8 seams; the last closes the ring)');
    expect(booklet).toContain('3. Join the 16 copies of C into a ring (16 seams; the last closes the ring)');
    for (const step of plan.steps) {
      expect(booklet).toContain(`${step.number}. ${step.label}`);
      expect(booklet).toContain(step.pressLabel.split(' ').slice(0, 4).join(' '));
      if (step.marks.length > 0) expect(booklet).toContain(`Match the ${step.marks.length} matching marks.`);
    }
  });

  it("carries the designer's notes: the pattern's on the cover and notes page, each section's on its piecing page and its templates", () => {
    expect(text(pages.slice(0, 1))).toContain('Choose a low-contrast background for the corners.');
    expect(booklet).toContain('Press the ring seams open to reduce bulk.');
    const noteA = document.sections.find((s) => s.label === 'A')!.note!;
    expect(booklet).toContain(`Designer's note: ${noteA}`);
    const templates = pages.slice(result.bookletSheetCount, result.bookletSheetCount + result.templateSheetCount);
    const withA = result.layout.sheets.filter((s) => s.sectionLabels.includes('A')).map((s) => templates[s.pageNumber - result.bookletSheetCount - 1]);
    expect(withA.length).toBeGreaterThan(0);
    for (const page of withA) expect(page.text.join(' ')).toContain(`Section A — designer's note: ${noteA}`);
  });

  it('says how to trim: straight edges with a ruler, curved edges with scissors, section by section', () => {
    expect(booklet).toContain(TRIMMING_RULE);
    // B is an arc section (5–8 in.); D's inner edge follows the 11 in. circle as chords (docs/design-notes.md#demo-data).
    expect(booklet).toContain('B: the inner and outer edges are curved');
    expect(booklet).toContain('D: one or more edges follow a curve');
  });

  it('states the copies rule with its figures on the cover', () => {
    const cover = text(pages.slice(0, 1));
    expect(cover).toContain('Freezer paper loses its hold by pressings');
    // docs/design-notes.md#copies: B has k = 3 patches and is sewn 8 times; with P = 16 one template lasts
    // floor(16 / 3) = 5 sections, so 8 sections take ceil(8 / 5) = 2 freezer-paper prints (8 on paper).
    expect(cover).toMatch(/B\s+3\s+8\s+5\s+8 paper \(2 on freezer paper\)/);
    // C: 3 patches, 16 sewn → ceil(16 / 5) = 4. Piece template B1: 8 pieces, one pressing each → ceil(8 / 16) = 1.
    expect(cover).toMatch(/C\s+3\s+16\s+5\s+16 paper \(4 on freezer paper\)/);
    expect(cover).toContain('B1 cuts 8 pieces: 1 print');
  });

  it('closes the booklet with every caution, before the templates', () => {
    for (const caution of PRINT_CAUTIONS) expect(booklet).toContain(caution.slice(0, 60));
  });

  it('prints a piece template of the strip-set patch B1 with the Oat centre line midway between the strip seams', () => {
    const [b1] = buildPieceTemplates(document);
    expect(b1.patchLabel).toBe('B1');
    const page = pages[result.bookletSheetCount + result.templateSheetCount];
    expect(page.text.join(' ')).toContain('Piece template B1');
    expect(page.text.join(' ')).toContain('centre of Oat');
    const centre = page.paths.filter(isCentreLine).flatMap((p) => p.subpaths);
    const guides = page.paths.filter(isGuideLine).flatMap((p) => p.subpaths);
    expect(centre.length).toBe(1);
    expect(guides.length).toBe(2);
    // The strips run straight up the template (axis -90°): the lines are vertical. Oat finishes 1 in.,
    // so its seams sit ½ in. (36 pt, ISO 32000-1 §8.3.2.3) either side of its centre line.
    const x = (s: { points: Array<{ x: number }> }) => s.points[0].x;
    for (const s of [...centre, ...guides]) expect(Math.abs(s.points[0].x - s.points[s.points.length - 1].x)).toBeLessThan(0.01);
    const gx = guides.map(x).sort((a, b) => a - b);
    expect(x(centre[0]) - gx[0]).toBeCloseTo(36, 1);
    expect(gx[1] - x(centre[0])).toBeCloseTo(36, 1);
    // True scale: the centre line runs the length of the cutting line along it.
    const lengthPt = Math.hypot(b1.centreLines[0].b.x - b1.centreLines[0].a.x, b1.centreLines[0].b.y - b1.centreLines[0].a.y) * 72;
    const drawn = centre[0].points;
    expect(Math.hypot(drawn[1].x - drawn[0].x, drawn[1].y - drawn[0].y)).toBeCloseTo(lengthPt, 1);
  });
});

describe('a section not sewable as numbered', () => {
  it('is refused with the reason unless printUnsewable is set', async () => {
    const attempt = renderPrintSet(unsewableStrip(), { fonts });
    await expect(attempt).rejects.toBeInstanceOf(UnsewablePatternError);
    await expect(renderPrintSet(unsewableStrip(), { fonts })).rejects.toThrow(/Section A is not sewable as numbered: .*A2/);
  });

  it('prints anyway when asked, and every page of the section says so', async () => {
    const result = await renderPrintSet(unsewableStrip(), { fonts, printUnsewable: true });
    const { pages } = await inspectPdf(result.pdf);
    const templatePages = pages.slice(result.bookletSheetCount, result.bookletSheetCount + result.templateSheetCount);
    const piecing = pages.slice(2, result.bookletSheetCount).filter((p) => p.text.join(' ').includes('Section A: piecing steps'));
    expect(piecing.length).toBe(1);
    for (const page of [...piecing, ...templatePages]) expect(page.text.join(' ')).toContain('NOT SEWABLE AS NUMBERED: section A — printed anyway');
    expect(templatePages.length).toBe(1);
    // Pages about other things (the fabric requirements) carry no such notice.
    expect(pages[2].text.join(' ')).not.toContain('NOT SEWABLE AS NUMBERED');
    expect(text(pages.slice(0, 1))).toContain('Section A is not sewable as numbered');
  });
});
