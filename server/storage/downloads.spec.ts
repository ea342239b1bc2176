/**
 * The server's stored files through the file store, on both homes: uploads and print sets are written,
 * served (whole, by range, 304 on a matching ETag, 416 past the end, HEAD) and removed through the
 * store; with PostgreSQL nothing lands in the data folder. The PostgreSQL store uses 1 kB chunks
 * here, so the image spans six chunks and the ranges asked for cross their boundaries.
 */
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import type { Express } from 'express';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startPgCluster, type PgCluster } from '../../tests/support/pg-cluster';
import { migratePostgres } from '../db/postgres';
import { createApp } from '../app';
import { sweepStoredFilesIn } from '../services/housekeeping';
import { PrintSetService } from '../services/print-sets';
import { seededRandom } from '../../tests/support/random';
import { sampleDocument, startTestServer, TINY_PNG, userClient, type Client, type TestServer } from '../test/harness';
import { DiskFileStore } from './disk-store';
import type { FileStore } from './file-store';
import { PgFileStore } from './pg-store';

const binary = (res: import('superagent').Response, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
};

const sha = (b: Uint8Array) => crypto.createHash('sha256').update(b).digest('hex');

/** A PNG by its bytes (file-type reads the signature) of 5 kB: the tiny image and seeded bytes after it. */
const IMAGE = (() => {
  const next = seededRandom(5);
  return Buffer.concat([TINY_PNG, Buffer.from(Array.from({ length: 5000 }, () => Math.floor(next() * 256)))]);
})();

interface Served {
  app: Express;
  store: FileStore;
  /** Whether files land in the data folder. */
  onDisk: boolean;
  close(): Promise<void>;
}

async function servedFromDisk(t: TestServer): Promise<Served> {
  return { app: t.app, store: new DiskFileStore(t.dataDir), onDisk: true, close: async () => undefined };
}

async function servedFromPostgres(t: TestServer): Promise<Served> {
  const cluster: PgCluster = await startPgCluster({ database: 'downloads' });
  const pool = new pg.Pool({ connectionString: cluster.url, max: 4 });
  await migratePostgres(pool);
  const store = new PgFileStore(pool, 1024);
  const printSets = new PrintSetService(t.ctx.data, t.ctx.config, t.ctx.log, store, t.ctx.printSets.jobOptions);
  // The server's context with the PostgreSQL store (the `files` a server with DATABASE_URL is given).
  const ctx = Object.assign({}, t.ctx, { files: store, printSets });
  return {
    app: createApp(ctx),
    store,
    onDisk: false,
    close: async () => {
      await printSets.close();
      await pool.end();
      await cluster.stop();
    },
  };
}

