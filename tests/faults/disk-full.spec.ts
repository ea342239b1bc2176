/**
 * Disk full and unwritable data folder (issue: benchmarks, load, faults) — uploads, saves and print
 * sets: the client gets a clear error, the server does not crash, and no corrupt or half-written
 * file stays behind.
 *
 * The tests run as root, where `chmod` does not stop writes, so other ways are used:
 * - "disk full", two ways, each test run with both:
 *   a) the data folder on a small tmpfs (`mount -t tmpfs -o size=N`): a real full file system,
 *      writes fail with ENOSPC. Needs the right to mount (root with CAP_SYS_ADMIN); where mounting
 *      is refused, (b) is used in its place and the test says so.
 *   b) the server under a file-size limit (RLIMIT_FSIZE, set with util-linux `prlimit --fsize=N --`,
 *      which execs the server in place). Node ignores SIGXFSZ, so a write past the limit fails with
 *      EFBIG (getrlimit(2), RLIMIT_FSIZE). It hits uploads and the SQLite file alike.
 * - "unwritable folder": the folder the server writes into is replaced by a plain file of the same
 *   name, so creating or writing files inside it fails (ENOTDIR/EEXIST) whatever the user.
 */
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import Database from 'better-sqlite3';
import { afterAll, describe, expect, it } from 'vitest';
import { signedInClient } from '../support/api-client';
import { checkDatabase, listFiles, sha256OfFile, withReadOnlyDatabase } from '../support/database-check';
import { gridDocument, manySheetsDocument } from '../support/documents';
import { answerProblem, expectCleanAnswer, TINY_PNG, uploadForm } from '../support/fixtures';
import { fillDisk } from '../support/fill-disk';
import { startServerProcess, waitForHealth, type ServerProcess } from '../support/server-process';

const started: ServerProcess[] = [];
const mounts: string[] = [];
afterAll(async () => {
  for (const s of started) await s.stop();
  for (const dir of mounts) {
    try {
      execFileSync('umount', [dir], { stdio: 'pipe' });
    } catch {
      // unmounted by the test already
    }
    fs.rmSync(dir, { recursive: true, force: true });
  }
});

/** What a clear storage error looks like: a JSON error that says the thing was not stored. */
const CLEAR_STORAGE_ERROR = /disk|storage|space|full|nothing (was|has been) (saved|stored)|not (been )?(saved|stored)|could not (be )?(saved|stored|write)|cannot (be )?(saved|stored)/i;

function expectClearStorageError(res: { status: number; text: string; json: any; contentType: string }, what: string) {
  // A server-side fault may be a 5xx (507 Insufficient Storage fits, RFC 4918 §11.5), but it must be
  // a JSON error that tells the user their work was not stored — not a bare "Internal server error".
  expect(res.status, `${what}: ${res.text.slice(0, 200)}`).toBeGreaterThanOrEqual(400);
  expect(res.contentType, what).toContain('application/json');
  expect(typeof res.json?.error, what).toBe('string');
  // Soft, so the checks after it (crash, stray files, integrity) still run and report.
  expect.soft(res.json.error, `${what}: the error should say the data was not stored`).toMatch(CLEAR_STORAGE_ERROR);
}

/** A PNG of about `bytes` bytes: a valid 1 × 1 image followed by filler after its end chunk. */
const bigPng = (bytes: number) => Buffer.concat([TINY_PNG, Buffer.alloc(bytes - TINY_PNG.length, 0x5a)]);

/** Files left in a folder that are neither listed in the database nor the database itself. */
function strayFiles(dataDir: string, folder: string, known: string[]): string[] {
  return listFiles(path.join(dataDir, folder))
    .map((f) => `${folder}/${f}`)
    .filter((f) => !known.includes(f));
}

type DiskKind = 'tmpfs' | 'prlimit';

