import { describe, expect, it } from 'vitest';
import { applyAffine } from './affine';
import { boundingRect, clippedBounds, minimumAreaTurn } from './layout-geometry';
import { separated } from './nest-pair';
import { layoutTemplates } from './plan-print-layout';
import { planPrintLayout } from './render-print-set';
import { buildPrintTemplates } from './print-templates';
import { equalSpans, prepareTemplate, tileGridFromSpans } from './prepare-template';
import { CAPTION_IN, EDGE_SAFE_IN, ITEM_GAP_IN } from './sheet-frame';
import { asymmetricBlock, testMedallion } from './testing/print-test-fixtures';
import { buildOrchardWheel } from '../demo/index';
import { readPatternDocument } from '../document/index';
import type { RectIn } from './paper';
import { tileDrawing } from './testing/tile-drawing';

const turn = (pts: { x: number; y: number }[], a: number) =>
  pts.map((p) => ({ x: Math.cos(a) * p.x - Math.sin(a) * p.y, y: Math.sin(a) * p.x + Math.cos(a) * p.y }));


describe('minimum-area turn', () => {
  it('turns a 4 × 1 rectangle drawn at 30° back square to the axes', () => {
    const rect = turn([{ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 4, y: 1 }, { x: 0, y: 1 }], Math.PI / 6);
    const t = minimumAreaTurn(rect);
    const box = boundingRect(turn(rect, t));
    // The best box of a rectangle is the rectangle itself: area 4.
    expect(box.width * box.height).toBeCloseTo(4, 9);
  });

  it('leaves an axis-aligned rectangle unturned', () => {
    expect(minimumAreaTurn([{ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 4, y: 1 }, { x: 0, y: 1 }])).toBe(0);
  });
});

describe('clipped bounds', () => {
  it('gives the box of the part of an L-shape inside a window, and null for an empty window', () => {
    const l = [{ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 4, y: 1 }, { x: 1, y: 1 }, { x: 1, y: 4 }, { x: 0, y: 4 }];
    expect(clippedBounds(l, { x: 0.5, y: 0.5, width: 5, height: 5 })).toEqual({ x: 0.5, y: 0.5, width: 3.5, height: 3.5 });
    expect(clippedBounds(l, { x: 2, y: 2, width: 1, height: 1 })).toBeNull();
  });
});

