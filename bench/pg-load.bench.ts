/**
 * PostgreSQL under load (issue 18, docs/postgresql.md): autocannon 9 against the real server process,
 * reading a pattern and saving revisions, on SQLite (one instance, the default) and on PostgreSQL with
 * one instance and with two instances sharing one database (the load split evenly between them, as
 * a load balancer would), in the same run, interleaved in rounds.
 *
 * Everything runs on this machine's cores: autocannon, the server processes and PostgreSQL (a
 * throwaway cluster, tests/support/pg-cluster.ts: fsync off, like the tests'), so two instances do not
 * get more cores than one; the figures compare the three set-ups under the same load, not a fleet.
 * Besides req/s and latency, the CPU each request cost: the server processes (every thread) and the
 * PostgreSQL server processes (the postmaster's children), from /proc.
 *
 * Saves: every connection saves onto a pattern no other connection is saving at that moment (a pool of
 * patterns with their known head revisions), so each save is a real new revision, not a 409, whichever
 * instance it reaches. Afterwards the stored revisions are counted against the 2xx answers.
 */
// autocannon ships no types; its declaration lives beside the test helpers.
// eslint-disable-next-line @typescript-eslint/triple-slash-reference
/// <reference path="../tests/support/autocannon.d.ts" />
import autocannon from 'autocannon';
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { ApiClient, newCredentials } from '../tests/support/api-client';
import { gridDocument } from '../tests/support/documents';
import { startPgCluster, type PgCluster } from '../tests/support/pg-cluster';
import { startServerProcess, type ServerProcess } from '../tests/support/server-process';
import { ms, quantile, saveRequestHooks, type BenchSection, type SavedPattern } from './bench-kit';

const CONNECTIONS = 50;
const ROUNDS = 3;
const SECONDS = 4;
/** Patterns to save onto (more than connections, so a free one is always at hand). */
const PATTERNS = 100;
/** Ports of the three servers (the PostgreSQL benchmark's own range). */
const BASE_PORT = Number(process.env['SW_PG_BENCH_PORT'] ?? 4884);
const SECRET = 'pg-load-bench-secret-'.padEnd(48, 'x');
/**
 * Within a run, a pattern whose save has had no answer this long is taken for lost and saved onto
 * again: longer than autocannon's 10 s request timeout, as saves take seconds at p99 on a loaded
 * machine and an earlier reuse would make a live save's successor a 409.
 */
const STALE_BUSY_MS = 15_000;

type SetupName = 'sqlite' | 'postgres × 1' | 'postgres × 2';

interface Setup {
  name: SetupName;
  /** Base URLs the load is split across. */
  urls: string[];
  /** Server processes whose CPU is counted. */
  pids: () => number[];
  /** The PostgreSQL server's main process, when there is one. */
  postmaster?: number;
  client: ApiClient;
  headers: Record<string, string>;
  patterns: SavedPattern[];
  readPath: string;
}

interface Result {
  raw: autocannon.Result;
  serverCpuMs: number;
  databaseCpuMs: number;
}

const CLK_TCK = (() => {
  try {
    return Number(execFileSync('getconf', ['CLK_TCK']).toString().trim()) || 100;
  } catch {
    return 100;
  }
})();

/** utime + stime of a process (every thread), in ms; 0 when it is gone (proc(5) fields 14 and 15). */
function cpuMsOf(pid: number): number {
  try {
    const stat = fs.readFileSync(`/proc/${pid}/stat`, 'utf8');
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    return ((Number(fields[11]) + Number(fields[12])) * 1000) / CLK_TCK;
  } catch {
    return 0;
  }
}

