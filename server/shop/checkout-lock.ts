import { sql } from 'drizzle-orm';
import type { Data } from '../db/data';

/**
 * Runs one checkout at a time per buyer and pattern. A checkout first looks for an open one to offer
 * again, then makes the order and its provider session: two requests at once (a double click, or two
 * instances behind a load balancer) would each make one, and the buyer could pay twice.
 *
 * In one app the checkouts of one key run in turn. On PostgreSQL, `fn` also runs inside a
 * transaction holding a transaction-scoped advisory lock on the key, so instances take turns too; `fn`
 * gets that transaction and runs its queries on it (queries on other connections could wait for a
 * connection that a checkout waiting for the lock holds). On SQLite (one instance) `fn` gets `d`
 * itself and no transaction: a SQLite transaction may not wait on the network (docs/postgresql.md).
 */
export class CheckoutLock {
  /** Checkouts under way in this app, by buyer and pattern: each waits for the one before. */
  private readonly running = new Map<string, Promise<unknown>>();

  constructor(private readonly d: Data) {}

  run<T>(buyerId: string, patternId: string, fn: (db: Data) => Promise<T>): Promise<T> {
    const d = this.d;
    const key = `checkout:${buyerId}:${patternId}`;
    const before = this.running.get(key) ?? Promise.resolve();
    const run = before
      .catch(() => undefined)
      .then(() =>
        d.dialect === 'postgres'
          ? d.transaction(async (tx) => {
              await tx.rows(sql`SELECT pg_advisory_xact_lock(hashtextextended(${key}, 0))`);
              return fn(tx);
            })
          : fn(d),
      );
    this.running.set(key, run);
    const forget = () => {
      if (this.running.get(key) === run) this.running.delete(key);
    };
    run.then(forget, forget);
    return run;
  }
}
