import type { jsPDF } from 'jspdf';
import type { Point } from '../document/index';
import { POINTS_PER_INCH, type RectIn } from './paper';
import type { PrintFonts } from './print-options';
import { FALLBACK_FAMILY_PREFIX, FontFallback } from './font-fallback';

/** Family name the shipped TrueType fonts are registered under in the PDF. */
export const PDF_FONT_FAMILY = 'Roboto';

/** A stroke style: width in points, dash pattern in points (solid when empty), RGB colour. */
export interface StrokeStyle {
  widthPt: number;
  dashPt?: number[];
  colour?: string;
}

/** Text settings: size in points, weight, colour, alignment. */
export interface TextStyle {
  sizePt: number;
  bold?: boolean;
  colour?: string;
  align?: 'left' | 'center' | 'right';
  /** Vertical anchor of the given point. */
  baseline?: 'alphabetic' | 'middle' | 'top' | 'bottom';
  /** Counter-clockwise turn in degrees (90 reads upward). */
  angleDeg?: number;
}

const pt = (inches: number): number => inches * POINTS_PER_INCH;

/** Arabic letters and presentation forms: jsPDF joins them before measuring. */
const ARABIC = /[\u0600-\u06ff\u0750-\u077f\u08a0-\u08ff\ufb50-\ufdff\ufe70-\ufeff]/;

/**
 * Benchmark and test hook: `created` is called with every pen made, before it draws (the print
 * benchmark records a render's drawing through it, to write the same drawing with the pen alone).
 */
export const penHooks: { created?: (pen: PdfPen) => void } = {};

/**
 * Draws on a jsPDF document in inches from the page's top-left corner (y down), always with the
 * embedded TrueType fonts. Each polygon or polyline is one path (m … l … h) and one paint operator.
 */
export class PdfPen {
  /** Fonts for the characters the main one lacks (Japanese, Arabic …), when the document has them. */
  private readonly fallback: FontFallback;
  /** Advance widths at 1 pt by font (`family/weight`) and character code, each measured once. */
  private readonly widthCache = new Map<string, Map<number, number>>();
  /** The main family's maps of {@link widthCache} (normal, bold), looked up on every measure. */
  private readonly mainWidths: readonly [Map<number, number>, Map<number, number>];

  /**
   * `measuringOnly`: a pen that measures and wraps text like any other but puts nothing on the page (to
   * find out how many sheets a part needs before writing it).
   */
  constructor(
    readonly doc: jsPDF,
    readonly measuringOnly = false,
  ) {
    this.fallback = new FontFallback(doc, PDF_FONT_FAMILY, FontFallback.familiesOf(doc));
    this.mainWidths = [this.glyphWidths(PDF_FONT_FAMILY, false), this.glyphWidths(PDF_FONT_FAMILY, true)];
    if (!measuringOnly) penHooks.created?.(this);
  }

  /** Strokes a polyline, closed when asked. */
  polyline(points: readonly Point[], closed: boolean, style: StrokeStyle): void {
    if (this.measuringOnly) return;
    if (points.length < 2) return;
    this.setStroke(style);
    const ops: Array<{ op: string; c: number[] }> = [{ op: 'm', c: [pt(points[0].x), pt(points[0].y)] }];
    for (let i = 1; i < points.length; i++) ops.push({ op: 'l', c: [pt(points[i].x), pt(points[i].y)] });
    if (closed) ops.push({ op: 'h', c: [] });
    this.doc.path(ops);
    this.doc.stroke();
  }

  /** Several separate straight lines as one path and one stroke. */
  segments(lines: ReadonlyArray<{ a: Point; b: Point }>, style: StrokeStyle): void {
    if (this.measuringOnly) return;
    if (lines.length === 0) return;
    this.setStroke(style);
    const ops: Array<{ op: string; c: number[] }> = [];
    for (const { a, b } of lines) {
      ops.push({ op: 'm', c: [pt(a.x), pt(a.y)] }, { op: 'l', c: [pt(b.x), pt(b.y)] });
    }
    this.doc.path(ops);
    this.doc.stroke();
  }

  /** A rectangle (the PDF `re` operator): stroked, filled or both. */
  rect(r: RectIn, style: StrokeStyle | null, fill?: string): void {
    if (this.measuringOnly) return;
    if (style) this.setStroke(style);
    if (fill) this.doc.setFillColor(fill);
    const mode = style && fill ? 'FD' : fill ? 'F' : 'S';
    this.doc.rect(pt(r.x), pt(r.y), pt(r.width), pt(r.height), mode);
  }