describe.each([
  ['the data folder', servedFromDisk],
  ['PostgreSQL', servedFromPostgres],
])('stored files served from %s', (_name, serve) => {
  let t: TestServer;
  let s: Served;
  let owner: Client;
  let patternId: string;
  beforeAll(async () => {
    t = await startTestServer();
    s = await serve(t);
    owner = await userClient(s.app, 'files@store.test', 'designer');
    patternId = (await owner.post('/api/patterns', { document: sampleDocument('Stored block') }).expect(201)).body.pattern.id;
  }, 120_000);
  afterAll(async () => {
    await s?.close();
    await t?.close();
  });

  it('serves an upload whole, by range, as 304 and HEAD, answers 416 past its end, and removes it with its row', async () => {
    const up = (await owner.req('post', `/api/patterns/${patternId}/uploads`).attach('file', IMAGE, 'dot.png').expect(201)).body.upload;
    const key = `uploads/${owner.user!.id}/${up.id}.png`;
    expect(up.sha256).toBe(sha(IMAGE));
    expect((await s.store.stat(key))?.size).toBe(IMAGE.byteLength);
    expect(fs.existsSync(path.join(t.dataDir, key))).toBe(s.onDisk);

    const whole = await owner.get(up.url).buffer(true).parse(binary).expect(200);
    expect((whole.body as Buffer).equals(IMAGE)).toBe(true);
    expect(whole.headers).toMatchObject({
      'content-type': 'image/png',
      'content-length': String(IMAGE.byteLength),
      'accept-ranges': 'bytes',
      etag: `"${sha(IMAGE)}"`,
      'cache-control': 'private, max-age=3600',
    });
    expect(whole.headers['content-disposition']).toContain('dot.png');

    await owner.get(up.url).set('If-None-Match', `"${sha(IMAGE)}"`).expect(304);
    const part = await owner.get(up.url).set('Range', 'bytes=1000-2100').buffer(true).parse(binary).expect(206);
    expect(part.headers['content-range']).toBe(`bytes 1000-2100/${IMAGE.byteLength}`);
    expect((part.body as Buffer).equals(IMAGE.subarray(1000, 2101))).toBe(true);
    const tail = await owner.get(up.url).set('Range', 'bytes=-5').buffer(true).parse(binary).expect(206);
    expect((tail.body as Buffer).equals(IMAGE.subarray(-5))).toBe(true);
    // If-Range with a validator that no longer matches: the whole file (RFC 9110 §13.1.5).
    const stale = await owner.get(up.url).set('Range', 'bytes=1000-2100').set('If-Range', '"another"').buffer(true).parse(binary).expect(200);
    expect((stale.body as Buffer).equals(IMAGE)).toBe(true);
    const past = await owner.get(up.url).set('Range', `bytes=${IMAGE.byteLength}-`).expect(416);
    expect(past.headers['content-range']).toBe(`bytes */${IMAGE.byteLength}`);
    const head = await owner.agent.head(up.url).expect(200);
    expect(head.headers['content-length']).toBe(String(IMAGE.byteLength));

    await owner.del(`/api/patterns/${patternId}/uploads/${up.id}`).expect(204);
    expect(await s.store.stat(key)).toBeUndefined();
    await owner.get(up.url).expect(404);
  });

  it('stores a rendered print set, serves it whole and by range, and removes it when the set is deleted', async () => {
    const made = await owner.post(`/api/patterns/${patternId}/print-sets`, { options: { paper: 'letter' } }).expect(202);
    let set = made.body.printSet;
    for (let i = 0; i < 600 && set.status !== 'done' && set.status !== 'failed'; i++) {
      await new Promise((r) => setTimeout(r, 100));
      set = (await owner.get(`/api/patterns/${patternId}/print-sets/${set.id}`).expect(200)).body.printSet;
    }
    expect(set.error).toBeNull();
    expect(set.status).toBe('done');
    const key = `print-sets/${owner.user!.id}/${set.id}.pdf`;
    expect((await s.store.stat(key))?.size).toBe(set.bytes);
    expect(fs.existsSync(path.join(t.dataDir, key))).toBe(s.onDisk);

    const whole = await owner.get(set.url).buffer(true).parse(binary).expect(200);
    const pdf = whole.body as Buffer;
    expect(whole.headers['content-type']).toBe('application/pdf');
    expect(whole.headers.etag).toBe(`"${set.sha256}"`);
    expect(pdf.byteLength).toBe(set.bytes);
    expect(sha(pdf)).toBe(set.sha256);
    const from = Math.floor(pdf.byteLength / 3);
    const part = await owner.get(set.url).set('Range', `bytes=${from}-${from + 999}`).buffer(true).parse(binary).expect(206);
    expect((part.body as Buffer).equals(pdf.subarray(from, from + 1000))).toBe(true);

    await owner.del(`/api/patterns/${patternId}/print-sets/${set.id}`).expect(204);
    expect(await s.store.stat(key)).toBeUndefined();
  });

  it('sweeps files no row names and keeps the ones rows name', async () => {
    const up = (await owner.req('post', `/api/patterns/${patternId}/uploads`).attach('file', TINY_PNG, 'kept.png').expect(201)).body.upload;
    await s.store.put(`uploads/${owner.user!.id}/orphan.png`, TINY_PNG);
    expect(await sweepStoredFilesIn(t.ctx.data, s.store)).toEqual([`uploads/${owner.user!.id}/orphan.png`]);
    expect(await s.store.stat(`uploads/${owner.user!.id}/${up.id}.png`)).toBeDefined();
    await owner.get(up.url).expect(200);
  });
});
