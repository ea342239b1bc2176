/**
 * API under load (issue: benchmarks, load, faults): autocannon 9 against the real server process on
 * 127.0.0.1 with 50 concurrent connections — read a pattern, list patterns, save a revision.
 * Targets on this 2-core machine: reads ≥ 1,000 requests/s, saves ≥ 300/s, p99 ≤ 50 ms for reads;
 * reported as measured, never asserted. autocannon runs in this process, on the same two cores as
 * the server, so the figures are a floor for a server with the machine to itself.
 *
 * Saves: every connection saves onto a pattern no other connection is saving at that moment (a pool
 * of patterns, each with its known head revision), so a save is a real new revision, not a 409.
 * Afterwards the stored revisions are counted and compared with the 2xx answers.
 */
// autocannon ships no types; its declaration lives beside the test helpers.
// eslint-disable-next-line @typescript-eslint/triple-slash-reference
/// <reference path="../tests/support/autocannon.d.ts" />
import autocannon from 'autocannon';
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import * as piecing from '@seamwright/piecing';
import { signedInClient } from '../tests/support/api-client';
import { gridDocument } from '../tests/support/documents';
import { startServerProcess, type ServerProcess } from '../tests/support/server-process';
import { ms, quantile, type BenchSection } from './bench-kit';

const CONNECTIONS = 50;
const RUNS = 3;
const SECONDS = 5;

type Result = autocannon.Result & { serverCpuMs?: number };

/** Clock ticks per second of /proc/<pid>/stat times (getconf CLK_TCK; 100 on Linux almost always). */
const CLK_TCK = (() => {
  try {
    return Number(execFileSync('getconf', ['CLK_TCK']).toString().trim()) || 100;
  } catch {
    return 100;
  }
})();

/** CPU time (user + system) the process has used so far, in ms; undefined off Linux. */
function cpuMs(pid: number | undefined): number | undefined {
  if (!pid) return undefined;
  try {
    const stat = fs.readFileSync(`/proc/${pid}/stat`, 'utf8');
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    // Fields 14 and 15 of proc(5) (utime, stime), counted from 1 with pid and comm first.
    return ((Number(fields[11]) + Number(fields[12])) * 1000) / CLK_TCK;
  } catch {
    return undefined;
  }
}

/** The demo "Garden Gate" when the piecing library has its builder, else a 3 × 3 grid block. */
function benchDocument(title: string): unknown {
  const build = (piecing as Record<string, unknown>)['buildGardenGate'];
  if (typeof build === 'function') {
    const doc = build() as Record<string, unknown>;
    return { ...doc, title };
  }
  return gridDocument(title, 3, 3, 4);
}

let serverPid: number | undefined;

async function run(opts: autocannon.Options): Promise<Result> {
  const before = cpuMs(serverPid);
  const result: Result = await autocannon({ connections: CONNECTIONS, duration: SECONDS, ...opts });
  const after = cpuMs(serverPid);
  if (before !== undefined && after !== undefined) result.serverCpuMs = after - before;
  return result;
}

function summaryRow(name: string, target: string, results: Result[]) {
  const rps = results.map((r) => r.requests.average);
  const total2xx = results.reduce((s, r) => s + r['2xx'], 0);
  const non2xx = results.reduce((s, r) => s + r.non2xx, 0);
  const errors = results.reduce((s, r) => s + r.errors + r.timeouts, 0);
  const cpu = results.reduce((s, r) => s + (r.serverCpuMs ?? Number.NaN), 0);
  const answered = results.reduce((s, r) => s + r['2xx'] + r.non2xx, 0);
  const cpuPerRequest = cpu / answered;
  return {
    scenario: name,
    connections: CONNECTIONS,
    runs: `${results.length} × ${SECONDS} s`,
    req_per_s_median: Math.round(quantile(rps, 0.5)),
    req_per_s_min_max: `${Math.round(Math.min(...rps))}–${Math.round(Math.max(...rps))}`,
    p50_ms: ms(quantile(results.map((r) => r.latency.p50), 0.5)),
    p99_ms: ms(quantile(results.map((r) => r.latency.p99), 0.5)),
    max_ms: ms(Math.max(...results.map((r) => r.latency.max))),
    answers_2xx: total2xx,
    non_2xx: non2xx,
    errors,
    server_cpu_ms_per_req: Number.isFinite(cpuPerRequest) ? cpuPerRequest.toFixed(2) : 'n/a',
    one_core_capacity_req_per_s: Number.isFinite(cpuPerRequest) ? Math.round(1000 / cpuPerRequest) : 'n/a',
    target,
  };
}

