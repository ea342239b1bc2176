/**
 * Small helpers shared by the benchmark files. A benchmark file is `bench/<name>.bench.ts` and
 * default-exports an async function returning a {@link BenchSection}; `bench/run.ts` runs them all and
 * writes `bench/report.md` and `bench/report.json`. Benchmarks measure; they never fail on a time.
 */
import type autocannon from 'autocannon';
import { performance } from 'node:perf_hooks';

/** One part of the report: a titled table plus notes (targets, ratios, caveats). */
export interface BenchSection {
  title: string;
  rows: Array<Record<string, string | number>>;
  notes?: string[];
}

/** Summary statistics of repeated timings, in milliseconds. */
export interface TimingStats {
  runs: number;
  medianMs: number;
  minMs: number;
  maxMs: number;
  p95Ms: number;
}

/** Returns the q-quantile (0…1) of the values, by linear interpolation. */
export function quantile(values: readonly number[], q: number): number {
  if (values.length === 0) return Number.NaN;
  const sorted = [...values].sort((a, b) => a - b);
  const pos = (sorted.length - 1) * q;
  const lo = Math.floor(pos);
  const hi = Math.ceil(pos);
  return sorted[lo] + (sorted[hi] - sorted[lo]) * (pos - lo);
}

/** Summarises a list of timings in milliseconds. */
export function summarise(timesMs: readonly number[]): TimingStats {
  return {
    runs: timesMs.length,
    medianMs: quantile(timesMs, 0.5),
    minMs: Math.min(...timesMs),
    maxMs: Math.max(...timesMs),
    p95Ms: quantile(timesMs, 0.95),
  };
}

/** Times `fn` `runs` times after `warmup` untimed runs; returns the statistics. */
export async function timeRuns(fn: () => unknown, runs = 7, warmup = 1): Promise<TimingStats> {
  for (let i = 0; i < warmup; i++) await fn();
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    await fn();
    times.push(performance.now() - t0);
  }
  return summarise(times);
}

/** Formats milliseconds with sensible precision for the report. */
export function ms(value: number): string {
  return value >= 100 ? value.toFixed(0) : value >= 10 ? value.toFixed(1) : value.toFixed(2);
}

/**
 * One contender in an interleaved comparison: a name for the report and either the work to time
 * (`run`, timed here by the wall clock) or a `sample` that returns the milliseconds it measured itself
 * (e.g. a time taken inside a browser page).
 */
export type RoundVariant =
  | {
      name: string;
      /** The work timed once per round (awaited if it returns a promise). */
      run: () => unknown;
    }
  | {
      name: string;
      /** Does the work once and returns its own measurement in milliseconds. */
      sample: () => number | Promise<number>;
    };

/** Options of {@link interleavedRounds}. */
export interface RoundsOptions {
  /** Timed rounds; each round runs every variant once, in order (A B C, A B C, …). Default 7. */
  rounds?: number;
  /** Untimed rounds first (JIT warm-up, caches). Default 1. */
  warmup?: number;
  /** Name of the variant every ratio is taken against. Default: the first variant. */
  baseline?: string;
  /**
   * Start each round one variant further along (A B C, B C A, C A B, …), so no variant always runs
   * first after a pause or last before one. Default false: the fixed order A B C every round.
   */
  rotate?: boolean;
  /** Calls of `run` per timed sample, for work shorter than the timer's resolution; the sample is the mean. Default 1. */
  repeat?: number;
}

/** The figures of one variant over the rounds of {@link interleavedRounds}. */
export interface RoundsVariantStats extends TimingStats {
  name: string;
  /** Time of each round, in round order (ms). */
  timesMs: number[];
  /** This variant's time ÷ the baseline's time in the same round, per round (1 for the baseline itself). */
  ratios: number[];
  ratioMedian: number;
  ratioMin: number;
  ratioMax: number;
}

/** Result of {@link interleavedRounds}: the baseline's name, the number of rounds, one entry per variant. */
export interface RoundsResult {
  baseline: string;
  rounds: number;
  variants: RoundsVariantStats[];
}

/**
 * Times several variants of the same work side by side: `rounds` rounds, each running every variant
 * once (A B C, A B C, …), so drift on a shared machine (other processes, thermal, GC pressure) lands on
 * all variants alike. Returns per-round times and, per round, each variant's time divided by the
 * baseline's time in that same round, with medians and min–max of both. A ratio above 1 means slower
 * than the baseline. Use {@link roundsRows} to put the result into a report table.
 */
