import { describe, expect, it } from 'vitest';
import { applyAffine } from './affine';
import { boundingRect, clippedBounds, minimumAreaTurn } from './layout-geometry';
import { separated } from './nest-pair';
import { layoutTemplates } from './plan-print-layout';
import { planPrintLayout } from './render-print-set';
import { buildPrintTemplates } from './print-templates';
import { ITEM_GAP_IN } from './sheet-frame';
import { asymmetricBlock, testMedallion } from './testing/print-test-fixtures';
import type { RectIn } from './paper';

const turn = (pts: { x: number; y: number }[], a: number) =>
  pts.map((p) => ({ x: Math.cos(a) * p.x - Math.sin(a) * p.y, y: Math.sin(a) * p.x + Math.cos(a) * p.y }));

function disjoint(p: RectIn, q: RectIn, gap: number): boolean {
  return p.x + p.width + gap <= q.x + 1e-9 || q.x + q.width + gap <= p.x + 1e-9 || p.y + p.height + gap <= q.y + 1e-9 || q.y + q.height + gap <= p.y + 1e-9;
}

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

  it('keeps pieces apart, inside the content area, and the test squares clear of every cutting line', () => {
    for (const sheet of layout.sheets) {
      const boxes = new Map<string, RectIn>();
      for (const p of sheet.placements) {
        // Nested copies share a box; the caption strip belongs to the box.
        const key = `${p.templateId}#${Math.min(p.copy, p.nestedWith ?? p.copy)}#${p.tile ? `${p.tile.row},${p.tile.column}` : ''}`;
        const r = p.caption ? unionRect(p.rect, p.caption.rect) : p.rect;
        boxes.set(key, boxes.has(key) ? unionRect(boxes.get(key)!, r) : r);
      }
      const list = [...boxes.values()];
      const c = sheet.frame.content;
      for (const r of [...list, sheet.frame.testBlock]) {
        expect(r.x).toBeGreaterThanOrEqual(c.x - 1e-9);
        expect(r.y).toBeGreaterThanOrEqual(c.y - 1e-9);
        expect(r.x + r.width).toBeLessThanOrEqual(c.x + c.width + 1e-9);
        expect(r.y + r.height).toBeLessThanOrEqual(c.y + c.height + 1e-9);
      }
      for (let i = 0; i < list.length; i++) for (let j = i + 1; j < list.length; j++) expect(disjoint(list[i], list[j], ITEM_GAP_IN - 1e-6)).toBe(true);
      // The test squares may sit in an empty corner of a template's box, never on its cutting line
      // (outlines were simplified within 0.02 in. for the search, so allow that twice).
      const tb = sheet.frame.testBlock;
      const block = [{ x: tb.x, y: tb.y }, { x: tb.x + tb.width, y: tb.y }, { x: tb.x + tb.width, y: tb.y + tb.height }, { x: tb.x, y: tb.y + tb.height }];
      for (const p of sheet.placements) {
        const ring = p.tile ? rectRing(p.rect) : byId.get(p.templateId)!.cuttingLine.map((q) => applyAffine(p.transform, q));
        expect(separated(block, ring, ITEM_GAP_IN - 0.04)).toBe(true);
        if (p.caption) expect(separated(block, rectRing(p.caption.rect), ITEM_GAP_IN - 0.04)).toBe(true);
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

function unionRect(p: RectIn, q: RectIn): RectIn {
  const x = Math.min(p.x, q.x);
  const y = Math.min(p.y, q.y);
  return { x, y, width: Math.max(p.x + p.width, q.x + q.width) - x, height: Math.max(p.y + p.height, q.y + q.height) - y };
}

function rectRing(r: RectIn) {
  return [{ x: r.x, y: r.y }, { x: r.x + r.width, y: r.y }, { x: r.x + r.width, y: r.y + r.height }, { x: r.x, y: r.y + r.height }];
}
