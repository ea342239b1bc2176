import { beforeAll, describe, expect, it } from 'vitest';
import { buildCuttingList, planCopies, sectionSeamAllowance } from '../fabrication/index';
import { polygonArea, signedArea } from '../geometry/index';
import { applyAffine, type Affine } from './affine';
import { inspectPdf, rectangleSides, signedAreaPt, type PdfPageInfo, type PdfPath } from './testing/pdf-inspect';
import { renderPrintSet, type PrintSetResult } from './render-print-set';
import { PAPER_NAMES, type PaperName } from './paper';
import { asymmetricBlock, readShippedFonts, testMedallion } from './testing/print-test-fixtures';
import type { PatternDocument } from '../document/index';

// Reference values (not taken from our own tables):
// 1 pt = 1/72 in. (ISO 32000-1:2008 §8.3.2.3); 1 in. = 25.4 mm exactly; ISO 216 A4 210 × 297 mm, A3 297 × 420 mm;
// ANSI/ASME Y14.1 Letter 8.5 × 11 in., Tabloid 11 × 17 in.; Legal 8.5 × 14 in. (North American practice).
const MM = 72 / 25.4;
const PAGE_PT: Record<PaperName, [number, number]> = {
  letter: [612, 792],
  legal: [612, 1008],
  tabloid: [792, 1224],
  a4: [210 * MM, 297 * MM],
  a3: [297 * MM, 420 * MM],
};
const INCH_SQUARE_PT = 72;
const CM2_SQUARE_PT = 20 * MM; // 56.6929…
const STANDARD_14 = ['Helvetica', 'Times', 'Courier', 'Symbol', 'ZapfDingbats'];

const fonts = readShippedFonts();
const CREATED = '2026-11-30T12:00:00Z';

// Line styles of the writer (draw-template.ts): sewing line 0.9 pt solid, cutting line 0.5 pt dashed 6/3.
const isSewing = (p: PdfPath) => p.kind === 'stroke' && Math.abs(p.lineWidth - 0.9) < 1e-6 && p.dash.length === 0;
const isCutting = (p: PdfPath) => p.kind === 'stroke' && Math.abs(p.lineWidth - 0.5) < 1e-6 && p.dash.join() === '6,3';

async function render(document: PatternDocument, paper: PaperName, extra: Record<string, unknown> = {}): Promise<PrintSetResult> {
  return renderPrintSet(document, { paper, createdAt: CREATED, fonts, ...extra });
}

