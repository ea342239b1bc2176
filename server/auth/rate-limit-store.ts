import type Database from 'better-sqlite3';
import type { ClientRateLimitInfo, Options, Store } from 'express-rate-limit';
import type pg from 'pg';

/** A row as a statement returns it (PostgreSQL answers bigint columns as strings). */
export type RateLimitRow = Record<string, unknown>;

/**
 * The little the rate-limit store needs of a database: run one statement written with `?`
 * placeholders and give back its rows (those of `RETURNING` or `SELECT`; none otherwise). SQLite
 * answers at once, PostgreSQL with a promise; the store awaits either.
 */
export interface RateLimitSql {
  query(sql: string, params: readonly (string | number)[]): RateLimitRow[] | Promise<RateLimitRow[]>;
}

/** {@link RateLimitSql} over a better-sqlite3 connection; statements are prepared once. */
export function sqliteRateLimitSql(sqlite: Database.Database): RateLimitSql {
  const prepared = new Map<string, Database.Statement>();
  return {
    query(sql, params) {
      let stmt = prepared.get(sql);
      if (!stmt) {
        stmt = sqlite.prepare(sql);
        prepared.set(sql, stmt);
      }
      if (stmt.reader) return stmt.all(...params) as RateLimitRow[];
      stmt.run(...params);
      return [];
    },
  };
}

/** {@link RateLimitSql} over a node-postgres pool: `?` placeholders become `$1`, `$2`, … */
export function pgRateLimitSql(pool: pg.Pool): RateLimitSql {
  const numbered = new Map<string, string>();
  return {
    async query(sql, params) {
      let text = numbered.get(sql);
      if (text === undefined) {
        let n = 0;
        text = sql.replace(/\?/g, () => `$${++n}`);
        numbered.set(sql, text);
      }
      const result = await pool.query(text, params as (string | number)[]);
      return result.rows as RateLimitRow[];
    },
  };
}

/**
 * One statement counts a hit: a new key starts at 1 with a fresh window; an existing key whose window
 * has ended starts again at 1 with a fresh window; otherwise its count goes up by one and its window
 * stays. Both `SET` expressions read the row as it was before the update (SQL's rule, kept by SQLite
 * and PostgreSQL), so the two CASEs agree. `INSERT … ON CONFLICT … DO UPDATE … RETURNING` runs on
 * SQLite 3.35+ and PostgreSQL 9.5+; on PostgreSQL concurrent hits on one key wait for each other's row
 * lock, so none is lost. Parameters: key, new window end, now, now.
 */
const INCREMENT = `INSERT INTO rate_limit_hits (key, hits, reset_at) VALUES (?, 1, ?)
ON CONFLICT (key) DO UPDATE SET
  hits = CASE WHEN rate_limit_hits.reset_at <= ? THEN 1 ELSE rate_limit_hits.hits + 1 END,
  reset_at = CASE WHEN rate_limit_hits.reset_at <= ? THEN excluded.reset_at ELSE rate_limit_hits.reset_at END
RETURNING hits, reset_at`;

/** Takes one hit back (a successful request under `skipSuccessfulRequests`), within the window only. */
const DECREMENT = 'UPDATE rate_limit_hits SET hits = hits - 1 WHERE key = ? AND hits > 0 AND reset_at > ?';
const GET = 'SELECT hits, reset_at FROM rate_limit_hits WHERE key = ? AND reset_at > ?';
const RESET = 'DELETE FROM rate_limit_hits WHERE key = ?';
const SWEEP = 'DELETE FROM rate_limit_hits WHERE reset_at <= ?';

/** Removes every count whose window has ended (any limiter's); shared by the stores' lazy sweep. */
export async function sweepRateLimitHits(sql: RateLimitSql, now = Date.now()): Promise<void> {
  await sql.query(SWEEP, [now]);
}

export interface DatabaseRateLimitStoreOptions {
  /** Put before every key, so limiters on one table never share a count (e.g. `signIn/ip/`). */
  prefix: string;
  /** The clock, in epoch milliseconds (tests move it). */
  now?: () => number;
  /** Sweep ended windows lazily from increments (default true). */
  sweep?: boolean;
}

/**
 * An express-rate-limit `Store` that keeps its counts in the `rate_limit_hits` table, so every server
 * instance on one database counts together (issue 18, docs/postgresql.md). One implementation for
 * SQLite and PostgreSQL over {@link RateLimitSql}. Rows whose window has ended are swept at most once
 * per window, by whichever increment comes first after that.
 */
export class DatabaseRateLimitStore implements Store {
  /** Counts are in the database, not in this process. */
  readonly localKeys = false;
  readonly prefix: string;
  private windowMs = 60_000;
  private nextSweepAt = 0;
  private readonly now: () => number;
  private readonly sweep: boolean;

  constructor(
    private readonly sql: RateLimitSql,
    options: DatabaseRateLimitStoreOptions,
  ) {
    this.prefix = options.prefix;
    this.now = options.now ?? Date.now;
    this.sweep = options.sweep ?? true;
  }

  init(options: Options): void {
    this.windowMs = options.windowMs;
  }

  async increment(key: string): Promise<ClientRateLimitInfo> {
    const now = this.now();
    if (this.sweep && now >= this.nextSweepAt) {
      this.nextSweepAt = now + this.windowMs;
      await sweepRateLimitHits(this.sql, now);
    }
    const rows = await this.sql.query(INCREMENT, [this.prefix + key, now + this.windowMs, now, now]);
    return toInfo(rows[0]);
  }

  async decrement(key: string): Promise<void> {
    await this.sql.query(DECREMENT, [this.prefix + key, this.now()]);
  }

  async resetKey(key: string): Promise<void> {
    await this.sql.query(RESET, [this.prefix + key]);
  }

  async get(key: string): Promise<ClientRateLimitInfo | undefined> {
    const rows = await this.sql.query(GET, [this.prefix + key, this.now()]);
    return rows[0] ? toInfo(rows[0]) : undefined;
  }
}

function toInfo(row: RateLimitRow | undefined): ClientRateLimitInfo {
  if (!row) throw new Error('rate_limit_hits: the count statement returned no row');
  return { totalHits: Number(row['hits']), resetTime: new Date(Number(row['reset_at'])) };
}
