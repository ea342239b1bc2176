import { beforeAll, describe, expect, it } from 'vitest';
import { buildGardenGate, buildOrchardWheel } from '../demo/index';
import { planCopies, sectionSeamAllowance } from '../fabrication/index';
import { polygonArea, signedArea } from '../geometry/index';
import { inspectPdf, rectangleSides, signedAreaPt, type PdfPageInfo, type PdfPath } from './testing/pdf-inspect';
import { renderPrintSet, type PrintSetResult } from './render-print-set';
import { readShippedFonts } from './testing/print-test-fixtures';

// 1 pt = 1/72 in. (ISO 32000-1 §8.3.2.3); 1 in. = 25.4 mm exactly, so 2 cm = 20 × 72 / 25.4 pt.
const CM2_PT = (20 * 72) / 25.4;
const isSewing = (p: PdfPath) => p.kind === 'stroke' && Math.abs(p.lineWidth - 0.9) < 1e-6 && p.dash.length === 0;
const isCutting = (p: PdfPath) => p.kind === 'stroke' && Math.abs(p.lineWidth - 0.5) < 1e-6 && p.dash.join() === '6,3';

describe('print set of the demo medallion "Orchard Wheel" on Letter', () => {
  const document = buildOrchardWheel();
  let result: PrintSetResult;
  let pages: PdfPageInfo[];

  beforeAll(async () => {
    result = await renderPrintSet(document, { paper: 'letter', createdAt: '2026-12-01T00:00:00Z', fonts: readShippedFonts() });
    ({ pages } = await inspectPdf(result.pdf));
  }, 30_000);

  it('has 8.5 × 11 in. sheets (612 × 792 pt, ANSI/ASME Y14.1), each with both test squares', () => {
    for (const page of pages) {
      const portrait = Math.abs(page.width - 612) <= 0.01 && Math.abs(page.height - 792) <= 0.01;
      const landscape = Math.abs(page.width - 792) <= 0.01 && Math.abs(page.height - 612) <= 0.01;
      expect(portrait || landscape).toBe(true);
      const squares = page.paths.filter((p) => p.kind === 'stroke').flatMap((p) => p.subpaths.map(rectangleSides));
      expect(squares.some((r) => r && Math.abs(r.width - 72) <= 0.01 && Math.abs(r.height - 72) <= 0.01)).toBe(true);
      expect(squares.some((r) => r && Math.abs(r.width - CM2_PT) <= 0.01 && Math.abs(r.height - CM2_PT) <= 0.01)).toBe(true);
    }
  });

  it('prints each section as often as the copies plan says, all mirrored', () => {
    const plan = planCopies(document);
    const expected = document.sections.map((s) => {
      const line = sectionSeamAllowance(s, document.seamAllowanceIn).sewingLine;
      return { id: s.id, areaPt: polygonArea(line) * 72 * 72, sign: Math.sign(signedArea(line)) };
    });
    const seen = new Map<string, number>();
    for (const page of pages.slice(result.bookletSheetCount, result.bookletSheetCount + result.templateSheetCount)) {
      for (const path of page.paths.filter(isSewing)) {
        for (const s of path.subpaths.filter((sp) => sp.closed)) {
          const a = signedAreaPt(s.points);
          const match = expected.find((e) => Math.abs(Math.abs(a) - e.areaPt) / e.areaPt < 0.002);
          expect(match).toBeDefined();
          // Mirrored once by the print set and once more by PDF's y-up space: the document's sign.
          expect(Math.sign(a)).toBe(match!.sign);
          seen.set(match!.id, (seen.get(match!.id) ?? 0) + 1);
        }
      }
    }
    for (const s of plan.sections) {
      const summary = result.layout.templates.find((t) => t.templateId === s.sectionId)!;
      expect(seen.get(s.sectionId)).toBe(s.templatesNeeded * summary.tilesPerCopy);
    }
  });

  it('keeps every cutting line inside the ½ in. margins (or clipped to a tile inside them)', () => {
    const m = 36;
    for (const page of pages.slice(result.bookletSheetCount, result.bookletSheetCount + result.templateSheetCount)) {
      const inside = (x: number, y: number) => x >= m - 0.01 && x <= page.width - m + 0.01 && y >= m - 0.01 && y <= page.height - m + 0.01;
      for (const path of page.paths.filter(isCutting)) {
        const pts = path.clips.length ? [rectangleSides(path.clips[path.clips.length - 1])!].flatMap((r) => [{ x: r.x, y: r.y }, { x: r.x + r.width, y: r.y + r.height }]) : path.subpaths.flatMap((s) => s.points);
        for (const p of pts) expect(inside(p.x, p.y)).toBe(true);
      }
    }
  });

  it('states its sheet count against the area bound, never below it', () => {
    expect(result.templateSheetCount).toBeGreaterThanOrEqual(result.lowerBoundSheets);
    expect(pages[0].text.join(' ')).toContain(`${result.templateSheetCount} sheets (at least ${result.lowerBoundSheets} by area)`);
  });
});

describe('print set of the demo block "Garden Gate"', () => {
  it('prints every section once per block on A4, untiled, within 1.3 × the area bound', async () => {
    const document = buildGardenGate();
    const result = await renderPrintSet(document, { paper: 'a4', fonts: readShippedFonts() });
    const plan = planCopies(document);
    expect(result.layout.templates.map((t) => t.sectionLabel)).toEqual(['A', 'B', 'C']);
    for (const t of result.layout.templates) {
      expect(t.tilesPerCopy).toBe(1);
      expect(t.copies).toBe(plan.sections.find((s) => s.sectionId === t.templateId)!.templatesNeeded);
    }
    expect(result.templateSheetCount).toBeLessThanOrEqual(1.3 * result.lowerBoundSheets);
  });
});
