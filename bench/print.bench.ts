/**
 * Print sets (issues 4 and 16).
 *
 * 1. Scaling: the whole render of the stress pattern on Letter at 1,000 / 2,000 / 5,000 / 10,000
 *    patches, in interleaved rounds against two peers writing the same drawing: the project's pen alone
 *    (every pen call and page of the render, recorded once and written again on a fresh jsPDF document:
 *    no geometry, layout, sewability or text fitting) and pdfkit (the same recorded drawing written with
 *    pdfkit, for reference; the product keeps jsPDF). Targets (issue 16): 5,000 patches ≤ 2 s and
 *    10,000 ≤ 4.5 s, and the render within 1.5× of the pen alone in the same round.
 * 2. The demo medallion "Orchard Wheel" on Letter and Tabloid: render time, peak memory, size, sheets N
 *    against the area lower bound M = ceil(total template area / printable area).
 *
 * Each case runs in its own child process so its heap and peak RSS (getrusage maxRSS) are its own.
 */
import { execFile } from 'node:child_process';
import { readFile } from 'node:fs/promises';
import { loadavg } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { promisify } from 'node:util';
import { interleavedRounds, ms, ratio, summarise, type BenchSection, type RoundsResult } from './bench-kit';
import type { PenCall, PenRecording } from '../projects/piecing/src/testing';

const MEDALLION_RUNS = 3;
/** Stress sizes; PRINT_BENCH_SIZES=1000,5000 runs only those (a quicker check on a busy machine). */
const SIZES: readonly number[] = process.env.PRINT_BENCH_SIZES ? process.env.PRINT_BENCH_SIZES.split(',').map(Number) : [1000, 2000, 5000, 10000];
/** Timed rounds per size (fewer for the largest, whose render takes seconds). */
const ROUNDS: Record<number, number> = { 1000: 4, 2000: 4, 5000: 3, 10000: 1 };
const TARGET_MS: Record<number, number> = { 5000: 2000, 10000: 4500 };
const here = fileURLToPath(import.meta.url);
const fontsDir = fileURLToPath(new URL('../fonts/', import.meta.url));
const CREATED_AT = '2026-12-01T00:00:00Z';

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

interface ScaleResult {
  patches: number;
  pages: number;
  bookletPages: number;
  bytes: number;
  penBytes: number;
  pdfkitBytes: number;
  penCalls: number;
  maxRssMiB: number;
  rounds: RoundsResult;
}

