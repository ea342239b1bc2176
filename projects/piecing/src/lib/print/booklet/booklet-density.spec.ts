import { beforeAll, describe, expect, it } from 'vitest';
import { buildStressPattern } from '../../demo/index';
import { derivePatches } from '../../geometry/index';
import { renderPrintSet, type PrintSetResult } from '../render-print-set';
import { pdfPageTexts, type PdfTextItem } from '../testing/pdf-inspect';
import { readShippedFonts } from '../testing/print-test-fixtures';
import { UNIT_LABELS_MAX } from './draw-joining-plan';

/*
 * The booklet spends no sheet it does not need (issue 16): short sections share a sheet, the piecing
 * reminders come once, the contents name a run of piecing sheets in one line, and the joining checks name
 * a large unit by the step that made it. Nothing is left out: every step of every section is still there.
 * Read back from the PDF with pdfjs-dist.
 */

const fonts = readShippedFonts();
const document = buildStressPattern(200);
let result: PrintSetResult;
let pages: PdfTextItem[][];
const textOf = (page: PdfTextItem[]) => page.map((t) => t.str).join(' ');
/** The header's subtitle of a page: the line above "Print at 100 % …" in the header band. */
const subtitleOf = (page: PdfTextItem[]) => page[page.findIndex((t) => t.str.startsWith('Print at 100 %')) - 1]?.str ?? '';

beforeAll(async () => {
  result = await renderPrintSet(document, { paper: 'letter', createdAt: '2026-12-01T00:00:00Z', fonts });
  pages = await pdfPageTexts(result.pdf);
}, 120_000);

describe('piecing steps of many short sections', () => {
  it('prints the reminders once, and every step of every section', () => {
    const booklet = pages.slice(0, result.bookletSheetCount).map(textOf).join(' ');
    expect(booklet.split('Press each patch flat after sewing it').length - 1).toBe(1);
    for (const section of document.sections) {
      expect([...booklet.matchAll(new RegExp(`Section ${section.label}: piecing steps(?! \\(continued\\))`, 'g'))].length).toBe(1);
      const patches = derivePatches(section).patches;
      expect(booklet).toContain(`Place ${patches[0].label} (`);
      for (const p of patches.slice(1)) expect(booklet).toContain(`Add ${p.label} (`);
    }
  });

  it('starts a section below the one before it when there is room, and the header names every section on the sheet', () => {
    const piecing = pages.slice(0, result.bookletSheetCount).filter((p) => subtitleOf(p).startsWith('Piecing — section'));
    // 20 sections of 10 steps, each a little over half a Letter sheet: a quarter fewer sheets than sections at least.
    expect(piecing.length).toBeLessThanOrEqual(Math.ceil(document.sections.length * 0.75));
    const shared = piecing.filter((p) => textOf(p).split(': piecing steps').length - 1 >= 2);
    expect(shared.length).toBeGreaterThan(0);
    for (const page of piecing) {
      // Every piecing sheet says which section its steps belong to, a section running on from the sheet before too.
      expect(textOf(page)).toMatch(/Section [A-Z]+: piecing steps/);
      if (!/^Section [A-Z]+: piecing steps/.test(textOf(page))) expect(textOf(page)).toMatch(/^Piecing steps/);
      const headed = [...textOf(page).matchAll(/Section ([A-Z]+): piecing steps/g)].map((m) => m[1]);
      const named = subtitleOf(page).replace(/^Piecing — sections? /, '').split(', ');
      // Every section begun on the sheet is in its header (a section running on from the sheet before is too).
      for (const label of headed) expect(named).toContain(label);
      expect(named.length).toBeLessThanOrEqual(headed.length + 1);
    }
  });

  it('lists the piecing sheets in the contents as one line from the first section to the last', () => {
    const cover = pages.filter((p) => /^Cover/.test(subtitleOf(p))).map(textOf).join(' ');
    const first = pages.findIndex((p) => subtitleOf(p).startsWith('Piecing — section')) + 1;
    const last = pages.length - [...pages].reverse().findIndex((p) => subtitleOf(p).startsWith('Piecing — section'));
    const labels = document.sections.map((s) => s.label);
    expect(cover).toMatch(new RegExp(`Piecing — sections ${labels[0]} to ${labels[labels.length - 1]}\\s+${first}–${last} `));
    // Every sheet the contents name is in the set.
    const contents = cover.slice(cover.indexOf('Contents Part'));
    const sheets = [...contents.matchAll(/ {3}(\d+)(?:–(\d+))?/g)].map((m) => Number(m[2] ?? m[1]));
    expect(sheets.length).toBeGreaterThan(5);
    expect(Math.max(...sheets)).toBe(pages.length);
  });
});

describe('joining checks of a large block', () => {
  it('name a unit of more than a few sections by the step that made it, so no check lists them all', () => {
    const joining = pages.slice(0, result.bookletSheetCount).filter((p) => subtitleOf(p) === 'Joining the sections').map(textOf).join(' ');
    const checks = joining.split('Check: ').slice(1);
    expect(checks.length).toBeGreaterThan(0);
    expect(joining).toMatch(/Check: Step \d+: unit \d+ \(made in step \d+, \d+ sections\)/);
    for (const check of checks) {
      for (const list of check.matchAll(/unit \d+ \(([^()]*)\)/g)) {
        if (list[1].startsWith('made in step')) continue;
        expect(list[1].split(', ').length).toBeLessThanOrEqual(UNIT_LABELS_MAX);
      }
    }
  });
});
