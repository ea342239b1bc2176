/**
 * The database as repository code sees it, one API for SQLite and PostgreSQL (issue 18,
 * docs/postgresql.md "Repository code"). Every query is written once with Drizzle's query builder
 * and awaited; raw SQL only where both dialects accept it, through the few helpers below.
 *
 * Rules for repository code:
 * - `await` every query (`await d.db.select()…`, `await d.db.insert(t).values(v).returning()`).
 *   Never `.get()`, `.all()`, `.run()` or `.values()`: they exist on SQLite alone. One row is
 *   `(await q)[0]`; "how many changed" is `.returning({ id })` and its length.
 * - Tables come from `d.t` (`const { users } = d.t`), never from the schema modules: on PostgreSQL
 *   they are `schema-pg.ts`'s tables, with the same names, columns and row types.
 * - Transactions are `d.transaction(async (tx) => …)` with `tx` another `Data`; never
 *   `d.db.transaction`. On SQLite a transaction may await only the database: the connection is
 *   shared by every request, and a transaction that waited on anything else (a hash, a file, the
 *   network) would let other requests' statements run inside it. It is checked: such a transaction
 *   is rolled back with an error.
 * - `.prepare()` (with `sql.placeholder`) and `await p.execute(values)` work on both.
 */
import type BetterSqlite3 from 'better-sqlite3';
import { sql, type SQL, type SQLWrapper } from 'drizzle-orm';
import type { Db, DatabaseHandle } from './database';
import type { PgDatabaseHandle } from './postgres';
import * as sqliteSchema from './schema';
import * as pgSchema from './schema-pg';

export type Dialect = 'sqlite' | 'postgres';

/** The tables, typed as SQLite's; on PostgreSQL the same names from schema-pg.ts (row types checked equal by the parity spec). */
export type Tables = typeof sqliteSchema;

/** Raw rows as both drivers give them: column names as written in the SQL (quote mixed-case aliases). */
export type RawRow = Record<string, unknown>;

export interface Data {
  readonly dialect: Dialect;
  /**
   * Drizzle's query builder. Typed as the SQLite one; on PostgreSQL it is Drizzle over node-postgres
   * with schema-pg. Await every query (see the rules above).
   */
  readonly db: Db;
  /** The tables of this database. */
  readonly t: Tables;
  /** True inside `transaction`. */
  readonly inTransaction: boolean;
  /**
   * Runs `fn` in one transaction (a savepoint when already inside one): committed when it resolves,
   * rolled back when it throws. SQLite takes the write lock at the start (BEGIN IMMEDIATE), so two
   * writers never deadlock on the upgrade.
   */
  transaction<T>(fn: (tx: Data) => Promise<T>): Promise<T>;
  /** Raw SQL both dialects accept; the rows as the driver gives them. */
  rows<R extends RawRow = RawRow>(query: SQL): Promise<R[]>;
  /** `expr LIKE pattern ESCAPE '\'`, ignoring case the same way on both (ASCII on SQLite, `ILIKE` on PostgreSQL). */
  likeIgnoringCase(expr: SQLWrapper, pattern: string): SQL;
  /** An ORDER BY key that sorts text ignoring case (`COLLATE NOCASE` on SQLite, `lower()` on PostgreSQL). */
  textIgnoringCase(expr: SQLWrapper): SQL;
  /**
   * A select whose rows this transaction takes for itself: `FOR UPDATE SKIP LOCKED` on PostgreSQL, so
   * instances sharing the database never take the same row; unchanged on SQLite, whose one writer
   * (BEGIN IMMEDIATE) already has the table to itself.
   */
  lockSkipLocked<Q>(select: Q): Q;
  /** The better-sqlite3 connection, on SQLite alone (pragmas, backups, the hot routes' statements). */
  readonly sqlite: BetterSqlite3.Database | undefined;
}

const likeSqlite = (expr: SQLWrapper, pattern: string) => sql`${expr} LIKE ${pattern} ESCAPE '\\'`;
const likePg = (expr: SQLWrapper, pattern: string) => sql`${expr} ILIKE ${pattern} ESCAPE '\\'`;

/** Thrown when a SQLite transaction awaited something other than the database (see the rules above). */
export class TransactionAwaitedOtherWork extends Error {
  constructor() {
    super('A SQLite transaction awaited something other than the database; it was rolled back (docs/postgresql.md "Repository code")');
  }
}

