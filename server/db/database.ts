import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import Database from 'better-sqlite3';
import { drizzle, type BetterSQLite3Database } from 'drizzle-orm/better-sqlite3';
import { migrate } from 'drizzle-orm/better-sqlite3/migrator';
import * as schema from './schema';

export type Db = BetterSQLite3Database<typeof schema>;

/** An open database: the Drizzle handle and the raw connection (for pragmas and closing). */
export interface DatabaseHandle {
  db: Db;
  sqlite: Database.Database;
  file: string;
  close(): void;
}

/** Folder of the committed drizzle-kit migrations. */
export const MIGRATIONS_DIR = fileURLToPath(new URL('../../drizzle', import.meta.url));

/** File name of the database inside the data folder. */
export const DATABASE_FILE = 'seamwright.db';

/**
 * Opens (creating when needed) the database in the data folder, turns on WAL and foreign keys,
 * and applies every pending migration.
 */
export function openDatabase(dataDir: string): DatabaseHandle {
  fs.mkdirSync(dataDir, { recursive: true });
  const file = path.join(dataDir, DATABASE_FILE);
  const sqlite = new Database(file);
  sqlite.pragma('journal_mode = WAL');
  sqlite.pragma('foreign_keys = ON');
  // WAL with synchronous=NORMAL loses nothing when the process dies; only a power cut can lose the
  // last commits (SQLite documentation, "Write-Ahead Logging").
  sqlite.pragma('synchronous = NORMAL');
  sqlite.pragma('busy_timeout = 5000');
  checkWrites(sqlite);
  const db = drizzle(sqlite, { schema });
  migrate(db, { migrationsFolder: MIGRATIONS_DIR });
  return {
    db,
    sqlite,
    file,
    close: () => {
      if (sqlite.open) sqlite.close();
    },
  };
}

/**
 * Makes a failed commit throw for every statement that writes and returns rows (`INSERT/UPDATE/DELETE
 * … RETURNING`). better-sqlite3's `.get()` steps such a statement once and then resets it; outside a
 * transaction SQLite commits at that reset, and better-sqlite3 drops the reset's error, so a commit
 * that failed (a full disk: SQLITE_FULL; a deferred foreign key) came back as a row as if stored.
 * `.all()` steps to the end, where the commit's error is thrown. Every statement drizzle prepares on
 * this connection goes through here, so no route can forget it.
 */
function checkWrites(sqlite: Database.Database): void {
  const prepare = sqlite.prepare.bind(sqlite);
  const checkedPrepare = (source: string) => {
    const stmt = prepare(source);
    if (stmt.reader && !stmt.readonly) {
      const all = stmt.all.bind(stmt);
      stmt.get = ((...params: unknown[]) => all(...params)[0]) as typeof stmt.get;
    }
    return stmt;
  };
  sqlite.prepare = checkedPrepare as typeof sqlite.prepare;
}

/** A transaction handle, as passed to `db.transaction(fn)`. */
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
/** Either the database or a transaction inside it. */
export type DbLike = Db | Tx;
