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
 *
 * Baselines in the same run, interleaved in rounds: bench/bare-api-server.ts answering the same bytes
 * from the same SQLite file on node:http alone ("bare") and on Express with no middleware ("express").
 * The figure that matters is server CPU per answered request (/proc/<pid>/stat, every thread of the
 * process) and its ratio to the bare server's in the same round; req/s and latency move with whatever
 * else runs on the machine.
 */
// autocannon ships no types; its declaration lives beside the test helpers.
// eslint-disable-next-line @typescript-eslint/triple-slash-reference
/// <reference path="../tests/support/autocannon.d.ts" />
import autocannon from 'autocannon';
import { execFileSync, spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import * as piecing from '@seamwright/piecing';
import { signedInClient } from '../tests/support/api-client';
import { gridDocument } from '../tests/support/documents';
import { REPO_ROOT, startServerProcess, type ServerProcess } from '../tests/support/server-process';
import { ms, quantile, saveRequestHooks, type BenchSection, type SavedPattern } from './bench-kit';

const CONNECTIONS = 50;
/** Rounds: in each, every scenario runs against each server in turn (the order turns round by round). */
const ROUNDS = 3;
const SECONDS = 4;

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


/** One request pattern, its path relative to a server's base URL. */
type Scenario = Omit<autocannon.Options, 'url'> & { url?: string };

interface Target {
  name: 'seamwright' | 'bare' | 'express';
  url: string;
  pid: number | undefined;
}

async function run(target: Target, opts: Scenario): Promise<Result> {
  const before = cpuMs(target.pid);
  const result: Result = await autocannon({ connections: CONNECTIONS, duration: SECONDS, ...opts, url: target.url + (opts.url ?? '') });
  const after = cpuMs(target.pid);
  if (before !== undefined && after !== undefined) result.serverCpuMs = after - before;
  return result;
}

const cpuPerRequest = (r: Result) => (r.serverCpuMs ?? Number.NaN) / (r['2xx'] + r.non2xx);
const range = (values: number[], digits: number) =>
  `${quantile(values, 0.5).toFixed(digits)} (${Math.min(...values).toFixed(digits)}–${Math.max(...values).toFixed(digits)})`;

function summaryRow(scenario: string, target: string, results: Result[], bare: Result[], express: Result[]) {
  const rps = results.map((r) => r.requests.average);
  const cpu = results.map(cpuPerRequest);
  // Per round: this server's CPU per request over the bare server's (and Express's) in the same round.
  const vsBare = results.map((r, i) => cpuPerRequest(r) / cpuPerRequest(bare[i]));
  const vsExpress = results.map((r, i) => cpuPerRequest(r) / cpuPerRequest(express[i]));
  return {
    scenario,
    server: target,
    rounds: `${results.length} × ${SECONDS} s`,
    req_per_s_median: Math.round(quantile(rps, 0.5)),
    p50_ms: ms(quantile(results.map((r) => r.latency.p50), 0.5)),
    p99_ms_median_min_max: range(results.map((r) => r.latency.p99), 0),
    answers_2xx: results.reduce((s, r) => s + r['2xx'], 0),
    non_2xx: results.reduce((s, r) => s + r.non2xx, 0),
    errors: results.reduce((s, r) => s + r.errors + r.timeouts, 0),
    cpu_ms_per_req_median_min_max: cpu.every(Number.isFinite) ? range(cpu, 3) : 'n/a',
    cpu_ratio_to_bare_per_round: target === 'bare' ? '1' : `${range(vsBare, 2)} [${vsBare.map((v) => v.toFixed(2)).join(', ')}]`,
    cpu_ratio_to_express_per_round: target === 'express' ? '1' : `${range(vsExpress, 2)} [${vsExpress.map((v) => v.toFixed(2)).join(', ')}]`,
  };
}

/** Starts bench/bare-api-server.ts in `mode` on the database file; resolves once it listens. */
async function startBaseline(mode: 'bare' | 'express', dbFile: string): Promise<{ child: ChildProcess; url: string }> {
  const child = spawn(process.execPath, ['--import', 'tsx', path.join('bench', 'bare-api-server.ts'), mode, dbFile, '0'], {
    cwd: REPO_ROOT,
    env: { ...process.env, NODE_ENV: 'production' },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  const port = await new Promise<number>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`${mode} server did not start: ${output}`)), 60_000);
    const onData = (d: Buffer) => {
      output += d.toString();
      const m = /listening (\d+)/.exec(output);
      if (m) {
        clearTimeout(timer);
        resolve(Number(m[1]));
      }
    };
    child.stdout!.on('data', onData);
    child.stderr!.on('data', onData);
    child.once('exit', (code) => reject(new Error(`${mode} server exited ${code}: ${output}`)));
  });
  return { child, url: `http://127.0.0.1:${port}` };
}

