import type { AppContext } from './app-context';
import type { Config } from './config';
import type { OpenedData } from './db/open-data';
import { MailOutbox, type OutboxOptions } from './services/mail-outbox';
import type { Mailer } from './services/mailer';
import { PrintSetService, printJobOptionsFromEnv } from './services/print-sets';
import { DocumentChecks } from './validation/document-checks';

export interface AppServicesOptions {
  mailer: Mailer;
  log: AppContext['log'];
  /** The environment the print-job settings are read from (PRINT_JOB_*). */
  env: Record<string, string | undefined>;
  /** The database the validation pool's workers store large saves in (PostgreSQL), if any. */
  databaseUrl: string | undefined;
  /** The mail outbox's timing (tests retry sooner). */
  outbox?: Partial<OutboxOptions>;
}

/**
 * The app context's services, made from an opened database: by the server's start-up and by the test
 * harness alike, so both run the same set of services. The outbox's sender is not started here.
 */
export function createAppContext(config: Config, opened: OpenedData, o: AppServicesOptions): AppContext {
  return {
    config,
    data: opened.data,
    files: opened.files,
    rateLimitSql: opened.rateLimitSql,
    mailer: o.mailer,
    mailOutbox: new MailOutbox(opened.data, o.mailer, o.log, o.outbox),
    log: o.log,
    printSets: new PrintSetService(opened.data, config, o.log, opened.files, { ...printJobOptionsFromEnv(o.env), pgPool: opened.postgres?.pool }),
    documentChecks: new DocumentChecks(config.dataDir, undefined, o.databaseUrl),
  };
}

/** Stops the context's services in order (renders, checks, mail), then closes the database. */
export async function closeAppContext(ctx: AppContext, opened: OpenedData): Promise<void> {
  await ctx.printSets.close();
  await ctx.documentChecks.close();
  await ctx.mailOutbox.close();
  ctx.mailer.close();
  await opened.close();
}
