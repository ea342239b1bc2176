import { inflateSync } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { jsPDF } from 'jspdf';
import { seededRandom } from '../../../../../tests/support/random';
import { embedFonts, PdfPen } from './pdf-pen';
import { binaryStringOfBytes, flateEncodeBinaryString, PDF_FLATE_LEVEL, useFastFlate } from './pdf-flate';
import { inspectPdf, pdfPageTexts } from './testing/pdf-inspect';
import { readShippedFonts } from './testing/print-test-fixtures';

/*
 * The print set's FlateEncode (pdf-flate.ts) replaces jsPDF's own. Node's zlib (a separate inflater,
 * not fflate) checks that what it writes decompresses to the exact bytes; jsPDF's own filter, taken
 * before ours is installed, checks the conversion (same bytes at jsPDF's level) and that a document
 * reads back the same (pdfjs-dist).
 */

type Filter = (data: string, chain?: string | string[]) => { data: string; reverseChain: string };
const api = jsPDF.API as unknown as { processDataByFilters: Filter };
const jsPdfOwn = api.processDataByFilters;

const bytesOf = (s: string) => Uint8Array.from(s, (c) => c.charCodeAt(0));
const stringOf = (bytes: Uint8Array) => Array.from(bytes, (b) => String.fromCharCode(b)).join('');

/** A binary string of every byte value, then random bytes and runs (compressible), past two chunks. */
function sampleBinary(length: number): string {
  const random = seededRandom(16);
  const out: number[] = [];
  for (let b = 0; b < 256; b++) out.push(b);
  while (out.length < length) {
    const run = 1 + Math.floor(random() * 40);
    const value = Math.floor(random() * 256);
    for (let k = 0; k < run && out.length < length; k++) out.push(random() < 0.5 ? value : Math.floor(random() * 256));
  }
  return stringOf(Uint8Array.from(out));
}

describe('flateEncodeBinaryString', () => {
  it('inflates back (node:zlib) to the exact bytes, with every byte value 0x00–0xff', () => {
    const data = sampleBinary(3 * 8192 + 17);
    const packed = flateEncodeBinaryString(data);
    expect([...packed].every((c) => c.charCodeAt(0) <= 0xff)).toBe(true);
    expect(stringOf(inflateSync(bytesOf(packed)))).toBe(data);
  });

  it("gives the bytes jsPDF 4's own FlateEncode gives at its level (fflate's default, 6)", () => {
    for (const data of ['', 'q 1 0 0 1 0 0 cm Q\n', sampleBinary(20000)]) {
      expect(flateEncodeBinaryString(data, 6)).toBe(jsPdfOwn(data, ['FlateEncode']).data);
    }
  });

  it('compresses at PDF_FLATE_LEVEL, which is not the default level', () => {
    const data = sampleBinary(50000);
    expect(PDF_FLATE_LEVEL).toBe(2);
    expect(flateEncodeBinaryString(data)).toBe(flateEncodeBinaryString(data, PDF_FLATE_LEVEL));
    expect(flateEncodeBinaryString(data)).not.toBe(flateEncodeBinaryString(data, 6));
  });
});

describe('binaryStringOfBytes', () => {
  it('keeps every byte as one character across chunk borders', () => {
    const bytes = Uint8Array.from({ length: 8192 * 2 + 5 }, (_, i) => (i * 131 + 7) & 0xff);
    const s = binaryStringOfBytes(bytes);
    expect(s.length).toBe(bytes.length);
    expect(bytesOf(s)).toEqual(bytes);
  });
});

describe('useFastFlate', () => {
  it('compresses FlateEncode streams of a whole document readably, and leaves other filters to jsPDF', async () => {
    const fonts = readShippedFonts();
    const newDoc = () => {
      const doc = new jsPDF({ unit: 'pt', format: 'letter', orientation: 'portrait', floatPrecision: 3, putOnlyUsedFonts: true, compress: true });
      doc.setFileId('00112233445566778899AABBCCDDEEFF');
      doc.setCreationDate('D:20261201000000+00\'00\'');
      embedFonts(doc, fonts);
      const pen = new PdfPen(doc);
      pen.text('Größe — Ærø ñ 12½ in.', { x: 1, y: 1 }, { sizePt: 12 });
      // A content-stream comment carrying raw bytes 0x80–0xff (comments may hold any byte: ISO 32000-1 §7.2.3).
      (doc.internal as unknown as { write(s: string): void }).write(`% ${stringOf(Uint8Array.from({ length: 128 }, (_, i) => 0x80 + i))}`);
      doc.addPage();
      pen.text('second page', { x: 1, y: 1 }, { sizePt: 12 });
      return new Uint8Array(doc.output('arraybuffer'));
    };
    const before = newDoc();
    useFastFlate(api);
    useFastFlate(api); // once only
    try {
      const after = newDoc();
      // pdfjs-dist names fonts by the document it read (g_d0_f1, g_d1_f1): left out.
      const read = async (pdf: Uint8Array) => (await inspectPdf(pdf)).pages.map((page) => ({ ...page, fontIds: page.fontIds.length }));
      expect(await read(after)).toEqual(await read(before));
      const texts = await pdfPageTexts(after);
      expect(texts.map((page) => page.map((t) => t.str).join(''))).toEqual(['Größe — Ærø ñ 12½ in.', 'second page']);
      // The first page's content stream, inflated with node:zlib, holds the raw bytes.
      const pdf = stringOf(after);
      const streams = [...pdf.matchAll(/\/Filter \/FlateDecode[^>]*>>\s*stream\r?\n/g)].map((m) => {
        const start = m.index + m[0].length;
        return inflateSync(bytesOf(pdf.slice(start, pdf.indexOf('endstream', start))));
      });
      const marked = streams.map(stringOf).filter((s) => s.includes('% \x80'));
      expect(marked).toHaveLength(1);
      expect(marked[0]).toContain(`% ${stringOf(Uint8Array.from({ length: 128 }, (_, i) => 0x80 + i))}`);
      expect(api.processDataByFilters('41', ['ASCIIHexDecode']).data).toBe('A');
    } finally {
      api.processDataByFilters = jsPdfOwn;
    }
  });
});