export default async function apiLoad(): Promise<BenchSection> {
  let server: ServerProcess | undefined;
  try {
    server = await startServerProcess({ env: { NODE_ENV: 'production', SEAMWRIGHT_SECRET: 'bench-secret-'.padEnd(48, 'x') } });
    serverPid = server.child?.pid;
    const { client } = await signedInClient(server.baseUrl, 'designer', 'load');
    const docJson = JSON.stringify(benchDocument('Load block'));
    // 60 patterns to list (three pages of 20) and to save onto.
    const patterns: { id: string; head: number; busySince: number }[] = [];
    for (let i = 0; i < Math.max(60, CONNECTIONS * 2); i++) {
      const res = await client.post('/api/patterns', { document: JSON.parse(docJson.replace('Load block', `Load block ${i}`)) });
      if (res.status !== 201) throw new Error(`create answered ${res.status}: ${res.text.slice(0, 200)}`);
      patterns.push({ id: res.json.pattern.id, head: 1, busySince: 0 });
    }
    await client.fetchCsrf();
    const headers = { cookie: client.cookieHeader(), accept: 'application/json' };
    const url = server.baseUrl;
    const readPath = `/api/patterns/${patterns[0].id}`;
    const readBytes = (await client.get(readPath)).text.length;

    // Warm-up (untimed): JIT, SQLite page cache.
    await run({ url: url + readPath, headers, duration: 2 });

    const reads: Result[] = [];
    const lists: Result[] = [];
    const saves: Result[] = [];
    for (let i = 0; i < RUNS; i++) reads.push(await run({ url: url + readPath, headers }));
    for (let i = 0; i < RUNS; i++) lists.push(await run({ url: `${url}/api/patterns`, headers }));

    const saveHeaders = { ...headers, 'content-type': 'application/json', 'x-csrf-token': client.csrfToken! };
    let conflicts = 0;
    for (let i = 0; i < RUNS; i++) {
      saves.push(
        await run({
          url,
          headers: saveHeaders,
          requests: [
            {
              method: 'PUT',
              setupRequest: (req, context: Record<string, unknown>) => {
                const now = Date.now();
                // A pattern nobody is saving (or whose save was never sent: stale after 2 s).
                const p = patterns.find((x) => x.busySince === 0 || now - x.busySince > 2000) ?? patterns[Math.floor(Math.random() * patterns.length)];
                p.busySince = now;
                context['pattern'] = p;
                return {
                  ...req,
                  path: `/api/patterns/${p.id}`,
                  body: `{"baseRevision":${p.head},"document":${docJson}}`,
                };
              },
              onResponse: (status, body, context: Record<string, unknown>) => {
                const p = context['pattern'] as (typeof patterns)[number] | undefined;
                if (!p) return;
                if (status === 200) p.head = (JSON.parse(body) as { revision: { number: number } }).revision.number;
                else if (status === 409) {
                  conflicts++;
                  const latest = (JSON.parse(body) as { details?: { latest?: { number?: number } } }).details?.latest?.number;
                  if (typeof latest === 'number') p.head = latest;
                }
                p.busySince = 0;
              },
            },
          ],
        }),
      );
    }
    // Count what was stored: every 2xx save is a revision beyond the first.
    let stored = 0;
    for (const p of patterns) {
      const res = await client.get(`/api/patterns/${p.id}`);
      stored += (res.json.pattern.headRevision as number) - 1;
    }
    const saved2xx = saves.reduce((s, r) => s + r['2xx'], 0);

    const load = os.loadavg().map((v) => v.toFixed(1)).join(' / ');
    return {
      title: `API under load (autocannon, ${CONNECTIONS} connections, 127.0.0.1)`,
      rows: [
        summaryRow('read a pattern (GET /api/patterns/:id)', 'reads ≥ 1,000/s, p99 ≤ 50 ms', reads),
        summaryRow('list patterns (GET /api/patterns, 20 of 100)', 'reads ≥ 1,000/s, p99 ≤ 50 ms', lists),
        summaryRow('save a revision (PUT /api/patterns/:id)', 'saves ≥ 300/s', saves),
      ],
      notes: [
        `Read answer ${(readBytes / 1024).toFixed(1)} kB (pattern + latest revision document); save body ${(docJson.length / 1024).toFixed(1)} kB (${typeof (piecing as Record<string, unknown>)['buildGardenGate'] === 'function' ? 'the demo Garden Gate' : 'a 3 × 3 grid block of 13 sections'}).`,
        `Saves: ${saved2xx} answered 2xx, ${stored} new revisions stored afterwards; ${conflicts} answered 409. ` +
          `Stored may exceed answered by the saves in flight when a run stopped (at most ${CONNECTIONS} per run, ${CONNECTIONS * RUNS} in all): ` +
          `${stored - saved2xx} here${stored >= saved2xx && stored - saved2xx <= CONNECTIONS * RUNS ? ', within that bound' : ' — OUTSIDE that bound, look into it'}. ` +
          'A 409 comes after such a cut-off save, whose pattern head the benchmark did not see advance.',
        `Server: NODE_ENV=production, one process, SQLite WAL, synchronous=NORMAL. Load average (1/5/15 min) at the end: ${load} on ${os.cpus().length} cores — other work on the machine lowers these figures.`,
        'Latency percentiles are autocannon\'s (HdrHistogram) per run; the median of the runs is shown, max is the largest of all runs.',
        'server_cpu_ms_per_req: CPU time the server process used (user + system, /proc/<pid>/stat) over the timed runs, divided by the answers; ' +
          'one_core_capacity = 1000 / that: what one core would serve with nothing else on it. It does not depend on other load on the machine, unlike req/s.',
      ],
    };
  } finally {
    await server?.stop();
  }
}
