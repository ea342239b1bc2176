import type { Config } from './config';
import type { DatabaseHandle, Db } from './db/database';
import type { MailOutbox } from './services/mail-outbox';
import type { Mailer } from './services/mailer';
import type { PrintSetService } from './services/print-sets';
import type { DocumentChecks } from './validation/document-checks';

/** Everything a route needs, made once at start and passed down (no module-level state). */
export interface AppContext {
  config: Config;
  database: DatabaseHandle;
  db: Db;
  mailer: Mailer;
  /** Durable outgoing mail: routes enqueue, a background sender delivers with retries. */
  mailOutbox: MailOutbox;
  log: (message: string, err?: unknown) => void;
  /** The print-set renderer (worker threads). */
  printSets: PrintSetService;
  /** Checks large pattern documents off the request thread (a small pool of worker threads). */
  documentChecks: DocumentChecks;
}
