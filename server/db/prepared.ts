import type { DbLike } from './database';

/**
 * Statements built once per database handle and reused (drizzle `.prepare()` with `sql.placeholder`).
 * For hot read queries; a transaction handle gets its own set, built on first use.
 */
export function preparedPerDb<T>(build: (db: DbLike) => T): (db: DbLike) => T {
  const cache = new WeakMap<DbLike, T>();
  return (db) => {
    let q = cache.get(db);
    if (!q) cache.set(db, (q = build(db)));
    return q;
  };
}