export async function interleavedRounds(variants: readonly RoundVariant[], options: RoundsOptions = {}): Promise<RoundsResult> {
  if (variants.length === 0) throw new Error('interleavedRounds: no variants');
  const rounds = options.rounds ?? 7;
  const warmup = options.warmup ?? 1;
  const repeat = Math.max(1, options.repeat ?? 1);
  const baseline = options.baseline ?? variants[0].name;
  const baseIndex = variants.findIndex((v) => v.name === baseline);
  if (baseIndex < 0) throw new Error(`interleavedRounds: no variant named ${baseline}`);
  const times: number[][] = variants.map(() => []);
  for (let round = -warmup; round < rounds; round++) {
    for (let k = 0; k < variants.length; k++) {
      const i = options.rotate ? (k + Math.max(round, 0)) % variants.length : k;
      const v = variants[i];
      let elapsed = 0;
      if ('sample' in v) {
        for (let r = 0; r < repeat; r++) elapsed += await v.sample();
        elapsed /= repeat;
      } else {
        const t0 = performance.now();
        for (let r = 0; r < repeat; r++) await v.run();
        elapsed = (performance.now() - t0) / repeat;
      }
      if (round >= 0) times[i].push(elapsed);
    }
  }
  return {
    baseline,
    rounds,
    variants: variants.map((v, i) => {
      const ratios = times[i].map((t, r) => t / times[baseIndex][r]);
      return {
        name: v.name,
        ...summarise(times[i]),
        timesMs: times[i],
        ratios,
        ratioMedian: quantile(ratios, 0.5),
        ratioMin: Math.min(...ratios),
        ratioMax: Math.max(...ratios),
      };
    }),
  };
}

/** Formats a ratio to two decimals with a ×. */
export function ratio(value: number): string {
  return `${value.toFixed(2)}×`;
}

/**
 * Report rows for an {@link interleavedRounds} result: one row per variant with its median and min–max
 * time and its per-round ratio to the baseline (median and min–max). `extra` columns (e.g. the task)
 * come first in every row.
 */
export function roundsRows(result: RoundsResult, extra: Record<string, string | number> = {}): BenchSection['rows'] {
  return result.variants.map((v) => ({
    ...extra,
    variant: v.name,
    rounds: result.rounds,
    'median ms': ms(v.medianMs),
    'min–max ms': `${ms(v.minMs)}–${ms(v.maxMs)}`,
    [`÷ ${result.baseline} (median)`]: v.name === result.baseline ? '1' : ratio(v.ratioMedian),
    [`÷ ${result.baseline} (min–max per round)`]: v.name === result.baseline ? '' : `${v.ratioMin.toFixed(2)}–${v.ratioMax.toFixed(2)}`,
  }));
}

/** A one-line statement of a ratio from the same run, for a report note: "B ÷ A = 1.23× (1.10–1.40 over 7 rounds)". */
export function ratioNote(result: RoundsResult, name: string): string {
  const v = result.variants.find((x) => x.name === name);
  if (!v) throw new Error(`ratioNote: no variant named ${name}`);
  return `${name} ÷ ${result.baseline} = ${ratio(v.ratioMedian)} (${v.ratioMin.toFixed(2)}–${v.ratioMax.toFixed(2)} over ${result.rounds} rounds)`;
}

/** A pattern that load-test saves build on: its id, the head revision last seen, and since when a save of it is in flight (0: none). */
export interface SavedPattern {
  id: string;
  head: number;
  busySince: number;
}

type RequestHooks = Pick<autocannon.Request, 'setupRequest' | 'onResponse'>;

/**
 * autocannon hooks for saves on `PUT /api/patterns/:id` that each build on their pattern's latest
 * revision: a request takes a pattern nobody is saving (or one whose save has been in flight longer
 * than `staleMs`, cut off by the end of a run), sends `docJson` on its head, and its answer moves the
 * head on (200) or to the latest the 409 names (-1 when unnamed: read it again after the run).
 */
export function saveRequestHooks(patterns: SavedPattern[], docJson: string, staleMs: number, onConflict: () => void): RequestHooks {
  return {
    setupRequest: (req, context: Record<string, unknown>) => {
      const now = Date.now();
      const p = patterns.find((x) => x.busySince === 0 || now - x.busySince > staleMs) ?? patterns[Math.floor(Math.random() * patterns.length)];
      p.busySince = now;
      context['pattern'] = p;
      return { ...req, path: `/api/patterns/${p.id}`, body: `{"baseRevision":${p.head},"document":${docJson}}` };
    },
    onResponse: (status, body, context: Record<string, unknown>) => {
      const p = context['pattern'] as SavedPattern | undefined;
      if (!p) return;
      if (status === 200) p.head = (JSON.parse(body) as { revision: { number: number } }).revision.number;
      else if (status === 409) {
        onConflict();
        const latest = (JSON.parse(body) as { details?: { latest?: { number?: number } } }).details?.latest?.number;
        p.head = typeof latest === 'number' ? latest : -1;
      }
      p.busySince = 0;
    },
  };
}
