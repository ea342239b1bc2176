import type { jsPDF } from 'jspdf';
import type { Point } from '../document/index';
import { POINTS_PER_INCH, type RectIn } from './paper';
import type { PrintFonts } from './print-options';
import { FALLBACK_FAMILY_PREFIX, FontFallback } from './font-fallback';
import { ColourOps, GlyphEncoder, pdfNumber } from './pdf-ops';

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

/** {@link ARABIC} for one character code. */
function isArabic(code: number): boolean {
  return (
    (code >= 0x0600 && code <= 0x06ff) ||
    (code >= 0x0750 && code <= 0x077f) ||
    (code >= 0x08a0 && code <= 0x08ff) ||
    (code >= 0xfb50 && code <= 0xfdff) ||
    (code >= 0xfe70 && code <= 0xfeff)
  );
}

/** The main family's width tables of a document, shared by every pen on it (the measuring pens of the covers too). */
const mainWidthTables = new WeakMap<jsPDF, readonly [Float64Array, Float64Array]>();
function mainWidthsOf(doc: jsPDF): readonly [Float64Array, Float64Array] {
  let tables = mainWidthTables.get(doc);
  if (!tables) mainWidthTables.set(doc, (tables = [mainWidthTable(), mainWidthTable()]));
  return tables;
}