describe('layout of the test medallion on Letter', () => {
  const document = testMedallion();
  const layout = planPrintLayout(document, { paper: 'letter' });
  const templates = buildPrintTemplates(document, { foundation: 'paper', copies: 'plan' });
  const byId = new Map(templates.map((t) => [t.id, t]));

  it('is the same plan every time (pure)', () => {
    expect(planPrintLayout(document, { paper: 'letter' })).toEqual(layout);
  });

  it('places every copy of every template, and tiles the corner that is larger than a sheet', () => {
    for (const t of templates) {
      const copies = new Set(layout.sheets.flatMap((s) => s.placements.filter((p) => p.templateId === t.id).map((p) => p.copy)));
      expect(copies.size).toBe(t.copies);
    }
    const corner = layout.templates.find((t) => t.sectionLabel === 'C')!;
    expect(corner.tilesPerCopy).toBeGreaterThan(1);
  });

  it('keeps every print inside the content area, clear of the others and of the test squares', () => {
    for (const sheet of layout.sheets) {
      const c = sheet.frame.content;
      for (const r of sheet.placements.map((p) => p.rect)) expect(within(r, c)).toBe(true);
      // The test squares may hang into the header band's left end (its text then starts beside them), and
      // up into the margin band, never nearer the paper's edge than ¼ in. (EDGE_SAFE_IN; see docs/printing.md).
      expect(within(sheet.frame.testBlock, sheet.frame.testArea)).toBe(true);
      expect(Math.min(sheet.frame.testBlock.x, sheet.frame.testBlock.y)).toBeGreaterThanOrEqual(EDGE_SAFE_IN - 1e-9);
      // What each print really covers: its cutting line (a tile: its clip rectangle), and its caption strip.
      const groups = sheet.placements.map((p) => [
        ...(p.tile ? tileDrawing(p, byId.get(p.templateId)!.cuttingLine.map((q) => applyAffine(p.transform, q))) : [byId.get(p.templateId)!.cuttingLine.map((q) => applyAffine(p.transform, q))]),
        ...(p.caption ? [rectRing(p.caption.rect)] : []),
      ]);
      groups.push([rectRing(sheet.frame.testBlock)]);
      // Gap between prints (0.1 in.); outlines were simplified within 0.02 in. for the gap search, so allow that twice.
      for (let i = 0; i < groups.length; i++) {
        for (let j = i + 1; j < groups.length; j++) {
          for (const a of groups[i]) for (const b of groups[j]) expect(separated(a, b, ITEM_GAP_IN - 0.04)).toBe(true);
        }
      }
    }
  });

  it('keeps every cutting line inside its box, and nested copies at least the gap apart', () => {
    for (const sheet of layout.sheets) {
      for (const p of sheet.placements) {
        if (p.tile) continue;
        const ring = byId.get(p.templateId)!.cuttingLine.map((q) => applyAffine(p.transform, q));
        const box = boundingRect(ring);
        expect(box.x).toBeGreaterThanOrEqual(p.rect.x - 1e-9);
        expect(box.y).toBeGreaterThanOrEqual(p.rect.y - 1e-9);
        expect(box.x + box.width).toBeLessThanOrEqual(p.rect.x + p.rect.width + 1e-9);
        expect(box.y + box.height).toBeLessThanOrEqual(p.rect.y + p.rect.height + 1e-9);
        if (p.nestedWith !== undefined && p.nestedWith > p.copy) {
          const partner = sheet.placements.find((o) => o.templateId === p.templateId && o.copy === p.nestedWith)!;
          const other = byId.get(p.templateId)!.cuttingLine.map((q) => applyAffine(partner.transform, q));
          expect(separated(ring, other, ITEM_GAP_IN - 1e-6)).toBe(true);
        }
      }
    }
  });

  it('counts the lower bound as ceil(total template area / printable area)', () => {
    const area = templates.reduce((s, t) => s + t.areaSqIn * t.copies, 0);
    // Letter less ½ in. margins: 7.5 × 10 in. = 75 sq in. printable.
    expect(layout.printableAreaSqIn).toBeCloseTo(75, 9);
    expect(layout.lowerBoundSheets).toBe(Math.ceil(area / 75));
    expect(layout.templateSheetCount).toBeGreaterThanOrEqual(layout.lowerBoundSheets);
  });

  it('prints one of each template when asked for single copies, and fewer on freezer paper', () => {
    const single = planPrintLayout(document, { paper: 'letter', copies: 'single' });
    expect(single.templates.every((t) => t.copies === 1)).toBe(true);
    // 8 ring copies with 16 pressings per freezer-paper template: ceil(8 / 16) = 1 print.
    const freezer = planPrintLayout(document, { paper: 'letter', foundation: 'freezer-paper' });
    expect(freezer.templates.find((t) => t.sectionLabel === 'A')!.copies).toBe(1);
  });
});

describe('layout of a small block', () => {
  it('fits one template on one sheet', () => {
    const document = asymmetricBlock();
    const layout = layoutTemplates(buildPrintTemplates(document, { foundation: 'paper', copies: 'plan' }), {
      paper: 'a4',
      marginIn: 0.5,
      mirrored: true,
      tileOverlapIn: 0.5,
    });
    expect(layout.templateSheetCount).toBe(1);
    expect(layout.lowerBoundSheets).toBe(1);
  });
});


function within(r: RectIn, outer: RectIn): boolean {
  return r.x >= outer.x - 1e-9 && r.y >= outer.y - 1e-9 && r.x + r.width <= outer.x + outer.width + 1e-9 && r.y + r.height <= outer.y + outer.height + 1e-9;
}

function rectRing(r: RectIn) {
  return [{ x: r.x, y: r.y }, { x: r.x + r.width, y: r.y }, { x: r.x + r.width, y: r.y + r.height }, { x: r.x, y: r.y + r.height }];
}

describe('tile spans', () => {
  it('cuts a length into equal spans that overlap by the overlap and cover it end to end', () => {
    // 10 in. in 3 spans overlapping ½ in.: each span (10 + 2 × 0.5) / 3 = 11/3 in. (worked by hand).
    const spans = equalSpans(10, 3, 0.5);
    expect(spans[0][0]).toBe(0);
    expect(spans[2][1]).toBeCloseTo(10, 12);
    for (const [a, b] of spans) expect(b - a).toBeCloseTo(11 / 3, 12);
    for (let k = 1; k < spans.length; k++) expect(spans[k - 1][1] - spans[k][0]).toBeCloseTo(0.5, 12);
  });

  it('leaves out the cells an L-shaped template does not reach, and trims the others to what they hold', () => {
    const l = [{ x: 0, y: 0 }, { x: 8, y: 0 }, { x: 8, y: 2 }, { x: 2, y: 2 }, { x: 2, y: 8 }, { x: 0, y: 8 }];
    const template = { id: 'l', sectionLabel: 'L', cuttingLine: l, freeRotation: false } as Parameters<typeof prepareTemplate>[0];
    const prepared = prepareTemplate(template, false);
    const half = prepared.width / 2;
    const grid = tileGridFromSpans(prepared, [[0, half + 0.25], [half - 0.25, prepared.width]], [[0, half + 0.25], [half - 0.25, prepared.height]], 0.5);
    // The L's far corner cell (row 2, column 2) holds nothing.
    expect(grid.tiles.map((t) => `${t.row},${t.column}`)).toEqual(['1,1', '1,2', '2,1']);
    const right = grid.tiles.find((t) => t.column === 2)!;
    // Only the arm, 2 in. deep plus the 0.02 in. clearance, is printed on the right-hand tile.
    expect(right.used.height).toBeCloseTo(2 + 2 * 0.02, 9);
  });
});

