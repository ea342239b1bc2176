import { describe, expect, it } from 'vitest';
import { jsPDF } from 'jspdf';
import { buildStressPattern } from '../../demo/index';
import { renderPrintSet } from '../render-print-set';
import { embedFonts } from '../pdf-pen';
import { inspectPdf } from './pdf-inspect';
import { recordPenDrawing, replayWithPen } from './pen-recorder';
import { readShippedFonts } from './print-test-fixtures';

/*
 * The print benchmark compares a render with its own drawing written by the pen alone: the replay must
 * draw what the render drew. pdfjs-dist reads both PDFs back.
 */

describe('recordPenDrawing and replayWithPen', () => {
  it('write again every path, clip (rectangles and polygons) and text of a render', async () => {
    const fonts = readShippedFonts();
    const document = buildStressPattern(40);
    const { result, recording } = await recordPenDrawing(() => renderPrintSet(document, { paper: 'letter', createdAt: '2026-12-01T00:00:00Z', fonts }));
    expect(recording.calls.some((c) => c.kind === 'clipRing')).toBe(true);
    const doc = new jsPDF({ unit: 'pt', format: [recording.firstPage.widthPt, recording.firstPage.heightPt], orientation: 'portrait', floatPrecision: 3, putOnlyUsedFonts: true, compress: true });
    embedFonts(doc, fonts);
    replayWithPen(doc, recording);
    const rendered = await inspectPdf(result.pdf);
    const replayed = await inspectPdf(new Uint8Array(doc.output('arraybuffer')));
    expect(replayed.pages.length).toBe(result.sheetCount);
    expect(replayed.pages.map((p) => p.paths)).toEqual(rendered.pages.map((p) => p.paths));
    expect(replayed.pages.map((p) => p.text)).toEqual(rendered.pages.map((p) => p.text));
  }, 60_000);
});
