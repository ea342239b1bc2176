import { describe, expect, it } from 'vitest';
import { curvedCornerDocument } from '../geometry/testing/curved-corner';
import { buildPrintTemplates } from './print-templates';
import { renderPrintSet } from './render-print-set';
import { inspectPdf, signedAreaPt, type PdfPath } from './testing/pdf-inspect';
import { readShippedFonts } from './testing/print-test-fixtures';

// Line style of the sewing line (draw-template.ts): 0.9 pt solid. 1 pt = 1/72 in. (ISO 32000-1:2008 §8.3.2.3).
const isSewing = (p: PdfPath) => p.kind === 'stroke' && Math.abs(p.lineWidth - 0.9) < 1e-6 && p.dash.length === 0;
const PT_PER_SQ_IN = 72 * 72;

describe('print set of a corner whose edge follows a ring', () => {
  it('prints the corner with its curve (not the chord) and carries its matching marks', async () => {
    const document = curvedCornerDocument();
    const corner = buildPrintTemplates(document, { foundation: 'paper', copies: 'plan' }).find((t) => t.sectionId === 'corner')!;
    expect(corner.matchingMarks).toHaveLength(4);
    for (const m of corner.matchingMarks) expect(Math.hypot(m.at.x, m.at.y)).toBeCloseTo(5, 9);

    // Tabloid holds the 8½ in. corner whole, so its sewing line is one closed path on one sheet.
    const result = await renderPrintSet(document, { paper: 'tabloid', createdAt: '2026-12-01T12:00:00Z', fonts: readShippedFonts() });
    const { pages } = await inspectPdf(result.pdf);
    const areas = pages.slice(result.bookletSheetCount, result.bookletSheetCount + result.templateSheetCount).flatMap((page) =>
      page.paths.filter(isSewing).flatMap((p) => p.subpaths.filter((s) => s.closed && s.points.length >= 3).map((s) => Math.abs(signedAreaPt(s.points)) / PT_PER_SQ_IN)),
    );
    // Standard mensuration: 64 − 25π/4 ≈ 44.37 sq in. for the corner (with the chord instead of the curve it
    // would be 64 − 12.5 = 51.5), and 25π/4 ≈ 19.63 for the quarter circle.
    const cornerArea = 64 - (25 * Math.PI) / 4;
    expect(areas.some((a) => Math.abs(a - cornerArea) < 0.02)).toBe(true);
    expect(areas.some((a) => Math.abs(a - 51.5) < 0.5)).toBe(false);
    expect(areas.some((a) => Math.abs(a - (25 * Math.PI) / 4) < 0.02)).toBe(true);
  });
});