/** A width table for the Basic Multilingual Plane: NaN (not measured) everywhere but Arabic (-1: measured with its text). */
function mainWidthTable(): Float64Array {
  const table = new Float64Array(0x10000).fill(NaN);
  for (let code = 0; code < 0x10000; code++) if (isArabic(code)) table[code] = -1;
  return table;
}

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
  /**
   * The main family's advance widths at 1 pt by character code (normal, bold), looked up on every measure:
   * NaN not measured yet, -1 for Arabic letters (measured with the whole text).
   */
  private readonly mainWidths: readonly [Float64Array, Float64Array];
  /** Whether the pen writes operators itself (a document in points with three decimals, as the print set makes). */
  private readonly direct: boolean;
  private readonly internal: JsPdfInternals;
  private readonly pageStates = new WeakMap<object, PageState>();
  private readonly colours: ColourOps;
  /** Glyph ids of the main font (normal, bold), when it is an embedded TrueType font. */
  private readonly mainGlyphs: readonly [GlyphEncoder | null, GlyphEncoder | null];
  /** Fonts jsPDF has written text in (and so marked to embed): the pen writes text itself only in those. */
  private readonly fontsUsed = new Set<string>();
  private readonly lineHeightFactor: number;

  /**
   * `measuringOnly`: a pen that measures and wraps text like any other but puts nothing on the page (to
   * find out how many sheets a part needs before writing it).
   */
  constructor(
    readonly doc: jsPDF,
    readonly measuringOnly = false,
  ) {
    this.fallback = new FontFallback(doc, PDF_FONT_FAMILY, FontFallback.familiesOf(doc));
    this.mainWidths = mainWidthsOf(doc);
    this.internal = doc.internal as unknown as JsPdfInternals;
    // Written directly only where jsPDF would write the same: points (no scaling), three decimals (floatPrecision: 3).
    const hpf = (doc as unknown as { hpf?: (n: number) => string }).hpf;
    this.direct = this.internal.scaleFactor === 1 && typeof this.internal.write === 'function' && typeof hpf === 'function' && hpf(0.12345) === '0.123';
    this.colours = new ColourOps(doc);
    this.lineHeightFactor = doc.getLineHeightFactor();
    const encoder = (style: 'normal' | 'bold'): GlyphEncoder | null => {
      const fonts = doc.getFontList()[PDF_FONT_FAMILY];
      if (!fonts?.includes(style)) return null;
      const font = (doc as unknown as { getFont(family: string, style: string): ConstructorParameters<typeof GlyphEncoder>[0] }).getFont(PDF_FONT_FAMILY, style);
      return GlyphEncoder.usable(font) ? encoderFor(doc, font) : null;
    };
    this.mainGlyphs = [encoder('normal'), encoder('bold')];
    if (!measuringOnly) penHooks.created?.(this);
  }

  /** Strokes a polyline, closed when asked. */
  polyline(points: readonly Point[], closed: boolean, style: StrokeStyle): void {
    if (this.measuringOnly) return;
    if (points.length < 2) return;
    const page = this.page();
    if (!page) {
      this.setStroke(style);
      const ops: Array<{ op: string; c: number[] }> = [{ op: 'm', c: [pt(points[0].x), pt(points[0].y)] }];
      for (let i = 1; i < points.length; i++) ops.push({ op: 'l', c: [pt(points[i].x), pt(points[i].y)] });
      if (closed) ops.push({ op: 'h', c: [] });
      this.doc.path(ops);
      this.doc.stroke();
      return;
    }
    this.write(this.strokeOps(page, style) + this.pathOps(page, points) + (closed ? 'h\nS' : 'S'));
  }

  /** Several separate straight lines as one path and one stroke. */
  segments(lines: ReadonlyArray<{ a: Point; b: Point }>, style: StrokeStyle): void {
    if (this.measuringOnly) return;
    if (lines.length === 0) return;
    const page = this.page();
    if (!page) {
      this.setStroke(style);
      const ops: Array<{ op: string; c: number[] }> = [];
      for (const { a, b } of lines) {
        ops.push({ op: 'm', c: [pt(a.x), pt(a.y)] }, { op: 'l', c: [pt(b.x), pt(b.y)] });
      }
      this.doc.path(ops);
      this.doc.stroke();
      return;
    }
    const h = page.heightPt;
    let ops = this.strokeOps(page, style);
    for (const { a, b } of lines) {
      ops += `${pdfNumber(pt(a.x))} ${pdfNumber(h - pt(a.y))} m\n${pdfNumber(pt(b.x))} ${pdfNumber(h - pt(b.y))} l\n`;
    }
    this.write(ops + 'S');
  }

  /** A rectangle (the PDF `re` operator): stroked, filled or both. */
  rect(r: RectIn, style: StrokeStyle | null, fill?: string): void {
    if (this.measuringOnly) return;
    const mode = style && fill ? 'FD' : fill ? 'F' : 'S';
    const page = this.page();
    if (!page) {
      if (style) this.setStroke(style);
      if (fill) this.doc.setFillColor(fill);
      this.doc.rect(pt(r.x), pt(r.y), pt(r.width), pt(r.height), mode);
      return;
    }
    const ops = (style ? this.strokeOps(page, style) : '') + (fill ? this.fillOps(page, fill) : '');
    const re = `${pdfNumber(pt(r.x))} ${pdfNumber(page.heightPt - pt(r.y))} ${pdfNumber(pt(r.width))} ${pdfNumber(-pt(r.height))} re`;
    this.write(`${ops}${re}\n${mode === 'FD' ? 'B' : mode === 'F' ? 'f' : 'S'}`);
  }

  /** A filled polygon without a stroke. */
  fillPolygon(points: readonly Point[], colour: string): void {
    if (this.measuringOnly) return;
    if (points.length < 3) return;
    const page = this.page();
    if (!page) {
      this.doc.setFillColor(colour);
      const ops: Array<{ op: string; c: number[] }> = [{ op: 'm', c: [pt(points[0].x), pt(points[0].y)] }];
      for (let i = 1; i < points.length; i++) ops.push({ op: 'l', c: [pt(points[i].x), pt(points[i].y)] });
      ops.push({ op: 'h', c: [] });
      this.doc.path(ops);
      this.doc.fill();
      return;
    }
    this.write(this.fillOps(page, colour) + this.pathOps(page, points) + 'h\nf');
  }

  /** A circle, stroked. */
  circle(centre: Point, radiusIn: number, style: StrokeStyle): void {
    if (this.measuringOnly) return;
    const page = this.page();
    if (page) {
      const ops = this.strokeOps(page, style);
      if (ops) this.write(ops.slice(0, -1));
    } else this.setStroke(style);
    this.doc.circle(pt(centre.x), pt(centre.y), pt(radiusIn), 'S');
  }

  /** Text at a point. */
  text(value: string | string[], at: Point, style: TextStyle): void {
    if (this.measuringOnly) return;
    const bold = style.bold ?? false;
    const lines = typeof value === 'string' ? [value] : value;
    if (lines.length === 0 || value === '') return; // jsPDF writes nothing for no text
    // Written by the pen when the main font has every character (its glyphs are looked up as it writes).
    if (this.writeText(lines, at, style, bold)) return;
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
    this.textWrittenByJsPdf(PDF_FONT_FAMILY, bold);
  }

  /**
   * Writes text in the main font as jsPDF's text() draws it (BT, font and size, leading, colour,
   * position, glyph ids, ET; font, leading and colour only when they change on the page, the glyph ids
   * as a literal string of two bytes each), without its per-call processing. False (nothing written) when jsPDF must
   * write it: turned text, a character outside the plain range, or the font's first text in the document
   * (jsPDF marks a font used, to embed it, only in its own text()).
   */
  private writeText(lines: readonly string[], at: Point, style: TextStyle, bold: boolean): boolean {
    if (style.angleDeg) return false;
    const page = this.page();
    if (!page) return false;
    const encoder = this.mainGlyphs[bold ? 1 : 0];
    if (!encoder || !this.fontsUsed.has(encoder.font.id)) return false;
    if (lines.length === 0 || (lines.length === 1 && lines[0] === '')) return true;
    const glyphs: string[] = [];
    for (const line of lines) {
      const g = encoder.encode(line);
      if (g === null) return false;
      glyphs.push(g);
    }
    const size = style.sizePt;
    const leading = size * this.lineHeightFactor;
    let y = pt(at.y);
    const descent = size * (this.lineHeightFactor - 1);
    switch (style.baseline) {
      case 'bottom':
        y -= descent;
        break;
      case 'top':
        y += size - descent;
        break;
      case 'middle':
        y += size / 2 - descent;
        break;
    }
    let x = pt(at.x);
    const align = style.align ?? 'left';
    let ops = 'BT\n';
    // Font, leading and colour carry over from one text object to the next on a page: written when they change.
    const font = `/${encoder.font.id} ${size} Tf`;
    if (page.font !== font) {
      page.font = font;
      ops += `${font}\n`;
    }
    // The leading is used by T* only (lines after the first, left-aligned).
    if (align === 'left' && glyphs.length > 1 && page.leading !== leading) {
      page.leading = leading;
      ops += `${pdfNumber(leading)} TL\n`;
    }
    const colour = this.colours.op(style.colour ?? '#000000', 'text');
    if (page.fill !== colour) {
      page.fill = colour;
      ops += `${colour}\n`;
    }
    if (align === 'left') {
      ops += `${pdfNumber(x)} ${pdfNumber(page.heightPt - y)} Td\n(${glyphs.join(') Tj\nT* (')}) Tj\n`;
    } else {
      const widths = lines.map((line) => this.unitWidth(line, PDF_FONT_FAMILY, bold) * size);
      const half = align === 'center';
      x -= half ? widths[0] / 2 : widths[0];
      ops += `${pdfNumber(x)} ${pdfNumber(page.heightPt - y)} Td\n(${glyphs[0]}) Tj\n`;
      for (let i = 1; i < lines.length; i++) {
        const dx = half ? (widths[i - 1] - widths[i]) / 2 : widths[i - 1] - widths[i];
        ops += `${pdfNumber(dx)} ${pdfNumber(-leading)} Td\n(${glyphs[i]}) Tj\n`;
      }
    }
    this.write(ops + 'ET');
    return true;
  }

  /** After jsPDF's own text(): the font is marked used; it has set the font, leading and colour its way. */
  private textWrittenByJsPdf(family: string, bold: boolean): void {
    if (family === PDF_FONT_FAMILY) this.fontsUsed.add(this.mainGlyphs[bold ? 1 : 0]?.font.id ?? '');
    const page = this.page();
    if (page) page.fill = page.font = page.leading = undefined;
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
      if (run.text !== '') this.textWrittenByJsPdf(run.family, bold);
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
    if (family === PDF_FONT_FAMILY) return this.mainUnitWidth(text, bold);
    if (ARABIC.test(text)) return this.shapedUnitWidth(text, family, bold);
    const widths = this.glyphWidths(family, bold);
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

  /** {@link unitWidth} in the main family, from a table by character code (the booklet measures every word it wraps). */
  private mainUnitWidth(text: string, bold: boolean): number {
    const widths = this.mainWidths[bold ? 1 : 0];
    let sum = 0;
    for (let i = 0; i < text.length; i++) {
      const code = text.charCodeAt(i);
      let w = widths[code];
      if (w !== w) {
        // Not measured yet (NaN).
        this.doc.setFont(PDF_FONT_FAMILY, bold ? 'bold' : 'normal');
        w = widths[code] = this.doc.getStringUnitWidth(text[i]);
      } else if (w < 0) return this.shapedUnitWidth(text, PDF_FONT_FAMILY, bold);
      sum += w;
    }
    return sum;
  }

  /** Arabic is shaped first (joined forms), so it is measured whole. */
  private shapedUnitWidth(text: string, family: string, bold: boolean): number {
    this.doc.setFont(family, bold ? 'bold' : 'normal');
    return this.doc.getStringUnitWidth(text);
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
    this.withClip(() => {
      this.doc.rect(pt(r.x), pt(r.y), pt(r.width), pt(r.height), null as unknown as string);
    }, draw);
  }

  /** Runs `draw` with everything clipped to a polygon (inches, y down). */
  clippedToRing(ring: readonly Point[], draw: () => void): void {
    if (this.measuringOnly) return draw();
    this.withClip(() => {
      const ops: Array<{ op: string; c: number[] }> = [{ op: 'm', c: [pt(ring[0].x), pt(ring[0].y)] }];
      for (let i = 1; i < ring.length; i++) ops.push({ op: 'l', c: [pt(ring[i].x), pt(ring[i].y)] });
      ops.push({ op: 'h', c: [] });
      this.doc.path(ops);
    }, draw);
  }

  /** q, the clipping path, W n, the drawing, Q: what the pen knows of the page's state is restored with it. */
  private withClip(path: () => void, draw: () => void): void {
    const before = this.page();
    const saved = before ? { ...before } : null;
    this.doc.saveGraphicsState();
    path();
    this.doc.clip();
    this.doc.discardPath();
    draw();
    this.doc.restoreGraphicsState();
    const after = this.page();
    if (after && saved && after === before) Object.assign(after, saved);
  }

  private setStroke(style: StrokeStyle): void {
    this.doc.setLineWidth(style.widthPt);
    this.doc.setDrawColor(style.colour ?? '#000000');
    this.doc.setLineDashPattern(style.dashPt ?? [], 0);
  }

  /**
   * What the pen has set on the current page (line width, stroke and fill colour, dash), to write only
   * what changes; null when the document is not one the pen writes directly (units other than points).
   * Each page's content stream starts from the PDF defaults, so a new page starts with nothing known.
   */
  private page(): PageState | null {
    if (!this.direct) return null;
    const info = this.internal.getCurrentPageInfo();
    const content = this.internal.pages[info.pageNumber];
    let state = this.pageStates.get(content);
    if (!state) {
      const box = info.pageContext.mediaBox;
      state = { heightPt: box.topRightY - box.bottomLeftY };
      this.pageStates.set(content, state);
    }
    return state;
  }

  /** Line width, stroke colour and dash operators for a style, only those that differ from the page's state. */
  private strokeOps(page: PageState, style: StrokeStyle): string {
    let ops = '';
    if (page.width !== style.widthPt) {
      page.width = style.widthPt;
      ops += `${pdfNumber(style.widthPt)} w\n`;
    }
    const draw = this.colours.op(style.colour ?? '#000000', 'draw');
    if (page.draw !== draw) {
      page.draw = draw;
      ops += `${draw}\n`;
    }
    const dash = style.dashPt && style.dashPt.length > 0 ? `[${style.dashPt.map(pdfNumber).join(' ')}] 0. d` : '[] 0. d';
    if (page.dash !== dash) {
      page.dash = dash;
      ops += `${dash}\n`;
    }
    return ops;
  }

  private fillOps(page: PageState, colour: string): string {
    const fill = this.colours.op(colour, 'fill');
    if (page.fill === fill) return '';
    page.fill = fill;
    return `${fill}\n`;
  }

  /** m and l operators of a path, each on its line (y up from the page's bottom, as jsPDF writes them). */
  private pathOps(page: PageState, points: readonly Point[]): string {
    const h = page.heightPt;
    let ops = `${pdfNumber(pt(points[0].x))} ${pdfNumber(h - pt(points[0].y))} m\n`;
    for (let i = 1; i < points.length; i++) ops += `${pdfNumber(pt(points[i].x))} ${pdfNumber(h - pt(points[i].y))} l\n`;
    return ops;
  }

  /**
   * One piece of the current page's content stream (jsPDF ends each piece with a line break), written
   * flat: see {@link flattened}.
   */
  private write(ops: string): void {
    this.internal.write(flattened(ops));
  }
}

