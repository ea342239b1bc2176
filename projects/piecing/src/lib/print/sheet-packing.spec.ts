import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { PatternDocument, Point } from '../document/index';
import { buildOrchardWheel, buildStressPattern } from '../demo/index';
import { applyAffine } from './affine';
import { separated } from './nest-pair';
import type { RectIn } from './paper';
import { layoutTemplates } from './plan-print-layout';
import { planPrintLayout } from './render-print-set';
import { EDGE_SAFE_IN, ITEM_GAP_IN, TEST_BLOCK_GAP_IN, TEST_BLOCK_IN } from './sheet-frame';
import { buildPrintTemplates } from './print-templates';
import type { PrintLayout } from './layout-types';
import { templateOfRing } from './testing/print-test-fixtures';
import { tileDrawing } from './testing/tile-drawing';
import type { PrintTemplate } from './template-model';

/*
 * Template sheets against the area bound (issue 16): the test squares cost no template slot, and
 * whatever the templates, every print and every test-square block lies inside the printable area,
 * clear of the header text and at least the gap from everything else on its sheet.
 */

describe('sheets of the demo medallion and the stress pattern', () => {
  it('lays the Orchard Wheel medallion on Letter in at most 18 sheets, 1.5 × the bound of 12 (24 before issue 16, 20 before outline nesting, 19 before the tiling was chosen with the whole packing)', () => {
    const layout = planPrintLayout(buildOrchardWheel(), { paper: 'letter' });
    expect(layout.lowerBoundSheets).toBe(12);
    expect(layout.templateSheetCount).toBeLessThanOrEqual(18);
    expectSound(layout, templatesOf(buildOrchardWheel()));
    // The corner D (13.54 in. square less a quarter disc) takes a 10 in. wide tile on a landscape sheet of
    // its own; its small end tiles then share sheets with the arcs' pairs (two rows to a sheet).
    const corner = layout.templates.find((t) => t.sectionLabel === 'D')!;
    expect(corner.tilesPerCopy).toBe(4);
    const wide = layout.sheets.flatMap((s) => s.placements).filter((p) => p.tile && p.rect.width > 9.99);
    expect(wide).toHaveLength(4);
    // Each copy's tile map rides on its largest tile, alone on its sheet: no header has to hold two maps
    // (the header's middle holds only a few, and the first tiles in reading order shared sheets).
    expect(wide.every((p) => p.tile!.first)).toBe(true);
    for (const sheet of layout.sheets) expect(sheet.placements.filter((p) => p.tile?.first).length, `tile maps on sheet ${sheet.pageNumber}`).toBeLessThanOrEqual(1);
  });

  it('lays the Orchard Wheel medallion on A4 in at most 21 sheets (22 before the tiling was chosen with the whole packing)', () => {
    const layout = planPrintLayout(buildOrchardWheel(), { paper: 'a4' });
    expect(layout.templateSheetCount).toBeLessThanOrEqual(21);
    expectSound(layout, templatesOf(buildOrchardWheel()));
  });

  it('puts four 1,000-patch stress templates on every A4 sheet but the last: the test squares take no slot', () => {
    const layout = planPrintLayout(buildStressPattern(1000), { paper: 'a4' });
    // 100 templates of 4.5 × 3.5 in. (cutting line), four to a sheet: 25 sheets; the bound is 21.
    expect(layout.templateSheetCount).toBe(25);
    expect(layout.templateSheetCount).toBeLessThanOrEqual(1.25 * layout.lowerBoundSheets);
    for (const sheet of layout.sheets.slice(0, -1)) expect(sheet.placements).toHaveLength(4);
  });

  it('puts four stress templates on a Letter sheet by raising the test squares into the margin band', () => {
    // Letter less ½ in. margins is 7.5 × 10 in.; four 4.54 × 3.54 in. boxes with 0.1 in. gaps need
    // 7.18 × 9.18 in. however they are turned, leaving strips 0.32 and 0.82 in. wide inside the margins —
    // narrower than the 1 in. square. Raised to ¼ in. from the paper's top edge, the square ends at
    // 1.25 in. and, 0.06 in. below it, the two rows of templates end at 1.31 + 9.18 = 10.49 ≤ 10.5 in.
    const layout = planPrintLayout(buildStressPattern(300), { paper: 'letter' });
    expect(layout.templateSheetCount).toBe(8);
    for (const sheet of layout.sheets.slice(0, -1)) {
      expect(sheet.placements).toHaveLength(4);
      expect(sheet.frame.testBlock.y).toBeCloseTo(EDGE_SAFE_IN, 9);
      expect(sheet.frame.testBlock.x).toBeCloseTo(0.5, 9);
    }
    expectSound(layout, templatesOf(buildStressPattern(300)));
  });

  it('keeps the test squares inside the ½ in. margins wherever raising them places nothing more', () => {
    // The last, part-filled stress sheet (two templates) and every sheet of the medallion have room inside the margins.
    const last = planPrintLayout(buildStressPattern(300), { paper: 'letter' }).sheets.at(-1)!;
    expect(last.placements).toHaveLength(2);
    expect(within(last.frame.testBlock, last.frame.printable), `test block of the last stress sheet`).toBe(true);
    const medallion = planPrintLayout(buildOrchardWheel(), { paper: 'letter' });
    for (const sheet of medallion.sheets) expect(within(sheet.frame.testBlock, sheet.frame.printable), `medallion sheet ${sheet.pageNumber}`).toBe(true);
  });

  it('keeps every 1,000-patch stress sheet sound on Letter and A4, four templates a sheet', () => {
    const document = buildStressPattern(1000);
    const byId = templatesOf(document);
    for (const paper of ['letter', 'a4'] as const) {
      const layout = planPrintLayout(document, { paper });
      // 100 templates of 4.5 × 3.5 in. (cutting line), four to a sheet: 25 sheets; the bound is 21.
      expect(layout.templateSheetCount, paper).toBe(25);
      expectSound(layout, byId);
    }
  });
});

