import type BetterSqlite3 from 'better-sqlite3';
import { fillPlaceholders } from 'drizzle-orm';
import type { Data, Tables } from './data';
import type { Db, DbLike } from './database';

/**
 * What statements are cached on: the drizzle session, which a transaction shares with the database
 * it runs on (same connection). Statements prepared once serve every transaction after it.
 */
function cacheKey(db: DbLike): object {
  return (db as unknown as { session?: object }).session ?? db;
}

/**
 * Statements built once per connection from `d.db` and `d.t` (drizzle `.prepare()` with
 * `sql.placeholder`) and run with `await q.execute(values)` on both databases (server/db/data.ts); on
 * PostgreSQL once per pool and once per transaction (node-postgres sends them unnamed).
 */
export function preparedOn<T>(build: (db: Db, t: Tables) => T): (d: Data) => T {
  const cache = new WeakMap<object, T>();
  return (d) => {
    const key = cacheKey(d.db);
    let q = cache.get(key);
    if (!q) cache.set(key, (q = build(d.db, d.t)));
    return q;
  };
}

/** The better-sqlite3 connection under a drizzle handle (the database, or a transaction on it). */
export function connectionOf(db: DbLike): BetterSqlite3.Database {
  return (db as unknown as { session: { client: BetterSqlite3.Database } }).session.client;
}

/**
 * A drizzle query's SQL prepared once as a plain better-sqlite3 statement that gives rows as arrays,
 * the columns in the query's select order: for hot lists whose rows are written out by hand, with no
 * per-row mapping into objects. Placeholders are bound by name as with drizzle's `.prepare()`.
 */
export function rawRowsOf(db: DbLike, query: { toSQL(): { sql: string; params: unknown[] } }): (values: Record<string, unknown>) => unknown[][] {
  const { sql, params } = query.toSQL();
  const statement = connectionOf(db).prepare(sql).raw(true);
  return (values) => statement.all(...fillPlaceholders(params, values)) as unknown[][];
}
