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

/**
 * Writes flowing content (headings, paragraphs, tables) down the content area of sheets, starting a
 * new sheet when the current one is full. The top-left test-square block is kept clear.
 */
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

  private top(): number {
    return this.frame.testBlock.y + this.frame.testBlock.height + 0.2;
  }

  private bottom(): number {
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

  paragraph(text: string, sizePt = 9, bold = false): void {
    const lines = this.pen.wrap(text, this.width, sizePt, bold);
    const lineIn = (sizePt * 1.3) / 72;
    for (const line of lines) {
      const y = this.room(lineIn);
      this.pen.text(line, { x: this.left, y: y + lineIn * 0.8 }, { sizePt, bold });
      this.y = y + lineIn;
    }
    this.y += 0.06;
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

  /** A table; the header row repeats on every sheet it runs onto. */
  table(columns: readonly TableColumn[], rows: readonly TableCell[][], sizePt = 8): void {
    const header = () => {
      const y = this.room(ROW_IN * 2);
      this.drawRow(columns, columns.map((c) => c.header), y, sizePt, true);
      this.pen.segments([{ a: { x: this.left, y: y + ROW_IN }, b: { x: this.left + sum(columns), y: y + ROW_IN } }], { widthPt: 0.6 });
      this.y = y + ROW_IN;
    };
    header();
    for (const row of rows) {
      const before = this.y;
      const y = this.room(ROW_IN);
      if (y < before) header();
      this.drawRow(columns, row, this.y, sizePt, false);
      this.pen.segments([{ a: { x: this.left, y: this.y + ROW_IN }, b: { x: this.left + sum(columns), y: this.y + ROW_IN } }], { widthPt: 0.25, colour: '#888888' });
      this.y += ROW_IN;
    }
    this.y += 0.15;
  }

  private drawRow(columns: readonly TableColumn[], cells: readonly TableCell[], y: number, sizePt: number, bold: boolean): void {
    let x = this.left;
    columns.forEach((col, i) => {
      const cell = cells[i] ?? '';
      const text = typeof cell === 'string' ? cell : cell.text;
      let tx = x + 0.04;
      if (typeof cell !== 'string') {
        this.pen.rect({ x: tx, y: y + 0.045, width: 0.2, height: 0.11 }, { widthPt: 0.3 }, cell.swatch);
        tx += 0.26;
      }
      const room = col.widthIn - (tx - x) - 0.04;
      const shown = fit(this.pen, text, room, sizePt, bold);
      if (col.align === 'right') this.pen.text(shown, { x: x + col.widthIn - 0.04, y: y + 0.14 }, { sizePt, bold, align: 'right' });
      else this.pen.text(shown, { x: tx, y: y + 0.14 }, { sizePt, bold });
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

function fit(pen: PdfPen, text: string, widthIn: number, sizePt: number, bold: boolean): string {
  if (pen.textWidth(text, sizePt, bold) <= widthIn) return text;
  let s = text;
  while (s.length > 1 && pen.textWidth(`${s}…`, sizePt, bold) > widthIn) s = s.slice(0, -1);
  return `${s}…`;
}