  /** A filled polygon without a stroke. */
  fillPolygon(points: readonly Point[], colour: string): void {
    if (this.measuringOnly) return;
    if (points.length < 3) return;
    this.doc.setFillColor(colour);
    const ops: Array<{ op: string; c: number[] }> = [{ op: 'm', c: [pt(points[0].x), pt(points[0].y)] }];
    for (let i = 1; i < points.length; i++) ops.push({ op: 'l', c: [pt(points[i].x), pt(points[i].y)] });
    ops.push({ op: 'h', c: [] });
    this.doc.path(ops);
    this.doc.fill();
  }

  /** A circle, stroked. */
  circle(centre: Point, radiusIn: number, style: StrokeStyle): void {
    if (this.measuringOnly) return;
    this.setStroke(style);
    this.doc.circle(pt(centre.x), pt(centre.y), pt(radiusIn), 'S');
  }

  /** Text at a point. */
  text(value: string | string[], at: Point, style: TextStyle): void {
    if (this.measuringOnly) return;
    const bold = style.bold ?? false;
    const lines = typeof value === 'string' ? [value] : value;
    if (lines.some((line) => !this.fallback.mainCovers(line, bold))) {
      // Line by line, each in runs of the fonts that have its characters (font-fallback.ts).
      const stepIn = (style.sizePt * this.doc.getLineHeightFactor()) / POINTS_PER_INCH;
      const turn = ((style.angleDeg ?? 0) * Math.PI) / 180;
      lines.forEach((line, k) => {
        // Lines go down the page, turned with the text (a counter-clockwise turn on the page, y down).
        const start = { x: at.x + k * stepIn * Math.sin(turn), y: at.y + k * stepIn * Math.cos(turn) };
        this.textRuns(line, start, style, turn);
      });
      return;
    }
    this.doc.setFont(PDF_FONT_FAMILY, bold ? 'bold' : 'normal');
    this.doc.setFontSize(style.sizePt);
    this.doc.setTextColor(style.colour ?? '#000000');
    this.doc.text(value, pt(at.x), pt(at.y), {
      align: style.align ?? 'left',
      baseline: style.baseline ?? 'alphabetic',
      ...(style.angleDeg ? { angle: style.angleDeg } : {}),
    });
  }

  /** One line in runs of fonts, placed one after another along the line's direction. */
  private textRuns(line: string, at: Point, style: TextStyle, turn: number): void {
    const bold = style.bold ?? false;
    const runs = this.fallback.runs(line, bold);
    const widths = runs.map((r) => this.runWidth(r.text, r.family, style.sizePt, bold));
    const total = widths.reduce((a, b) => a + b, 0);
    const align = style.align ?? 'left';
    let offset = align === 'center' ? -total / 2 : align === 'right' ? -total : 0;
    this.doc.setTextColor(style.colour ?? '#000000');
    runs.forEach((run, i) => {
      this.doc.setFont(run.family, bold ? 'bold' : 'normal');
      this.doc.setFontSize(style.sizePt);
      this.doc.text(run.text, pt(at.x + offset * Math.cos(turn)), pt(at.y - offset * Math.sin(turn)), {
        baseline: style.baseline ?? 'alphabetic',
        ...(style.angleDeg ? { angle: style.angleDeg } : {}),
      });
      offset += widths[i];
    });
  }

  private runWidth(text: string, family: string, sizePt: number, bold: boolean): number {
    return (this.unitWidth(text, family, bold) * sizePt) / POINTS_PER_INCH;
  }

  /**
   * Width of a text in one family at 1 pt, from widths measured once per character and font: jsPDF
   * sums glyph advances without kerning (its `widthOfString`), so the sum of cached characters is the
   * width it would measure for the whole string. Arabic is shaped first (joined forms), so it is measured whole.
   */
  private unitWidth(text: string, family: string, bold: boolean): number {
    if (ARABIC.test(text)) {
      this.doc.setFont(family, bold ? 'bold' : 'normal');
      return this.doc.getStringUnitWidth(text);
    }
    const widths = family === PDF_FONT_FAMILY ? this.mainWidths[bold ? 1 : 0] : this.glyphWidths(family, bold);
    let sum = 0;
    for (let i = 0; i < text.length; i++) {
      const code = text.charCodeAt(i);
      let w = widths.get(code);
      if (w === undefined) {
        this.doc.setFont(family, bold ? 'bold' : 'normal');
        w = this.doc.getStringUnitWidth(text[i]);
        widths.set(code, w);
      }
      sum += w;
    }
    return sum;
  }

  private glyphWidths(family: string, bold: boolean): Map<number, number> {
    const key = bold ? `${family}/bold` : `${family}/normal`;
    let map = this.widthCache.get(key);
    if (!map) this.widthCache.set(key, (map = new Map()));
    return map;
  }

  /** Width of a text in inches at a size and weight. */
  textWidth(value: string, sizePt: number, bold = false): number {
    if (!this.fallback.mainCovers(value, bold)) {
      return this.fallback.runs(value, bold).reduce((sum, r) => sum + this.runWidth(r.text, r.family, sizePt, bold), 0);
    }
    return this.runWidth(value, PDF_FONT_FAMILY, sizePt, bold);
  }

