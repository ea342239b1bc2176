/**
 * Small helpers shared by the benchmark files. A benchmark file is `bench/<name>.bench.ts` and
 * default-exports an async function returning a {@link BenchSection}; `bench/run.ts` runs them all and
 * writes `bench/report.md` and `bench/report.json`. Benchmarks measure; they never fail on a time.
 */
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