/** The SQLite database of the data folder as `Data`. */
export function sqliteData(handle: Pick<DatabaseHandle, 'db' | 'sqlite'>): Data {
  const { sqlite } = handle;
  let savepoints = 0;
  // One transaction at a time on the one connection; the next waits for the one before to end.
  let queue: Promise<unknown> = Promise.resolve();

  const make = (inTransaction: boolean): Data => ({
    dialect: 'sqlite',
    db: handle.db,
    t: sqliteSchema,
    inTransaction,
    sqlite,
    transaction<T>(fn: (tx: Data) => Promise<T>): Promise<T> {
      if (inTransaction) return savepoint(fn);
      const run = queue.then(() => outermost(fn));
      queue = run.catch(() => undefined);
      return run;
    },
    async rows<R extends RawRow>(query: SQL): Promise<R[]> {
      return handle.db.all<R>(query);
    },
    likeIgnoringCase: likeSqlite,
    textIgnoringCase: (expr) => sql`${expr} COLLATE NOCASE`,
    lockSkipLocked: (select) => select,
  });
  const inside = make(true);

  // How long a statement waits for another connection's write lock (set when the database is opened).
  const busyTimeoutMs = Number(sqlite.pragma('busy_timeout', { simple: true })) || 0;

  /**
   * BEGIN IMMEDIATE without sleeping on this thread. While another connection holds the write lock
   * (the validation pool's worker storing a large save: server/validation/document-worker.ts),
   * SQLite's busy handler would sleep right here, stalling the request thread for the whole of that
   * write. Instead the lock is tried without waiting and, while busy, tried again after a timer (the
   * event loop turns meanwhile), until the connection's busy timeout has passed; then SQLite's own
   * SQLITE_BUSY error, as before.
   */
  async function beginImmediate(): Promise<void> {
    const started = Date.now();
    for (let waitMs = 1; ; waitMs = Math.min(waitMs * 2, 20)) {
      sqlite.pragma('busy_timeout = 0');
      try {
        sqlite.exec('BEGIN IMMEDIATE');
        return;
      } catch (err) {
        const code = (err as { code?: unknown }).code;
        if (typeof code !== 'string' || !code.startsWith('SQLITE_BUSY') || Date.now() - started >= busyTimeoutMs) throw err;
      } finally {
        sqlite.pragma(`busy_timeout = ${busyTimeoutMs}`);
      }
      await new Promise((resolve) => setTimeout(resolve, waitMs));
    }
  }

  async function outermost<T>(fn: (tx: Data) => Promise<T>): Promise<T> {
    await beginImmediate();
    // A macrotask that runs before COMMIT means the body waited on something other than SQLite
    // (whose queries resolve at once): other requests may have run statements inside this transaction.
    let otherWork = false;
    const probe = setImmediate(() => (otherWork = true));
    try {
      const result = await fn(inside);
      if (otherWork) throw new TransactionAwaitedOtherWork();
      sqlite.exec('COMMIT');
      return result;
    } catch (err) {
      if (sqlite.inTransaction) sqlite.exec('ROLLBACK');
      throw err;
    } finally {
      clearImmediate(probe);
    }
  }

  async function savepoint<T>(fn: (tx: Data) => Promise<T>): Promise<T> {
    const name = `sw_sp_${++savepoints}`;
    sqlite.exec(`SAVEPOINT ${name}`);
    try {
      const result = await fn(inside);
      sqlite.exec(`RELEASE ${name}`);
      return result;
    } catch (err) {
      if (sqlite.inTransaction) {
        sqlite.exec(`ROLLBACK TO ${name}`);
        sqlite.exec(`RELEASE ${name}`);
      }
      throw err;
    }
  }

  return make(false);
}

type PgLike = PgDatabaseHandle['db'];
type PgTx = Parameters<Parameters<PgLike['transaction']>[0]>[0];

/** A PostgreSQL database (or a transaction in it) as `Data`. */
export function pgData(handle: Pick<PgDatabaseHandle, 'db'>): Data {
  const make = (db: PgLike | PgTx, inTransaction: boolean): Data => ({
    dialect: 'postgres',
    db: db as unknown as Db,
    t: pgSchema as unknown as Tables,
    inTransaction,
    sqlite: undefined,
    transaction<T>(fn: (tx: Data) => Promise<T>): Promise<T> {
      // Drizzle makes a nested transaction a savepoint.
      return (db as PgLike).transaction((tx) => fn(make(tx, true)));
    },
    async rows<R extends RawRow>(query: SQL): Promise<R[]> {
      const result = await (db as PgLike).execute(query);
      return result.rows as R[];
    },
    likeIgnoringCase: likePg,
    textIgnoringCase: (expr) => sql`lower(${expr})`,
    lockSkipLocked: <Q>(select: Q): Q => (select as unknown as { for(strength: 'update', config: { skipLocked: true }): Q }).for('update', { skipLocked: true }),
  });
  return make(handle.db, false);
}