describe('tiles beside test squares raised into the margin band', () => {
  it('tiles a 3.3 × 17.4 in. template with stress rectangles on Letter, no tile map on a sheet with raised squares', () => {
    // Two rows of 8.97 in. tiles (9.17 in. with the caption) fit under squares raised into the margin band
    // (9.19 in. left), or beside squares inside the margins; four 4.5 × 3.5 in. rectangles a sheet need the
    // squares raised. A first tile (its sheet carries the tile map) must never count on raising them.
    const ring = (w: number, h: number) => [{ x: 0, y: 0 }, { x: w, y: 0 }, { x: w, y: h }, { x: 0, y: h }];
    const base = { kind: 'straight' as const, seams: [], patches: [], guideLines: [], matchingMarks: [], orientation: { direction: { x: 0, y: -1 }, towards: 'top of block' }, freeRotation: false };
    const templates: PrintTemplate[] = [
      { ...base, id: 'tall', sectionId: 'tall', sectionLabel: 'T', sewingLine: ring(3.3, 17.4), cuttingLine: ring(3.3, 17.4), copies: 2, areaSqIn: 3.3 * 17.4 },
      { ...base, id: 'rect', sectionId: 'rect', sectionLabel: 'R', sewingLine: ring(4.5, 3.5), cuttingLine: ring(4.5, 3.5), copies: 8, areaSqIn: 4.5 * 3.5 },
    ];
    const layout = layoutTemplates(templates, { paper: 'letter', marginIn: 0.5, mirrored: true, tileOverlapIn: 0.5 });
    expect(layout.templates.find((t) => t.templateId === 'tall')!.tilesPerCopy).toBeGreaterThan(1);
    // The rectangles four to a sheet, their squares raised.
    const rectSheets = layout.sheets.filter((s) => s.placements.filter((p) => p.templateId === 'rect').length === 4);
    expect(rectSheets.length).toBe(2);
    for (const sheet of rectSheets) expect(sheet.frame.testBlock.y).toBeCloseTo(EDGE_SAFE_IN, 9);
    expectSound(layout, new Map(templates.map((t) => [t.id, t])));
  });
});