describe('print set of the test medallion (Letter, mirrored)', () => {
  const document = testMedallion();
  let result: PrintSetResult;
  let pages: PdfPageInfo[];
  let fontInfo: Awaited<ReturnType<typeof inspectPdf>>['fonts'];

  beforeAll(async () => {
    result = await render(document, 'letter');
    ({ pages, fonts: fontInfo } = await inspectPdf(result.pdf));
    // One render with its booklet, read back once for every check below; generous for a shared CI machine.
  }, 30_000);

  it('has the booklet, then the template sheets, then the piece templates, as counted', () => {
    expect(pages.length).toBe(result.sheetCount);
    expect(result.templateSheetCount).toBe(result.layout.sheets.length);
    expect(result.sheetCount).toBe(result.bookletSheetCount + result.templateSheetCount + result.pieceTemplateSheetCount);
    expect(result.layout.sheets[0].pageNumber).toBe(result.bookletSheetCount + 1);
  });

  it('puts a 1 in. (72 pt) and a 2 cm (56.69 pt) test square on every sheet', () => {
    for (const page of pages) {
      const squares = page.paths
        .filter((p) => p.kind === 'stroke')
        .flatMap((p) => p.subpaths.map(rectangleSides))
        .filter((r): r is NonNullable<typeof r> => r !== null && Math.abs(r.width - r.height) < 0.01);
      expect(squares.some((r) => Math.abs(r.width - INCH_SQUARE_PT) <= 0.01)).toBe(true);
      expect(squares.some((r) => Math.abs(r.width - CM2_SQUARE_PT) <= 0.01)).toBe(true);
    }
  });

  it('labels every sheet with the title, "Sheet n of N" and the print-at-100 % line', () => {
    pages.forEach((page, i) => {
      const text = page.text.join(' ');
      expect(text).toContain('Test medallion');
      expect(text).toContain(`Sheet ${i + 1} of ${pages.length}`);
      expect(text).toContain('Print at 100 % / actual size — measure before cutting');
    });
  });

  it('states "N sheets (at least M by area)" on the cover, with M = ceil(total template area / printable area)', () => {
    const plan = planCopies(document);
    let area = 0;
    for (const s of document.sections) {
      const copies = plan.sections.find((c) => c.sectionId === s.id)!.templatesNeeded;
      area += polygonArea(sectionSeamAllowance(s, document.seamAllowanceIn).cuttingLine) * copies;
    }
    const m = Math.ceil(area / (7.5 * 10)); // Letter less ½ in. margins: 7.5 × 10 in.
    expect(result.lowerBoundSheets).toBe(m);
    expect(pages[0].text.join(' ')).toContain(`${result.templateSheetCount} sheets (at least ${m} by area)`);
  });

  it('embeds the shipped TrueType font and no standard-14 font', () => {
    expect(fontInfo.length).toBeGreaterThan(0);
    for (const f of fontInfo) {
      expect(f.missingFile).toBe(false);
      expect(f.isType3Font).toBe(false);
      expect(f.type).toMatch(/TrueType|CIDFontType2/);
      expect(f.dataLength).toBeGreaterThan(1000);
      expect(STANDARD_14.some((s) => f.name.startsWith(s))).toBe(false);
    }
    for (const page of pages) expect(page.fontIds.length).toBeGreaterThan(0);
    const raw = Buffer.from(result.pdf).toString('latin1');
    expect(raw).toContain('/FontFile2');
    expect(raw).not.toMatch(/\/BaseFont \/(Helvetica|Times|Courier|Symbol|ZapfDingbats)/);
  });

  it('prints every template as many times as the copies plan says, with its copy tag', () => {
    const plan = planCopies(document);
    for (const s of plan.sections) {
      const summary = result.layout.templates.find((t) => t.templateId === s.sectionId)!;
      expect(summary.copies).toBe(s.templatesNeeded);
      const placements = result.layout.sheets.flatMap((sh) => sh.placements.filter((p) => p.templateId === s.sectionId));
      expect(placements.length).toBe(s.templatesNeeded * summary.tilesPerCopy);
    }
    const templateText = pages.slice(result.bookletSheetCount, result.bookletSheetCount + result.templateSheetCount).map((p) => p.text.join(' ')).join(' ');
    for (let k = 1; k <= 8; k++) expect(templateText).toMatch(new RegExp(`copy ${k} of 8|copies (${k} and \\d+|\\d+ and ${k}) of 8`));
  });

  it('keeps every cutting line inside the printable area, or clipped to tiles inside it', () => {
    const marginPt = 0.5 * 72;
    let cutting = 0;
    // Page 1 (the cover) has a cutting-line sample in its legend: only template sheets are counted.
    pages.slice(result.bookletSheetCount, result.bookletSheetCount + result.templateSheetCount).forEach((page) => {
      const inside = (x: number, y: number) =>
        x >= marginPt - 0.01 && x <= page.width - marginPt + 0.01 && y >= marginPt - 0.01 && y <= page.height - marginPt + 0.01;
      for (const path of page.paths.filter(isCutting)) {
        cutting++;
        if (path.clips.length === 0) {
          for (const s of path.subpaths) for (const p of s.points) expect(inside(p.x, p.y)).toBe(true);
        } else {
          const clip = rectangleSides(path.clips[path.clips.length - 1])!;
          expect(inside(clip.x, clip.y) && inside(clip.x + clip.width, clip.y + clip.height)).toBe(true);
        }
      }
    });
    const expected = result.layout.sheets.reduce((s, sh) => s + sh.placements.length, 0);
    expect(cutting).toBe(expected);
  });

  it('covers a tiled template completely, neighbouring tiles overlapping by at least ½ in.', () => {
    const corner = document.sections.find((s) => s.label === 'C')!;
    const ring = sectionSeamAllowance(corner, document.seamAllowanceIn).cuttingLine;
    const tiles = result.layout.sheets.flatMap((s) => s.placements.filter((p) => p.templateId === corner.id));
    expect(tiles.length).toBeGreaterThan(1);
    // Every point of the cutting line shows on some tile.
    for (const q of ring) {
      expect(tiles.some((t) => contains(t.rect, applyAffine(t.transform, q), 1e-6))).toBe(true);
    }
    // Neighbours share a strip at least the stated overlap (≥ ½ in.) wide, in drawing-plane inches.
    for (const a of tiles) {
      for (const b of tiles) {
        if (b.tile!.row !== a.tile!.row || b.tile!.column !== a.tile!.column + 1) continue;
        const ra = backToDrawing(a.transform, a.rect);
        const rb = backToDrawing(b.transform, b.rect);
        const overlap = Math.min(ra.x1, rb.x1) - Math.max(ra.x0, rb.x0);
        expect(overlap).toBeGreaterThanOrEqual(0.5 - 1e-9);
        // Alignment marks in the shared strip are at the same drawing-plane points on both tiles.
        const strip = { x0: Math.max(ra.x0, rb.x0), x1: Math.min(ra.x1, rb.x1), y0: Math.max(ra.y0, rb.y0), y1: Math.min(ra.y1, rb.y1) };
        const inStrip = (p: { x: number; y: number }) => p.x >= strip.x0 - 1e-9 && p.x <= strip.x1 + 1e-9 && p.y >= strip.y0 - 1e-9 && p.y <= strip.y1 + 1e-9;
        const marksA = a.tile!.alignmentMarks.map((m) => invert(a.transform, m)).filter(inStrip);
        const marksB = b.tile!.alignmentMarks.map((m) => invert(b.transform, m)).filter(inStrip);
        expect(marksA.length).toBeGreaterThan(0);
        expect(marksB.length).toBe(marksA.length);
        for (const m of marksA) expect(marksB.some((n) => Math.hypot(n.x - m.x, n.y - m.y) < 1e-6)).toBe(true);
      }
    }
    const text = pages.map((p) => p.text.join(' ')).join(' ');
    expect(text).toMatch(/row 2, column \d/);
  });

  it('mirrors every template: sewing lines wind the other way round than in the document', () => {
    // The drawing plane is y-down and PDF space y-up, so an unmirrored copy shows the opposite sign of
    // the document's signed area; a mirror image flips it once more.
    const expected = document.sections.map((s) => {
      const line = sectionSeamAllowance(s, document.seamAllowanceIn).sewingLine;
      return { areaPt: polygonArea(line) * 72 * 72, sign: Math.sign(signedArea(line)) };
    });
    let checked = 0;
    for (const page of pages.slice(result.bookletSheetCount, result.bookletSheetCount + result.templateSheetCount)) {
      for (const path of page.paths.filter(isSewing)) {
        for (const s of path.subpaths.filter((sp) => sp.closed && sp.points.length >= 3)) {
          const a = signedAreaPt(s.points);
          const match = expected.find((e) => Math.abs(Math.abs(a) - e.areaPt) / e.areaPt < 0.002);
          expect(match).toBeDefined();
          expect(Math.sign(a)).toBe(match!.sign);
          checked++;
        }
      }
    }
    expect(checked).toBe(result.layout.sheets.reduce((s, sh) => s + sh.placements.length, 0));
  });

  it('opens with the booklet: fabric requirements, cutting, strip sets and the cautions', () => {
    const tail = pages.slice(0, result.bookletSheetCount).map((p) => p.text.join(' ')).join(' ');
    expect(tail).toContain('Cutting instructions');
    // Every fabric of the cutting list is listed with its yardage.
    for (const f of buildCuttingList(document).fabrics) expect(tail).toContain(f.name);
    expect(tail).toContain('Where each fabric goes');
    expect(tail).toContain('Strip set');
    expect(tail).toContain('Rotary cutters are very sharp');
    expect(tail).toContain('Freezer paper in a laser printer');
  });
});

