/**
 * Opens the server's database from its settings (issue 18, docs/postgresql.md): PostgreSQL when
 * DATABASE_URL is set, else SQLite in the data folder. Both are migrated on open. What else lives
 * where the database is follows it: stored files (the data folder, or PostgreSQL's chunk tables) and
 * the rate-limit counts.
 */
import type { Config } from '../config';
import { pgRateLimitSql, sqliteRateLimitSql, type RateLimitSql } from '../auth/rate-limit-store';
import { DiskFileStore } from '../storage/disk-store';
import type { FileStore } from '../storage/file-store';
import { PgFileStore } from '../storage/pg-store';
import { pgData, sqliteData, type Data } from './data';
import { openDatabase, type DatabaseHandle } from './database';
import { openPostgres, type PgDatabaseHandle } from './postgres';

export interface OpenedData {
  data: Data;
  /** Stored files: the data folder with SQLite, the database with PostgreSQL. */
  files: FileStore;
  /** Where rate-limit counts are kept (the same database). */
  rateLimitSql: RateLimitSql;
  /** The SQLite file, with SQLite. */
  sqlite: DatabaseHandle | undefined;
  /** The PostgreSQL pool, with PostgreSQL. */
  postgres: PgDatabaseHandle | undefined;
  /** Where the data is, for the start-up line (a PostgreSQL URL without its password). */
  where: string;
  close(): Promise<void>;
}

export interface OpenDataOptions {
  /** Most PostgreSQL connections this instance opens (default 10). */
  poolSize?: number;
}

export async function openData(config: Pick<Config, 'dataDir' | 'databaseUrl'>, options: OpenDataOptions = {}): Promise<OpenedData> {
  if (config.databaseUrl) {
    const postgres = await openPostgres(config.databaseUrl, { max: options.poolSize });
    return {
      data: pgData(postgres),
      files: new PgFileStore(postgres.pool),
      rateLimitSql: pgRateLimitSql(postgres.pool),
      sqlite: undefined,
      postgres,
      where: postgres.displayUrl,
      close: () => postgres.close(),
    };
  }
  const sqlite = openDatabase(config.dataDir);
  return {
    data: sqliteData(sqlite),
    files: new DiskFileStore(config.dataDir),
    rateLimitSql: sqliteRateLimitSql(sqlite.sqlite),
    sqlite,
    postgres: undefined,
    where: config.dataDir,
    close: async () => sqlite.close(),
  };
}
