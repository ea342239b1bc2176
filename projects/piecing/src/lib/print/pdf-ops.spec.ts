import { describe, expect, it } from 'vitest';
import { jsPDF } from 'jspdf';
import { seededRandom } from '../../../../../tests/support/random';
import { embedFonts, PdfPen, PDF_FONT_FAMILY, type TextStyle } from './pdf-pen';
import { pdfNumber } from './pdf-ops';
import { readShippedFonts } from './testing/print-test-fixtures';

/*
 * The pen writes path and text operators itself (issue 16: jsPDF's per-call drawing API was most of a
 * print set's time). What it writes must be what jsPDF writes for the same call, so these compare its
 * output with jsPDF's own, operator for operator.
 */

const fonts = readShippedFonts();

function newDoc(): jsPDF {
  // As the print set makes its document (render-print-set.ts).
  const doc = new jsPDF({ unit: 'pt', format: 'letter', orientation: 'portrait', floatPrecision: 3, putOnlyUsedFonts: true, compress: true });
  embedFonts(doc, fonts);
  return doc;
}

/** The pieces written on the current page since `from`. */
function written(doc: jsPDF, from: number): string[] {
  const pages = (doc.internal as unknown as { pages: string[][] }).pages;
  return pages[doc.getCurrentPageInfo().pageNumber].slice(from);
}
const pageLength = (doc: jsPDF) => written(doc, 0).length;

/** Literal strings `(…)` of glyph ids as jsPDF's hex strings `<…>` (escapes per ISO 32000-1:2008 §7.3.4.2). */
function literalsAsHex(ops: string): string {
  return ops.replace(/\(((?:[^\\)]|\\.)*)\) Tj/gs, (_, body: string) => {
    const bytes = body.replace(/\\(.)/gs, (_m, c: string) => (c === 'n' ? '\n' : c === 'r' ? '\r' : c));
    return `<${[...bytes].map((c) => c.charCodeAt(0).toString(16).padStart(2, '0')).join('')}> Tj`;
  });
}
const fontId = (doc: jsPDF, style: string) => (doc as unknown as { getFont(family: string, style: string): { id: string } }).getFont(PDF_FONT_FAMILY, style).id;

describe('pdfNumber', () => {
  it('formats numbers as jsPDF does with three decimals', () => {
    const doc = newDoc();
    const hpf = (doc as unknown as { hpf(n: number): string }).hpf;
    const random = seededRandom(16);
    const values = [0, 1, -1, 0.5, 12.25, 612, 791.999, -0.004, 0.0004, 100.1, 3.07, 1234.567];
    for (let i = 0; i < 5000; i++) values.push((random() - 0.5) * 10 ** Math.floor(random() * 5));
    for (const v of values) {
      // Exact halves of the last digit may round either way (toFixed works on the binary value): left out.
      if (Math.abs(Math.abs(v * 1000 - Math.trunc(v * 1000)) - 0.5) < 1e-6) continue;
      expect(pdfNumber(v), String(v)).toBe(hpf(v).replace(/^-0\.$/, '0.'));
    }
  });
});