describe('every sheet of any set of templates', () => {
  it('keeps prints and test squares inside the printable area, apart, and off the header text', () => {
    fc.assert(
      fc.property(
        fc.array(templateArb(), { minLength: 1, maxLength: 6 }),
        fc.constantFrom('letter' as const, 'a4' as const, 'legal' as const),
        fc.constantFrom(0.25, 0.5, 0.75),
        fc.boolean(),
        (shapes, paper, marginIn, mirrored) => {
          const templates = shapes.map((s, i) => ({ ...s, id: `t${i}`, sectionId: `t${i}`, sectionLabel: String.fromCharCode(65 + i) }));
          const layout = layoutTemplates(templates, { paper, marginIn, mirrored, tileOverlapIn: 0.5 });
          expectSound(layout, new Map(templates.map((t) => [t.id, t])));
          // Every copy placed (whole or as tiles).
          for (const t of templates) {
            const copies = new Set(layout.sheets.flatMap((s) => s.placements.filter((p) => p.templateId === t.id).map((p) => p.copy)));
            expect(copies.size).toBe(t.copies);
          }
        },
      ),
      { numRuns: 30 },
    );
  });
});

/** The soundness every template sheet must keep (see the describe above). */
function expectSound(layout: PrintLayout, byId: Map<string, PrintTemplate>): void {
  for (const sheet of layout.sheets) {
    const { content, printable, header, testBlock } = sheet.frame;
    // The block is the two test squares side by side (1 in. and 2 cm) or one above the other.
    const sides = [testBlock.width, testBlock.height].sort((a, b) => a - b);
    expect(sides[0]).toBeCloseTo(TEST_BLOCK_IN.height, 9);
    expect(sides[1]).toBeCloseTo(TEST_BLOCK_IN.width, 9);
    // Inside the margins, or raised into the margin band but never nearer the paper's edge than ¼ in.
    // (most home printers cannot print the outer ¼ in.: common practice, from memory).
    const paper = { x: EDGE_SAFE_IN, y: EDGE_SAFE_IN, width: sheet.frame.widthIn - 2 * EDGE_SAFE_IN, height: sheet.frame.heightIn - 2 * EDGE_SAFE_IN };
    expect(within(testBlock, paper), `test block of sheet ${sheet.pageNumber} at least ¼ in. from the paper's edge`).toBe(true);
    expect(within(testBlock, sheet.frame.testArea), `test block of sheet ${sheet.pageNumber} inside the test-square area`).toBe(true);
    if (layout.marginIn <= EDGE_SAFE_IN) expect(within(testBlock, printable), `test block of sheet ${sheet.pageNumber} inside the printable area`).toBe(true);
    // Raised into the margin band, the header's text takes the room a tile map would need.
    if (testBlock.y < printable.y - 1e-9) {
      for (const p of sheet.placements) expect(p.tile?.first ?? false, `first tile on sheet ${sheet.pageNumber}, whose test squares are raised`).toBe(false);
    }
    // In the header band only at its left end: the header's text is drawn to the right of it.
    if (testBlock.y < header.y + header.height) expect(testBlock.x).toBeCloseTo(printable.x, 9);
    const groups: Point[][][] = [[rectRing(testBlock)]];
    const names = ['test block'];
    for (const p of sheet.placements) {
      expect(within(p.rect, content), `${p.sectionLabel}${p.copy} inside the content area`).toBe(true);
      if (p.caption) expect(within(p.caption.rect, content), `caption of ${p.sectionLabel}${p.copy}`).toBe(true);
      const cut = byId.get(p.templateId)!.cuttingLine.map((q) => applyAffine(p.transform, q));
      const rings = p.tile ? tileDrawing(p, cut) : [cut];
      if (!p.tile) {
        // The real cutting line inside the print's box (which lies inside the content area).
        for (const q of rings[0]) expect(within({ x: q.x, y: q.y, width: 0, height: 0 }, p.rect), `${p.sectionLabel}${p.copy} cutting line inside its box`).toBe(true);
      }
      if (p.caption) rings.push(rectRing(p.caption.rect));
      groups.push(rings);
      names.push(`${p.sectionLabel}${p.copy}${p.tile ? ` tile ${p.tile.row},${p.tile.column}` : ''}`);
    }
    // At least the gap apart (outlines were simplified within 0.02 in. for the search, so allow that twice);
    // the test block at least its own gap from every cutting line and caption (it is a plain rectangle).
    for (let i = 0; i < groups.length; i++) {
      for (let j = i + 1; j < groups.length; j++) {
        const gap = i === 0 ? TEST_BLOCK_GAP_IN - 1e-6 : ITEM_GAP_IN - 0.04;
        for (const a of groups[i]) for (const b of groups[j]) expect(separated(a, b, gap), `${names[i]} apart from ${names[j]} on sheet ${sheet.pageNumber}`).toBe(true);
      }
    }
  }
}

