/**
 * The file-store contract, run against both homes of stored files: the data folder (disk) and
 * PostgreSQL (a throwaway cluster from tests/support/pg-cluster.ts, its tables made by the committed
 * migrations of drizzle-pg/).
 */
import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { Readable } from 'node:stream';
import { buffer } from 'node:stream/consumers';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seededRandom } from '../../tests/support/random';
import { startPgCluster, type PgCluster } from '../../tests/support/pg-cluster';
import { migratePostgres } from '../db/postgres';
import { DiskFileStore } from './disk-store';
import type { ByteRange, FileStore } from './file-store';
import { DEFAULT_CHUNK_BYTES, PgFileStore } from './pg-store';

interface Home {
  store: FileStore;
  /** What a store keeps besides the files it names: temporary files (disk), chunk rows no head names (PostgreSQL). */
  strays(): Promise<number>;
  /** Bytes of storage held for all files (disk: file sizes; PostgreSQL: chunk bytes). */
  heldBytes(): Promise<number>;
  close(): Promise<void>;
}

async function diskHome(): Promise<Home> {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'seamwright-store-'));
  const all = () => (fs.readdirSync(dir, { recursive: true, withFileTypes: true }) as fs.Dirent[]).filter((e) => e.isFile()).map((e) => path.join(e.parentPath, e.name));
  return {
    store: new DiskFileStore(dir),
    strays: async () => all().filter((f) => path.basename(f).endsWith('.tmp')).length,
    heldBytes: async () => all().reduce((n, f) => n + fs.statSync(f).size, 0),
    close: async () => fs.rmSync(dir, { recursive: true, force: true }),
  };
}

async function pgHome(): Promise<Home> {
  const cluster: PgCluster = await startPgCluster({ database: 'files' });
  const pool = new pg.Pool({ connectionString: cluster.url, max: 6 });
  await migratePostgres(pool);
  const one = async (sql: string) => Number((await pool.query<{ n: string }>(sql)).rows[0]!.n);
  return {
    store: new PgFileStore(pool),
    strays: () => one('SELECT count(*) AS n FROM stored_file_chunks c WHERE NOT EXISTS (SELECT 1 FROM stored_files f WHERE f.file_id = c.file_id)'),
    heldBytes: () => one('SELECT coalesce(sum(length(data)), 0) AS n FROM stored_file_chunks'),
    close: async () => {
      await pool.end();
      await cluster.stop();
    },
  };
}

/** Bytes from the shared seeded generator (tests/support/random.ts). */
function bytes(n: number, seed: number): Buffer {
  const next = seededRandom(seed);
  const out = Buffer.alloc(n);
  for (let i = 0; i < n; i++) out[i] = Math.floor(next() * 256);
  return out;
}

/** A stream of `data` in uneven pieces (never aligned with a chunk), as a network body arrives. */
function pieces(data: Buffer, size = 100_003): Readable {
  return Readable.from(
    (function* () {
      for (let at = 0; at < data.byteLength; at += size) yield data.subarray(at, at + size);
    })(),
  );
}

/** A stream that sends `before` bytes, then fails, as a client that hangs up mid-upload. */
function failingAfter(data: Buffer, before: number): Readable {
  return Readable.from(
    (async function* () {
      for (let at = 0; at < before; at += 65_536) yield data.subarray(at, Math.min(at + 65_536, before));
      throw new Error('the source broke off');
    })(),
  );
}

const sha = (b: Uint8Array) => crypto.createHash('sha256').update(b).digest('hex');

async function read(store: FileStore, key: string, range?: ByteRange): Promise<Buffer | undefined> {
  const stream = await store.openRead(key, range);
  return stream ? buffer(stream) : undefined;
}

const THREE_MB = bytes(3 * 1024 * 1024 + 17, 18);
const C = DEFAULT_CHUNK_BYTES;

