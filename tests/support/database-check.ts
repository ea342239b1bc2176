/**
 * Reads the server's SQLite file directly, read-only, after the server has been stopped: integrity
 * check, foreign-key check and a few row queries the fault tests compare with what the API answered.
 */
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import Database from 'better-sqlite3';

/** File name of the database inside the data folder (server/db/database.ts). */
export const DATABASE_FILE = 'seamwright.db';

export interface DatabaseReport {
  integrity: string[];
  foreignKeyProblems: unknown[];
  journalMode: string;
}

/** Opens the data folder's database read-only and runs `fn` on it. */
export function withReadOnlyDatabase<T>(dataDir: string, fn: (db: Database.Database) => T): T {
  const db = new Database(path.join(dataDir, DATABASE_FILE), { readonly: true, fileMustExist: true });
  try {
    return fn(db);
  } finally {
    db.close();
  }
}

/** `PRAGMA integrity_check` (rows; ["ok"] when sound), `PRAGMA foreign_key_check` and the journal mode. */
export function checkDatabase(dataDir: string): DatabaseReport {
  return withReadOnlyDatabase(dataDir, (db) => ({
    integrity: (db.pragma('integrity_check') as { integrity_check: string }[]).map((r) => r.integrity_check),
    foreignKeyProblems: db.pragma('foreign_key_check') as unknown[],
    journalMode: String(db.pragma('journal_mode', { simple: true })),
  }));
}

/** SHA-256 of a file, hex. */
export function sha256OfFile(file: string): string {
  return crypto.createHash('sha256').update(fs.readFileSync(file)).digest('hex');
}

/** Every file under `dir` (relative paths), recursively. */
export function listFiles(dir: string): string[] {
  if (!fs.existsSync(dir)) return [];
  const out: string[] = [];
  const walk = (rel: string) => {
    for (const entry of fs.readdirSync(path.join(dir, rel), { withFileTypes: true })) {
      const child = rel ? path.join(rel, entry.name) : entry.name;
      if (entry.isDirectory()) walk(child);
      else out.push(child);
    }
  };
  walk('');
  return out.sort();
}
