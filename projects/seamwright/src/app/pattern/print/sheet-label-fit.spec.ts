import type { SheetPlacement } from '@seamwright/piecing';
import { MIN_LABEL_PX, SHEET_PREVIEW_PX, labelFontIn, placeSheetLabel } from './sheet-label-fit';

const identity = { a: 1, b: 0, c: 0, d: 1, e: 0, f: 0 };

function placement(rect: SheetPlacement['rect'], extra: Partial<SheetPlacement> = {}): SheetPlacement {
  return { templateId: 't', sectionLabel: 'B', copy: 3, copies: 8, rect, transform: identity, turnDeg: 0, ...extra };
}

describe('sheet preview labels', () => {
  it('sizes labels so they render at the readable minimum on the preview', () => {
    // Letter is 8.5 in. wide: at 200 px that is 23.5 px per inch, so 10 px of text is 0.425 in.
    const fontIn = labelFontIn(8.5);
    expect(fontIn * (SHEET_PREVIEW_PX / 8.5)).toBeCloseTo(MIN_LABEL_PX, 9);
    expect(MIN_LABEL_PX).toBeGreaterThanOrEqual(9);
  });

  it('writes the whole label inside a print wide enough for it', () => {
    const l = placeSheetLabel(placement({ x: 1, y: 2, width: 4, height: 3 }), 0.425);
    expect(l).toMatchObject({ text: 'B 3/8', full: 'B 3/8', outside: false, x: 1.05 });
    expect(l.leader).toBeUndefined();
  });

  it('shortens a tile label to what fits and keeps the whole one for hover', () => {
    const tile = { row: 2, column: 1, rows: 2, columns: 2 } as SheetPlacement['tile'];
    // "B 3/8 · tile 2,1" is 16 characters, about 4.4 in. at 0.425 in.; the print is 2.5 in. wide.
    const l = placeSheetLabel(placement({ x: 1, y: 2, width: 2.5, height: 3 }, { tile }), 0.425);
    expect(l).toMatchObject({ text: 'B 3/8', full: 'B 3/8 · tile 2,1', outside: false });
  });

  it('moves the label out with a leader line when even the section letter does not fit', () => {
    const l = placeSheetLabel(placement({ x: 3, y: 4, width: 0.3, height: 0.3 }), 0.425);
    expect(l.outside).toBe(true);
    expect(l.text).toBe('B');
    // Above the print, to its right, the leader ending at the print's middle.
    expect(l.y).toBeLessThan(4);
    expect(l.x).toBeGreaterThan(3.3);
    expect(l.leader).toEqual({ x1: l.x, y1: l.y, x2: 3.15, y2: 4.15 });
  });

  it('puts an outside label below a print at the top edge of the sheet', () => {
    const l = placeSheetLabel(placement({ x: 3, y: 0.5, width: 0.3, height: 0.3 }), 0.425);
    expect(l.outside).toBe(true);
    expect(l.y).toBeGreaterThan(0.8);
  });
});
