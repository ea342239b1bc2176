import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { Point } from '../document/index';
import { buildOrchardWheel } from '../demo/index';
import { applyAffine } from './affine';
import type { PrintLayout } from './layout-types';
import { separated } from './nest-pair';
import type { PaperName } from './paper';
import { layoutTemplates } from './plan-print-layout';
import { buildPrintTemplates } from './print-templates';
import { ITEM_GAP_IN } from './sheet-frame';
import { templateOfRing } from './testing/print-test-fixtures';
import { tileDrawing } from './testing/tile-drawing';
import type { PrintTemplate } from './template-model';

/*
 * Templates are nested by their real outlines (arcs and wedges head to tail, pieces in the empty
 * corners of others), so boxes may overlap: what must never happen is two cutting lines (or a tile's
 * marks and captions) coming nearer than the gap kept for cutting them apart. These checks use the
 * real cutting lines, not the simplified ones the layout searches with.
 */

const medallion = buildPrintTemplates(buildOrchardWheel(), { foundation: 'paper', copies: 'plan' });

describe('templates nested by their outlines keep the cutting gap', () => {
  for (const paper of ['letter', 'a4', 'legal'] as const) {
    for (const mirrored of [true, false]) {
      it(`keeps every pair of the medallion's prints ${ITEM_GAP_IN} in. apart on ${paper}${mirrored ? ', mirrored' : ''}`, () => {
        const layout = layoutTemplates(medallion, { paper, marginIn: 0.5, mirrored, tileOverlapIn: 0.5 });
        expectApart(layout, medallion);
        expectEveryCopy(layout, medallion);
      });
    }
  }

  it('nests the medallion on Letter into 18 sheets and on A4 into 21 (20 and 23 with boxes and pairs of one template, 19 and 22 before the corner tiling was chosen with the whole packing)', () => {
    const count = (paper: PaperName) => layoutTemplates(medallion, { paper, marginIn: 0.5, mirrored: true, tileOverlapIn: 0.5 }).templateSheetCount;
    expect(count('letter')).toBeLessThanOrEqual(18);
    expect(count('a4')).toBeLessThanOrEqual(21);
  });

  it('puts pieces of different templates into one another’s empty corners on the medallion', () => {
    // Some sheet holds prints whose boxes overlap: only outline nesting puts them there.
    const layout = layoutTemplates(medallion, { paper: 'letter', marginIn: 0.5, mirrored: true, tileOverlapIn: 0.5 });
    const overlapping = layout.sheets.some((s) =>
      s.placements.some((a, i) =>
        s.placements.some((b, j) => j > i && a.templateId !== b.templateId && a.rect.x < b.rect.x + b.rect.width && b.rect.x < a.rect.x + a.rect.width && a.rect.y < b.rect.y + b.rect.height && b.rect.y < a.rect.y + a.rect.height),
      ),
    );
    expect(overlapping).toBe(true);
  });

  it('keeps the gap between the real outlines of random arcs, wedges, triangles and rectangles', () => {
    fc.assert(
      fc.property(
        fc.array(shapeArb(), { minLength: 1, maxLength: 5 }),
        fc.constantFrom('letter' as const, 'a4' as const),
        fc.boolean(),
        (shapes, paper, mirrored) => {
          const templates = shapes.map((s, i) => ({ ...s, id: `t${i}`, sectionId: `t${i}`, sectionLabel: String.fromCharCode(65 + i) }));
          const layout = layoutTemplates(templates, { paper, marginIn: 0.5, mirrored, tileOverlapIn: 0.5 });
          expectApart(layout, templates);
          expectEveryCopy(layout, templates);
        },
      ),
      { numRuns: 25 },
    );
  });
});

