import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { Options } from 'express-rate-limit';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { type PgCluster, startPgCluster } from '../../tests/support/pg-cluster';
import { type DatabaseHandle, openDatabase } from '../db/database';
import { openPostgres, type PgDatabaseHandle } from '../db/postgres';
import {
  DatabaseRateLimitStore,
  pgRateLimitSql,
  type RateLimitSql,
  sqliteRateLimitSql,
} from './rate-limit-store';

const WINDOW_MS = 60_000;
const T0 = Date.UTC(2026, 0, 1);

/** Two connections to one database (two server instances), and a way to read the table directly. */
interface Backend {
  first: RateLimitSql;
  second: RateLimitSql;
  rowCount(): Promise<number>;
  clear(): Promise<void>;
}

interface BackendKind {
  name: string;
  open(): Promise<Backend>;
  close(): Promise<void>;
}

function sqliteBackend(): BackendKind {
  let dir = '';
  let handles: DatabaseHandle[] = [];
  return {
    name: 'SQLite',
    async open() {
      dir = mkdtempSync(path.join(tmpdir(), 'sw-rate-limit-'));
      handles = [openDatabase(dir), openDatabase(dir)];
      const [a, b] = handles as [DatabaseHandle, DatabaseHandle];
      return {
        first: sqliteRateLimitSql(a.sqlite),
        second: sqliteRateLimitSql(b.sqlite),
        rowCount: () => Promise.resolve((a.sqlite.prepare('SELECT count(*) AS n FROM rate_limit_hits').get() as { n: number }).n),
        clear: () => Promise.resolve(void a.sqlite.prepare('DELETE FROM rate_limit_hits').run()),
      };
    },
    async close() {
      for (const h of handles) h.close();
      if (dir) rmSync(dir, { recursive: true, force: true });
    },
  };
}

function pgBackend(): BackendKind {
  let cluster: PgCluster | undefined;
  let handles: PgDatabaseHandle[] = [];
  return {
    name: 'PostgreSQL',
    async open() {
      cluster = await startPgCluster();
      handles = [await openPostgres(cluster.url), await openPostgres(cluster.url)];
      const [a, b] = handles as [PgDatabaseHandle, PgDatabaseHandle];
      return {
        first: pgRateLimitSql(a.pool),
        second: pgRateLimitSql(b.pool),
        rowCount: async () => Number((await a.pool.query<{ n: string }>('SELECT count(*) AS n FROM rate_limit_hits')).rows[0]!.n),
        clear: async () => void (await a.pool.query('DELETE FROM rate_limit_hits')),
      };
    },
    async close() {
      for (const h of handles) await h.close();
      await cluster?.stop();
    },
  };
}