/** The PostgreSQL server's processes: the postmaster and its children (backends, writers). */
function postgresPids(postmaster: number): number[] {
  const pids = [postmaster];
  for (const entry of fs.readdirSync('/proc')) {
    if (!/^\d+$/.test(entry)) continue;
    try {
      const stat = fs.readFileSync(`/proc/${entry}/stat`, 'utf8');
      const ppid = Number(stat.slice(stat.lastIndexOf(')') + 2).split(' ')[1]);
      if (ppid === postmaster) pids.push(Number(entry));
    } catch {
      // gone meanwhile
    }
  }
  return pids;
}

/** CPU ms per pid now. */
function cpuSnapshot(pids: number[]): Map<number, number> {
  return new Map(pids.map((p) => [p, cpuMsOf(p)]));
}

/** CPU used since `before` by those pids and any new ones (a new backend counts from 0). */
function cpuSince(before: Map<number, number>, pidsNow: number[]): number {
  let sum = 0;
  for (const p of pidsNow) sum += cpuMsOf(p) - (before.get(p) ?? 0);
  return sum;
}

async function run(setup: Setup, opts: Omit<autocannon.Options, 'url'> & { path?: string }, duration = SECONDS): Promise<Result> {
  const serverBefore = cpuSnapshot(setup.pids());
  const dbBefore = setup.postmaster ? cpuSnapshot(postgresPids(setup.postmaster)) : new Map<number, number>();
  const { path: p, ...rest } = opts;
  const urls = setup.urls.map((u) => u + (p ?? ''));
  const raw = await autocannon({
    connections: CONNECTIONS,
    duration,
    ...rest,
    // autocannon splits the connections evenly across several URLs (its README: `url`); the shared
    // declaration types one.
    url: (urls.length === 1 ? urls[0] : urls) as string,
  });
  return {
    raw,
    serverCpuMs: cpuSince(serverBefore, setup.pids()),
    databaseCpuMs: setup.postmaster ? cpuSince(dbBefore, postgresPids(setup.postmaster)) : 0,
  };
}

/** Signs up and makes the pattern pool on `baseUrl`. */
async function prepare(name: SetupName, urls: string[], pids: () => number[], postmaster?: number): Promise<Setup> {
  const client = new ApiClient(urls[0]);
  await client.signUp(newCredentials('designer', 'pgload'));
  const patterns: Setup['patterns'] = [];
  for (let i = 0; i < PATTERNS; i++) {
    const res = await client.post('/api/patterns', { document: gridDocument(`Load block ${i}`) });
    if (res.status !== 201) throw new Error(`${name}: create answered ${res.status}: ${res.text.slice(0, 200)}`);
    patterns.push({ id: res.json.pattern.id, head: 1, busySince: 0 });
  }
  await client.fetchCsrf();
  const headers = { cookie: client.cookieHeader(), accept: 'application/json' };
  return { name, urls, pids, postmaster, client, headers, patterns, readPath: `/api/patterns/${patterns[0].id}` };
}

const docJson = JSON.stringify(gridDocument('Load block saved'));
let conflicts = 0;

function saveScenario(setup: Setup): Omit<autocannon.Options, 'url'> {
  const headers = { ...setup.headers, 'content-type': 'application/json', 'x-csrf-token': setup.client.csrfToken! };
  const { patterns } = setup;
  return {
    headers,
    requests: [
      {
        method: 'PUT',
        ...saveRequestHooks(patterns, docJson, STALE_BUSY_MS, () => conflicts++),
      },
    ],
  };
}

/**
 * After a run: the saves it cut off (autocannon stops without their answers) may still have stored a
 * revision, so those patterns' heads, and any a 409 left unknown, are read again from the server.
 */
async function refreshHeads(setup: Setup) {
  for (const p of setup.patterns) {
    if (p.busySince === 0 && p.head >= 0) continue;
    p.head = (await setup.client.get(`/api/patterns/${p.id}`)).json.pattern.headRevision as number;
    p.busySince = 0;
  }
}

const range = (values: number[], digits: number) =>
  `${quantile(values, 0.5).toFixed(digits)} (${Math.min(...values).toFixed(digits)}–${Math.max(...values).toFixed(digits)})`;

