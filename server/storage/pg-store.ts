import crypto from 'node:crypto';
import { Readable } from 'node:stream';
import type pg from 'pg';
import { checkKey, type ByteRange, type FileStat, type FileStore, type StoredFile, type SweepOptions } from './file-store';

/** Bytes per chunk row: large enough that a 20 MB PDF is 80 rows, small enough to hold in memory. */
export const DEFAULT_CHUNK_BYTES = 256 * 1024;

/** What the store needs of node-postgres: a `pg.Pool` (shared with the server's database). */
export type PgPool = Pick<pg.Pool, 'connect' | 'query'>;

interface Head {
  file_id: string;
  size: string;
  chunk_bytes: number;
}

/**
 * Stored files in PostgreSQL (docs/file-store.md), in the tables of `pg-file-tables.ts`: a head row per key and
 * its bytes in `bytea` chunks. A write streams its source into chunk rows of a new generation inside one
 * transaction and moves the head to them at the end, so it is all or nothing and never holds more than
 * one chunk in memory. A read fetches one chunk per query as the reader asks for more (no connection
 * is held between chunks); a range read starts at the chunk holding its first byte.
 */
export class PgFileStore implements FileStore {
  constructor(
    private readonly pool: PgPool,
    private readonly chunkBytes = DEFAULT_CHUNK_BYTES,
  ) {}

  async put(key: string, source: Readable | Uint8Array): Promise<StoredFile> {
    checkKey(key);
    return this.transaction(async (client) => {
      const fileId = crypto.randomUUID();
      const hash = crypto.createHash('sha256');
      let size = 0;
      let seq = 0;
      // The chunk being filled; a part that covers whole chunks is stored from its own bytes, uncopied.
      let current = Buffer.allocUnsafe(this.chunkBytes);
      let filled = 0;
      const insert = (data: Buffer) => client.query('INSERT INTO stored_file_chunks (file_id, seq, data) VALUES ($1, $2, $3)', [fileId, seq++, data]);
      const parts: Iterable<Uint8Array> | AsyncIterable<Uint8Array | string> = source instanceof Uint8Array ? [source] : source;
      for await (const part of parts) {
        const chunk = typeof part === 'string' ? Buffer.from(part) : Buffer.from(part.buffer, part.byteOffset, part.byteLength);
        hash.update(chunk);
        size += chunk.byteLength;
        let at = 0;
        while (at < chunk.byteLength) {
          if (filled === 0 && chunk.byteLength - at >= this.chunkBytes) {
            await insert(chunk.subarray(at, at + this.chunkBytes));
            at += this.chunkBytes;
            continue;
          }
          const n = chunk.copy(current, filled, at, Math.min(chunk.byteLength, at + this.chunkBytes - filled));
          filled += n;
          at += n;
          if (filled === this.chunkBytes) {
            await insert(current);
            current = Buffer.allocUnsafe(this.chunkBytes);
            filled = 0;
          }
        }
      }
      if (filled > 0) await insert(current.subarray(0, filled));
      const sha256 = hash.digest('hex');
      await this.replaceHead(client, key, fileId, size, sha256);
      return { size, sha256 };
    });
  }

  async stat(key: string): Promise<FileStat | undefined> {
    const { rows } = await this.pool.query<{ size: string; modified_at: Date }>('SELECT size, modified_at FROM stored_files WHERE key = $1', [checkKey(key)]);
    return rows[0] ? { size: Number(rows[0].size), modifiedAt: rows[0].modified_at } : undefined;
  }

  async openRead(key: string, range?: ByteRange): Promise<Readable | undefined> {
    const { rows } = await this.pool.query<Head>('SELECT file_id, size, chunk_bytes FROM stored_files WHERE key = $1', [checkKey(key)]);
    const head = rows[0];
    if (!head) return undefined;
    const size = Number(head.size);
    const start = range?.start ?? 0;
    const end = range?.end ?? size - 1;
    if (start < 0 || end >= size || (range && start > end)) throw new RangeError(`range ${start}-${end} lies outside ${key} (${size} bytes)`);
    const pool = this.pool;
    const chunkBytes = head.chunk_bytes;
    async function* chunks(): AsyncGenerator<Buffer> {
      for (let seq = Math.floor(start / chunkBytes); seq * chunkBytes <= end; seq++) {
        // Only the wanted bytes of the first and last chunk travel (substring of bytea counts from 1).
        const from = Math.max(start - seq * chunkBytes, 0);
        const to = Math.min(end - seq * chunkBytes, chunkBytes - 1);
        const part = await pool.query<{ data: Buffer }>('SELECT substring(data from $3 for $4) AS data FROM stored_file_chunks WHERE file_id = $1 AND seq = $2', [
          head!.file_id,
          seq,
          from + 1,
          to - from + 1,
        ]);
        const data = part.rows[0]?.data;
        if (!data || data.byteLength !== to - from + 1) throw new Error(`${key} was replaced or removed while it was read`);
        yield data;
      }
    }
    return Readable.from(chunks(), { objectMode: false });
  }

