import type { RateLimitSql } from './auth/rate-limit-store';
import type { Config } from './config';
import type { Data } from './db/data';
import type { MailOutbox } from './services/mail-outbox';
import type { Mailer } from './services/mailer';
import type { PrintSetService } from './services/print-sets';
import type { FileStore } from './storage/file-store';
import type { DocumentChecks } from './validation/document-checks';

/** Everything a route needs, made once at start and passed down (no module-level state). */
export interface AppContext {
  config: Config;
  /** The database, SQLite or PostgreSQL, as repository code sees it (server/db/data.ts). */
  data: Data;
  /** Stored files (print sets, uploads): the data folder with SQLite, the database with PostgreSQL. */
  files: FileStore;
  /** Where rate-limit counts are kept (the same database). */
  rateLimitSql: RateLimitSql;
  mailer: Mailer;
  /** Durable outgoing mail: routes enqueue, a background sender delivers with retries. */
  mailOutbox: MailOutbox;
  log: (message: string, err?: unknown) => void;
  /** The print-set renderer (worker threads). */
  printSets: PrintSetService;
  /** Checks large pattern documents off the request thread (a small pool of worker threads). */
  documentChecks: DocumentChecks;
}
