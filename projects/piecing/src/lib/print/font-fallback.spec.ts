import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { sampleBlock } from '../../../../../tests/fixtures/documents';
import { readPatternDocument } from '../document/parse-pattern';
import { renderPrintSet } from './render-print-set';
import { inspectPdf } from './testing/pdf-inspect';
import { readShippedFonts } from './testing/print-test-fixtures';

const FONTS = new URL('../../../../../fonts/', import.meta.url);
const font = (name: string) => new Uint8Array(readFileSync(fileURLToPath(new URL(name, FONTS))));

// "Garden" in Japanese (庭園), Arabic (حديقة, Arabic letters in their base form) and a flower emoji.
const JAPANESE = '庭園のブロック';
const ARABIC = 'حديقة';
const TITLE = `Garden ${JAPANESE} ${ARABIC} 🌸`;

/** All the text pdfjs reads from the first pages, joined, in NFKC (Arabic presentation forms back to base letters). */
async function readBack(fallbacks: Uint8Array[]): Promise<string> {
  const document = readPatternDocument({ ...sampleBlock('x', 4), title: TITLE });
  const fonts = { ...readShippedFonts(), fallbacks };
  const result = await renderPrintSet(document, { paper: 'letter', createdAt: '2026-12-01T12:00:00Z', fonts });
  const { pages } = await inspectPdf(result.pdf);
  return pages
    .slice(0, 2)
    .map((p) => p.text.join(''))
    .join('\n')
    .normalize('NFKC');
}

describe('text the main font lacks, in the fallback fonts', () => {
  it('a title in Japanese and Arabic is in the PDF text of the cover; the emoji is left out, not the rest', async () => {
    const text = await readBack([font('DroidSansFallback-Japanese.ttf'), font('NotoSansArabic-Regular.ttf')]);
    expect(text).toContain(`Garden ${JAPANESE}`);
    // jsPDF draws Arabic in presentation forms, laid right to left, so the letters may come back in
    // either order; every letter is there.
    const arabic = [...ARABIC].join('');
    expect(text.includes(arabic) || text.includes([...ARABIC].reverse().join(''))).toBe(true);
    // Emoji cannot be embedded by jsPDF (font-fallback.ts): never in the text, and nothing after it lost.
    expect(text).not.toContain('🌸');
  });

  it('without the fallbacks the title is cut at its first Japanese character (what the fallbacks fix)', async () => {
    const text = await readBack([]);
    expect(text).toContain('Garden');
    expect(text).not.toContain(JAPANESE);
  });
});
