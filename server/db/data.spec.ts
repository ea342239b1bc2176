/**
 * The data layer itself (server/db/data.ts, docs/postgresql.md "Repository code") on both databases:
 * transactions commit and roll back, a nested one is a savepoint, the case-ignoring helpers agree, and
 * each database's own guarantee holds (SQLite: one transaction at a time, none that awaits other work;
 * PostgreSQL: rows taken with lockSkipLocked go to one transaction only).
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import Database from 'better-sqlite3';
import { and, asc, eq, inArray, like, lte, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startPgCluster, type PgCluster } from '../../tests/support/pg-cluster';
import { sqliteData, TransactionAwaitedOtherWork, type Data } from './data';
import { openData, type OpenedData } from './open-data';

const DIALECTS = ['sqlite', 'postgres'] as const;

describe.each(DIALECTS)('Data on %s', (dialect) => {
  let cluster: PgCluster | undefined;
  let opened: OpenedData;
  let dataDir: string;
  let d: Data;
  let n = 0;

  beforeAll(async () => {
    dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'seamwright-data-'));
    if (dialect === 'postgres') cluster = await startPgCluster();
    opened = await openData({ dataDir, databaseUrl: cluster?.url }, { poolSize: 4 });
    d = opened.data;
  });
  afterAll(async () => {
    await opened?.close();
    await cluster?.stop();
    fs.rmSync(dataDir, { recursive: true, force: true });
  });

  /** A user row with a fresh id; `name` is its display name. */
  const user = (name: string) => {
    const id = `u${++n}-${dialect}`;
    return { id, email: `${id}@data.test`, displayName: name, passwordHash: 'x', role: 'designer' as const };
  };
  const names = async (ids: string[]) =>
    (await d.db.select({ name: d.t.users.displayName }).from(d.t.users).where(inArray(d.t.users.id, ids)).orderBy(asc(d.t.users.displayName))).map(
      (r) => r.name,
    );

  it('is the database asked for', () => {
    expect(d.dialect).toBe(dialect);
    expect(d.inTransaction).toBe(false);
  });

  it('commits a transaction that resolves, with its result', async () => {
    const a = user('committed');
    const result = await d.transaction(async (tx) => {
      expect(tx.inTransaction).toBe(true);
      await tx.db.insert(tx.t.users).values(a);
      return (await tx.db.select({ id: tx.t.users.id }).from(tx.t.users).where(eq(tx.t.users.id, a.id)))[0]?.id;
    });
    expect(result).toBe(a.id);
    expect(await names([a.id])).toEqual(['committed']);
  });

  it('rolls back a transaction that throws, and passes the error on', async () => {
    const a = user('rolled back');
    const oops = new Error('oops');
    await expect(
      d.transaction(async (tx) => {
        await tx.db.insert(tx.t.users).values(a);
        expect(await tx.db.select().from(tx.t.users).where(eq(tx.t.users.id, a.id))).toHaveLength(1);
        throw oops;
      }),
    ).rejects.toBe(oops);
    expect(await names([a.id])).toEqual([]);
  });

  it('makes a nested transaction a savepoint: an inner throw rolls back the inner part only', async () => {
    const [outer, inner, kept, after] = [user('outer'), user('inner, thrown'), user('inner, kept'), user('after')];
    await d.transaction(async (tx) => {
      await tx.db.insert(tx.t.users).values(outer);
      await expect(
        tx.transaction(async (sp) => {
          expect(sp.inTransaction).toBe(true);
          await sp.db.insert(sp.t.users).values(inner);
          throw new Error('inner');
        }),
      ).rejects.toThrow('inner');
      await tx.transaction(async (sp) => {
        await sp.db.insert(sp.t.users).values(kept);
      });
      await tx.db.insert(tx.t.users).values(after);
    });
    expect(await names([outer.id, inner.id, kept.id, after.id])).toEqual(['after', 'inner, kept', 'outer']);
  });

  it('rolls back a kept savepoint too when the outer transaction throws', async () => {
    const [outer, inner] = [user('outer, thrown'), user('inner of a thrown outer')];
    await expect(
      d.transaction(async (tx) => {
        await tx.db.insert(tx.t.users).values(outer);
        await tx.transaction(async (sp) => {
          await sp.db.insert(sp.t.users).values(inner);
        });
        throw new Error('outer');
      }),
    ).rejects.toThrow('outer');
    expect(await names([outer.id, inner.id])).toEqual([]);
  });

  it('matches LIKE patterns ignoring ASCII case, with backslash escapes, the same on both', async () => {
    const rows = ['Orchard Wheel', 'ORCHARD gate', 'orchard', 'Marigold_Ink', 'Marigold-Ink', 'Plum'].map((name) => ({
      ...user(name),
      email: `${name.replace(/\W/g, '').toLowerCase()}-like-${dialect}@data.test`,
    }));
    await d.db.insert(d.t.users).values(rows);
    const ids = rows.map((r) => r.id);
    const matching = async (pattern: string) =>
      (
        await d.db
          .select({ name: d.t.users.displayName })
          .from(d.t.users)
          .where(and(inArray(d.t.users.id, ids), d.likeIgnoringCase(d.t.users.displayName, pattern)))
          .orderBy(asc(d.t.users.displayName))
      ).map((r) => r.name);
    expect(await matching('%orchard%')).toEqual(['ORCHARD gate', 'Orchard Wheel', 'orchard']);
    expect(await matching('orchard')).toEqual(['orchard']);
    // `\_` is a literal underscore, `_` any one character.
    expect(await matching('marigold\\_%')).toEqual(['Marigold_Ink']);
    expect(await matching('marigold_ink')).toEqual(['Marigold-Ink', 'Marigold_Ink']);
    // Drizzle's plain `like` is case-sensitive on PostgreSQL: the helper is what makes both agree.
    if (dialect === 'postgres') {
      const plain = await d.db.select({ name: d.t.users.displayName }).from(d.t.users).where(and(inArray(d.t.users.id, ids), like(d.t.users.displayName, '%orchard%')));
      expect(plain.map((r) => r.name)).toEqual(['orchard']);
    }
  });

  it('sorts text ignoring case the same on both', async () => {
    const rows = ['banana', 'Cherry', 'apple', 'Banana split', 'APRICOT'].map((name) => ({ ...user(name), email: `${name.replace(/\W/g, '')}-sort-${dialect}@data.test` }));
    await d.db.insert(d.t.users).values(rows);
    const sorted = await d.db
      .select({ name: d.t.users.displayName })
      .from(d.t.users)
      .where(inArray(d.t.users.id, rows.map((r) => r.id)))
      .orderBy(d.textIgnoringCase(d.t.users.displayName));
    expect(sorted.map((r) => r.name)).toEqual(['apple', 'APRICOT', 'banana', 'Banana split', 'Cherry']);
  });

  it('runs raw SQL both dialects accept, with quoted aliases as written', async () => {
    const a = user('raw');
    await d.db.insert(d.t.users).values(a);
    // The id is a bound parameter on both drivers.
    const rows = await d.rows<{ displayName: string; n: number }>(sql`SELECT display_name AS "displayName", 1 + 1 AS "n" FROM users WHERE id = ${a.id}`);
    expect(rows.map((r) => ({ displayName: r.displayName, n: Number(r.n) }))).toEqual([{ displayName: 'raw', n: 2 }]);
  });

  if (dialect === 'sqlite') {
    it('rolls back a transaction that awaits other work (a timer) with TransactionAwaitedOtherWork, leaving nothing', async () => {
      const a = user('awaited a timer');
      await expect(
        d.transaction(async (tx) => {
          await tx.db.insert(tx.t.users).values(a);
          await new Promise((resolve) => setTimeout(resolve, 5));
        }),
      ).rejects.toBeInstanceOf(TransactionAwaitedOtherWork);
      expect(await names([a.id])).toEqual([]);
      // The connection is usable again afterwards.
      const b = user('after the timer');
      await d.transaction(async (tx) => {
        await tx.db.insert(tx.t.users).values(b);
      });
      expect(await names([b.id])).toEqual(['after the timer']);
    });

    it('runs two transactions started at once one after the other', async () => {
      const events: string[] = [];
      const body = (label: string, rows: ReturnType<typeof user>[]) => async (tx: Data) => {
        events.push(`${label} begins`);
        for (const r of rows) {
          await tx.db.insert(tx.t.users).values(r);
          events.push(`${label} wrote ${r.displayName}`);
        }
        events.push(`${label} ends`);
        return rows.length;
      };
      const first = [user('first 1'), user('first 2')];
      const second = [user('second 1'), user('second 2')];
      expect(await Promise.all([d.transaction(body('A', first)), d.transaction(body('B', second))])).toEqual([2, 2]);
      expect(events).toEqual(['A begins', 'A wrote first 1', 'A wrote first 2', 'A ends', 'B begins', 'B wrote second 1', 'B wrote second 2', 'B ends']);
      expect(await names([...first, ...second].map((r) => r.id))).toEqual(['first 1', 'first 2', 'second 1', 'second 2']);
    });

    it('runs the next transaction after one that threw', async () => {
      const a = user('after a throw');
      const [failed, ok] = await Promise.allSettled([
        d.transaction(async () => {
          throw new Error('first fails');
        }),
        d.transaction(async (tx) => {
          await tx.db.insert(tx.t.users).values(a);
          return 'ok';
        }),
      ]);
      expect(failed.status).toBe('rejected');
      expect(ok).toEqual({ status: 'fulfilled', value: 'ok' });
      expect(await names([a.id])).toEqual(['after a throw']);
    });

    it("waits for another connection's write lock with the event loop turning, then runs", async () => {
      // The validation pool's worker writes a large save through a connection of its own like this one.
      const other = new Database(d.sqlite!.name);
      try {
        other.exec('BEGIN IMMEDIATE');
        const a = user('after the other writer');
        let ran = false;
        const started = performance.now();
        const waiting = d.transaction(async (tx) => {
          await tx.db.insert(tx.t.users).values(a);
          ran = true;
        });
        // A timer on this thread fires while the lock is still held: nothing sleeps in SQLite's busy handler.
        const timerAfter = await new Promise<number>((resolve) => setTimeout(() => resolve(performance.now() - started), 30));
        expect(timerAfter).toBeLessThan(1000);
        expect(ran).toBe(false);
        other.exec('COMMIT');
        await waiting;
        expect(await names([a.id])).toEqual(['after the other writer']);
      } finally {
        other.close();
      }
    });

    it("gives up with SQLite's SQLITE_BUSY once the connection's busy timeout has passed, and keeps that timeout", async () => {
      const other = new Database(d.sqlite!.name);
      const mine = new Database(d.sqlite!.name);
      try {
        mine.pragma('busy_timeout = 150');
        const short = sqliteData({ db: d.db, sqlite: mine });
        other.exec('BEGIN IMMEDIATE');
        const started = performance.now();
        await expect(short.transaction(async () => 'never')).rejects.toMatchObject({ code: 'SQLITE_BUSY' });
        expect(performance.now() - started).toBeGreaterThanOrEqual(140);
        expect(mine.pragma('busy_timeout', { simple: true })).toBe(150);
        other.exec('COMMIT');
        expect(await short.transaction(async () => 'now')).toBe('now');
      } finally {
        other.close();
        mine.close();
      }
    });
  }

  if (dialect === 'postgres') {
    it('gives two concurrent transactions taking the same due rows with lockSkipLocked disjoint sets', async () => {
      const { mailOutbox } = d.t;
      const due = new Date(Date.now() - 1000);
      const ids = Array.from({ length: 6 }, (_, i) => `due-${i}`);
      await d.db.insert(mailOutbox).values(ids.map((id) => ({ id, kind: 'test', to: 'a@data.test', subject: id, text: id, nextAttemptAt: due })));
      // Each transaction takes up to four due rows, then holds them until the other has taken its own:
      // both selects run while the other's rows are locked.
      let tookA!: () => void;
      let tookB!: () => void;
      const aTook = new Promise<void>((r) => (tookA = r));
      const bTook = new Promise<void>((r) => (tookB = r));
      const take = (took: () => void, other: Promise<void>) =>
        d.transaction(async (tx) => {
          const rows = await tx.lockSkipLocked(
            tx.db.select({ id: tx.t.mailOutbox.id }).from(tx.t.mailOutbox).where(lte(tx.t.mailOutbox.nextAttemptAt, new Date())).orderBy(asc(tx.t.mailOutbox.id)).limit(4),
          );
          took();
          await other;
          return rows.map((r) => r.id);
        });
      const [a, b] = await Promise.all([take(tookA, bTook), take(tookB, aTook)]);
      expect(a.filter((id) => b.includes(id))).toEqual([]);
      expect([...a, ...b].sort()).toEqual(ids);
      expect([a.length, b.length].sort()).toEqual([2, 4]);
    });
  }
});