/** Read by {@link flattened}, so that engines keep the read. */
let flattenProbe = 0;

/**
 * The same string, flat in memory. V8 builds `a + b` and template strings as ropes (a tree of the
 * pieces) and joins them only when the characters are read; a page's operators stay in jsPDF's page
 * array until the PDF is written, so every piece of every operator (each number, each space) lived
 * that long as an object of its own, and the young-generation collections copied them over and over
 * (about half of the pen's time on a 2,000-patch print set). Reading one character makes V8 join the
 * rope once, now, leaving one object per operator string. Other engines just read a character.
 */
export function flattened(s: string): string {
  if (s.length > 0) flattenProbe = (flattenProbe + s.charCodeAt(s.length >> 1)) & 0xffff;
  return s;
}

/** What the pen has set on one page's content stream; undefined: not known (the PDF default or jsPDF's). */
interface PageState {
  heightPt: number;
  width?: number;
  draw?: string;
  dash?: string;
  fill?: string;
  /** Text font and size (`/F1 8 Tf`) and leading (TL). */
  font?: string;
  leading?: number;
}

/** The parts of jsPDF's `internal` the pen writes through (not all in its published types). */
interface JsPdfInternals {
  scaleFactor: number;
  write(ops: string): void;
  getCurrentPageInfo(): { pageNumber: number; pageContext: { mediaBox: { bottomLeftY: number; topRightY: number } } };
  /** Each page's content stream (index 1 is the first page). */
  pages: object[];
}

