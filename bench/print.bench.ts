/**
 * Print sets (issue 4): the demo medallion "Orchard Wheel" and a 1,000-patch stress pattern on
 * Letter (and the medallion on Tabloid for comparison) — time to render the PDF, peak memory, size, and sheets N against the area lower bound
 * M = ceil(total template area / printable area). Target on the medallion: N ≤ 1.3 × M (reported,
 * never asserted). Each case runs in its own child process so its peak RSS (getrusage maxRSS) is
 * its own, not the benchmark runner's.
 */
import { execFile } from 'node:child_process';
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { promisify } from 'node:util';
import { ms, summarise, type BenchSection } from './bench-kit';

const RUNS = 3;
const here = fileURLToPath(import.meta.url);
const fontsDir = fileURLToPath(new URL('../fonts/', import.meta.url));

interface CaseResult {
  times: number[];
  maxRssMiB: number;
  peakHeapMiB: number;
  bytes: number;
  pages: number;
  templateSheets: number;
  lowerBound: number;
  templates: number;
  prints: number;
}

/** Child mode: render one case RUNS times and print the figures as JSON. */
async function child(which: string): Promise<void> {
  const piecing = await import('../projects/piecing/src/public-api');
  const { buildStressPattern } = await import('../projects/piecing/src/testing');
  const document = which.startsWith('medallion') ? piecing.buildOrchardWheel() : buildStressPattern(1000);
  const paper = which.endsWith('tabloid') ? 'tabloid' : 'letter';
  const fonts = await piecing.loadPrintFonts((f) => readFile(join(fontsDir, f)));
  let peakHeap = 0;
  const sampler = setInterval(() => (peakHeap = Math.max(peakHeap, process.memoryUsage().heapUsed)), 5);
  const times: number[] = [];
  let last: Awaited<ReturnType<typeof piecing.renderPrintSet>> | null = null;
  for (let i = 0; i < RUNS; i++) {
    const t0 = performance.now();
    last = await piecing.renderPrintSet(document, { paper, createdAt: '2026-12-01T00:00:00Z', fonts });
    times.push(performance.now() - t0);
  }
  clearInterval(sampler);
  const r = last!;
  const result: CaseResult = {
    times,
    maxRssMiB: process.resourceUsage().maxRSS / 1024,
    peakHeapMiB: peakHeap / 2 ** 20,
    bytes: r.pdf.length,
    pages: r.sheetCount,
    templateSheets: r.templateSheetCount,
    lowerBound: r.lowerBoundSheets,
    templates: r.layout.templates.length,
    prints: r.layout.templates.reduce((s, t) => s + t.copies, 0),
  };
  process.stdout.write(`${JSON.stringify(result)}\n`);
}

async function runCase(which: string): Promise<CaseResult> {
  const { stdout } = await promisify(execFile)(process.execPath, ['--import', 'tsx', here], {
    env: { ...process.env, PRINT_BENCH_CASE: which },
    maxBuffer: 1 << 20,
  });
  return JSON.parse(stdout.trim().split('\n').pop()!) as CaseResult;
}

export default async function printBench(): Promise<BenchSection> {
  const rows: BenchSection['rows'] = [];
  const notes: string[] = [];
  for (const [which, label, paper] of [
    ['medallion', 'Orchard Wheel (demo medallion), paper foundations', 'Letter, ½ in. margins'],
    ['stress', 'stress pattern, 1,000 patches', 'Letter, ½ in. margins'],
    ['medallion-tabloid', 'Orchard Wheel, for comparison', 'Tabloid, ½ in. margins'],
  ] as const) {
    const r = await runCase(which);
    const t = summarise(r.times);
    const ratio = r.templateSheets / r.lowerBound;
    rows.push({
      case: label,
      paper,
      templates_prints: `${r.templates} / ${r.prints}`,
      render_ms_median: ms(t.medianMs),
      render_ms_min_max: `${ms(t.minMs)}–${ms(t.maxMs)}`,
      peak_rss_MiB: Math.round(r.maxRssMiB),
      peak_heap_MiB: Math.round(r.peakHeapMiB),
      pdf_kB: Math.round(r.bytes / 1024),
      pages: r.pages,
      template_sheets_N: r.templateSheets,
      lower_bound_M: r.lowerBound,
      N_over_M: ratio.toFixed(2),
    });
    if (which === 'medallion') notes.push(`Medallion target N ≤ 1.3 × M: ${r.templateSheets} ≤ ${(1.3 * r.lowerBound).toFixed(1)}? ${ratio <= 1.3 ? 'met' : 'NOT met'} (N/M = ${ratio.toFixed(2)}).`);
  }
  notes.push(`${RUNS} renders per case in a child process (node --import tsx); peak RSS is that process's getrusage maxRSS, peak heap sampled every 5 ms.`);
  notes.push('Pages = cover + template sheets + fabric key / strip sets / cautions. M counts only template area (cutting line area × prints).');
  return { title: 'Print sets (PDF)', rows, notes };
}

if (process.env.PRINT_BENCH_CASE) {
  child(process.env.PRINT_BENCH_CASE).catch((error: unknown) => {
    process.stderr.write(`${error instanceof Error ? error.stack : String(error)}\n`);
    process.exitCode = 1;
  });
}
