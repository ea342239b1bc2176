import type { PdfPen } from './pdf-pen';
import type { SheetFrame } from './sheet-frame';

/** A column of a table: header, width in inches, alignment. */
export interface TableColumn {
  header: string;
  widthIn: number;
  align?: 'left' | 'right';
}

/** A cell is text, or text with a colour swatch before it. */
export type TableCell = string | { text: string; swatch: string };

const ROW_IN = 0.2;
const CELL_PAD = 0.04;
const SWATCH_IN = 0.26;

/**
 * Writes flowing content (headings, paragraphs, tables) down the content area of sheets, starting a
 * new sheet when the current one is full. The top-left test-square block is kept clear.
 */
/** Space after a paragraph, in inches. */
const PARAGRAPH_GAP_IN = 0.06;

/** A paragraph's line height for a type size, in inches. */
function paragraphLineIn(sizePt: number): number {
  return (sizePt * 1.3) / 72;
}

export class SheetFlow {
  private frame: SheetFrame;
  y: number;

  constructor(
    private readonly pen: PdfPen,
    private readonly newSheet: () => SheetFrame,
    first?: SheetFrame,
  ) {
    this.frame = first ?? newSheet();
    this.y = this.top();
  }

  get left(): number {
    return this.frame.content.x;
  }

  get width(): number {
    return this.frame.content.width;
  }

  /** Where content starts on a sheet (below the test squares). */
  top(): number {
    return this.frame.testBlock.y + this.frame.testBlock.height + 0.2;
  }

  /** Bottom of the content area on the current sheet. */
  bottom(): number {
    return this.frame.content.y + this.frame.content.height;
  }

  /** Makes room for `heightIn`, starting a new sheet when it is not there. Returns the y to draw at. */
  room(heightIn: number): number {
    if (this.y + heightIn > this.bottom() && this.y > this.top() + 1e-9) {
      this.frame = this.newSheet();
      this.y = this.top();
    }
    return this.y;
  }

  heading(text: string, sizePt = 13): void {
    const y = this.room(0.5);
    this.pen.text(text, { x: this.left, y: y + 0.22 }, { sizePt, bold: true });
    this.y = y + 0.34;
  }

  /** The height {@link paragraph} takes for `text` when it stays on one sheet, in inches. */
  paragraphHeight(text: string, sizePt = 9, bold = false): number {
    return this.pen.wrap(text, this.width, sizePt, bold).length * paragraphLineIn(sizePt) + PARAGRAPH_GAP_IN;
  }

  paragraph(text: string, sizePt = 9, bold = false): void {
    const lines = this.pen.wrap(text, this.width, sizePt, bold);
    const lineIn = paragraphLineIn(sizePt);
    for (const line of lines) {
      const y = this.room(lineIn);
      this.pen.text(line, { x: this.left, y: y + lineIn * 0.8 }, { sizePt, bold });
      this.y = y + lineIn;
    }
    this.y += PARAGRAPH_GAP_IN;
  }

  /** Starts a new sheet unless the current one is still empty. */
  startSheet(): void {
    if (this.y > this.top() + 1e-9) {
      this.frame = this.newSheet();
      this.y = this.top();
    }
  }

  /** Height a block may take on an empty sheet, in inches. */
  get sheetRoom(): number {
    return this.bottom() - this.top();
  }

  /** Room left on the current sheet, in inches. */
  get roomLeft(): number {
    return this.bottom() - this.y;
  }

  gap(heightIn: number): void {
    this.y += heightIn;
  }

