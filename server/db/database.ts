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

/** A transaction handle, as passed to `db.transaction(fn)`. */
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
/** Either the database or a transaction inside it. */
export type DbLike = Db | Tx;
