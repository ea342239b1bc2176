/**
 * Durability (issue: benchmarks, load, faults): a client saves 200 revisions of one pattern while the
 * real server process is killed with SIGKILL at seeded random moments (mostly while a save is in
 * flight) and restarted. Afterwards every save the server answered 2xx is present with its document,
 * revision numbers run 1…head without gaps, and the SQLite file passes `PRAGMA integrity_check`
 * (SQLite documentation, "PRAGMA integrity_check": it answers the single row "ok" when sound).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiClient, signedInClient } from '../support/api-client';
import { checkDatabase, withReadOnlyDatabase } from '../support/database-check';
import { gridDocument } from '../support/documents';
import { faultSeed, seededRandom, sleep } from '../support/random';
import { startServerProcess, waitForHealth, type ServerProcess } from '../support/server-process';

const SEED = faultSeed(20_261_201);
/** Saves that must be answered 2xx. */
const SAVES = 200;
/** Kills during the run (each at a random save, at a random moment inside that save). */
const KILLS = 12;
/** Upper bound on save attempts, so a server that never answers cannot loop for ever. */
const MAX_ATTEMPTS = SAVES * 3;

let server: ServerProcess;
let client: ApiClient;
let patternId: string;

beforeAll(async () => {
  server = await startServerProcess();
  ({ client } = await signedInClient(server.baseUrl, 'designer', 'durable'));
  const created = await client.post('/api/patterns', { document: gridDocument(`Durability ${SEED} save start`, 8, 8, 16) });
  expect(created.status, created.text).toBe(201);
  patternId = created.json.pattern.id;
});

afterAll(async () => {
  await server?.stop();
});

/** True for the errors fetch throws when the server is gone mid-request (reset, refused, closed). */
function isConnectionError(err: unknown): boolean {
  const e = err as { name?: string; cause?: { code?: string } };
  return e?.name === 'TypeError' || ['ECONNRESET', 'ECONNREFUSED', 'UND_ERR_SOCKET'].includes(e?.cause?.code ?? '');
}

describe('durability under SIGKILL', () => {
  it(`keeps every acknowledged save of ${SAVES} with ${KILLS} kills (seed ${SEED})`, async () => {
    const rng = seededRandom(SEED);
    // Which saves get a kill, and how far into the save it lands.
    const killAt = new Map<number, number>();
    for (let guard = 0; killAt.size < KILLS && guard < 10_000; guard++) killAt.set(5 + Math.floor(rng() * (SAVES - 10)), rng());

    const acked = new Map<number, string>(); // revision number → title it was saved with
    let head = 1;
    let attempt = 0;
    let acknowledged = 0;
    let connectionErrors = 0;
    let conflicts = 0;
    let kills = 0;
    let restarting: Promise<void> | undefined;
    const saveTimes: number[] = [];

    while (acknowledged < SAVES && attempt < MAX_ATTEMPTS) {
      attempt++;
      const title = `Durability ${SEED} save ${attempt}`;
      const fraction = killAt.get(acknowledged);
      if (fraction !== undefined && !restarting) {
        killAt.delete(acknowledged);
        // Land the kill somewhere inside a typical save (median so far), sometimes just after it.
        const typical = saveTimes.length ? saveTimes.sort((a, b) => a - b)[saveTimes.length >> 1] : 10;
        const delay = fraction * typical * 1.2;
        restarting = sleep(delay).then(async () => {
          await server.kill('SIGKILL');
          kills++;
          await server.restart();
        });
        void restarting.finally(() => (restarting = undefined));
      }
      const t0 = performance.now();
      try {
        const res = await client.put(`/api/patterns/${patternId}`, { baseRevision: head, document: gridDocument(title, 8, 8, 16) }, { timeoutMs: 20_000 });
        if (res.status === 200) {
          saveTimes.push(performance.now() - t0);
          expect(res.json.revision.number).toBe(head + 1);
          head = res.json.revision.number;
          acked.set(head, title);
          acknowledged++;
        } else if (res.status === 409) {
          // Our base was stale: a save whose answer was lost to a kill had been stored after all.
          conflicts++;
          const latest = res.json?.details?.latest;
          expect(typeof latest?.number, res.text).toBe('number');
          expect(latest.number).toBeGreaterThan(head);
          head = latest.number;
        } else {
          throw new Error(`save ${attempt} answered ${res.status}: ${res.text.slice(0, 300)}`);
        }
      } catch (err) {
        if (!isConnectionError(err)) throw err;
        connectionErrors++;
        if (restarting) await restarting;
        await waitForHealth(server.baseUrl, 60_000);
      }
    }
    if (restarting) await restarting;
    console.log(
      `durability seed ${SEED}: ${acknowledged} acknowledged saves in ${attempt} attempts, ${kills} kills, ` +
        `${connectionErrors} connection errors, ${conflicts} conflicts (lost answers of stored saves), head ${head}, ${server.starts} starts`,
    );
    expect(acknowledged).toBe(SAVES);
    expect(kills).toBe(KILLS);

    // Through the API: every acknowledged save is there with its own document.
    for (const [number, title] of acked) {
      const res = await client.get(`/api/patterns/${patternId}/revisions/${number}`);
      expect(res.status, res.text).toBe(200);
      expect(res.json.revision.document.title).toBe(title);
    }
    const listed: number[] = [];
    for (let page = 1; page <= 20; page++) {
      const res = await client.get(`/api/patterns/${patternId}/revisions?page=${page}&pageSize=100`);
      expect(res.status, res.text).toBe(200);
      listed.push(...res.json.items.map((r: { number: number }) => r.number));
      if (listed.length >= res.json.total) break;
    }
    const current = await client.get(`/api/patterns/${patternId}`);
    const finalHead: number = current.json.pattern.headRevision;
    expect(finalHead).toBeGreaterThanOrEqual(head);
    expect([...listed].sort((a, b) => a - b)).toEqual(Array.from({ length: finalHead }, (_, i) => i + 1));

    // Stop the server the hard way once more, then read the file itself.
    await server.kill('SIGKILL');
    const report = checkDatabase(server.dataDir);
    expect(report.integrity).toEqual(['ok']);
    expect(report.foreignKeyProblems).toEqual([]);
    expect(report.journalMode).toBe('wal');
    const rows = withReadOnlyDatabase(server.dataDir, (db) =>
      db
        .prepare(`SELECT number, json_extract(document, '$.title') AS title FROM revisions WHERE pattern_id = ? ORDER BY number`)
        .all(patternId) as { number: number; title: string }[],
    );
    const byNumber = new Map(rows.map((r) => [r.number, r.title]));
    for (const [number, title] of acked) expect(byNumber.get(number)).toBe(title);
    expect(rows.map((r) => r.number)).toEqual(Array.from({ length: finalHead }, (_, i) => i + 1));
    const headRow = withReadOnlyDatabase(server.dataDir, (db) =>
      db.prepare('SELECT head_revision AS head FROM patterns WHERE id = ?').get(patternId) as { head: number },
    );
    expect(headRow.head).toBe(finalHead);
  });
});