describe('print set options', () => {
  it.each(PAPER_NAMES)('writes %s pages at the standard size (within 0.01 pt), portrait or landscape', async (paper) => {
    const result = await render(testMedallion(), paper, { copies: 'single' });
    const { pages } = await inspectPdf(result.pdf);
    const [w, h] = PAGE_PT[paper];
    for (const page of pages) {
      const portrait = Math.abs(page.width - w) <= 0.01 && Math.abs(page.height - h) <= 0.01;
      const landscape = Math.abs(page.width - h) <= 0.01 && Math.abs(page.height - w) <= 0.01;
      expect(portrait || landscape).toBe(true);
    }
  });

  it('gives byte-identical PDFs for the same document and options, and differs when the date does', async () => {
    const doc = asymmetricBlock();
    const a = await render(doc, 'a4');
    const b = await render(doc, 'a4');
    expect(Buffer.from(a.pdf).equals(Buffer.from(b.pdf))).toBe(true);
    const raw = Buffer.from(a.pdf).toString('latin1');
    expect(raw).toContain("/CreationDate (D:20261130120000+00'00')");
    const c = await render(doc, 'a4', { createdAt: '2026-11-30T12:00:01Z' });
    expect(Buffer.from(a.pdf).equals(Buffer.from(c.pdf))).toBe(false);
  });

  it('prints as seen from the front when asked: the same outline, wound the other way', async () => {
    const doc = asymmetricBlock();
    const line = sectionSeamAllowance(doc.sections[0], doc.seamAllowanceIn).sewingLine;
    const docSign = Math.sign(signedArea(line));
    // The trapezoid (0,0) (3,0) (3,1) (0,2): area 3 × (1 + 2) / 2 = 4.5 sq in. = 4.5 × 72² pt².
    const areaPt = 4.5 * 72 * 72;
    for (const mirrored of [true, false]) {
      const result = await render(doc, 'letter', { mirrored });
      const { pages } = await inspectPdf(result.pdf);
      const outlines = pages[result.bookletSheetCount].paths.filter(isSewing).flatMap((p) => p.subpaths.filter((s) => s.closed));
      expect(outlines.length).toBe(1);
      const a = signedAreaPt(outlines[0].points);
      expect(Math.abs(a)).toBeCloseTo(areaPt, 0);
      expect(Math.sign(a)).toBe(mirrored ? docSign : -docSign);
    }
  });

  it('rejects bad options with the field named', async () => {
    await expect(render(asymmetricBlock(), 'letter', { marginIn: 0.01 })).rejects.toThrow(/marginIn/);
    await expect(render(asymmetricBlock(), 'b5' as PaperName)).rejects.toThrow(/paper/);
  });
});