/** Every pair of prints on a sheet: their real cutting lines (tiles: what they print) at least the gap apart. */
function expectApart(layout: PrintLayout, templates: readonly PrintTemplate[]): void {
  const byId = new Map(templates.map((t) => [t.id, t]));
  for (const sheet of layout.sheets) {
    const drawn = sheet.placements.map((p) => {
      const cut = byId.get(p.templateId)!.cuttingLine.map((q) => applyAffine(p.transform, q));
      const rings = p.tile ? tileDrawing(p, cut) : [cut];
      if (p.caption) rings.push(rectRing(p.caption.rect));
      return { name: `${p.sectionLabel}${p.copy}${p.tile ? ` tile ${p.tile.row},${p.tile.column}` : ''}`, rings };
    });
    for (let i = 0; i < drawn.length; i++) {
      for (let j = i + 1; j < drawn.length; j++) {
        for (const a of drawn[i].rings) {
          for (const b of drawn[j].rings) {
            expect(separated(a, b, ITEM_GAP_IN - 1e-6), `${drawn[i].name} and ${drawn[j].name} on sheet ${sheet.pageNumber}`).toBe(true);
          }
        }
      }
    }
  }
}

/** Every copy of every template is printed (whole or as tiles), no copy twice. */
function expectEveryCopy(layout: PrintLayout, templates: readonly PrintTemplate[]): void {
  for (const t of templates) {
    const placed = layout.sheets.flatMap((s) => s.placements.filter((p) => p.templateId === t.id && !p.tile).map((p) => p.copy));
    const tiled = new Set(layout.sheets.flatMap((s) => s.placements.filter((p) => p.templateId === t.id && p.tile).map((p) => p.copy)));
    expect(new Set(placed).size, `${t.sectionLabel}: no copy printed whole twice`).toBe(placed.length);
    expect(new Set([...placed, ...tiled]).size, `${t.sectionLabel}: every copy`).toBe(t.copies);
  }
}

function rectRing(r: { x: number; y: number; width: number; height: number }): Point[] {
  return [{ x: r.x, y: r.y }, { x: r.x + r.width, y: r.y }, { x: r.x + r.width, y: r.y + r.height }, { x: r.x, y: r.y + r.height }];
}

/** Random pieces that leave room inside their boxes (arcs, wedges, triangles) beside plain rectangles. */
function shapeArb(): fc.Arbitrary<Omit<PrintTemplate, 'id' | 'sectionId' | 'sectionLabel'>> {
  const polar = (r: number, a: number): Point => ({ x: r * Math.cos(a), y: r * Math.sin(a) });
  const arc = fc
    .record({ r: fc.double({ min: 1, max: 10, noNaN: true }), depth: fc.double({ min: 0.8, max: 3.5, noNaN: true }), sweep: fc.double({ min: 0.3, max: 1.2, noNaN: true }) })
    .map(({ r, depth, sweep }) => {
      const n = 10;
      const outer = Array.from({ length: n + 1 }, (_, k) => polar(r + depth, (sweep * k) / n));
      const inner = Array.from({ length: n + 1 }, (_, k) => polar(r, (sweep * (n - k)) / n));
      return [...outer, ...inner];
    });
  const wedge = fc.record({ r: fc.double({ min: 2, max: 7, noNaN: true }), sweep: fc.double({ min: 0.3, max: 1.2, noNaN: true }) }).map(({ r, sweep }) => [
    { x: 0, y: 0 },
    ...Array.from({ length: 9 }, (_, k) => polar(r, (sweep * k) / 8)),
  ]);
  const triangle = fc.record({ w: fc.double({ min: 1, max: 7, noNaN: true }), h: fc.double({ min: 1, max: 7, noNaN: true }), t: fc.double({ min: 0, max: 1, noNaN: true }) }).map(({ w, h, t }) => [
    { x: 0, y: 0 },
    { x: w, y: 0 },
    { x: w * t, y: h },
  ]);
  const rect = fc.record({ w: fc.double({ min: 0.8, max: 7, noNaN: true }), h: fc.double({ min: 0.8, max: 7, noNaN: true }) }).map(({ w, h }) => [
    { x: 0, y: 0 },
    { x: w, y: 0 },
    { x: w, y: h },
    { x: 0, y: h },
  ]);
  return fc
    .record({ ring: fc.oneof(arc, wedge, triangle, rect), copies: fc.integer({ min: 1, max: 6 }), freeRotation: fc.boolean() })
    .map(({ ring, copies, freeRotation }) => templateOfRing(ring, copies, freeRotation));
}
