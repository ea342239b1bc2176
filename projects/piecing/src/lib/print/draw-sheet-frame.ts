import type { TilePlacement } from './layout-types';
import type { RectIn } from './paper';
import type { PdfPen } from './pdf-pen';
import { TEST_SQUARE_CM_IN, TEST_SQUARE_IN, type SheetFrame } from './sheet-frame';

/** The line every sheet carries next to its test squares. */
export const PRINT_AT_ACTUAL_SIZE = 'Print at 100 % / actual size — measure before cutting';

/** What the header of one sheet says. */
export interface SheetHeading {
  title: string;
  pageNumber: number;
  pageCount: number;
  /** Second line: the sections on the sheet, or what the sheet holds. */
  subtitle: string;
  /** Small note at the right of the third line (mirroring). */
  note?: string;
  /** Small note at the right of the second line, under the sheet number (the copies rule of the sheet). */
  aside?: string;
  /** Shown in bold red in place of the subtitle: a section on the sheet is not sewable as numbered. */
  warning?: string;
}

const INK = '#000000';
const MUTED = '#444444';
const WARNING = '#b3261e';

/** Draws the header band and the test-square block of a sheet. */
export function drawSheetFrame(pen: PdfPen, frame: SheetFrame, heading: SheetHeading): void {
  const h = frame.header;
  const right = h.x + h.width;
  // A template sheet may hang its test squares in the top-left corner of the header band (they then
  // cost no template room): the header's text starts to the right of them.
  const tb = frame.testBlock;
  const inBand = tb.y < h.y + h.height && tb.x < h.x + h.width * 0.45;
  const left = inBand ? tb.x + tb.width + 0.15 : h.x;
  // Raised into the margin band (never on a sheet with a tile map), the squares leave the title its usual
  // width, moved right, short of the sheet number and the notes on the right (2.25 in. at most).
  const raised = inBand && tb.y < h.y - 1e-9;
  const leftWidth = raised ? Math.min(h.width * 0.45, right - 2.4 - left) : h.x + h.width * 0.45 - left;
  const sheetLabel = `Sheet ${heading.pageNumber} of ${heading.pageCount}`;
  pen.text(sheetLabel, { x: right, y: h.y + 0.17 }, { sizePt: 11, bold: true, align: 'right' });
  // Left 45 %: title and subtitle; the middle is kept for tile maps; right: sheet number and notes.
  pen.text(fitText(pen, heading.title, leftWidth, 11, true), { x: left, y: h.y + 0.17 }, { sizePt: 11, bold: true });
  if (heading.warning) pen.text(fitText(pen, heading.warning, leftWidth, 8, true), { x: left, y: h.y + 0.3 }, { sizePt: 8, bold: true, colour: WARNING });
  else pen.text(fitText(pen, heading.subtitle, leftWidth, 8), { x: left, y: h.y + 0.3 }, { sizePt: 8, colour: MUTED });
  if (heading.aside) pen.text(fitText(pen, heading.aside, 2.25, 7), { x: right, y: h.y + 0.3 }, { sizePt: 7, colour: MUTED, align: 'right' });
  pen.text(PRINT_AT_ACTUAL_SIZE, { x: left, y: h.y + 0.43 }, { sizePt: 8, bold: true });
  if (heading.note) {
    const room = right - left - pen.textWidth(PRINT_AT_ACTUAL_SIZE, 8, true) - 0.3;
    pen.text(fitText(pen, heading.note, room, 7), { x: right, y: h.y + 0.43 }, { sizePt: 7, colour: MUTED, align: 'right' });
  }
  pen.segments([{ a: { x: inBand ? left - 0.05 : h.x, y: h.y + h.height }, b: { x: right, y: h.y + h.height } }], { widthPt: 0.4, colour: MUTED });
  drawTestSquares(pen, frame.testBlock);
}

/**
 * The 1 in. and 2 cm test squares, each one `re` path with sides of exactly 72 pt and 56.693 pt
 * (ISO 32000-1 §8.3.2.3: 1 unit = 1/72 in.; 1 in. = 25.4 mm), labelled inside.
 */
export function drawTestSquares(pen: PdfPen, block: RectIn): void {
  const inch = { x: block.x, y: block.y, width: TEST_SQUARE_IN, height: TEST_SQUARE_IN };
  // Side by side when the block is wider than tall, else the 2 cm square below the 1 in. one.
  const cm =
    block.width >= block.height
      ? { x: block.x + TEST_SQUARE_IN + 0.12, y: block.y + TEST_SQUARE_IN - TEST_SQUARE_CM_IN, width: TEST_SQUARE_CM_IN, height: TEST_SQUARE_CM_IN }
      : { x: block.x, y: block.y + TEST_SQUARE_IN + 0.12, width: TEST_SQUARE_CM_IN, height: TEST_SQUARE_CM_IN };
  const line = { widthPt: 0.5, colour: INK };
  pen.rect(inch, line);
  pen.rect(cm, line);
  pen.text(['1 in.', 'test square', 'measure me'], { x: inch.x + 0.5, y: inch.y + 0.38 }, { sizePt: 7, bold: true, align: 'center' });
  pen.text(['2 cm', 'test square'], { x: cm.x + cm.width / 2, y: cm.y + cm.height / 2 - 0.04 }, { sizePt: 7, bold: true, align: 'center' });
}

/**
 * A small map of how a template's tiles join: the grid with the tile on this sheet shaded, each tile
 * marked with the page it is on; empty grid cells (nothing of the template there) are left blank.
 */
export function drawTileMap(pen: PdfPen, area: RectIn, label: string, tile: TilePlacement): void {
  const labelWidth = pen.textWidth(label, 6, true) + 0.06;
  const cell = Math.min(0.22, area.height / tile.rows, (area.width - labelWidth) / tile.columns);
  const x0 = area.x + labelWidth;
  const y0 = area.y + (area.height - cell * tile.rows) / 2;
  pen.text(label, { x: area.x, y: area.y + area.height / 2 }, { sizePt: 6, bold: true, baseline: 'middle' });
  for (let r = 0; r < tile.rows; r++) {
    for (let c = 0; c < tile.columns; c++) {
      if (!tile.occupied[r][c]) continue;
      const here = r + 1 === tile.row && c + 1 === tile.column;
      const rect = { x: x0 + c * cell, y: y0 + r * cell, width: cell, height: cell };
      pen.rect(rect, { widthPt: 0.4, colour: INK }, here ? '#c8c8c8' : undefined);
      const page = tile.pageOf[`${r + 1},${c + 1}`];
      if (page && cell >= 0.12) {
        pen.text(String(page), { x: rect.x + cell / 2, y: rect.y + cell / 2 }, { sizePt: cell >= 0.16 ? 5 : 4, align: 'center', baseline: 'middle' });
      }
    }
  }
}

/** Width a tile map needs in the header for a grid. */
export function tileMapWidth(pen: PdfPen, label: string, tile: TilePlacement, heightIn: number): number {
  const cell = Math.min(0.22, heightIn / tile.rows);
  return pen.textWidth(label, 6, true) + 0.06 + cell * tile.columns;
}

/** Shortens text with an ellipsis until it fits the width. */
export function fitText(pen: PdfPen, value: string, widthIn: number, sizePt: number, bold = false): string {
  if (pen.textWidth(value, sizePt, bold) <= widthIn) return value;
  let s = value;
  while (s.length > 1 && pen.textWidth(`${s}…`, sizePt, bold) > widthIn) s = s.slice(0, -1);
  return `${s}…`;
}