/** A server whose data folder can hold about `bytes` (tmpfs) or whose files can grow to `bytes` (prlimit). */
async function serverOnSmallDisk(kind: DiskKind, bytes: number): Promise<{ server: ServerProcess; how: string }> {
  if (kind === 'tmpfs') {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'seamwright-small-disk-'));
    try {
      execFileSync('mount', ['-t', 'tmpfs', '-o', `size=${bytes},mode=0700`, 'tmpfs', dir], { stdio: 'pipe' });
      mounts.push(dir);
      const server = await startServerProcess({ dataDir: dir });
      started.push(server);
      return { server, how: `data folder on a ${bytes / 1024 / 1024} MB tmpfs (ENOSPC)` };
    } catch (err) {
      fs.rmSync(dir, { recursive: true, force: true });
      if (mounts.includes(dir)) throw err;
      console.log(`tmpfs mount refused (${(err as Error).message.split('\n')[0]}): using the file-size limit instead`);
    }
  }
  const server = await startServerProcess({ wrapper: ['prlimit', `--fsize=${bytes}`, '--'] });
  started.push(server);
  return { server, how: `RLIMIT_FSIZE ${bytes / 1024 / 1024} MB via prlimit (EFBIG)` };
}

describe.each<DiskKind>(['tmpfs', 'prlimit'])('disk full (%s)', (kind) => {
  it('an upload bigger than the space left: clear error, no crash, no half-written file, no row', async () => {
    // 2.5 MB: the database and small images fit, a 3 MB image does not.
    const { server, how } = await serverOnSmallDisk(kind, 2.5 * 1024 * 1024);
    console.log(`disk full, upload: ${how}`);
    const { client } = await signedInClient(server.baseUrl, 'designer', 'full-disk');
    const made = await client.post('/api/patterns', { document: gridDocument('Full disk block', 2, 2, 2) });
    expect(made.status).toBe(201);
    const id = made.json.pattern.id;

    const small = await client.request('POST', `/api/patterns/${id}/uploads`, { body: uploadForm(bigPng(200_000)) });
    expect(small.status, small.text).toBe(201);
    const big = await client.request('POST', `/api/patterns/${id}/uploads`, { body: uploadForm(bigPng(3 * 1024 * 1024)) });
    expect(answerProblem(big) ?? '', 'no stack trace, JSON body').not.toMatch(/stack trace|without JSON/);
    expectClearStorageError(big, 'upload past the file-size limit');

    // Right away: no temporary or partial file of the refused upload is left taking up the space.
    const leftovers = listFiles(path.join(server.dataDir, 'uploads')).filter((f) => /(^|\/)\.|\.tmp$/.test(f));
    expect.soft(leftovers, 'temporary files left by the refused upload').toEqual([]);

    // No crash: the same process still answers, and the next small upload works.
    expect(server.alive(), server.output()).toBe(true);
    await waitForHealth(server.baseUrl, 5_000);
    const again = await client.request('POST', `/api/patterns/${id}/uploads`, { body: uploadForm(bigPng(100_000)) });
    expect(again.status, again.text).toBe(201);
    const listed = await client.get(`/api/patterns/${id}/uploads`);
    expect(listed.json.items.map((u: { id: string }) => u.id).sort()).toEqual([small.json.upload.id, again.json.upload.id].sort());

    await server.kill('SIGKILL');
    const rows = withReadOnlyDatabase(server.dataDir, (db) => db.prepare('SELECT storage_path AS p, bytes FROM uploads').all() as { p: string; bytes: number }[]);
    expect(rows).toHaveLength(2);
    for (const r of rows) expect(fs.statSync(path.join(server.dataDir, r.p)).size).toBe(r.bytes);
    // No half-written (temporary or truncated) file of the refused upload is left in the folder.
    expect(strayFiles(server.dataDir, 'uploads', rows.map((r) => r.p))).toEqual([]);
    expect(checkDatabase(server.dataDir).integrity).toEqual(['ok']);
  });

  it('saves that outgrow the space left: clear error, no crash, every answered save intact', async () => {
    // Each save of this document adds about 0.4 MB to the write-ahead log; 3 MB per file stops the
    // server a few saves in.
    const limit = 3 * 1024 * 1024;
    const { server, how } = await serverOnSmallDisk(kind, limit);
    const { client } = await signedInClient(server.baseUrl, 'designer', 'full-db');
    const doc = (n: number) => gridDocument(`Growing block ${n}`, 30, 30, 16);
    const size = JSON.stringify(doc(0)).length;
    const made = await client.post('/api/patterns', { document: doc(1) });
    expect(made.status, made.text).toBe(201);
    const id = made.json.pattern.id;
    const acked = new Map<number, string>([[1, 'Growing block 1']]);
    let head = 1;
    let failure: Awaited<ReturnType<typeof client.put>> | undefined;
    for (let i = 2; i <= Math.ceil((2 * limit) / size) + 5 && !failure; i++) {
      const res = await client.put(`/api/patterns/${id}`, { baseRevision: head, document: doc(i) }, { timeoutMs: 30_000 });
      if (res.status === 200) {
        head = res.json.revision.number;
        acked.set(head, `Growing block ${i}`);
      } else failure = res;
    }
    console.log(`disk full (${how}): document ${(size / 1024).toFixed(0)} kB, ${acked.size} saves stored before the limit, then ${failure?.status}: ${failure?.text.slice(0, 160)}`);
    expect(failure, 'the limit should have been reached').toBeDefined();
    expectClearStorageError(failure!, 'save past the file-size limit');
    expect(server.alive(), server.output()).toBe(true);
    await waitForHealth(server.baseUrl, 5_000);
    // Reads still work and show the last answered save.
    const read = await client.get(`/api/patterns/${id}`);
    expect(read.status).toBe(200);
    expect(read.json.pattern.headRevision).toBe(head);
    expect(read.json.revision.document.title).toBe(acked.get(head));

    // Restart without the limit: the database is sound and holds every answered save.
    await server.kill('SIGKILL');
    const report = checkDatabase(server.dataDir);
    expect(report.integrity).toEqual(['ok']);
    const stored = withReadOnlyDatabase(server.dataDir, (db) =>
      db.prepare(`SELECT number, json_extract(document, '$.title') AS title FROM revisions WHERE pattern_id = ? ORDER BY number`).all(id) as { number: number; title: string }[],
    );
    expect(stored.map((r) => [r.number, r.title])).toEqual([...acked]);
  });
});