describe.each([sqliteBackend(), pgBackend()])('rate-limit counts in the database: $name', (kind) => {
  let backend: Backend;
  let clock = T0;
  const now = () => clock;

  /** Stores that do not sweep, so the counting statement alone is checked; the last test sweeps. */
  function store(sql: RateLimitSql, prefix = 'signIn/ip/', sweep = false): DatabaseRateLimitStore {
    const s = new DatabaseRateLimitStore(sql, { prefix, now, sweep });
    s.init({ windowMs: WINDOW_MS } as Options);
    return s;
  }

  beforeAll(async () => {
    backend = await kind.open();
  }, 60_000);
  afterAll(() => kind.close());
  beforeEach(async () => {
    clock = T0;
    await backend.clear();
  });

  it('counts hits on a key, with the window set by the first hit', async () => {
    const s = store(backend.first);
    expect(await s.increment('1.2.3.4')).toEqual({ totalHits: 1, resetTime: new Date(T0 + WINDOW_MS) });
    clock = T0 + 10_000;
    expect(await s.increment('1.2.3.4')).toEqual({ totalHits: 2, resetTime: new Date(T0 + WINDOW_MS) });
    clock = T0 + WINDOW_MS - 1;
    expect(await s.increment('1.2.3.4')).toEqual({ totalHits: 3, resetTime: new Date(T0 + WINDOW_MS) });
    expect(await s.increment('5.6.7.8')).toEqual({ totalHits: 1, resetTime: new Date(clock + WINDOW_MS) });
    expect(await s.get('1.2.3.4')).toEqual({ totalHits: 3, resetTime: new Date(T0 + WINDOW_MS) });
  });

  it('starts again at 1 with a new window once the window has ended', async () => {
    const s = store(backend.first);
    await s.increment('k');
    await s.increment('k');
    await s.increment('k');
    clock = T0 + WINDOW_MS;
    expect(await s.get('k')).toBeUndefined();
    expect(await s.increment('k')).toEqual({ totalHits: 1, resetTime: new Date(T0 + 2 * WINDOW_MS) });
    clock = T0 + WINDOW_MS + 5;
    expect(await s.increment('k')).toEqual({ totalHits: 2, resetTime: new Date(T0 + 2 * WINDOW_MS) });
  });

  it('decrement takes one hit back within the window, never below zero', async () => {
    const s = store(backend.first);
    await s.increment('k');
    await s.increment('k');
    await s.decrement('k');
    expect((await s.get('k'))?.totalHits).toBe(1);
    await s.decrement('k');
    await s.decrement('k');
    expect((await s.get('k'))?.totalHits).toBe(0);
    expect((await s.increment('k')).totalHits).toBe(1);
  });

  it('resetKey forgets one key only', async () => {
    const s = store(backend.first);
    await s.increment('a');
    await s.increment('a');
    await s.increment('b');
    await s.resetKey('a');
    expect(await s.get('a')).toBeUndefined();
    expect((await s.increment('a')).totalHits).toBe(1);
    expect((await s.get('b'))?.totalHits).toBe(1);
  });

  it('limiters with different prefixes keep separate counts for the same key', async () => {
    const ip = store(backend.first, 'signIn/ip/');
    const reset = store(backend.first, 'reset/ip/');
    await ip.increment('1.2.3.4');
    await ip.increment('1.2.3.4');
    expect((await reset.increment('1.2.3.4')).totalHits).toBe(1);
    expect((await ip.get('1.2.3.4'))?.totalHits).toBe(2);
  });

  it('two instances on one database share one count (across instances)', async () => {
    const a = store(backend.first);
    const b = store(backend.second);
    expect((await a.increment('k')).totalHits).toBe(1);
    expect((await b.increment('k')).totalHits).toBe(2);
    expect((await a.increment('k')).totalHits).toBe(3);
    await b.decrement('k');
    expect((await a.get('k'))?.totalHits).toBe(2);
    await a.resetKey('k');
    expect((await b.increment('k')).totalHits).toBe(1);
  });

  it('50 hits at once from two instances end at exactly 50, each count given once', async () => {
    const a = store(backend.first);
    const b = store(backend.second);
    const results = await Promise.all(Array.from({ length: 50 }, (_, i) => (i % 2 ? a : b).increment('k')));
    expect(results.map((r) => r.totalHits).sort((x, y) => x - y)).toEqual(Array.from({ length: 50 }, (_, i) => i + 1));
    expect((await a.get('k'))?.totalHits).toBe(50);
  });

  it('sweeps rows whose window has ended, at most once per window', async () => {
    const s = store(backend.first, 'signIn/ip/', true);
    await s.increment('old-1');
    clock = T0 + 1;
    await s.increment('old-2');
    expect(await backend.rowCount()).toBe(2);
    clock = T0 + WINDOW_MS;
    await s.increment('new');
    // old-1 ended at T0 + WINDOW_MS and is gone; old-2 ends 1 ms later and stays.
    expect(await backend.rowCount()).toBe(2);
    expect(await s.get('old-1')).toBeUndefined();
    clock = T0 + WINDOW_MS + 1;
    await s.increment('new');
    // Swept once at T0 + WINDOW_MS: not again within that window, so old-2 (ended now) stays as a row.
    expect(await backend.rowCount()).toBe(2);
    clock = T0 + 2 * WINDOW_MS;
    await s.increment('new');
    expect(await backend.rowCount()).toBe(1);
  });
});
