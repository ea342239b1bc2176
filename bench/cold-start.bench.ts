/**
 * Cold start (issue: benchmarks, load, faults): `node --import tsx server/main.ts` — what `npm start`
 * runs last, after its build step — on an installed tree, from spawning the process to the first answered
 * request (`GET /api/health` 200, polled every 5 ms), and to the first answered page (`GET /`, the
 * built app, when dist/seamwright/browser exists). Several runs each: a fresh data folder (the
 * migrations run, the demo data is seeded) and an existing one. Then `npm start` as a whole (issue 16:
 * ≤ 15 s to the first answer on an installed and built tree): scripts/start.sh with its build check,
 * fake mail and payment servers and the server, to the first answered page — run only when the build
 * in dist/seamwright is current (scripts/app-build-stamp.mjs), so the benchmark never starts a build.
 */
import { spawn, spawnSync } from 'node:child_process';
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
    // utime + stime, and cutime + cstime: the children it has already waited for (npm start's checks).
    let total = ((Number(f[11]) + Number(f[12]) + Number(f[13]) + Number(f[14])) * 1000) / CLK_TCK;
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
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/main.ts'], {
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
    // End the whole group (the server and any worker it started).
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

/** `npm start` (scripts/start.sh) on free ports and a fresh data folder, to the first answered page. */
async function oneNpmStart(dataDir: string) {
  const [port, smtp, mailHttp, stripe] = [await freePort(), await freePort(), await freePort(), await freePort()];
  const t0 = performance.now();
  const child = spawn('bash', ['scripts/start.sh'], {
    cwd: ROOT,
    detached: true,
    stdio: ['ignore', 'ignore', 'pipe'],
    env: {
      ...process.env,
      PORT: String(port),
      SMTP_PORT: String(smtp),
      FAKE_MAIL_HTTP_PORT: String(mailHttp),
      FAKE_STRIPE_PORT: String(stripe),
      SEAMWRIGHT_DATA_DIR: dataDir,
      NODE_ENV: 'production',
    },
  });
  let stderr = '';
  child.stderr?.on('data', (d: Buffer) => (stderr += d.toString()));
  let exited = false;
  child.once('exit', () => (exited = true));
  try {
    const page = await firstAnswer(`http://127.0.0.1:${port}/`, t0 + 120_000, () => !exited);
    if (page === undefined) throw new Error(`npm start: no page within 120 s: ${stderr.slice(-500)}`);
    return { pageMs: page - t0, cpuMs: child.pid ? treeCpuMs(child.pid) : undefined };
  } finally {
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
    // npm start as a whole, only on a current build (the check is the one start.sh makes).
    const built = spawnSync(process.execPath, ['scripts/app-build-stamp.mjs', 'check', 'dist/seamwright'], { cwd: ROOT }).status === 0;
    const npmRuns: { pageMs: number; cpuMs?: number }[] = [];
    if (built) for (let i = 0; i < 3; i++) npmRuns.push(await oneNpmStart(fresh()));
    const npmRow: Record<string, string | number> = npmRuns.length
      ? {
          data_folder: 'npm start, fresh (build current: skipped)',
          runs: npmRuns.length,
          health_median_ms: '—',
          health_min_max_ms: '—',
          first_page_median_ms: `${ms(summarise(npmRuns.map((r) => r.pageMs)).medianMs)} (${ms(Math.min(...npmRuns.map((r) => r.pageMs)))}–${ms(Math.max(...npmRuns.map((r) => r.pageMs)))})`,
          cpu_to_first_answer_median_ms: ms(summarise(npmRuns.map((r) => r.cpuMs ?? Number.NaN)).medianMs),
        }
      : { data_folder: 'npm start', runs: 0, health_median_ms: 'not run: dist/seamwright is not a build of the current sources (it would build)' };
    return {
      title: 'Cold start: node --import tsx server/main.ts, and npm start, to the first answered request',
      rows: [row('fresh (migrate + seed demo)', freshRuns), row('existing database', existingRuns), npmRow],
      notes: [
        `First start of this run (tsx transform cache cold or stale): ${ms(warm.healthMs)} ms to /api/health; not counted above.`,
        'NODE_ENV=production, demo seeding on, fake mail server in the benchmark process; timed from spawn to the first 200 answer.',
        'cpu_to_first_answer: CPU time (user + system, /proc) of the server process (for npm start: bash, npm and every process it started), up to the first answer: what the start costs with the machine to itself, whatever else runs on it.',
        `Load average (1/5/15 min) at the end: ${os.loadavg().map((v) => v.toFixed(1)).join(' / ')} on ${os.cpus().length} cores.`,
        '`npm start` runs `ng build seamwright` (about 15–28 s here, 73 s on a slow machine) only when the app\'s sources changed since the last build (scripts/build-app-if-changed.sh); the npm start row is a start with the build current. Target (issue 16): ≤ 15 s to the first answer.',
      ],
    };
  } finally {
    await mail.close();
    for (const d of dirs) fs.rmSync(d, { recursive: true, force: true });
  }
}