describe.each([
  ['the data folder', diskHome],
  ['PostgreSQL', pgHome],
])('file store in %s', (_name, makeHome) => {
  let home: Home;
  beforeAll(async () => {
    home = await makeHome();
  }, 120_000);
  afterAll(async () => {
    await home?.close();
  });

  it('stores a 3 MB stream and reads back the same bytes, with their size and SHA-256', async () => {
    const stored = await home.store.put('print-sets/u1/big.pdf', pieces(THREE_MB));
    expect(stored).toEqual({ size: THREE_MB.byteLength, sha256: sha(THREE_MB) });
    const back = await read(home.store, 'print-sets/u1/big.pdf');
    expect(back!.byteLength).toBe(THREE_MB.byteLength);
    expect(sha(back!)).toBe(sha(THREE_MB));
    expect(back!.equals(THREE_MB)).toBe(true);
    const stat = await home.store.stat('print-sets/u1/big.pdf');
    expect(stat?.size).toBe(THREE_MB.byteLength);
    expect(Math.abs(stat!.modifiedAt.getTime() - Date.now())).toBeLessThan(60_000);
    // Whole buffers and pieces larger than a chunk are stored alike.
    for (const [key, source] of [
      ['print-sets/u1/buffer.pdf', THREE_MB],
      ['print-sets/u1/large-pieces.pdf', pieces(THREE_MB, 600_001)],
    ] as const) {
      expect(await home.store.put(key, source), key).toEqual({ size: THREE_MB.byteLength, sha256: sha(THREE_MB) });
      expect((await read(home.store, key))!.equals(THREE_MB), key).toBe(true);
    }
    await home.store.remove(['print-sets/u1/buffer.pdf', 'print-sets/u1/large-pieces.pdf']);
    expect(await home.store.put('uploads/u1/small.png', Buffer.from('tiny'))).toEqual({ size: 4, sha256: sha(Buffer.from('tiny')) });
    expect((await read(home.store, 'uploads/u1/small.png'))!.toString()).toBe('tiny');
  });

  it('reads byte ranges, across chunk boundaries too', async () => {
    const last = THREE_MB.byteLength - 1;
    const ranges: ByteRange[] = [
      { start: 0, end: 0 },
      { start: C - 1, end: C },
      { start: C, end: 2 * C - 1 },
      { start: C - 5, end: 3 * C + 5 },
      { start: 1000, end: last },
      { start: last, end: last },
      { start: 0, end: last },
    ];
    for (const r of ranges) {
      const part = await read(home.store, 'print-sets/u1/big.pdf', r);
      expect(part!.byteLength, `${r.start}-${r.end}`).toBe(r.end - r.start + 1);
      expect(part!.equals(THREE_MB.subarray(r.start, r.end + 1)), `${r.start}-${r.end}`).toBe(true);
    }
  });

  it('stores an empty file', async () => {
    expect(await home.store.put('uploads/u0/empty.png', Readable.from([]))).toEqual({ size: 0, sha256: sha(Buffer.alloc(0)) });
    expect((await home.store.stat('uploads/u0/empty.png'))?.size).toBe(0);
    expect((await read(home.store, 'uploads/u0/empty.png'))!.byteLength).toBe(0);
    await home.store.remove(['uploads/u0/empty.png']);
  });

  it('answers nothing for a key with no file, and refuses keys that are not plain relative paths', async () => {
    expect(await home.store.stat('uploads/nobody/none.png')).toBeUndefined();
    expect(await home.store.openRead('uploads/nobody/none.png')).toBeUndefined();
    for (const bad of ['../outside', '/etc/passwd', 'uploads//x', 'uploads/./x', 'a\\b', '']) {
      await expect(home.store.put(bad, Buffer.from('x')), bad).rejects.toThrow(/not a stored-file key/);
    }
  });

  it('removes files with their bytes, and ignores keys with no file', async () => {
    const before = await home.heldBytes();
    await home.store.put('uploads/u2/gone.png', pieces(THREE_MB.subarray(0, 600_000)));
    expect(await home.heldBytes()).toBe(before + 600_000);
    await home.store.remove(['uploads/u2/gone.png', 'uploads/u2/never.png']);
    expect(await home.store.stat('uploads/u2/gone.png')).toBeUndefined();
    expect(await home.store.openRead('uploads/u2/gone.png')).toBeUndefined();
    expect(await home.heldBytes()).toBe(before);
    expect(await home.strays()).toBe(0);
  });

  it('keeps nothing of a write whose source fails midway, and keeps the file it would have replaced', async () => {
    const before = await home.heldBytes();
    await expect(home.store.put('print-sets/u3/broken.pdf', failingAfter(THREE_MB, 1_000_000))).rejects.toThrow('the source broke off');
    expect(await home.store.stat('print-sets/u3/broken.pdf')).toBeUndefined();
    expect(await home.strays()).toBe(0);
    expect(await home.heldBytes()).toBe(before);

    await home.store.put('print-sets/u3/kept.pdf', Buffer.from('the first version'));
    await expect(home.store.put('print-sets/u3/kept.pdf', failingAfter(THREE_MB, 700_000))).rejects.toThrow('the source broke off');
    expect((await read(home.store, 'print-sets/u3/kept.pdf'))!.toString()).toBe('the first version');
    expect(await home.strays()).toBe(0);
  });

  it('replaces a file whole, dropping the old bytes', async () => {
    await home.store.put('print-sets/u4/again.pdf', pieces(THREE_MB.subarray(0, 900_000)));
    const before = await home.heldBytes();
    await home.store.put('print-sets/u4/again.pdf', Buffer.from('second'));
    expect((await read(home.store, 'print-sets/u4/again.pdf'))!.toString()).toBe('second');
    expect(await home.heldBytes()).toBe(before - 900_000 + 6);
  });

  it('stores concurrent writes of different keys, each with its own bytes', async () => {
    const files = Array.from({ length: 8 }, (_, i) => ({ key: `uploads/u5/f${i}.png`, data: bytes(300_000 + i * 7_919, 100 + i) }));
    const stored = await Promise.all(files.map((f) => home.store.put(f.key, pieces(f.data, 32_768 + f.data.byteLength % 1000))));
    expect(stored).toEqual(files.map((f) => ({ size: f.data.byteLength, sha256: sha(f.data) })));
    for (const f of files) expect((await read(home.store, f.key))!.equals(f.data), f.key).toBe(true);
  });

  it('copies a file to another key that outlives the original', async () => {
    await home.store.put('uploads/u6/original.png', pieces(THREE_MB.subarray(0, 2 * C + 3)));
    await home.store.copy('uploads/u6/original.png', 'uploads/u7/copy.png');
    await home.store.remove(['uploads/u6/original.png']);
    expect((await read(home.store, 'uploads/u7/copy.png'))!.equals(THREE_MB.subarray(0, 2 * C + 3))).toBe(true);
    await expect(home.store.copy('uploads/u6/original.png', 'uploads/u7/other.png')).rejects.toThrow();
    expect(await home.store.stat('uploads/u7/other.png')).toBeUndefined();
  });

  it('sweeps files under the given folders that no row keeps', async () => {
    await home.store.put('uploads/u8/keep.png', Buffer.from('keep'));
    await home.store.put('uploads/u8/orphan.png', Buffer.from('orphan'));
    await home.store.put('elsewhere/u8/untouched.bin', Buffer.from('other folder'));
    const kept = new Set(['uploads/u8/keep.png', 'print-sets/u1/big.pdf', 'uploads/u1/small.png', 'uploads/u7/copy.png', 'print-sets/u3/kept.pdf', 'print-sets/u4/again.pdf']);
    for (let i = 0; i < 8; i++) kept.add(`uploads/u5/f${i}.png`);
    // A file written just now may belong to a row another instance is about to insert: kept.
    expect(await home.store.sweep(['uploads', 'print-sets'], (k) => kept.has(k), { writtenBefore: new Date(Date.now() - 60_000) })).toEqual([]);
    expect(await home.store.stat('uploads/u8/orphan.png')).toBeDefined();
    expect(await home.store.sweep(['uploads', 'print-sets'], (k) => kept.has(k))).toEqual(['uploads/u8/orphan.png']);
    expect(await home.store.stat('uploads/u8/orphan.png')).toBeUndefined();
    expect((await read(home.store, 'uploads/u8/keep.png'))!.toString()).toBe('keep');
    expect((await read(home.store, 'elsewhere/u8/untouched.bin'))!.toString()).toBe('other folder');
    expect(await home.store.sweep(['uploads', 'print-sets'], (k) => kept.has(k))).toEqual([]);
  });
});
