import { describe, expect, it, vi } from 'vitest';
import { jsPDF } from 'jspdf';
import { IDENTITY } from './affine';
import { drawTileMaps, type DrawnTileMap } from './draw-tile-maps';
import type { PlannedSheet, SheetPlacement } from './layout-types';
import type { RectIn } from './paper';
import { embedFonts, PdfPen } from './pdf-pen';
import { sheetFrame } from './sheet-frame';
import type { PrintTemplate } from './template-model';
import { readShippedFonts } from './testing/print-test-fixtures';

const fonts = readShippedFonts();
const frame = sheetFrame('letter', 'portrait', 0.5);

/** A 2 × 2-tiled copy's chosen tile in this box, with a caption strip above it. */
function firstTile(copy: number, rect: RectIn): SheetPlacement {
  return {
    templateId: 'd',
    sectionLabel: 'D',
    copy,
    copies: 4,
    rect,
    transform: IDENTITY,
    turnDeg: 0,
    caption: { rect: { x: rect.x, y: rect.y - 0.2, width: rect.width, height: 0.2 }, vertical: false },
    tile: {
      row: 1,
      column: 1,
      rows: 2,
      columns: 2,
      occupied: [
        [true, true],
        [true, true],
      ],
      pageOf: { '1,2': 9, '2,1': 10, '2,2': 11 },
      first: true,
      alignmentMarks: [],
      joinLines: [],
    },
  };
}

function sheetOf(placements: SheetPlacement[]): PlannedSheet {
  return { pageNumber: 8, frame, placements, sectionLabels: ['D'] };
}

const byId = new Map([['d', { id: 'd', sectionLabel: 'D' } as PrintTemplate]]);

function draw(sheet: PlannedSheet): { drawn: DrawnTileMap[]; texts: string[] } {
  const doc = new jsPDF({ unit: 'pt', format: 'letter', orientation: 'portrait', compress: true });
  embedFonts(doc, fonts);
  const pen = new PdfPen(doc);
  const text = vi.spyOn(pen, 'text');
  const drawn = drawTileMaps(pen, frame, sheet, byId);
  return { drawn, texts: text.mock.calls.map((c) => String(c[0])) };
}

function overlaps(a: RectIn, b: RectIn): boolean {
  return a.x < b.x + b.width && b.x < a.x + a.width && a.y < b.y + b.height && b.y < a.y + a.height;
}

function inside(a: RectIn, room: RectIn): boolean {
  return a.x >= room.x - 1e-9 && a.y >= room.y - 1e-9 && a.x + a.width <= room.x + room.width + 1e-9 && a.y + a.height <= room.y + room.height + 1e-9;
}

describe('tile maps on a sheet holding more chosen tiles than its header fits', () => {
  // Four copies' chosen tiles on one Letter sheet: the header's room (45 % … 2.3 in. from the right,
  // about 1.8 in.) holds one 2 × 2 map; free room is left above the right-hand boxes and at the bottom.
  const sheet = sheetOf([
    firstTile(1, { x: 0.5, y: 2.4, width: 3.6, height: 3.8 }),
    firstTile(2, { x: 4.3, y: 2.4, width: 3.7, height: 3.8 }),
    firstTile(3, { x: 0.5, y: 6.6, width: 3.6, height: 3.9 }),
    firstTile(4, { x: 4.3, y: 6.6, width: 3.7, height: 3.0 }),
  ]);

  it('draws every copy’s map, some in the header and the rest in free room of the content area', () => {
    const { drawn, texts } = draw(sheet);
    const labels = [1, 2, 3, 4].map((n) => `D copy ${n} tiles:`);
    for (const label of labels) expect(texts).toContain(label);
    expect(drawn.map((m) => m.label).sort()).toEqual(labels);
    expect(drawn.filter((m) => m.where === 'header').length).toBeGreaterThanOrEqual(1);
    expect(drawn.filter((m) => m.where === 'content').length).toBeGreaterThanOrEqual(1);
    expect(drawn.some((m) => m.where === 'note')).toBe(false);
  });

  it('keeps every map clear of the template boxes, their captions, the test squares and each other', () => {
    const { drawn } = draw(sheet);
    const boxes = [frame.testBlock, ...sheet.placements.flatMap((p) => [p.rect, p.caption!.rect])];
    for (const m of drawn) {
      for (const box of boxes) expect(overlaps(m.area, box), `${m.label} over a box`).toBe(false);
      expect(inside(m.area, m.where === 'header' ? frame.header : frame.content)).toBe(true);
    }
    for (const [i, a] of drawn.entries()) for (const b of drawn.slice(i + 1)) expect(overlaps(a.area, b.area)).toBe(false);
  });

  it('names the maps it has no room for in one line below the printable area', () => {
    // The content area filled edge to edge: only the header's map can be drawn.
    const full = sheetOf([1, 2, 3].map((n) => firstTile(n, { x: frame.content.x, y: frame.content.y + 0.2, width: frame.content.width, height: frame.content.height - 0.2 })));
    const { drawn, texts } = draw(full);
    const header = drawn.filter((m) => m.where === 'header').map((m) => m.label);
    expect(header).toEqual(['D copy 1 tiles:']);
    const note = texts.find((t) => t.startsWith('Tile maps not shown'));
    expect(note).toContain('D copy 2, D copy 3');
    const line = drawn.find((m) => m.where === 'note')!;
    expect(line.area.y).toBeGreaterThanOrEqual(frame.printable.y + frame.printable.height);
  });
});