  /**
   * Splits text into lines no wider than `widthIn`: at spaces, at line breaks, and inside a word only
   * when the word alone is wider than the line. Nothing is left out. Widths come from the per-character cache.
   */
  wrap(value: string, widthIn: number, sizePt: number, bold = false): string[] {
    const limit = widthIn + 1e-9;
    // When the main font has every character, each piece is measured in it directly (what textWidth does then).
    const main = this.fallback.mainCovers(value, bold);
    const space = this.pieceWidth(' ', main, sizePt, bold);
    const lines: string[] = [];
    for (const paragraph of value.split(/\r?\n/)) {
      let line = '';
      let lineW = 0;
      for (const word of paragraph.split(' ')) {
        if (word === '') continue;
        let w = this.pieceWidth(word, main, sizePt, bold);
        if (line !== '' && lineW + space + w <= limit) {
          line += ` ${word}`;
          lineW += space + w;
          continue;
        }
        if (line !== '') lines.push(line);
        line = word;
        lineW = w;
        // A word wider than the line: as many characters as fit on each line.
        while (lineW > limit && line.length > 1) {
          let cut = 1;
          let cutW = this.pieceWidth(line[0], main, sizePt, bold);
          while (cut < line.length) {
            const next = this.pieceWidth(line[cut], main, sizePt, bold);
            if (cutW + next > limit) break;
            cutW += next;
            cut++;
          }
          lines.push(line.slice(0, cut));
          line = line.slice(cut);
          w = this.pieceWidth(line, main, sizePt, bold);
          lineW = w;
        }
      }
      lines.push(line);
    }
    return lines;
  }

  /** Width of a piece of a wrapped text: in the main font when it has every character of the text (`main`). */
  private pieceWidth(piece: string, main: boolean, sizePt: number, bold: boolean): number {
    return main ? this.runWidth(piece, PDF_FONT_FAMILY, sizePt, bold) : this.textWidth(piece, sizePt, bold);
  }

  /** Runs `draw` with everything clipped to a rectangle. */
  clipped(r: RectIn, draw: () => void): void {
    if (this.measuringOnly) return draw();
    this.doc.saveGraphicsState();
    this.doc.rect(pt(r.x), pt(r.y), pt(r.width), pt(r.height), null as unknown as string);
    this.doc.clip();
    this.doc.discardPath();
    draw();
    this.doc.restoreGraphicsState();
  }

  private setStroke(style: StrokeStyle): void {
    this.doc.setLineWidth(style.widthPt);
    this.doc.setDrawColor(style.colour ?? '#000000');
    this.doc.setLineDashPattern(style.dashPt ?? [], 0);
  }
}

/**
 * Registers the shipped TrueType fonts (regular and bold) with a jsPDF document, and any fallback fonts
 * (for characters Roboto lacks: fonts/README.md) as families `SwFallback0`, `SwFallback1`, … used for both
 * weights.
 */
export function embedFonts(doc: jsPDF, fonts: PrintFonts & { fallbacks?: readonly Uint8Array[] }): void {
  const files: Array<[string, Uint8Array, 'normal' | 'bold']> = [
    ['Roboto-Regular.ttf', fonts.regular, 'normal'],
    ['Roboto-Bold.ttf', fonts.bold, 'bold'],
  ];
  for (const [name, bytes, style] of files) {
    if (!(bytes instanceof Uint8Array) || bytes.length < 12 || bytes[0] !== 0 || bytes[1] !== 1 || bytes[2] !== 0 || bytes[3] !== 0) {
      throw new TypeError(`${name}: expected the bytes of a TrueType font file (version 0x00010000)`);
    }
    doc.addFileToVFS(name, binaryString(bytes));
    doc.addFont(name, PDF_FONT_FAMILY, style, undefined, 'Identity-H');
  }
  (fonts.fallbacks ?? []).forEach((bytes, i) => {
    const name = `${FALLBACK_FAMILY_PREFIX}${i}.ttf`;
    doc.addFileToVFS(name, binaryString(bytes));
    for (const style of ['normal', 'bold'] as const) doc.addFont(name, `${FALLBACK_FAMILY_PREFIX}${i}`, style, undefined, 'Identity-H');
  });
  doc.setFont(PDF_FONT_FAMILY, 'normal');
}

/** The bytes as a "binary string" (one char per byte), the form jsPDF's virtual file system takes. */
function binaryString(bytes: Uint8Array): string {
  const parts: string[] = [];
  const chunk = 0x8000;
  for (let i = 0; i < bytes.length; i += chunk) {
    parts.push(String.fromCharCode(...bytes.subarray(i, i + chunk)));
  }
  return parts.join('');
}