describe('unwritable data folder (the folder replaced by a file)', () => {
  it('uploads into a folder that cannot be written: clear error, no crash, nothing stored', async () => {
    const server = await startServerProcess();
    started.push(server);
    const { client } = await signedInClient(server.baseUrl, 'designer', 'blocked');
    const made = await client.post('/api/patterns', { document: gridDocument('Blocked block', 2, 2, 2) });
    const id = made.json.pattern.id;
    const uploads = path.join(server.dataDir, 'uploads');
    fs.rmSync(uploads, { recursive: true, force: true });
    fs.writeFileSync(uploads, 'not a folder');

    const res = await client.request('POST', `/api/patterns/${id}/uploads`, { body: uploadForm(TINY_PNG) });
    expectClearStorageError(res, 'upload into an unwritable folder');
    expect(server.alive(), server.output()).toBe(true);
    const listed = await client.get(`/api/patterns/${id}/uploads`);
    expect(listed.json.items).toEqual([]);
    // The rest of the API carries on: saves go to the database, which is still writable.
    const saved = await client.put(`/api/patterns/${id}`, { baseRevision: 1, document: gridDocument('Blocked block 2', 2, 2, 2) });
    expect(saved.status, saved.text).toBe(200);
    expect(fs.readFileSync(uploads, 'utf8')).toBe('not a folder');

    // Put the folder back: uploads work again without a restart.
    fs.rmSync(uploads);
    const ok = await client.request('POST', `/api/patterns/${id}/uploads`, { body: uploadForm(TINY_PNG) });
    expect(ok.status, ok.text).toBe(201);
  });
});

