import type { jsPDF } from 'jspdf';

/** Families the fallback fonts are registered under: `SwFallback0`, `SwFallback1`, … in the order given. */
export const FALLBACK_FAMILY_PREFIX = 'SwFallback';

/** A stretch of text drawn in one font family. */
export interface TextRun {
  text: string;
  family: string;
}

interface GlyphSource {
  metadata?: { characterToGlyph(code: number): number };
}

/**
 * Splits text into runs of one font each: the main family wherever it has the character, else the
 * first fallback that has it. jsPDF writes text as glyph ids and stops a string at the first character
 * its font lacks, so a title in Japanese or Arabic would vanish without this. Characters no font has
 * (an emoji: jsPDF reads text as UTF-16 code units, so characters beyond the Basic Multilingual Plane
 * cannot be drawn at all; control characters) are left out instead of cutting the text short.
 */
export class FontFallback {
  private readonly covered = new Map<string, Map<number, boolean>>();
  /** The main family's maps of {@link covered} (normal, bold), looked up for every text drawn or measured. */
  private readonly mainCovered: readonly [Map<number, boolean>, Map<number, boolean>];
  /** The same for the Basic Multilingual Plane as flat tables (0 not yet known, 1 has it, 2 lacks it), normal and bold. */
  private readonly mainTable: readonly [Uint8Array, Uint8Array] = [new Uint8Array(0x10000), new Uint8Array(0x10000)];

  constructor(
    private readonly doc: jsPDF,
    readonly mainFamily: string,
    readonly fallbacks: readonly string[],
  ) {
    this.mainCovered = [this.coverage(mainFamily, false), this.coverage(mainFamily, true)];
  }

  /** The families registered as fallbacks in a document, in order. */
  static familiesOf(doc: jsPDF): string[] {
    return Object.keys(doc.getFontList())
      .filter((f) => f.startsWith(FALLBACK_FAMILY_PREFIX))
      .sort((a, b) => Number(a.slice(FALLBACK_FAMILY_PREFIX.length)) - Number(b.slice(FALLBACK_FAMILY_PREFIX.length)));
  }

  /** The runs of `value` (spaces and digits stay with the run around them when its font has them). */
  runs(value: string, bold: boolean): TextRun[] {
    const runs: TextRun[] = [];
    let current: TextRun | null = null;
    for (let i = 0; i < value.length; i++) {
      const code = value.charCodeAt(i);
      if (code >= 0xd800 && code <= 0xdfff) continue; // half of a character beyond the BMP: cannot be drawn
      const ch = value[i];
      const family: string | null = current && this.has(current.family, code, bold) ? current.family : this.familyFor(code, bold);
      if (family === null) continue;
      if (current && current.family === family) current.text += ch;
      else runs.push((current = { text: ch, family }));
    }
    return runs;
  }

  /** Whether the main family draws the whole text on its own. */
  mainCovers(value: string, bold: boolean): boolean {
    const table = this.mainTable[bold ? 1 : 0];
    for (let i = 0; i < value.length; i++) {
      const code = value.charCodeAt(i);
      let known = table[code];
      if (known === 0) table[code] = known = this.has(this.mainFamily, code, bold) ? 1 : 2;
      if (known === 2) return false;
    }
    return true;
  }

  /** The family that draws a character: the main one when it has it, else the first fallback that does; null when none. */
  familyFor(code: number, bold: boolean): string | null {
    if (this.has(this.mainFamily, code, bold)) return this.mainFamily;
    return this.fallbacks.find((f) => this.has(f, code, bold)) ?? null;
  }

  private coverage(family: string, bold: boolean): Map<number, boolean> {
    const key = bold ? `${family}/bold` : `${family}/normal`;
    let map = this.covered.get(key);
    if (!map) this.covered.set(key, (map = new Map()));
    return map;
  }

  private has(family: string, code: number, bold: boolean): boolean {
    const map = family === this.mainFamily ? this.mainCovered[bold ? 1 : 0] : this.coverage(family, bold);
    let known = map.get(code);
    if (known === undefined) {
      const font = this.doc.internal as unknown as { getFont(family: string, style: string): GlyphSource };
      known = (font.getFont(family, bold ? 'bold' : 'normal').metadata?.characterToGlyph(code) ?? 0) !== 0;
      map.set(code, known);
    }
    return known;
  }
}
