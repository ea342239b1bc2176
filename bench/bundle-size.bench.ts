/**
 * Initial JavaScript transfer size of the app's first screen (issue: benchmarks, load, faults;
 * target ≤ 500 kB compressed, the drafting board loaded lazily).
 *
 * Reads the build output in dist/seamwright/browser (building it with `ng build seamwright` when it
 * is missing): the initial chunks are the `<script src>` and `<link rel="modulepreload">` files of
 * index.html, plus every chunk those reach through static `import … from "./chunk-….js"` (a check that
 * the preload list is complete). Everything else is lazy: reached only through dynamic `import()`.
 * Sizes: raw, gzip level 9 and brotli quality 11 (Node's zlib), the encodings a server or CDN serves.
 */
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import zlib from 'node:zlib';
import type { BenchSection } from './bench-kit';

const ROOT = fileURLToPath(new URL('../', import.meta.url));
const BROWSER_DIR = path.join(ROOT, 'dist/seamwright/browser');
const TARGET_KB = 500;

const kB = (bytes: number) => (bytes / 1000).toFixed(1);

interface Sized {
  file: string;
  raw: number;
  gzip: number;
  brotli: number;
}

function sizes(file: string): Sized {
  const data = fs.readFileSync(path.join(BROWSER_DIR, file));
  return {
    file,
    raw: data.length,
    gzip: zlib.gzipSync(data, { level: 9 }).length,
    brotli: zlib.brotliCompressSync(data, {
      params: { [zlib.constants.BROTLI_PARAM_QUALITY]: 11, [zlib.constants.BROTLI_PARAM_SIZE_HINT]: data.length },
    }).length,
  };
}

/** The `src`/`href` of index.html's module scripts, module preloads and stylesheets. */
export function initialFilesOf(html: string): { scripts: string[]; preloads: string[]; styles: string[] } {
  const attr = (tag: string, name: string) => new RegExp(`\\b${name}\\s*=\\s*["']([^"']+)["']`, 'i').exec(tag)?.[1];
  const tags = html.match(/<(script|link)\b[^>]*>/gi) ?? [];
  const scripts: string[] = [];
  const preloads: string[] = [];
  const styles: string[] = [];
  for (const tag of tags) {
    if (/^<script/i.test(tag)) {
      const src = attr(tag, 'src');
      if (src) scripts.push(src);
    } else {
      const rel = attr(tag, 'rel')?.toLowerCase();
      const href = attr(tag, 'href');
      if (!href) continue;
      if (rel === 'modulepreload') preloads.push(href);
      else if (rel === 'stylesheet') styles.push(href);
    }
  }
  return { scripts, preloads, styles };
}

/** Static and dynamic imports of relative chunks in an ES module built by esbuild. */
export function importsOf(code: string): { staticImports: string[]; dynamicImports: string[] } {
  const staticImports = new Set<string>();
  const dynamicImports = new Set<string>();
  for (const m of code.matchAll(/\bimport\s*(?:[\w${},*\s]+?\s*from\s*)?["'](\.\/[^"']+\.js)["']/g)) staticImports.add(m[1].slice(2));
  for (const m of code.matchAll(/\bexport\s*(?:\*|\{[^}]*\})\s*from\s*["'](\.\/[^"']+\.js)["']/g)) staticImports.add(m[1].slice(2));
  for (const m of code.matchAll(/\bimport\(\s*["'](\.\/[^"']+\.js)["']\s*\)/g)) dynamicImports.add(m[1].slice(2));
  return { staticImports: [...staticImports], dynamicImports: [...dynamicImports] };
}

function where(name: string, lazy: string[], initial: string[]): string {
  if (lazy.length === 0 && initial.length === 0) return `${name}: not in this build.`;
  return `${name}: lazy in ${lazy.join(', ') || 'no chunk'}; initial in ${initial.join(', ') || 'no chunk'}.`;
}