describe('layout of the demo medallion and of edge cases', () => {
  it('splits each Orchard Wheel corner into at most four tiles on Letter, each fitting a sheet with its caption', () => {
    // Equal 2 × 4 cells took six tiles per corner; cutting the first or last row and column as large
    // as a sheet takes needs fewer joins for the quilter.
    const layout = planPrintLayout(buildOrchardWheel(), { paper: 'letter' });
    const corner = layout.templates.find((t) => t.sectionLabel === 'D')!;
    expect(corner.tilesPerCopy).toBeGreaterThan(1);
    expect(corner.tilesPerCopy).toBeLessThanOrEqual(4);
    for (const sheet of layout.sheets) {
      const c = sheet.frame.content;
      for (const p of sheet.placements.filter((q) => q.tile)) {
        expect(p.rect.width).toBeLessThanOrEqual(c.width + 1e-9);
        expect(p.rect.height + CAPTION_IN).toBeLessThanOrEqual(c.height + 1e-9);
      }
    }
  });

  it('keeps every Orchard Wheel print clear of the others on Letter and on A4 with 1 in. margins', () => {
    const document = buildOrchardWheel();
    const templates = new Map(buildPrintTemplates(document, { foundation: 'paper', copies: 'plan' }).map((t) => [t.id, t]));
    for (const options of [{ paper: 'letter' as const }, { paper: 'a4' as const, marginIn: 1 }]) {
      const layout = planPrintLayout(document, options);
      for (const sheet of layout.sheets) {
        const groups = sheet.placements.map((p) => [
          ...(p.tile ? tileDrawing(p, templates.get(p.templateId)!.cuttingLine.map((q) => applyAffine(p.transform, q))) : [templates.get(p.templateId)!.cuttingLine.map((q) => applyAffine(p.transform, q))]),
          ...(p.caption ? [rectRing(p.caption.rect)] : []),
        ]);
        groups.push([rectRing(sheet.frame.testBlock)]);
        for (let i = 0; i < groups.length; i++) {
          for (let j = i + 1; j < groups.length; j++) {
            for (const a of groups[i]) for (const b of groups[j]) expect(separated(a, b, ITEM_GAP_IN - 0.04)).toBe(true);
          }
        }
      }
    }
  });

  it('plans no template sheets for an empty pattern, and a bound of 0', () => {
    const layout = planPrintLayout(readPatternDocument({ formatVersion: 1, title: 'Empty', canvas: { widthIn: 4, heightIn: 4 } }));
    expect(layout.templateSheetCount).toBe(0);
    expect(Object.is(layout.lowerBoundSheets, 0)).toBe(true);
  });

  it('tiles a 60 × 45 in. section on Letter with every tile inside the content area', () => {
    const document = readPatternDocument({
      formatVersion: 1,
      title: 'Wall hanging',
      canvas: { widthIn: 60, heightIn: 45 },
      sections: [{ id: 'a', label: 'A', geometry: { kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 60, y: 0 }, { x: 60, y: 45 }, { x: 0, y: 45 }] } }],
    });
    const layout = planPrintLayout(document, { paper: 'letter' });
    const summary = layout.templates[0];
    // 60.5 × 45.5 in. with ¼ in. allowance: at least 61 / 7.5 × 46 / 9.5 cells, so more than 30 tiles.
    expect(summary.tilesPerCopy).toBeGreaterThan(30);
    expect(layout.templateSheetCount).toBeGreaterThanOrEqual(layout.lowerBoundSheets);
    for (const sheet of layout.sheets) {
      for (const p of sheet.placements) {
        expect(p.rect.x + p.rect.width).toBeLessThanOrEqual(sheet.frame.content.x + sheet.frame.content.width + 1e-9);
        expect(p.rect.y + p.rect.height).toBeLessThanOrEqual(sheet.frame.content.y + sheet.frame.content.height + 1e-9);
      }
    }
  });
});
