import { beforeAll, describe, expect, it } from 'vitest';
import { jsPDF } from 'jspdf';
import { buildStressPattern } from '../demo/index';
import { derivePatches } from '../geometry/index';
import { embedFonts, PdfPen } from './pdf-pen';
import { renderPrintSet, type PrintSetResult } from './render-print-set';
import { SheetFlow } from './sheet-flow';
import { sheetFrame, type SheetFrame } from './sheet-frame';
import { pdfPageTexts, type PdfTextItem } from './testing/pdf-inspect';
import { readShippedFonts } from './testing/print-test-fixtures';

/*
 * No text of a print set is cut short (issue 16): long cells wrap, long tables run on onto the next
 * sheet under their header, and the covers continue on sheets of their own. Everything is read back
 * from the PDF with pdfjs-dist (Mozilla's reader), never from our own writer.
 */

const fonts = readShippedFonts();
const PT_PER_IN = 72; // 1 pt = 1/72 in. (ISO 32000-1:2008 §8.3.2.3)
/** The one ellipsis the print set writes on purpose: it names the dashed "edge of …" lines of tiles. */
const QUOTED_ELLIPSIS = '"edge of …"';

function newDoc(): jsPDF {
  const doc = new jsPDF({ unit: 'pt', format: 'letter', orientation: 'portrait', compress: true });
  embedFonts(doc, fonts);
  return doc;
}

describe('print set of a 1,000-patch pattern read back with pdfjs-dist', () => {
  const document = buildStressPattern(1000);
  let result: PrintSetResult;
  let pages: PdfTextItem[][];

  beforeAll(async () => {
    result = await renderPrintSet(document, { paper: 'letter', createdAt: '2026-12-01T00:00:00Z', fonts });
    pages = await pdfPageTexts(result.pdf);
    // A few seconds on an idle machine (render about 1 s, reading 170-odd sheets back); generous for a shared CI machine.
  }, 180_000);

  it('lists every patch in the fabric key, each once per fabric it is cut from', () => {
    const start = pages.findIndex((p) => p.some((t) => t.str === 'Where each fabric goes'));
    expect(start).toBeGreaterThan(1);
    // The key runs from its heading to the next part's heading (cutting instructions).
    const items: string[] = [];
    let inKey = false;
    for (const page of pages.slice(start)) {
      for (const t of page) {
        if (t.str === 'Where each fabric goes') inKey = true;
        else if (t.str === 'Cutting instructions') inKey = false;
        else if (inKey) items.push(t.str);
      }
      if (!inKey && items.length > 0) break;
    }
    const tokens = items.join(' ').split(/[\s,]+/).filter((w) => w !== '');
    const expected: string[] = [];
    for (const section of document.sections) {
      for (const patch of derivePatches(section).patches) {
        const fabrics = new Set(patch.stripSet ? patch.stripSet.strips.map((s) => s.fabricId) : [patch.fabricId]);
        for (let k = 0; k < fabrics.size; k++) expected.push(patch.label);
      }
    }
    expect(expected.length).toBeGreaterThanOrEqual(1000);
    const seen = new Map<string, number>();
    for (const w of tokens) seen.set(w, (seen.get(w) ?? 0) + 1);
    const want = new Map<string, number>();
    for (const l of expected) want.set(l, (want.get(l) ?? 0) + 1);
    const missing = [...want].filter(([label, n]) => (seen.get(label) ?? 0) !== n).map(([label]) => label);
    expect(missing).toEqual([]);
    // The key is longer than one sheet: it ran on (with its header) instead of being cut.
    const keyPages = pages.filter((p) => p.some((t) => /^[A-Z]+\d+,/.test(t.str)) && p.some((t) => t.str === 'Used in patches'));
    expect(keyPages.length).toBeGreaterThanOrEqual(2);
  });

  it('writes no text cut short with an ellipsis on any sheet', () => {
    const cut = pages.flatMap((p, i) => p.filter((t) => t.str.replace(QUOTED_ELLIPSIS, '').includes('…')).map((t) => `sheet ${i + 1}: ${t.str}`));
    expect(cut).toEqual([]);
  });

  it('names every section in the "where each section is" table, which continues past the how-to-print sheet', () => {
    const tableStart = pages[1].findIndex((t) => t.str === 'Where each section is');
    expect(tableStart).toBeGreaterThan(0);
    const continued = pages.filter((p) => p.some((t) => t.str === 'How to print (continued)'));
    expect(continued.length).toBeGreaterThanOrEqual(1);
    const cells = new Set([...pages[1].slice(tableStart), ...continued.flat()].map((t) => t.str));
    expect(document.sections.filter((s) => !cells.has(s.label)).map((s) => s.label)).toEqual([]);
  });

  it('states the page count the PDF has, continuation sheets included', () => {
    const statement = pages[1].find((t) => /^\d+ sheets in all/.test(t.str));
    expect(Number(statement?.str.match(/^(\d+)/)?.[1])).toBe(pages.length);
    expect(pages.length).toBe(result.sheetCount);
  });
});