export default async function bundleSize(): Promise<BenchSection> {
  const notes: string[] = [];
  if (!fs.existsSync(path.join(BROWSER_DIR, 'index.html'))) {
    notes.push('dist/seamwright/browser was missing: built it with `ng build seamwright` first.');
    execFileSync(process.execPath, [path.join(ROOT, 'node_modules/@angular/cli/bin/ng.js'), 'build', 'seamwright', '--no-progress'], {
      cwd: ROOT,
      stdio: 'inherit',
    });
  }
  const built = fs.statSync(path.join(BROWSER_DIR, 'index.html')).mtime.toISOString();
  const html = fs.readFileSync(path.join(BROWSER_DIR, 'index.html'), 'utf8');
  const { scripts, preloads, styles } = initialFilesOf(html);
  const entry = [...scripts, ...preloads].map((f) => f.replace(/^\.?\//, ''));

  // Follow static imports from the entry files: all of them are fetched before the first screen.
  const initial = new Set<string>();
  const queue = [...entry];
  const lazyRoots = new Set<string>();
  for (let guard = 0; queue.length > 0 && guard < 10_000; guard++) {
    const file = queue.shift()!;
    if (initial.has(file)) continue;
    initial.add(file);
    const { staticImports, dynamicImports } = importsOf(fs.readFileSync(path.join(BROWSER_DIR, file), 'utf8'));
    queue.push(...staticImports);
    for (const d of dynamicImports) lazyRoots.add(d);
  }
  const missingPreloads = [...initial].filter((f) => !entry.includes(f));
  if (missingPreloads.length > 0) notes.push(`static imports not in index.html's preload list (still initial): ${missingPreloads.join(', ')}`);

  const allJs = fs.readdirSync(BROWSER_DIR).filter((f) => f.endsWith('.js'));
  const lazy = allJs.filter((f) => !initial.has(f));
  const initialSizes = [...initial].sort().map(sizes);
  const lazySizes = lazy.sort().map(sizes);
  const sum = (list: Sized[], k: keyof Omit<Sized, 'file'>) => list.reduce((s, x) => s + x[k], 0);
  const styleSizes = styles.map((f) => sizes(f.replace(/^\.?\//, '')));

  const rows: BenchSection['rows'] = [
    ...initialSizes.map((s) => ({ chunk: s.file, kind: 'initial JS', raw_kB: kB(s.raw), gzip_kB: kB(s.gzip), brotli_kB: kB(s.brotli) })),
    {
      chunk: `initial JS total (${initialSizes.length} files)`,
      kind: 'initial JS',
      raw_kB: kB(sum(initialSizes, 'raw')),
      gzip_kB: kB(sum(initialSizes, 'gzip')),
      brotli_kB: kB(sum(initialSizes, 'brotli')),
    },
    ...styleSizes.map((s) => ({ chunk: s.file, kind: 'initial CSS', raw_kB: kB(s.raw), gzip_kB: kB(s.gzip), brotli_kB: kB(s.brotli) })),
    {
      chunk: `lazy JS total (${lazySizes.length} files)`,
      kind: 'lazy JS',
      raw_kB: kB(sum(lazySizes, 'raw')),
      gzip_kB: kB(sum(lazySizes, 'gzip')),
      brotli_kB: kB(sum(lazySizes, 'brotli')),
    },
  ];
  const biggestLazy = [...lazySizes].sort((a, b) => b.gzip - a.gzip).slice(0, 6);
  const lazyWith = (needle: RegExp) =>
    lazySizes.filter((s) => needle.test(fs.readFileSync(path.join(BROWSER_DIR, s.file), 'utf8'))).map((s) => s.file);
  const initialWith = (needle: RegExp) =>
    initialSizes.filter((s) => needle.test(fs.readFileSync(path.join(BROWSER_DIR, s.file), 'utf8'))).map((s) => s.file);
  const gz = sum(initialSizes, 'gzip');
  const br = sum(initialSizes, 'brotli');
  notes.push(
    `Initial JS of the first screen: ${kB(gz)} kB gzip, ${kB(br)} kB brotli (target ≤ ${TARGET_KB} kB compressed): ${gz <= TARGET_KB * 1000 ? 'within' : 'OVER'} the target (gzip).`,
    `Build of ${built} in dist/seamwright/browser; kB = 1000 bytes; gzip level 9, brotli quality 11.`,
    `Lazy chunks (dynamic import only): ${lazySizes.length}; the largest by gzip: ${biggestLazy.map((s) => `${s.file} ${kB(s.gzip)} kB`).join(', ')}.`,
    where('Konva (drafting board)', lazyWith(/Konva/), initialWith(/Konva/)),
    where('jsPDF (print sets)', lazyWith(/jsPDF/), initialWith(/jsPDF/)),
  );
  return { title: 'Initial JavaScript transfer size (first screen)', rows, notes };
}