  async copy(fromKey: string, toKey: string): Promise<void> {
    checkKey(toKey);
    await this.transaction(async (client) => {
      const { rows } = await client.query<Head & { sha256: string }>('SELECT file_id, size, chunk_bytes, sha256 FROM stored_files WHERE key = $1', [checkKey(fromKey)]);
      const from = rows[0];
      if (!from) throw Object.assign(new Error(`no stored file ${fromKey}`), { code: 'ENOENT' });
      const fileId = crypto.randomUUID();
      await client.query('INSERT INTO stored_file_chunks (file_id, seq, data) SELECT $1, seq, data FROM stored_file_chunks WHERE file_id = $2', [fileId, from.file_id]);
      await this.replaceHead(client, toKey, fileId, Number(from.size), from.sha256, from.chunk_bytes);
    });
  }

  async remove(keys: readonly string[]): Promise<void> {
    if (keys.length === 0) return;
    // One statement: the heads and their chunks go together.
    await this.pool.query(
      'WITH gone AS (DELETE FROM stored_files WHERE key = ANY($1::text[]) RETURNING file_id) DELETE FROM stored_file_chunks WHERE file_id IN (SELECT file_id FROM gone)',
      [keys.map(checkKey)],
    );
  }

  async sweep(prefixes: readonly string[], keep: (key: string) => boolean, options: SweepOptions = {}): Promise<string[]> {
    const { rows } = await this.pool.query<{ key: string }>(
      'SELECT key FROM stored_files f WHERE EXISTS (SELECT 1 FROM unnest($1::text[]) p WHERE starts_with(f.key, p)) AND modified_at < $2 ORDER BY key',
      [prefixes.map((p) => `${p}/`), options.writtenBefore ?? new Date(8.64e15)],
    );
    const removed = rows.map((r) => r.key).filter((k) => !keep(k));
    await this.remove(removed);
    // Chunks no head names: none are left by a failed write (its transaction rolls back), but a crash
    // of an older version or a hand edit might. A write in progress is not visible here, so it stays.
    await this.pool.query('DELETE FROM stored_file_chunks c WHERE NOT EXISTS (SELECT 1 FROM stored_files f WHERE f.file_id = c.file_id)');
    return removed;
  }

  /** Points `key` at the chunks of `fileId` and drops the chunks it pointed at before. */
  private async replaceHead(client: pg.PoolClient, key: string, fileId: string, size: number, sha256: string, chunkBytes = this.chunkBytes): Promise<void> {
    // Writers of the same key take turns here, so each one sees (and removes) the generation before it.
    await client.query("SELECT pg_advisory_xact_lock(hashtextextended('stored_files:' || $1, 0))", [key]);
    const old = await client.query<{ file_id: string }>('SELECT file_id FROM stored_files WHERE key = $1', [key]);
    await client.query(
      `INSERT INTO stored_files (key, file_id, size, sha256, chunk_bytes, modified_at) VALUES ($1, $2, $3, $4, $5, now())
       ON CONFLICT (key) DO UPDATE SET file_id = excluded.file_id, size = excluded.size, sha256 = excluded.sha256,
         chunk_bytes = excluded.chunk_bytes, modified_at = excluded.modified_at`,
      [key, fileId, size, sha256, chunkBytes],
    );
    if (old.rows[0]) await client.query('DELETE FROM stored_file_chunks WHERE file_id = $1', [old.rows[0].file_id]);
  }

  private async transaction<T>(work: (client: pg.PoolClient) => Promise<T>): Promise<T> {
    const client = await this.pool.connect();
    let broken: Error | undefined;
    try {
      await client.query('BEGIN');
      const result = await work(client);
      await client.query('COMMIT');
      return result;
    } catch (err) {
      await client.query('ROLLBACK').catch((rollbackErr: Error) => (broken = rollbackErr));
      throw err;
    } finally {
      // A connection whose rollback failed is closed rather than handed to the next caller.
      client.release(broken);
    }
  }
}