function contains(r: { x: number; y: number; width: number; height: number }, p: { x: number; y: number }, eps: number): boolean {
  return p.x >= r.x - eps && p.x <= r.x + r.width + eps && p.y >= r.y - eps && p.y <= r.y + r.height + eps;
}

/** A sheet point mapped back into the drawing plane through the inverse of a placement's map. */
function invert(m: Affine, p: { x: number; y: number }): { x: number; y: number } {
  const det = m.a * m.d - m.b * m.c;
  const x = p.x - m.e;
  const y = p.y - m.f;
  return { x: (m.d * x - m.c * y) / det, y: (-m.b * x + m.a * y) / det };
}

/** A sheet rectangle mapped back into the drawing plane through the inverse of a placement's map. */
function backToDrawing(m: Affine, r: { x: number; y: number; width: number; height: number }) {
  const inv = (p: { x: number; y: number }) => invert(m, p);
  const corners = [inv({ x: r.x, y: r.y }), inv({ x: r.x + r.width, y: r.y }), inv({ x: r.x, y: r.y + r.height }), inv({ x: r.x + r.width, y: r.y + r.height })];
  return { x0: Math.min(...corners.map((c) => c.x)), x1: Math.max(...corners.map((c) => c.x)), y0: Math.min(...corners.map((c) => c.y)), y1: Math.max(...corners.map((c) => c.y)) };
}