/** One glyph encoder per font of a document, shared by every pen on it (each keeps jsPDF's glyph records once). */
const encoders = new WeakMap<jsPDF, Map<string, GlyphEncoder>>();
function encoderFor(doc: jsPDF, font: ConstructorParameters<typeof GlyphEncoder>[0]): GlyphEncoder {
  let byFont = encoders.get(doc);
  if (!byFont) encoders.set(doc, (byFont = new Map()));
  let encoder = byFont.get(font.id);
  if (!encoder) byFont.set(font.id, (encoder = new GlyphEncoder(font)));
  return encoder;
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

/** Font files already turned into binary strings: every print set embeds the same few fonts. */
const binaryStrings = new WeakMap<Uint8Array, { length: number; text: string }>();

/** The bytes as a "binary string" (one char per byte), the form jsPDF's virtual file system takes. */
function binaryString(bytes: Uint8Array): string {
  const known = binaryStrings.get(bytes);
  // The same array with the same length: font bytes are read once and not written to.
  if (known && known.length === bytes.length) return known.text;
  const text = binaryStringOf(bytes);
  binaryStrings.set(bytes, { length: bytes.length, text });
  return text;
}

function binaryStringOf(bytes: Uint8Array): string {
  const parts: string[] = [];
  const chunk = 0x8000;
  for (let i = 0; i < bytes.length; i += chunk) {
    parts.push(String.fromCharCode(...bytes.subarray(i, i + chunk)));
  }
  return parts.join('');
}