async function bodyOf(url: string, headers: Record<string, string>): Promise<string> {
  const res = await fetch(url, { headers });
  return res.text();
}

export default async function apiLoad(): Promise<BenchSection> {
  let server: ServerProcess | undefined;
  const baselines: ChildProcess[] = [];
  try {
    server = await startServerProcess({ env: { NODE_ENV: 'production', SEAMWRIGHT_SECRET: 'bench-secret-'.padEnd(48, 'x') } });
    const { client } = await signedInClient(server.baseUrl, 'designer', 'load');
    const docJson = JSON.stringify(benchDocument('Load block'));
    // 100 patterns to list (five pages of 20) and to save onto.
    const patterns: SavedPattern[] = [];
    for (let i = 0; i < Math.max(60, CONNECTIONS * 2); i++) {
      const res = await client.post('/api/patterns', { document: JSON.parse(docJson.replace('Load block', `Load block ${i}`)) });
      if (res.status !== 201) throw new Error(`create answered ${res.status}: ${res.text.slice(0, 200)}`);
      patterns.push({ id: res.json.pattern.id, head: 1, busySince: 0 });
    }
    await client.fetchCsrf();
    const headers = { cookie: client.cookieHeader(), accept: 'application/json' };
    const readPath = `/api/patterns/${patterns[0].id}`;
    const readBytes = (await client.get(readPath)).text.length;
    // The product's first list stores the page's previews; the baselines read them.
    await client.get('/api/patterns');

    const dbFile = path.join(server.dataDir, 'seamwright.db');
    const bare = await startBaseline('bare', dbFile);
    const express = await startBaseline('express', dbFile);
    baselines.push(bare.child, express.child);
    const targets: Target[] = [
      { name: 'seamwright', url: server.baseUrl, pid: server.child?.pid },
      { name: 'bare', url: bare.url, pid: bare.child.pid },
      { name: 'express', url: express.url, pid: express.child.pid },
    ];

    // The baselines answer the same bytes as the product (checked here, reported in the notes).
    const sameBytes: string[] = [];
    for (const p of [readPath, '/api/patterns']) {
      const [ours, ...others] = await Promise.all(targets.map((t) => bodyOf(t.url + p, headers)));
      sameBytes.push(`${p.startsWith('/api/patterns/') ? 'read' : 'list'}: ${others.every((o) => o === ours) ? 'identical' : 'DIFFERENT'} (${ours.length} bytes)`);
    }

    const saveHeaders = { ...headers, 'content-type': 'application/json', 'x-csrf-token': client.csrfToken! };
    let conflicts = 0;
    const saveRequest = (): Scenario => ({
      headers: saveHeaders,
      requests: [
        {
          method: 'PUT',
          // A pattern nobody is saving (or whose save was never sent: stale after 2 s).
          ...saveRequestHooks(patterns, docJson, 2000, () => conflicts++),
        },
      ],
    });
    const refreshHeads = async () => {
      for (const p of patterns.filter((x) => x.head < 0)) p.head = (await client.get(`/api/patterns/${p.id}`)).json.pattern.headRevision as number;
    };
    const scenarios = {
      read: (): Scenario => ({ url: readPath, headers }),
      list: (): Scenario => ({ url: '/api/patterns', headers }),
      save: saveRequest,
    };

    // Warm-up (untimed): JIT, SQLite page cache, every server and scenario.
    for (const t of targets) {
      for (const [name, make] of Object.entries(scenarios)) {
        if (name === 'list') await client.get('/api/patterns');
        await run(t, { ...make(), duration: 1 });
        await refreshHeads();
      }
    }

    const results: Record<keyof typeof scenarios, Record<Target['name'], Result[]>> = {
      read: { seamwright: [], bare: [], express: [] },
      list: { seamwright: [], bare: [], express: [] },
      save: { seamwright: [], bare: [], express: [] },
    };
    const savedByProduct: number[] = [];
    for (let round = 0; round < ROUNDS; round++) {
      const order = targets.map((_, i) => targets[(i + round) % targets.length]);
      for (const name of Object.keys(scenarios) as (keyof typeof scenarios)[]) {
        // The saves before this list left the listed patterns' stored previews behind their heads: the
        // product's own list (untimed) stores them again, so every server answers the same bytes, with
        // previews, whichever goes first (a baseline going first would answer null previews, less work).
        if (name === 'list') await client.get('/api/patterns');
        for (const t of order) {
          const r = await run(t, scenarios[name]());
          results[name][t.name].push(r);
          if (name === 'save' && t.name === 'seamwright') savedByProduct.push(r['2xx']);
          await refreshHeads();
        }
      }
    }
    // Every 2xx save (of any server, warm-ups included) is a revision beyond the first.
    let stored = 0;
    for (const p of patterns) {
      const res = await client.get(`/api/patterns/${p.id}`);
      stored += (res.json.pattern.headRevision as number) - 1;
    }
    const saved2xx = Object.values(results.save).flat().reduce((s, r) => s + r['2xx'], 0);

    const load = os.loadavg().map((v) => v.toFixed(1)).join(' / ');
    const rows = (['read', 'list', 'save'] as const).flatMap((name) =>
      targets.map((t) =>
        summaryRow(
          { read: 'read a pattern (GET /api/patterns/:id)', list: 'list patterns (GET /api/patterns, 20 of 100)', save: 'save a revision (PUT /api/patterns/:id)' }[name],
          t.name,
          results[name][t.name],
          results[name].bare,
          results[name].express,
        ),
      ),
    );
    return {
      title: `API under load (autocannon, ${CONNECTIONS} connections, 127.0.0.1) against a bare node:http server and Express in the same run`,
      rows,
      notes: [
        'Targets (issue 16): Seamwright CPU per request ≤ 3× the bare server for reads and saves, ≤ 2× for lists, in the same round; reads p99 ≤ 50 ms at 50 connections.',
        `Read answer ${(readBytes / 1024).toFixed(1)} kB (pattern + latest revision document); save body ${(docJson.length / 1024).toFixed(1)} kB (${typeof (piecing as Record<string, unknown>)['buildGardenGate'] === 'function' ? 'the demo Garden Gate' : 'a 3 × 3 grid block of 13 sections'}).`,
        `Same bytes: ${sameBytes.join('; ')}.`,
        'Seamwright answers these three requests in its hot routes (server/http/hot-routes.ts) in front of Express: the same session, CSRF, access and body checks, the same security headers and bytes as its Express routes (server/hot-routes.spec.ts compares them); other requests and unusual ones (HEAD, bodies over 64 kB, other content types) go through Express.',
        'bare / express: bench/bare-api-server.ts on the same SQLite file — session cookie lookup, access (404 to strangers), CSRF header on writes, the document through the piecing library\'s parsePatternDocument, one immediate transaction per save; no security headers, no rate limits, no other routes.',
        `Saves: ${saved2xx} answered 2xx over all servers in the timed rounds (Seamwright ${savedByProduct.join(' + ')}), ${stored} revisions stored in all (warm-ups included); ${conflicts} answered 409 (a save cut off when a run stopped leaves its pattern's head unseen).`,
        `Rounds: ${ROUNDS}; in each, every scenario runs against the three servers in turn, the order turning each round. Ratios are per round (median, min–max, then each round's).`,
        `Server: NODE_ENV=production, one process each, SQLite WAL, synchronous=NORMAL. Load average (1/5/15 min) at the end: ${load} on ${os.cpus().length} cores — other work on the machine lowers req/s and raises latency, and (less) CPU per request too, which is why only same-round ratios are compared.`,
        'Latency percentiles are autocannon\'s (HdrHistogram) per run. cpu_ms_per_req: CPU time of the server process (user + system, every thread) over the run, divided by the answers.',
      ],
    };
  } finally {
    for (const c of baselines) c.kill('SIGTERM');
    await server?.stop();
  }
}