function templatesOf(document: PatternDocument): Map<string, PrintTemplate> {
  return new Map(buildPrintTemplates(document, { foundation: 'paper', copies: 'plan' }).map((t) => [t.id, t]));
}

/** Random cutting lines: rectangles, triangles, L-shapes and arcs (annular sectors), some larger than a sheet. */
function templateArb(): fc.Arbitrary<Omit<PrintTemplate, 'id' | 'sectionId' | 'sectionLabel'>> {
  const rect = fc.record({ w: fc.double({ min: 0.6, max: 16, noNaN: true }), h: fc.double({ min: 0.6, max: 12, noNaN: true }) }).map(({ w, h }) => [
    { x: 0, y: 0 },
    { x: w, y: 0 },
    { x: w, y: h },
    { x: 0, y: h },
  ]);
  const triangle = fc.record({ w: fc.double({ min: 1, max: 8, noNaN: true }), h: fc.double({ min: 1, max: 8, noNaN: true }), t: fc.double({ min: 0, max: 1, noNaN: true }) }).map(({ w, h, t }) => [
    { x: 0, y: 0 },
    { x: w, y: 0 },
    { x: w * t, y: h },
  ]);
  const ell = fc.record({ w: fc.double({ min: 2, max: 9, noNaN: true }), arm: fc.double({ min: 0.5, max: 1.8, noNaN: true }) }).map(({ w, arm }) => [
    { x: 0, y: 0 },
    { x: w, y: 0 },
    { x: w, y: arm },
    { x: arm, y: arm },
    { x: arm, y: w },
    { x: 0, y: w },
  ]);
  const arc = fc
    .record({ r: fc.double({ min: 2, max: 12, noNaN: true }), depth: fc.double({ min: 0.8, max: 3, noNaN: true }), sweep: fc.double({ min: 0.3, max: 1.4, noNaN: true }) })
    .map(({ r, depth, sweep }) => {
      const n = 12;
      const outer = Array.from({ length: n + 1 }, (_, k) => polar(r + depth, (sweep * k) / n));
      const inner = Array.from({ length: n + 1 }, (_, k) => polar(r, (sweep * (n - k)) / n));
      return [...outer, ...inner];
    });
  return fc
    .record({
      ring: fc.oneof(rect, triangle, ell, arc),
      copies: fc.integer({ min: 1, max: 3 }),
      freeRotation: fc.boolean(),
    })
    .map(({ ring, copies, freeRotation }) => templateOfRing(ring, copies, freeRotation));
}

function polar(r: number, a: number): Point {
  return { x: r * Math.cos(a), y: r * Math.sin(a) };
}

function within(r: RectIn, outer: RectIn): boolean {
  return r.x >= outer.x - 1e-9 && r.y >= outer.y - 1e-9 && r.x + r.width <= outer.x + outer.width + 1e-9 && r.y + r.height <= outer.y + outer.height + 1e-9;
}

function rectRing(r: RectIn): Point[] {
  return [{ x: r.x, y: r.y }, { x: r.x + r.width, y: r.y }, { x: r.x + r.width, y: r.y + r.height }, { x: r.x, y: r.y + r.height }];
}

