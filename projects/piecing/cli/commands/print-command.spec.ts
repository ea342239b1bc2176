import { mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import * as pdfjs from 'pdfjs-dist/legacy/build/pdf.mjs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { misnumberedStrip } from '../../../../tests/fixtures/documents';
import { runCliCollecting } from '../testing/run-cli-collecting';

const repoRoot = fileURLToPath(new URL('../../../..', import.meta.url));


/** The text of every page, read back with pdfjs-dist. */
async function pageTexts(data: Uint8Array): Promise<string[]> {
  const pdf = await pdfjs.getDocument({ data, verbosity: 0 }).promise;
  const out: string[] = [];
  for (let i = 1; i <= pdf.numPages; i++) {
    const content = await (await pdf.getPage(i)).getTextContent();
    out.push(content.items.map((item) => ('str' in item ? item.str : '')).join(' '));
  }
  await pdf.destroy();
  return out;
}

function run(...argv: string[]) {
  return runCliCollecting(repoRoot, argv);
}

describe('seamwright print', () => {
  let dir: string;
  beforeAll(async () => {
    dir = await mkdtemp(join(tmpdir(), 'seamwright-print-'));
  });
  afterAll(async () => {
    await rm(dir, { recursive: true, force: true });
  });

  it('writes an A4 print set that pdfjs-dist reads, at 210 × 297 mm (ISO 216)', async () => {
    const out = join(dir, 'lantern.pdf');
    const { code, out: text, err } = await run('print', 'docs/examples/straight-block-three-sections.json', '--paper', 'a4', '--out', out);
    expect(err).toBe('');
    expect(code).toBe(0);
    expect(text).toMatch(/Lantern Block: \d+ sheets written to .*lantern\.pdf \(templates: \d+ sheets? \(at least \d+ by area\); mirrored, a4\)/);
    const pdf = await pdfjs.getDocument({ data: new Uint8Array(await readFile(out)), verbosity: 0 }).promise;
    const page = await pdf.getPage(1);
    // 210 mm and 297 mm at 72 pt per inch, 25.4 mm per inch.
    expect(page.view[2]).toBeCloseTo((210 / 25.4) * 72, 2);
    expect(page.view[3]).toBeCloseTo((297 / 25.4) * 72, 2);
    await pdf.destroy();
  });

  it('says "as seen from the front" with --front and writes the same bytes twice', async () => {
    const a = join(dir, 'a.pdf');
    const b = join(dir, 'b.pdf');
    const first = await run('print', 'docs/examples/arc-ring-with-strip-set.json', '--front', '--out', a, '--margin', '0.75');
    expect(first.code).toBe(0);
    expect(first.out).toContain('as seen from the front, letter');
    await run('print', 'docs/examples/arc-ring-with-strip-set.json', '--front', '--out', b, '--margin', '0.75');
    expect(Buffer.compare(await readFile(a), await readFile(b))).toBe(0);
  });

  it('rejects a paper it does not know and a missing --out, with usage', async () => {
    const bad = await run('print', 'docs/examples/arc-ring-with-strip-set.json', '--paper', 'b5', '--out', join(dir, 'x.pdf'));
    expect(bad.code).toBe(2);
    expect(bad.err).toMatch(/paper/);
    const noOut = await run('print', 'docs/examples/arc-ring-with-strip-set.json');
    expect(noOut.code).toBe(2);
    expect(noOut.err).toContain('usage: seamwright print');
  });

  it('reports an invalid pattern file as invalid input', async () => {
    const r = await run('print', 'no-such-file.json', '--out', join(dir, 'y.pdf'));
    expect(r.code).toBe(1);
    expect(r.err).toContain('no such file');
  });

  it('refuses a pattern with a section not sewable as numbered (exit 1, the reason on stderr) unless --print-unsewable', async () => {
    const pattern = join(dir, 'misnumbered.json');
    await writeFile(pattern, JSON.stringify(misnumberedStrip()));
    const out = join(dir, 'misnumbered.pdf');
    const refused = await run('print', pattern, '--out', out);
    expect(refused.code).toBe(1);
    expect(refused.err).toContain('Section A is not sewable as numbered: A2 shares no seam with the patches sewn before it (A1)');
    expect(refused.err).toContain('--print-unsewable');
    expect(refused.out).toBe('');
    await expect(readFile(out)).rejects.toThrow(/ENOENT/);

    const anyway = await run('print', pattern, '--out', out, '--print-unsewable');
    expect(anyway.code).toBe(0);
    expect(anyway.err).toContain('warning: Section A is not sewable as numbered');
    const pages = await pageTexts(new Uint8Array(await readFile(out)));
    // The one section's pages: its piecing steps and its template sheet, the last (the booklet's other pages are about the whole pattern).
    const ofA = [...pages.filter((t) => t.includes('Section A: piecing steps')), pages[pages.length - 1]];
    expect(ofA.length).toBe(2);
    expect(ofA[1]).toContain(`Sheet ${pages.length} of ${pages.length}`);
    for (const page of ofA) expect(page).toContain('NOT SEWABLE AS NUMBERED: section A — printed anyway');
  });
});