describe('wrapping and running on', () => {
  it('wraps a list of labels into lines no wider than the column, keeping every word in order', () => {
    const doc = newDoc();
    const pen = new PdfPen(doc);
    const words = Array.from({ length: 300 }, (_, i) => `${String.fromCharCode(65 + (i % 26))}${i + 1},`);
    const widthIn = 4.7;
    const lines = pen.wrap(words.join(' '), widthIn, 8);
    expect(lines.join(' ').split(' ')).toEqual(words);
    doc.setFont('Roboto', 'normal');
    doc.setFontSize(8);
    for (const [i, line] of lines.entries()) {
      // jsPDF's own measure of the whole line, not our per-character cache.
      expect(doc.getTextWidth(line)).toBeLessThanOrEqual(widthIn * PT_PER_IN + 1e-6);
      // Greedy: the next word would not have fitted on this line.
      const next = lines[i + 1]?.split(' ')[0];
      if (next) expect(doc.getTextWidth(`${line} ${next}`)).toBeGreaterThan(widthIn * PT_PER_IN);
    }
    // 1,691 characters (300 labels of 3–5 characters, with spaces) at 8 pt, about 0.45–0.55 em each in
    // Roboto: 1.5–1.9 pt per character … 338 pt (4.7 in.) a line holds 75–95 characters: 17–23 lines.
    expect(words.join(' ').length).toBe(1691);
    expect(lines.length).toBeGreaterThanOrEqual(17);
    expect(lines.length).toBeLessThanOrEqual(23);
  });

  it('measures a text as wide as jsPDF does, and breaks a word wider than the line without losing a character', () => {
    const doc = newDoc();
    const pen = new PdfPen(doc);
    const text = 'Sewing line (section outline and seams): sew on it — ½ in. × 3⅞ in.';
    doc.setFont('Roboto', 'bold');
    doc.setFontSize(9.5);
    expect(pen.textWidth(text, 9.5, true) * PT_PER_IN).toBeCloseTo(doc.getTextWidth(text), 9);
    const word = 'X'.repeat(120);
    const lines = pen.wrap(word, 1, 8);
    expect(lines.join('')).toBe(word);
    expect(lines.length).toBeGreaterThan(1);
    for (const line of lines) expect(pen.textWidth(line, 8)).toBeLessThanOrEqual(1 + 1e-9);
  });

  it('runs a table cell longer than a sheet onto the next sheets, the header repeated on each, nothing lost', async () => {
    const doc = newDoc();
    const pen = new PdfPen(doc);
    const frames: SheetFrame[] = [];
    const first = sheetFrame('letter', 'portrait', 0.5);
    frames.push(first);
    const flow = new SheetFlow(pen, () => {
      doc.addPage('letter', 'portrait');
      const f = sheetFrame('letter', 'portrait', 0.5);
      frames.push(f);
      return f;
    }, first);
    const labels = Array.from({ length: 2500 }, (_, i) => `P${i + 1}`);
    flow.table(
      [
        { header: 'Fabric', widthIn: 2.0 },
        { header: 'Used in patches', widthIn: flow.width - 2.0 },
      ],
      [
        [{ text: 'Plum', swatch: '#6b2d5c' }, labels.join(', ')],
        ['Oat', 'P1'],
      ],
    );
    const pages = await pdfPageTexts(new Uint8Array(doc.output('arraybuffer')));
    expect(pages.length).toBe(frames.length);
    expect(pages.length).toBeGreaterThanOrEqual(2);
    const columnLeftPt = (first.content.x + 2.0) * PT_PER_IN;
    const columnRightPt = (first.content.x + first.content.width) * PT_PER_IN;
    const found: string[] = [];
    for (const page of pages) {
      // Each sheet the table is on starts with its header row.
      expect(page.map((t) => t.str)).toContain('Used in patches');
      for (const t of page) {
        if (!/^P\d+/.test(t.str)) continue;
        expect(t.x).toBeGreaterThanOrEqual(columnLeftPt);
        expect(t.x + t.width).toBeLessThanOrEqual(columnRightPt + 0.01);
        found.push(...t.str.split(/,\s*/).filter((w) => w !== ''));
      }
    }
    expect(found).toEqual([...labels, 'P1']);
  });
});
