import type { jsPDF } from 'jspdf';

/*
 * What the pen needs to write PDF operators through jsPDF's own content stream (`doc.internal.write`)
 * in the form jsPDF writes them, without going through jsPDF's per-call drawing API: numbers formatted
 * like jsPDF's (three decimals, trailing zeros dropped: "12.5", "3.", "0."), colours encoded by jsPDF's
 * own encoder (once per colour), text as glyph ids of a TrueType font in Identity-H encoding (the glyphs
 * jsPDF's text() writes for such a font, as a literal string of two bytes each instead of its hex, with
 * the same bookkeeping of used glyphs for the subset it embeds).
 */

/** A number as jsPDF writes it with `floatPrecision: 3` (`toFixed(3)` without trailing zeros), without a string per digit. */
export function pdfNumber(value: number): string {
  const r = Math.round(value * 1000);
  if (r === 0) return '0.';
  if (!Number.isFinite(r) || Math.abs(r) > 1e15) return value.toFixed(3).replace(/0+$/, '');
  const negative = r < 0;
  const a = negative ? -r : r;
  const whole = Math.floor(a / 1000);
  const frac = a - whole * 1000;
  const head = (negative ? '-' : '') + whole + '.';
  if (frac === 0) return head;
  if (frac % 100 === 0) return head + frac / 100;
  if (frac % 10 === 0) return head + (frac < 100 ? '0' : '') + frac / 10;
  return head + (frac < 10 ? '00' : frac < 100 ? '0' : '') + frac;
}

/** jsPDF's internals the pen reads (not in its published types). */
interface JsPdfInternals {
  __private__: { encodeColorString(options: { ch1: string; pdfColorType: 'draw' | 'fill' | 'text'; precision: number }): string };
}

/** A TrueType font as jsPDF keeps it (the parts Identity-H text writing touches). */
interface EmbeddedFont {
  id: string;
  encoding: string;
  metadata?: {
    characterToGlyph(code: number): number;
    widthOfGlyph(glyph: number): number;
    glyIdsUsed: number[];
    toUnicode: Record<number, number>;
    Unicode: { widths: unknown[] };
  };
}

/**
 * Colour operators of one document, each colour encoded once by jsPDF's encoder: stroke (`G`/`RG`,
 * two decimals, what `setDrawColor` writes), fill (`g`/`rg`, two decimals, `setFillColor`) and text
 * (`g`/`rg`, three decimals, what `text()` writes inside BT … ET).
 */
export class ColourOps {
  private readonly cache = { draw: new Map<string, string>(), fill: new Map<string, string>(), text: new Map<string, string>() };

  constructor(private readonly doc: jsPDF) {}

  op(colour: string, kind: 'draw' | 'fill' | 'text'): string {
    const cache = this.cache[kind];
    let op = cache.get(colour);
    if (op === undefined) {
      const internals = this.doc as unknown as JsPdfInternals;
      op = internals.__private__.encodeColorString({ ch1: colour, pdfColorType: kind, precision: kind === 'text' ? 3 : 2 });
      cache.set(colour, op);
    }
    return op;
  }
}

/** One byte inside a PDF literal string: parentheses, backslash and line ends escaped (ISO 32000-1:2008 §7.3.4.2). */
function literalByte(byte: number): string {
  switch (byte) {
    case 0x0a:
      return '\\n';
    case 0x0d:
      return '\\r';
    case 0x28:
    case 0x29:
    case 0x5c:
      return '\\' + String.fromCharCode(byte);
    default:
      return String.fromCharCode(byte);
  }
}

/** Code points text() may be written for directly: no bidi reordering, shaping, control or surrogate characters. */
function plainCode(code: number): boolean {
  if (code < 0x20) return false;
  if (code < 0x0590) return true;
  if (code < 0x2000 || code > 0x2bff) return false;
  // Directional marks, embeddings and isolates.
  return !(code === 0x200e || code === 0x200f || (code >= 0x202a && code <= 0x202e) || (code >= 0x2066 && code <= 0x2069));
}

/**
 * Hex glyph ids of one Identity-H font, by character, each looked up once; keeps jsPDF's records of
 * the glyphs used (the embedded subset, the ToUnicode map and the widths array) as its text() does.
 */
export class GlyphEncoder {
  /** Hex glyph id by character code; '' when the text must go through jsPDF's text() (see {@link plainCode}). */
  private readonly coded: Array<string | undefined> = [];
  /** Glyph by character code, for glyphs that more than one character maps to (ToUnicode takes the last one drawn). */
  private readonly sharedGlyph = new Map<number, number>();
  private readonly codeOfGlyph = new Map<number, number>();

  constructor(readonly font: EmbeddedFont) {}

  /** Whether jsPDF's text() would write this font in Identity-H (else the pen uses text()). */
  static usable(font: EmbeddedFont | undefined): boolean {
    return !!font && font.encoding === 'Identity-H' && !!font.metadata && typeof font.metadata.characterToGlyph === 'function';
  }

  /** The glyph ids of a line as the inside of a PDF literal string, or null when it has a character that needs jsPDF's text(). */
  encode(line: string): string | null {
    let out = '';
    for (let i = 0; i < line.length; i++) {
      const code = line.charCodeAt(i);
      let h = this.coded[code];
      if (h === undefined) h = this.learn(code);
      if (h === '') return null;
      if (this.sharedGlyph.size > 0) {
        const glyph = this.sharedGlyph.get(code);
        if (glyph !== undefined) this.font.metadata!.toUnicode[glyph] = code;
      }
      out += h;
    }
    return out;
  }

  private learn(code: number): string {
    const meta = this.font.metadata!;
    const glyph = plainCode(code) ? meta.characterToGlyph(code) : 0;
    if (!glyph) return (this.coded[code] = '');
    // As jsPDF's pdfEscape16: the glyph goes into the subset, the ToUnicode map and the widths array.
    meta.glyIdsUsed.push(glyph);
    meta.toUnicode[glyph] = code;
    const widths = meta.Unicode.widths;
    if (widths.indexOf(glyph) === -1) widths.push(glyph, [parseInt(String(meta.widthOfGlyph(glyph)), 10)]);
    const other = this.codeOfGlyph.get(glyph);
    if (other !== undefined && other !== code) {
      this.sharedGlyph.set(other, glyph);
      this.sharedGlyph.set(code, glyph);
    } else this.codeOfGlyph.set(glyph, code);
    return (this.coded[code] = literalByte(glyph >> 8) + literalByte(glyph & 0xff));
  }
}
