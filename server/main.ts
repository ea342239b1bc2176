import type { Server } from 'node:http';
import { createApp } from './app';
import { closeAppContext, createAppContext } from './app-services';
import { ConfigError, loadConfig } from './config';
import { openData } from './db/open-data';
import { DEMO_ACCOUNTS, seedDemoIfEmpty } from './db/seed';
import { createSmtpMailer } from './services/mailer';
import { startHousekeeping, sweepStoredFilesAtStart } from './services/housekeeping';

function log(message: string, err?: unknown): void {
  const time = new Date().toISOString();
  if (err === undefined) console.log(`${time} ${message}`);
  else console.error(`${time} ${message}`, err);
}

/** Starts Seamwright's server; resolves once it listens. */
export async function startServer(env: NodeJS.ProcessEnv = process.env, argv: string[] = process.argv) {
  const config = loadConfig(env);
  const opened = await openData(config);
  if (config.databaseUrl && !config.secret) {
    // Sessions live in the database, but CSRF tokens are signed with this secret: without one shared
    // secret, another instance refuses the tokens this one gives (README "Running on more than one machine").
    log('DATABASE_URL is set but SEAMWRIGHT_SECRET is not: this instance signs CSRF tokens with a secret of its own, which other instances refuse; give every instance the same SEAMWRIGHT_SECRET');
  }
  const mailer = createSmtpMailer(config);
  const report = config.seedDemo || argv.includes('--seed-demo') ? await seedDemoIfEmpty(opened.data, config.bcryptRounds) : undefined;
  if (report) {
    log(`Seeded demo data: ${report.accountsCreated.length} accounts, patterns: ${report.patternsCreated.join(', ') || 'none'}`);
    for (const a of DEMO_ACCOUNTS) log(`  demo sign-in: ${a.email} / ${a.password} (${a.role})`);
  }
  const swept = await sweepStoredFilesAtStart(opened.data, opened.files);
  if (swept.length > 0) log(`Removed ${swept.length} temporary or orphaned files: ${swept.slice(0, 10).join(', ')}${swept.length > 10 ? ', …' : ''}`);
  const ctx = createAppContext(config, opened, { mailer, log, env, databaseUrl: config.databaseUrl });
  await ctx.printSets.resumeUnfinished();
  ctx.mailOutbox.start();
  const stopHousekeeping = startHousekeeping(opened.data, log);
  const app = createApp(ctx);
  const server: Server = await new Promise((resolve, reject) => {
    const s = app.listen(config.port, config.host, () => resolve(s));
    s.once('error', reject);
  });
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : config.port;
  log(`Seamwright listening on http://${config.host}:${port} (data in ${opened.where})`);
  let closing = false;
  const close = async () => {
    if (closing) return;
    closing = true;
    const closed = new Promise<void>((resolve) => server.close(() => resolve()));
    // Idle keep-alive sockets go now; open streams (print-set events) get two seconds.
    server.closeIdleConnections();
    const force = setTimeout(() => server.closeAllConnections(), 2000);
    await closed;
    clearTimeout(force);
    stopHousekeeping();
    await closeAppContext(ctx, opened);
  };
  return { server, port, ctx, close };
}

const isMain = import.meta.url === `file://${process.argv[1]}` || process.argv[1]?.endsWith('server/main.ts');
if (isMain) {
  startServer()
    .then(({ close }) => {
      const stop = (signal: string) => {
        log(`${signal}: shutting down`);
        close().then(
          () => process.exit(0),
          () => process.exit(1),
        );
      };
      process.once('SIGINT', () => stop('SIGINT'));
      process.once('SIGTERM', () => stop('SIGTERM'));
    })
    .catch((err) => {
      if (err instanceof ConfigError) console.error(err.message);
      else log('Seamwright failed to start', err);
      process.exit(1);
    });
}
