/**
 * Cold start (issue: benchmarks, load, faults): `tsx server/main.ts` — what `npm start` runs last,
 * after its build step — on an installed tree, from spawning the process to the first answered
 * request (`GET /api/health` 200, polled every 5 ms), and to the first answered page (`GET /`, the
 * built app, when dist/seamwright/browser exists). Several runs each: a fresh data folder (the
 * migrations run, the demo data is seeded) and an existing one. The build step of `npm start` is
 * not included (see the bundle benchmark and the Angular build timings in the notes).
 */
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { startFakeMailServer } from '../server/dev/fake-mail-server';
import { freePort } from '../tests/support/server-process';
import { ms, summarise, type BenchSection } from './bench-kit';

const ROOT = fileURLToPath(new URL('../', import.meta.url));
const RUNS = 5;
const sleep = (t: number) => new Promise((r) => setTimeout(r, t));

/** Clock ticks per second of /proc/<pid>/stat (100 on Linux almost always). */
const CLK_TCK = 100;

/** CPU ms (user + system) used so far by a process and all its descendants; undefined off Linux. */
function treeCpuMs(pid: number): number | undefined {
  try {
    const stat = fs.readFileSync(`/proc/${pid}/stat`, 'utf8');
    const f = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    let total = ((Number(f[11]) + Number(f[12])) * 1000) / CLK_TCK;
    const children = fs.readFileSync(`/proc/${pid}/task/${pid}/children`, 'utf8').trim();
    for (const c of children ? children.split(/\s+/) : []) total += treeCpuMs(Number(c)) ?? 0;
    return total;
  } catch {
    return undefined;
  }
}

async function firstAnswer(url: string, deadline: number, alive: () => boolean): Promise<number | undefined> {
  for (let i = 0; i < 100_000 && performance.now() < deadline; i++) {
    if (!alive()) return undefined;
    try {
      const res = await fetch(url, { signal: AbortSignal.timeout(1000) });
      await res.arrayBuffer();
      if (res.status === 200) return performance.now();
    } catch {
      // not yet listening
    }
    await sleep(5);
  }
  return undefined;
}

async function oneStart(dataDir: string, smtpPort: number, seed: boolean) {
  const port = await freePort();
  const t0 = performance.now();
  const child = spawn(path.join(ROOT, 'node_modules/.bin/tsx'), ['server/main.ts'], {
    cwd: ROOT,
    detached: true,
    stdio: ['ignore', 'ignore', 'pipe'],
    env: {
      ...process.env,
      NODE_ENV: 'production',
      PORT: String(port),
      HOST: '127.0.0.1',
      SEAMWRIGHT_DATA_DIR: dataDir,
      SEAMWRIGHT_SEED_DEMO: seed ? '1' : '0',
      SMTP_HOST: '127.0.0.1',
      SMTP_PORT: String(smtpPort),
    },
  });
  let stderr = '';
  child.stderr?.on('data', (d: Buffer) => (stderr += d.toString()));
  let exited = false;
  child.once('exit', () => (exited = true));
  try {
    const health = await firstAnswer(`http://127.0.0.1:${port}/api/health`, t0 + 60_000, () => !exited);
    if (health === undefined) throw new Error(`no health answer within 60 s: ${stderr.slice(-500)}`);
    const cpuMs = child.pid ? treeCpuMs(child.pid) : undefined;
    const page = fs.existsSync(path.join(ROOT, 'dist/seamwright/browser/index.html'))
      ? await firstAnswer(`http://127.0.0.1:${port}/`, t0 + 60_000, () => !exited)
      : undefined;
    return { healthMs: health - t0, pageMs: page === undefined ? undefined : page - t0, cpuMs };
  } finally {
    // tsx runs the server in a child node process: end the whole group.
    const done = new Promise((r) => child.once('exit', r));
    if (!exited && child.pid) {
      try {
        process.kill(-child.pid, 'SIGTERM');
      } catch {
        // gone
      }
      const timer = setTimeout(() => child.pid && process.kill(-child.pid, 'SIGKILL'), 5_000);
      await done;
      clearTimeout(timer);
    }
  }
}

export default async function coldStart(): Promise<BenchSection> {
  const mail = await startFakeMailServer({ host: '127.0.0.1', smtpPort: 0, httpPort: 0 });
  const dirs: string[] = [];
  const fresh = () => {
    const d = fs.mkdtempSync(path.join(os.tmpdir(), 'seamwright-cold-'));
    dirs.push(d);
    return d;
  };
  try {
    // One untimed start warms tsx's transform cache (as any second `npm start` finds it).
    const existing = fresh();
    const warm = await oneStart(existing, mail.smtpPort, true);
    type Run = { healthMs: number; pageMs?: number; cpuMs?: number };
    const freshRuns: Run[] = [];
    const existingRuns: Run[] = [];
    for (let i = 0; i < RUNS; i++) {
      freshRuns.push(await oneStart(fresh(), mail.smtpPort, true));
      existingRuns.push(await oneStart(existing, mail.smtpPort, true));
    }
    const row = (name: string, runs: Run[]) => {
      const cpu = runs.map((r) => r.cpuMs).filter((v): v is number => v !== undefined);
      const h = summarise(runs.map((r) => r.healthMs));
      const pages = runs.map((r) => r.pageMs).filter((v): v is number => v !== undefined);
      const p = pages.length ? summarise(pages) : undefined;
      return {
        data_folder: name,
        runs: h.runs,
        health_median_ms: ms(h.medianMs),
        health_min_max_ms: `${ms(h.minMs)}–${ms(h.maxMs)}`,
        first_page_median_ms: p ? ms(p.medianMs) : 'no build',
        cpu_to_first_answer_median_ms: cpu.length ? ms(summarise(cpu).medianMs) : 'n/a',
      };
    };
    return {
      title: 'Cold start: tsx server/main.ts to the first answered request',
      rows: [row('fresh (migrate + seed demo)', freshRuns), row('existing database', existingRuns)],
      notes: [
        `First start of this run (tsx transform cache cold or stale): ${ms(warm.healthMs)} ms to /api/health; not counted above.`,
        'NODE_ENV=production, demo seeding on, fake mail server in the benchmark process; timed from spawn to the first 200 answer.',
        'cpu_to_first_answer: CPU time (user + system, /proc) of tsx and the server process it starts, up to the first answer: what the start costs with the machine to itself, whatever else runs on it.',
        `Load average (1/5/15 min) at the end: ${os.loadavg().map((v) => v.toFixed(1)).join(' / ')} on ${os.cpus().length} cores.`,
        '`npm start` also runs `ng build seamwright` first (about 15–28 s here, stack notes); that is not part of this figure.',
      ],
    };
  } finally {
    await mail.close();
    for (const d of dirs) fs.rmSync(d, { recursive: true, force: true });
  }
}