describe('PdfPen writing text itself', () => {
  const cases: Array<[string | string[], TextStyle]> = [
    ['Section A: piecing steps', { sizePt: 13, bold: true }],
    ['Press toward A2 — trim ¼ in. beyond it', { sizePt: 7.5 }],
    [['first line of a cell', 'second, shorter', 'third'], { sizePt: 8, colour: '#555555' }],
    [['centred', 'under it, longer'], { sizePt: 9, align: 'center', baseline: 'middle' }],
    [['right', 'aligned lines'], { sizePt: 7, align: 'right', baseline: 'top', colour: '#b03a2e' }],
    ['at the bottom', { sizePt: 6, baseline: 'bottom' }],
  ];

  it.each(cases)('writes %j as jsPDF text() does (glyph ids as a literal string, the leading only where T* uses it)', (value, style) => {
    const doc = newDoc();
    const pen = new PdfPen(doc);
    // The first text in a font goes through jsPDF (which marks the font used); the pen writes the next ones.
    pen.text('first', { x: 1, y: 1 }, { sizePt: 10, bold: style.bold });
    // A new page: nothing set on it yet, so the pen writes font, colour (and leading) as jsPDF does.
    doc.addPage();
    const from = pageLength(doc); // after jsPDF's own line width and stroke colour at the page's start
    pen.text(value, { x: 2.5, y: 3.25 }, style);
    const mine = literalsAsHex(written(doc, from).join('\n'));

    const reference = newDoc();
    reference.setFont(PDF_FONT_FAMILY, style.bold ? 'bold' : 'normal');
    reference.setFontSize(style.sizePt);
    reference.setTextColor(style.colour ?? '#000000');
    const at = pageLength(reference);
    reference.text(value, 2.5 * 72, 3.25 * 72, { align: style.align ?? 'left', baseline: style.baseline ?? 'alphabetic' });
    let theirs = written(reference, at).join('\n');
    if (!theirs.includes('T*')) theirs = theirs.replace(/\n[\d.]+ TL\n/, '\n');
    expect(mine).toBe(theirs);
    expect(fontId(doc, style.bold ? 'bold' : 'normal')).toBe(fontId(reference, style.bold ? 'bold' : 'normal'));
    expect(mine).toMatch(/^BT\n/);
  });

  it('writes font, leading and colour again only when they change on the page', () => {
    const doc = newDoc();
    const pen = new PdfPen(doc);
    pen.text('first', { x: 1, y: 1 }, { sizePt: 8 }); // through jsPDF (the font's first text)
    pen.text('second', { x: 1, y: 1.5 }, { sizePt: 8 }); // the pen's own: font and colour set
    const from = pageLength(doc);
    pen.text(['two', 'lines'], { x: 1, y: 2 }, { sizePt: 8 });
    pen.text('same font', { x: 1, y: 3 }, { sizePt: 8 });
    pen.fillPolygon(
      [
        { x: 1, y: 1 },
        { x: 2, y: 1 },
        { x: 2, y: 2 },
      ],
      '#ff0000',
    );
    pen.text('after a red fill', { x: 1, y: 4 }, { sizePt: 9 });
    const blocks = written(doc, from).filter((w) => w.startsWith('BT'));
    expect(blocks[0]).toMatch(/^BT\n[\d.]+ TL\n[\d.]+ [\d.]+ Td\n\(/); // leading for T*; font and colour as before
    expect(blocks[1]).toMatch(/^BT\n[\d.]+ [\d.]+ Td\n\(/);
    expect(blocks[2]).toMatch(/^BT\n\/F\d+ 9 Tf\n0\. g\n/); // the fill made the colour red in between
  });

  it('writes a stroke style once while it stays the same, and again on a new page', () => {
    const doc = newDoc();
    const pen = new PdfPen(doc);
    const style = { widthPt: 0.5, colour: '#999999', dashPt: [3, 2] };
    const square = [
      { x: 1, y: 1 },
      { x: 2, y: 1 },
      { x: 2, y: 2 },
    ];
    pen.polyline(square, true, style);
    pen.polyline(square, false, style);
    const ops = written(doc, 0).join('\n');
    expect(ops.match(/ w\n/g)).toHaveLength(2); // jsPDF's own at the page's start, then the pen's once
    expect(ops.match(/\] 0\. d/g)).toHaveLength(1);
    expect(ops).toContain('0.5 w\n0.6 G\n[3. 2.] 0. d\n72. 720. m\n144. 720. l\n144. 648. l\nh\nS\n72. 720. m');
    doc.addPage();
    pen.polyline(square, false, style);
    expect(written(doc, 0).join('\n')).toContain('0.5 w\n0.6 G\n[3. 2.] 0. d\n72. 720. m');
  });
});