  /**
   * A table. A cell too long for its column wraps onto more lines (the row grows); a row that does not
   * fit in the room left runs on onto the next sheet, and the header row repeats on every sheet the
   * table runs onto. Nothing is shortened or left out.
   */
  table(columns: readonly TableColumn[], rows: readonly TableCell[][], sizePt = 8): void {
    const lineIn = tableLineIn(sizePt);
    const total = sum(columns);
    const header = () => {
      const lines = this.cellLines(columns, columns.map((c) => c.header), sizePt, true);
      const height = rowHeight(Math.max(1, ...lines.map((l) => l.length)), lineIn);
      // The header never stands alone at the foot of a sheet: room for it and one line of a row.
      const y = this.room(height + ROW_IN);
      this.drawRow(columns, columns.map((c) => c.header), lines, 0, Infinity, y, sizePt, true, lineIn);
      this.pen.segments([{ a: { x: this.left, y: y + height }, b: { x: this.left + total, y: y + height } }], { widthPt: 0.6 });
      this.y = y + height;
    };
    header();
    let fresh = false;
    for (const row of rows) {
      const lines = this.cellLines(columns, row, sizePt, false);
      const count = Math.max(1, ...lines.map((l) => l.length));
      let from = 0;
      while (from < count) {
        const left = count - from;
        const fits = Math.floor((this.bottom() - this.y - (ROW_IN - lineIn)) / lineIn + 1e-9);
        if (fits < left && !fresh) {
          // A row that fits on a fresh sheet moves there whole; a longer one fills this sheet and runs on.
          const fitsFresh = this.y - this.top() > 1e-9 && from === 0 && rowHeight(left, lineIn) <= this.sheetRoom - 2 * ROW_IN;
          if (fits < 1 || fitsFresh) {
            this.frame = this.newSheet();
            this.y = this.top();
            header();
            fresh = true;
            continue;
          }
        }
        const take = Math.max(1, Math.min(left, fits));
        const height = rowHeight(take, lineIn);
        this.drawRow(columns, row, lines, from, from + take, this.y, sizePt, false, lineIn);
        this.pen.segments([{ a: { x: this.left, y: this.y + height }, b: { x: this.left + total, y: this.y + height } }], { widthPt: 0.25, colour: '#888888' });
        this.y += height;
        from += take;
        fresh = false;
      }
    }
    this.y += 0.15;
  }

  /** Each cell's text wrapped to its column (after the swatch, when it has one). */
  private cellLines(columns: readonly TableColumn[], cells: readonly TableCell[], sizePt: number, bold: boolean): string[][] {
    return columns.map((col, i) => {
      const cell = cells[i] ?? '';
      const text = typeof cell === 'string' ? cell : cell.text;
      return this.pen.wrap(text, cellRoom(col, typeof cell !== 'string'), sizePt, bold);
    });
  }

  /** Lines `from`…`to` (exclusive) of a row's cells, the first at `y`. */
  private drawRow(
    columns: readonly TableColumn[],
    cells: readonly TableCell[],
    lines: readonly string[][],
    from: number,
    to: number,
    y: number,
    sizePt: number,
    bold: boolean,
    lineIn: number,
  ): void {
    let x = this.left;
    columns.forEach((col, i) => {
      const cell = cells[i] ?? '';
      let tx = x + CELL_PAD;
      if (typeof cell !== 'string') {
        if (from === 0) this.pen.rect({ x: tx, y: y + 0.045, width: 0.2, height: 0.11 }, { widthPt: 0.3 }, cell.swatch);
        tx += SWATCH_IN;
      }
      const shown = lines[i].slice(from, to);
      shown.forEach((line, k) => {
        const at = { x: col.align === 'right' ? x + col.widthIn - CELL_PAD : tx, y: y + 0.14 + k * lineIn };
        this.pen.text(line, at, { sizePt, bold, ...(col.align === 'right' ? { align: 'right' as const } : {}) });
      });
      x += col.widthIn;
    });
  }

  /** Reserves a block of `heightIn` and hands back its top-left corner. */
  block(heightIn: number): { x: number; y: number } {
    const y = this.room(heightIn);
    this.y = y + heightIn;
    return { x: this.left, y };
  }
}

function sum(columns: readonly TableColumn[]): number {
  return columns.reduce((s, c) => s + c.widthIn, 0);
}

/** Height of a table row of `lines` lines: one line keeps the usual 0.2 in. */
export function rowHeight(lines: number, lineIn: number): number {
  return ROW_IN + Math.max(0, lines - 1) * lineIn;
}

/** Line spacing inside table cells (1.2 × the type size). */
export function tableLineIn(sizePt: number): number {
  return (sizePt * 1.2) / 72;
}

/** Width a cell's text may take: the column less its padding, and the swatch when there is one. */
export function cellRoom(col: TableColumn, swatch: boolean): number {
  return col.widthIn - 2 * CELL_PAD - (swatch ? SWATCH_IN : 0);
}
