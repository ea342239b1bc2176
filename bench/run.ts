/**
 * `npm run bench`: runs every `bench/*.bench.ts` (or those named on the command line) and writes
 * `bench/report.md` and `bench/report.json` with the machine, the date and each benchmark's table.
 * A benchmark that throws is reported as such; the run goes on with the next one.
 */
import { readdirSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import type { BenchSection } from './bench-kit';

const here = dirname(fileURLToPath(import.meta.url));
const only = process.argv.slice(2);
const files = readdirSync(here)
  .filter((f) => f.endsWith('.bench.ts'))
  .filter((f) => only.length === 0 || only.some((o) => f.includes(o)))
  .sort();

const machine = {
  date: new Date().toISOString(),
  node: process.version,
  platform: `${os.platform()} ${os.release()} ${os.arch()}`,
  cpus: `${os.cpus().length} × ${os.cpus()[0]?.model ?? 'unknown'}`,
  memoryGiB: Math.round(os.totalmem() / 2 ** 30),
  /** Load average (1, 5, 15 min) when the run started: other work on the machine slows every figure. */
  loadAverage: os.loadavg().map((l) => Number(l.toFixed(1))),
};

const sections: Array<BenchSection & { file: string; seconds: number; error?: string }> = [];
for (const file of files) {
  console.log(`== ${file}`);
  const t0 = Date.now();
  try {
    const mod = (await import(pathToFileURL(join(here, file)).href)) as { default: () => Promise<BenchSection> };
    const section = await mod.default();
    sections.push({ ...section, file, seconds: (Date.now() - t0) / 1000 });
    console.table(section.rows);
    for (const note of section.notes ?? []) console.log(`  ${note}`);
  } catch (err) {
    const message = err instanceof Error ? err.message : String(err);
    console.error(`  failed: ${message}`);
    sections.push({ title: file, rows: [], file, seconds: (Date.now() - t0) / 1000, error: message });
  }
}

/** Renders one table as Markdown. */
function table(rows: BenchSection['rows']): string {
  if (rows.length === 0) return '_no rows_\n';
  const cols = [...new Set(rows.flatMap((r) => Object.keys(r)))];
  const line = (cells: Array<string | number>) => `| ${cells.join(' | ')} |`;
  return [line(cols), line(cols.map(() => '---')), ...rows.map((r) => line(cols.map((c) => r[c] ?? '')))].join('\n') + '\n';
}

const md = [
  '# Seamwright benchmarks',
  '',
  `Measured ${machine.date} on ${machine.cpus}, ${machine.memoryGiB} GiB, ${machine.platform}, Node ${machine.node}; load average ${machine.loadAverage.join(' / ')} at the start (${os.loadavg().map((l) => l.toFixed(1)).join(' / ')} at the end).`,
  'Figures are medians of several runs unless a column says otherwise. Comparisons run interleaved in rounds (A B C, A B C, …) in the same run; a ratio column gives the median of the per-round ratios and their min–max.',
  '',
  ...sections.flatMap((s) => [
    `## ${s.title}`,
    '',
    s.error ? `**Failed:** ${s.error}\n` : table(s.rows),
    ...(s.notes ?? []).map((n) => `- ${n}`),
    '',
    `_${s.file}, ${s.seconds.toFixed(1)} s_`,
    '',
  ]),
].join('\n');

if (only.length === 0) {
  writeFileSync(join(here, 'report.md'), md);
  writeFileSync(join(here, 'report.json'), JSON.stringify({ machine, sections }, null, 2) + '\n');
  console.log('wrote bench/report.md and bench/report.json');
} else {
  console.log(md);
}