/** Child mode: render the medallion RUNS times and print the figures as JSON. */
async function medallionChild(which: string): Promise<void> {
  const piecing = await import('../projects/piecing/src/public-api');
  const document = piecing.buildOrchardWheel();
  const paper = which.endsWith('tabloid') ? 'tabloid' : 'letter';
  const fonts = await piecing.loadPrintFonts((f) => readFile(join(fontsDir, f)));
  let peakHeap = 0;
  const sampler = setInterval(() => (peakHeap = Math.max(peakHeap, process.memoryUsage().heapUsed)), 5);
  const times: number[] = [];
  let last: Awaited<ReturnType<typeof piecing.renderPrintSet>> | null = null;
  for (let i = 0; i < MEDALLION_RUNS; i++) {
    const t0 = performance.now();
    last = await piecing.renderPrintSet(document, { paper, createdAt: CREATED_AT, fonts });
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

/** Child mode: the stress pattern at one size, render vs the pen alone vs pdfkit in interleaved rounds. */
async function scaleChild(patches: number): Promise<void> {
  const piecing = await import('../projects/piecing/src/public-api');
  const { buildStressPattern, recordPenDrawing, replayWithPen, embedFonts, useFastFlate } = await import('../projects/piecing/src/testing');
  const { jsPDF } = await import('jspdf');
  // The same writer as the render: jsPDF with the print set's FlateEncode (render-print-set.ts installs it too).
  useFastFlate(jsPDF.API);
  const PDFDocument = (await import('pdfkit')).default;
  const document = buildStressPattern(patches);
  const fontBytes = await piecing.loadPrintFonts((f) => readFile(join(fontsDir, f)));
  const render = () => piecing.renderPrintSet(document, { paper: 'letter', createdAt: CREATED_AT, fonts: fontBytes });
  const { result: first, recording } = await recordPenDrawing(render);

  let penBytes = 0;
  const penAlone = () => {
    const doc = new jsPDF({
      unit: 'pt',
      format: [recording.firstPage.widthPt, recording.firstPage.heightPt],
      orientation: 'portrait',
      floatPrecision: 3,
      putOnlyUsedFonts: true,
      compress: true,
    });
    embedFonts(doc, fontBytes);
    replayWithPen(doc, recording);
    penBytes = doc.output('arraybuffer').byteLength;
  };
  let pdfkitBytes = 0;
  const pdfkit = () => writeWithPdfkit(PDFDocument, recording, fontBytes).then((n) => (pdfkitBytes = n));

  const rounds = await interleavedRounds(
    [
      { name: 'pen alone (jsPDF)', run: penAlone },
      { name: 'whole render', run: render },
      { name: 'pdfkit, same drawing', run: pdfkit },
    ],
    // The recording render warms up; the largest size takes no further untimed round (on a busy machine it takes minutes).
    { rounds: ROUNDS[patches] ?? 3, warmup: patches >= 10000 ? 0 : 1, rotate: true },
  );
  const result: ScaleResult = {
    patches,
    pages: first.sheetCount,
    bookletPages: first.bookletSheetCount,
    bytes: first.pdf.length,
    penBytes,
    pdfkitBytes,
    penCalls: recording.calls.length,
    maxRssMiB: process.resourceUsage().maxRSS / 1024,
    rounds,
  };
  process.stdout.write(`${JSON.stringify(result)}\n`);
}

/** The recorded drawing written with pdfkit (points, y down, like the pen's inches × 72). Returns the PDF's size. */
async function writeWithPdfkit(
  PDFDocument: typeof import('pdfkit'),
  recording: PenRecording,
  fonts: { regular: Uint8Array; bold: Uint8Array },
): Promise<number> {
  const doc = new PDFDocument({ size: [recording.firstPage.widthPt, recording.firstPage.heightPt], margin: 0, compress: true, bufferPages: true, autoFirstPage: true });
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<void>((resolve) => doc.on('end', () => resolve()));
  doc.registerFont('R', Buffer.from(fonts.regular));
  doc.registerFont('B', Buffer.from(fonts.bold));
  const P = 72;
  const stroke = (style: { widthPt: number; dashPt?: number[]; colour?: string }) => {
    doc.lineWidth(style.widthPt).strokeColor(style.colour ?? '#000000');
    if (style.dashPt && style.dashPt.length > 0) doc.dash(style.dashPt[0], { space: style.dashPt[1] ?? style.dashPt[0] });
    else doc.undash();
  };
  type Pt = { x: number; y: number };
  const path = (pts: Pt[]) => {
    doc.moveTo(pts[0].x * P, pts[0].y * P);
    for (let i = 1; i < pts.length; i++) doc.lineTo(pts[i].x * P, pts[i].y * P);
  };
  const first = doc.bufferedPageRange().start;
  for (const call of recording.calls) {
    switch (call.kind) {
      case 'addPage':
        doc.addPage({ size: [call.widthPt, call.heightPt], margin: 0 });
        break;
      case 'setPage':
        doc.switchToPage(first + call.page - 1);
        break;
      case 'clip':
        doc.save().rect(call.rect.x * P, call.rect.y * P, call.rect.width * P, call.rect.height * P).clip();
        break;
      case 'clipRing':
        doc.save();
        path(call.ring as Pt[]);
        doc.closePath().clip();
        break;
      case 'unclip':
        doc.restore();
        break;
      case 'draw':
        drawCall(call);
        break;
    }
  }
  function drawCall(call: Extract<PenCall, { kind: 'draw' }>): void {
    const a = call.args as unknown[];
    switch (call.method) {
      case 'polyline': {
        const pts = a[0] as Pt[];
        if (pts.length < 2) return;
        stroke(a[2] as never);
        path(pts);
        if (a[1]) doc.closePath();
        doc.stroke();
        return;
      }
      case 'segments': {
        const lines = a[0] as Array<{ a: Pt; b: Pt }>;
        if (lines.length === 0) return;
        stroke(a[1] as never);
        for (const l of lines) doc.moveTo(l.a.x * P, l.a.y * P).lineTo(l.b.x * P, l.b.y * P);
        doc.stroke();
        return;
      }
      case 'rect': {
        const r = a[0] as { x: number; y: number; width: number; height: number };
        const style = a[1] as { widthPt: number } | null;
        const fill = a[2] as string | undefined;
        if (style) stroke(style as never);
        doc.rect(r.x * P, r.y * P, r.width * P, r.height * P);
        if (style && fill) doc.fillAndStroke(fill, (style as { colour?: string }).colour ?? '#000000');
        else if (fill) doc.fill(fill);
        else doc.stroke();
        return;
      }
      case 'fillPolygon': {
        const pts = a[0] as Pt[];
        if (pts.length < 3) return;
        path(pts);
        doc.closePath().fill(a[1] as string);
        return;
      }
      case 'circle': {
        const c = a[0] as Pt;
        stroke(a[2] as never);
        doc.circle(c.x * P, c.y * P, (a[1] as number) * P).stroke();
        return;
      }
      case 'text': {
        const lines = typeof a[0] === 'string' ? [a[0]] : (a[0] as string[]);
        const at = a[1] as Pt;
        const style = a[2] as { sizePt: number; bold?: boolean; colour?: string; align?: string; baseline?: string; angleDeg?: number };
        doc.font(style.bold ? 'B' : 'R').fontSize(style.sizePt).fillColor(style.colour ?? '#000000');
        if (style.angleDeg) doc.save().rotate(-style.angleDeg, { origin: [at.x * P, at.y * P] });
        lines.forEach((line, k) => {
          const w = style.align && style.align !== 'left' ? doc.widthOfString(line) : 0;
          const x = at.x * P - (style.align === 'center' ? w / 2 : style.align === 'right' ? w : 0);
          doc.text(line, x, at.y * P + k * style.sizePt * 1.15, { lineBreak: false, baseline: (style.baseline ?? 'alphabetic') as 'alphabetic' });
        });
        if (style.angleDeg) doc.restore();
        return;
      }
    }
  }
  doc.end();
  await done;
  return chunks.reduce((s, c) => s + c.length, 0);
}

async function runChild<T>(env: Record<string, string>): Promise<T> {
  const { stdout } = await promisify(execFile)(process.execPath, ['--import', 'tsx', here], {
    env: { ...process.env, ...env },
    maxBuffer: 1 << 24,
  });
  return JSON.parse(stdout.trim().split('\n').pop()!) as T;
}

export default async function printBench(): Promise<BenchSection> {
  const rows: BenchSection['rows'] = [];
  const notes: string[] = [];
  const loadAtStart = loadavg()[0];
  for (const patches of SIZES) {
    const r = await runChild<ScaleResult>({ PRINT_BENCH_SCALE: String(patches) });
    const render = r.rounds.variants.find((v) => v.name === 'whole render')!;
    for (const v of r.rounds.variants) {
      rows.push({
        case: `stress pattern, ${patches.toLocaleString('en-US')} patches, Letter`,
        variant: v.name,
        rounds: r.rounds.rounds,
        'median ms': ms(v.medianMs),
        'min–max ms': `${ms(v.minMs)}–${ms(v.maxMs)}`,
        '÷ pen alone (median)': v.name === r.rounds.baseline ? '1' : ratio(v.ratioMedian),
        '÷ pen alone (min–max per round)': v.name === r.rounds.baseline ? '' : `${v.ratioMin.toFixed(2)}–${v.ratioMax.toFixed(2)}`,
        pages: r.pages,
        pdf_kB: Math.round((v.name === 'whole render' ? r.bytes : v.name.startsWith('pdfkit') ? r.pdfkitBytes : r.penBytes) / 1024),
      });
    }
    const target = TARGET_MS[patches];
    const within = render.ratioMedian <= 1.5;
    notes.push(
      `${patches.toLocaleString('en-US')} patches: render ${ms(render.medianMs)} ms (${ms(render.minMs)}–${ms(render.maxMs)})` +
        (target ? `, target ≤ ${target} ms ${render.medianMs <= target ? 'met' : 'NOT met'}` : '') +
        `; ÷ pen alone ${ratio(render.ratioMedian)} (${render.ratioMin.toFixed(2)}–${render.ratioMax.toFixed(2)} per round), target ≤ 1.5× ${within ? 'met' : 'NOT met'}` +
        `; ${r.pages} pages (${r.bookletPages} before the templates), ${r.penCalls.toLocaleString('en-US')} pen calls, peak RSS ${Math.round(r.maxRssMiB)} MiB.`,
    );
  }
  for (const [which, label, paper] of [
    ['medallion', 'Orchard Wheel (demo medallion), paper foundations', 'Letter, ½ in. margins'],
    ['medallion-tabloid', 'Orchard Wheel, for comparison', 'Tabloid, ½ in. margins'],
  ] as const) {
    const r = await runChild<CaseResult>({ PRINT_BENCH_CASE: which });
    const t = summarise(r.times);
    rows.push({
      case: `${label}, ${paper}`,
      variant: 'whole render',
      rounds: r.times.length,
      'median ms': ms(t.medianMs),
      'min–max ms': `${ms(t.minMs)}–${ms(t.maxMs)}`,
      pages: r.pages,
      pdf_kB: Math.round(r.bytes / 1024),
      templates_prints: `${r.templates} / ${r.prints}`,
      template_sheets_N: r.templateSheets,
      lower_bound_M: r.lowerBound,
      peak_rss_MiB: Math.round(r.maxRssMiB),
    });
  }
  notes.push(
    'Rounds interleave the three variants (rotating which runs first) after one untimed round (at 10,000 patches the recording render is the only warm-up); the ratio is taken per round against the pen alone in the same round. ' +
      'Pen alone: the render\'s own pen calls and pages, recorded once (print/testing/pen-recorder.ts) and written on a fresh jsPDF document with embedded Roboto, compressed by the same FlateEncode as the render (print/pdf-flate.ts) — the floor for jsPDF. ' +
      'pdfkit: the same recorded calls written with pdfkit (reference only).',
  );
  notes.push('Every stress size runs in its own child process (node --import tsx); the medallion cases render 3 times each in theirs.');
  notes.push(`Load average (1 min) of the shared 2-core machine: ${loadAtStart.toFixed(1)} when this section started, ${loadavg()[0].toFixed(1)} when it ended.`);
  return { title: 'Print sets (PDF)', rows, notes };
}

if (process.env.PRINT_BENCH_CASE) {
  medallionChild(process.env.PRINT_BENCH_CASE).catch((error: unknown) => {
    process.stderr.write(`${error instanceof Error ? error.stack : String(error)}\n`);
    process.exitCode = 1;
  });
} else if (process.env.PRINT_BENCH_SCALE) {
  scaleChild(Number(process.env.PRINT_BENCH_SCALE)).catch((error: unknown) => {
    process.stderr.write(`${error instanceof Error ? error.stack : String(error)}\n`);
    process.exitCode = 1;
  });
}