export default async function pgLoad(): Promise<BenchSection> {
  const servers: ServerProcess[] = [];
  let cluster: PgCluster | undefined;
  try {
    const common = { NODE_ENV: 'production', SEAMWRIGHT_SECRET: SECRET };
    const sqlite = await startServerProcess({ port: BASE_PORT, env: common });
    servers.push(sqlite);
    cluster = await startPgCluster();
    const pgEnv = { ...common, DATABASE_URL: cluster.url };
    const [pgA, pgB] = await Promise.all([
      startServerProcess({ port: BASE_PORT + 1, env: pgEnv, startTimeoutMs: 120_000 }),
      startServerProcess({ port: BASE_PORT + 2, env: pgEnv, startTimeoutMs: 120_000 }),
    ]);
    servers.push(pgA, pgB);
    const postmaster = Number(fs.readFileSync(path.join(cluster.dir, 'data', 'postmaster.pid'), 'utf8').split('\n')[0]);
    const pidOf = (s: ServerProcess) => (s.child?.pid ? [s.child.pid] : []);

    const setups: Setup[] = [
      await prepare('sqlite', [sqlite.baseUrl], () => pidOf(sqlite)),
      await prepare('postgres × 1', [pgA.baseUrl], () => pidOf(pgA), postmaster),
    ];
    // Two instances: the same account and patterns as one instance's (a session is good on both).
    const one = setups[1];
    setups.push({ ...one, name: 'postgres × 2', urls: [pgA.baseUrl, pgB.baseUrl], pids: () => [...pidOf(pgA), ...pidOf(pgB)] });

    // The same bytes from every set-up that shares a database.
    const readA = await fetch(pgA.baseUrl + one.readPath, { headers: one.headers }).then((r) => r.text());
    const readB = await fetch(pgB.baseUrl + one.readPath, { headers: one.headers }).then((r) => r.text());
    if (readA !== readB) throw new Error('the two PostgreSQL instances answered the read differently');

    const scenarios = {
      read: (s: Setup) => ({ path: s.readPath, headers: s.headers }),
      save: (s: Setup) => saveScenario(s),
    };
    type ScenarioName = keyof typeof scenarios;

    // Warm-up (untimed): JIT, caches, connection pools.
    for (const s of setups) {
      for (const make of Object.values(scenarios)) {
        await run(s, make(s), 1);
        await refreshHeads(s);
      }
    }

    const results: Record<ScenarioName, Record<SetupName, Result[]>> = {
      read: { sqlite: [], 'postgres × 1': [], 'postgres × 2': [] },
      save: { sqlite: [], 'postgres × 1': [], 'postgres × 2': [] },
    };
    for (let round = 0; round < ROUNDS; round++) {
      const order = setups.map((_, i) => setups[(i + round) % setups.length]);
      for (const name of Object.keys(scenarios) as ScenarioName[]) {
        for (const s of order) {
          results[name][s.name].push(await run(s, scenarios[name](s)));
          await refreshHeads(s);
        }
      }
    }

    // Every 2xx save is a stored revision beyond the first (warm-ups included); counted per database.
    const storedOn = async (s: Setup) => {
      let n = 0;
      for (const p of s.patterns) n += ((await s.client.get(`/api/patterns/${p.id}`)).json.pattern.headRevision as number) - 1;
      return n;
    };
    const storedSqlite = await storedOn(setups[0]);
    const storedPg = await storedOn(setups[1]);
    const saved2xx = (names: SetupName[]) => names.reduce((sum, n) => sum + results.save[n].reduce((s, r) => s + r.raw['2xx'], 0), 0);

    const perReq = (r: Result, cpu: number) => cpu / Math.max(1, r.raw['2xx'] + r.raw.non2xx);
    const rows = (['read', 'save'] as const).flatMap((name) =>
      setups.map((s) => {
        const rs = results[name][s.name];
        const sqliteRs = results[name].sqlite;
        const rps = rs.map((r) => r.raw.requests.average);
        // Per round: this set-up's req/s over SQLite's in the same round.
        const vsSqlite = rs.map((r, i) => r.raw.requests.average / sqliteRs[i].raw.requests.average);
        return {
          scenario: name === 'read' ? 'read a pattern (GET /api/patterns/:id)' : 'save a revision (PUT /api/patterns/:id)',
          setup: s.name,
          rounds: `${rs.length} × ${SECONDS} s`,
          req_per_s_median_min_max: range(rps, 0),
          req_per_s_vs_sqlite_per_round: s.name === 'sqlite' ? '1' : `${range(vsSqlite, 2)} [${vsSqlite.map((v) => v.toFixed(2)).join(', ')}]`,
          p50_ms: ms(quantile(rs.map((r) => r.raw.latency.p50), 0.5)),
          p99_ms_median_min_max: range(rs.map((r) => r.raw.latency.p99), 0),
          answers_2xx: rs.reduce((sum, r) => sum + r.raw['2xx'], 0),
          non_2xx: rs.reduce((sum, r) => sum + r.raw.non2xx, 0),
          errors: rs.reduce((sum, r) => sum + r.raw.errors + r.raw.timeouts, 0),
          server_cpu_ms_per_req: range(rs.map((r) => perReq(r, r.serverCpuMs)), 3),
          postgres_cpu_ms_per_req: s.postmaster ? range(rs.map((r) => perReq(r, r.databaseCpuMs)), 3) : '—',
        };
      }),
    );
    const load = os.loadavg().map((v) => v.toFixed(1)).join(' / ');
    return {
      title: `PostgreSQL under load: one and two instances beside SQLite (autocannon, ${CONNECTIONS} connections, 127.0.0.1)`,
      rows,
      notes: [
        `Set-ups: sqlite — one server on SQLite in its data folder (the default); postgres × 1 — one server with DATABASE_URL; postgres × 2 — two servers on that same database, autocannon's ${CONNECTIONS} connections split evenly between them (one account, one set of ${PATTERNS} patterns, the session made on the first accepted by both). All NODE_ENV=production, one process each.`,
        `PostgreSQL: a throwaway cluster of this machine's PostgreSQL (tests/support/pg-cluster.ts: fsync, synchronous_commit and full_page_writes off, as in the tests), default pool of 10 connections per instance. A production database keeps its fsync on: saves there wait for the disk.`,
        'On SQLite the read and the save are answered by the hot routes in front of Express (server/http/hot-routes.ts); on PostgreSQL every request goes through Express (docs/postgresql.md "Repository code").',
        `Saves: ${saved2xx(['sqlite'])} answered 2xx on SQLite in the timed rounds, ${storedSqlite} revisions stored there in all (warm-ups included); ${saved2xx(['postgres × 1', 'postgres × 2'])} on PostgreSQL, ${storedPg} stored; ${conflicts} answered 409 (a save cut off when a run stopped may store its revision after the heads were read again). Save body ${(docJson.length / 1024).toFixed(1)} kB (a 3 × 3 grid block, tests/support/documents.ts); the read answers ${(readA.length / 1024).toFixed(1)} kB on PostgreSQL.`,
        `Everything shares ${os.cpus().length} cores: autocannon, the servers and PostgreSQL. A second instance adds no cores here, so postgres × 2 shows what sharing one database costs, not how a fleet scales; on a machine busy with other work, two server processes also get a larger share of its cores than one. Load average (1/5/15 min) at the end: ${load}.`,
        'server_cpu_ms_per_req: CPU (user + system, every thread) of the server process(es) over the run, divided by the answers; postgres_cpu_ms_per_req: the same for the PostgreSQL server processes (the postmaster and its children). req/s ratios are per round against SQLite in the same round.',
      ],
    };
  } finally {
    for (const s of servers) await s.stop();
    await cluster?.stop();
  }
}