describe('print sets on a full disk', () => {
  it('a PDF that does not fit on the disk holding the database: the set ends "failed" with a clear message, nothing half-written, the next one works', async () => {
    // The whole data folder — database, write-ahead log and print sets — on one small tmpfs, as on a
    // server with one disk.
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'seamwright-print-disk-'));
    execFileSync('mount', ['-t', 'tmpfs', '-o', 'size=64m,mode=0700', 'tmpfs', dir], { stdio: 'pipe' });
    mounts.push(dir);
    const server = await startServerProcess({ dataDir: dir });
    started.push(server);
    const { client } = await signedInClient(server.baseUrl, 'designer', 'full-print');
    const made = await client.post('/api/patterns', { document: manySheetsDocument(40, 'Full disk print') });
    expect(made.status, made.text).toBe(201);
    const id = made.json.pattern.id;
    const request = () => client.post(`/api/patterns/${id}/print-sets`, { options: { copies: 'single' } });

    // With room: the PDF's size, S.
    const roomy = await request();
    const done = await settle(client, id, roomy.json.printSet.id);
    expect(done.status, done.error ?? '').toBe('done');
    const pdfBytes: number = done.bytes;

    // The write-ahead log emptied (so the set's own rows need fresh space, as on a disk that filled up
    // over time), then the disk filled to leave S / 2: room for the set's rows and progress, not its PDF.
    const direct = new Database(path.join(dir, 'seamwright.db'));
    expect((direct.pragma('wal_checkpoint(TRUNCATE)') as { busy: number }[])[0].busy).toBe(0);
    direct.close();
    const free = Math.floor(pdfBytes / 2);
    const filler = path.join(dir, 'filler');
    fs.truncateSync(filler, fillDisk(filler) - free);
    const filesBefore = listFiles(path.join(dir, 'print-sets'));
    const first = await request();
    expect(first.status, first.text).toBe(202);
    // The set's own progress writes may use up the little space left, so that even its failure cannot
    // be written at once. Such a failure must be written once there is room again: the disk gets its
    // space back after a while, and from then on the set must end "failed" — never stay rendering.
    let failed = await settle(client, id, first.json.printSet.id, 60_000).catch(() => undefined);
    const whileFull = failed?.status ?? 'not settled while the disk was full';
    fs.rmSync(filler);
    failed ??= await settle(client, id, first.json.printSet.id, 60_000);
    console.log(`print set of a ${pdfBytes}-byte PDF with ${free} bytes left on the database's disk: ${whileFull}; then ${failed.status}, "${failed.error}"`);
    expect(failed.status).toBe('failed');
    expect(failed.error).toMatch(CLEAR_STORAGE_ERROR);
    expect(failed.sha256).toBeNull();
    expect(server.alive(), server.output()).toBe(true);
    const download = await client.get(`/api/patterns/${id}/print-sets/${first.json.printSet.id}/file`);
    expect(download.status).toBe(409);
    expectCleanAnswer(download, 'download of a failed print set');
    // Nothing half-written stays on the full disk.
    expect(listFiles(path.join(dir, 'print-sets'))).toEqual(filesBefore);

    // Space again: the next print set renders and stores a whole file.
    const second = await request();
    expect((await settle(client, id, second.json.printSet.id)).status).toBe('done');
    await server.kill('SIGKILL');
    const rows = withReadOnlyDatabase(server.dataDir, (db) =>
      db.prepare('SELECT id, status, storage_path AS p, sha256, bytes FROM print_sets ORDER BY created_at').all() as { id: string; status: string; p: string; sha256: string; bytes: number }[],
    );
    // The failure is stored, not only answered: it survives a kill.
    expect(rows.map((r) => [r.id, r.status])).toEqual([
      [roomy.json.printSet.id, 'done'],
      [first.json.printSet.id, 'failed'],
      [second.json.printSet.id, 'done'],
    ]);
    for (const row of [rows[0], rows[2]]) {
      expect(sha256OfFile(path.join(server.dataDir, row.p))).toBe(row.sha256);
      expect(fs.statSync(path.join(server.dataDir, row.p)).size).toBe(row.bytes);
    }
  });
});


/** Polls a print set until it is done or failed (bounded: 3 minutes unless told). */
async function settle(client: Awaited<ReturnType<typeof signedInClient>>['client'], patternId: string, setId: string, withinMs = 180_000) {
  for (let i = 0; i < withinMs / 200; i++) {
    const res = await client.get(`/api/patterns/${patternId}/print-sets/${setId}`);
    const set = res.json?.printSet;
    if (set && (set.status === 'done' || set.status === 'failed')) return set;
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`print set ${setId} did not settle within ${withinMs / 1000} s`);
}
