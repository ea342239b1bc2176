import { beforeAll, describe, expect, it } from 'vitest';
import { sampleBlock } from '../../../../../../tests/fixtures/documents';
import { readPatternDocument, type PatternDocument } from '../../document/index';
import { quiltPlan } from '../../quilt/index';
import { renderPrintSet, type PrintSetResult } from '../render-print-set';
import { inspectPdf, type PdfPageInfo } from '../testing/pdf-inspect';
import { readShippedFonts } from '../testing/print-test-fixtures';
import { assemblySteps, quiltPrintDocument, quiltPrintIssues } from './quilt-booklet';

const fonts = readShippedFonts();
const text = (pages: readonly PdfPageInfo[]) => pages.map((p) => p.text.join(' ')).join(' ');

/** A 10 in. test block set 4 × 5 with 2 in. sashing and two borders, named sizes and one colourway. */
function quiltBlock(): PatternDocument {
  const base = sampleBlock('Quilt booklet', 10);
  return readPatternDocument({
    ...base,
    fabrics: [...base.fabrics, { id: 'sage', name: 'Sage', colour: '#9aae8c' }, { id: 'ink', name: 'Ink', colour: '#262b3d' }],
    quilt: {
      columns: 4,
      rows: 5,
      sashing: { widthIn: 2, fabricId: 'sage', cornerstoneFabricId: 'ink' },
      borders: [
        { widthIn: 2, fabricId: 'ink' },
        { widthIn: 4, fabricId: 'plum' },
      ],
      binding: { fabricId: 'ink' },
      backing: { fabricId: 'oat' },
      sizes: [
        { name: 'Wall 2 × 2', columns: 2, rows: 2 },
        { name: 'Throw 4 × 5', columns: 4, rows: 5 },
      ],
    },
    colourways: [{ id: 'dusk', name: 'Dusk', fabrics: { plum: { name: 'Midnight', colour: '#2b2d4f' } } }],
  });
}

describe('the print set of a quilt in a chosen size and colourway', () => {
  let result: PrintSetResult;
  let pages: PdfPageInfo[];
  let booklet: string;

  beforeAll(async () => {
    result = await renderPrintSet(quiltBlock(), { paper: 'letter', quiltSize: 'Throw 4 × 5', colourwayId: 'dusk', fonts });
    ({ pages } = await inspectPdf(result.pdf));
    booklet = text(pages.slice(0, result.bookletSheetCount));
  }, 30_000);

  it('the cover carries the finished quilt size and the size chart', () => {
    const cover = text(pages.slice(0, 1));
    // Standard arithmetic: 4·10 + 3·2 + 2·(2 + 4) = 58 in.; 5·10 + 4·2 + 12 = 70 in.; 58 in. = 147.32 cm (1 in. = 2.54 cm exactly).
    expect(cover).toContain('Finished quilt: 58 × 70 in. (147.3 × 177.8 cm)');
    expect(cover).toContain('Throw 4 × 5 (this set)');
    // Wall 2 × 2: 2·10 + 2 + 12 = 34 in. each way.
    expect(cover).toContain('34 × 34 in.');
    // The colourway's fabric name, not the document's.
    expect(cover).toContain('Midnight');
    expect(cover).not.toContain('Plum');
  });

  it('fabric and templates are for the whole quilt: 20 blocks', () => {
    expect(booklet).toContain('Fabric for the whole quilt');
    expect(text(pages.slice(0, 1))).toContain('20 blocks, 1 section');
  });

  it('has a quilt assembly page: rows pressed opposite ways, borders measured through the centre, backing, batting, binding', () => {
    expect(booklet).toContain('Quilt assembly');
    expect(booklet).toMatch(/first row one way and of the next row the other way/);
    expect(booklet).toMatch(/Measure the quilt top through its centre/);
    const steps = assemblySteps(quiltPlan(quiltPrintDocument(quiltBlock(), { quiltSize: 'Throw 4 × 5' }), { sizeName: 'Throw 4 × 5' }));
    // Border 1 on the 46 × 58 in. centre: sides 58½ in. raw, then top and bottom 46 + 4 + ½ = 50½ in. raw (¼ in. seams).
    expect(steps.find((s) => s.startsWith('Border 1'))).toMatch(/should be about 58½ in\. raw.*\(about 50½ in\. raw\)/);
    // Backing 66 × 78 in.: two widths of 66 in. seamed across (design §11 rule; 2 × 66 = 132 < 2 × 78).
    expect(steps.find((s) => s.startsWith('Backing'))).toContain('2 widths of 66 in.');
    expect(steps.find((s) => s.startsWith('Backing'))).toContain('seams running across the quilt');
  });

  it('on point with sashing, the steps frame every block with strips and cornerstones before the setting triangles', () => {
    const doc = quiltBlock();
    const onPoint = readPatternDocument({ ...doc, quilt: { ...doc.quilt, setting: 'on-point', settingTrianglesFabricId: 'oat' } });
    const steps = assemblySteps(quiltPlan(onPoint, { sizeName: 'Wall 2 × 2' }));
    expect(steps.some((s) => s.startsWith('Sashing frames every block') && s.includes('Sage strip') && s.includes('Ink cornerstone'))).toBe(true);
    expect(steps.some((s) => s.startsWith('Sew the block rows and sashing rows with a side setting triangle'))).toBe(true);
  });

  it('the assembly picture leaves room for every step on the same sheet', () => {
    const sheet = pages.slice(0, result.bookletSheetCount).filter((p) => p.text.join(' ').includes('Putting the quilt together'));
    expect(sheet).toHaveLength(1);
    const words = sheet[0].text.join(' ');
    expect(words).toMatch(/Lay the 20 blocks out/);
    expect(words).toMatch(/Binding: join the \d+ strips/);
  });

  it('without a chosen size the print set stays the block (no quilt pages)', async () => {
    const plain = await renderPrintSet(quiltBlock(), { paper: 'letter', fonts });
    const { pages: p } = await inspectPdf(plain.pdf);
    const all = text(p.slice(0, plain.bookletSheetCount));
    expect(all).not.toContain('Quilt assembly');
    expect(all).toContain('Finished size: 10 × 10 in.');
  }, 30_000);

  it('an unknown size or colourway is named', () => {
    expect(quiltPrintIssues(quiltBlock(), { quiltSize: 'King', colourwayId: 'noon' }).map((i) => i.path)).toEqual(['colourwayId', 'quiltSize']);
    expect(quiltPrintDocument(quiltBlock(), { quiltSize: 'Wall 2 × 2' }).blockCount).toBe(4);
  });
});
