/**
 * The one seeded pseudo-random generator (mulberry32) of the tests and benchmarks: the same seed
 * gives the same numbers, so fault schedules (kill moments) and benchmark shapes repeat from run to
 * run. Set FAULT_SEED to replay a failing fault run.
 */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** The seed for this run: FAULT_SEED from the environment, else the given default. */
export function faultSeed(fallback: number): number {
  const raw = process.env['FAULT_SEED'];
  return raw && /^\d+$/.test(raw) ? Number(raw) : fallback;
}

export const sleep = (ms: number) => new Promise<void>((r) => setTimeout(r, ms));
