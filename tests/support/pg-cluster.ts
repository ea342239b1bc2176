/**
 * A throwaway PostgreSQL cluster for tests (docs/postgresql.md): a fresh temporary folder holding a
 * copy of an `initdb` template (trust authentication, UTF8, C locale; fsync off), `pg_ctl start` on a free loopback port
 * with its unix socket in that folder, one database created, and `stop()` that shuts the server down
 * and removes the folder. Each caller gets its own cluster, so spec files may run in parallel.
 *
 * initdb refuses to run as root: when the tests run as root (CI does), initdb and pg_ctl run as a
 * non-root user (`postgres`, which Debian's package creates, else `nobody`; SEAMWRIGHT_PG_USER
 * overrides) through `runuser` (or `setpriv` where runuser is missing), in a folder owned by that user.
 *
 * Binaries: initdb/pg_ctl from PATH, else the newest /usr/lib/postgresql/<version>/bin;
 * SEAMWRIGHT_PG_BIN names the folder explicitly.
 */
import { spawn, spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import {
  accessSync,
  chownSync,
  constants,
  existsSync,
  mkdtempSync,
  readdirSync,
  readFileSync,
  realpathSync,
  renameSync,
  rmSync,
  statSync,
} from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir, userInfo } from 'node:os';
import { delimiter, dirname, join } from 'node:path';
import pg from 'pg';

export interface PgCluster {
  /** postgres://seamwright@127.0.0.1:PORT/DATABASE — superuser, no password (trust). */
  readonly url: string;
  readonly port: number;
  readonly database: string;
  readonly user: string;
  /** The temporary folder: data/ (the cluster), server.log, the unix socket. */
  readonly dir: string;
  /** Creates another empty database in this cluster and returns its URL. */
  createDatabase(name: string): Promise<string>;
  /** Stops the server (immediate shutdown) and removes the folder. Safe to call twice. */
  stop(): Promise<void>;
}

export interface PgClusterOptions {
  /** Name of the database created at start (default `seamwright`). */
  database?: string;
}

export interface PgBinaries {
  binDir: string;
  initdb: string;
  pgCtl: string;
}

const SUPERUSER = 'seamwright';
/** The database every cluster starts with (made in the template). */
const TEMPLATE_DATABASE = 'seamwright';
const PORT_LOW = 55400;
const PORT_HIGH = 60999;

function isExecutable(path: string): boolean {
  try {
    accessSync(path, constants.X_OK);
    return true;
  } catch {
    return false;
  }
}

/** Where initdb and pg_ctl are, or null when PostgreSQL's server binaries are not installed. */
export function findPgBinaries(): PgBinaries | null {
  const candidates: string[] = [];
  const explicit = process.env['SEAMWRIGHT_PG_BIN'];
  if (explicit) candidates.push(explicit);
  for (const dir of (process.env['PATH'] ?? '').split(delimiter)) {
    if (!dir) continue;
    const initdb = join(dir, 'initdb');
    // Debian links initdb/pg_ctl into PATH only sometimes; follow the link to the versioned folder.
    if (isExecutable(initdb)) candidates.push(dirname(realpathSync(initdb)));
  }
  const root = '/usr/lib/postgresql';
  if (existsSync(root)) {
    const versions = readdirSync(root)
      .filter((v) => /^\d+(\.\d+)?$/.test(v))
      .sort((a, b) => Number(b) - Number(a));
    for (const v of versions) candidates.push(join(root, v, 'bin'));
  }
  for (const binDir of candidates) {
    const initdb = join(binDir, 'initdb');
    const pgCtl = join(binDir, 'pg_ctl');
    if (isExecutable(initdb) && isExecutable(pgCtl)) return { binDir, initdb, pgCtl };
  }
  return null;
}

interface RunAs {
  /** Prefix for every command: [] when we are not root. */
  prefix: string[];
  uid: number;
  gid: number;
}

function idOf(user: string): { uid: number; gid: number } | null {
  const uid = spawnSync('id', ['-u', user], { encoding: 'utf8' });
  const gid = spawnSync('id', ['-g', user], { encoding: 'utf8' });
  if (uid.status !== 0 || gid.status !== 0) return null;
  return { uid: Number(uid.stdout.trim()), gid: Number(gid.stdout.trim()) };
}

function onPath(name: string): boolean {
  return spawnSync('sh', ['-c', `command -v ${name}`], { stdio: 'ignore' }).status === 0;
}

let runAsCache: RunAs | undefined;

/** How to run initdb/pg_ctl: as ourselves, or (when root) as a non-root user. */
function runAs(): RunAs {
  if (runAsCache) return runAsCache;
  const me = userInfo();
  if (me.uid !== 0) {
    runAsCache = { prefix: [], uid: me.uid, gid: me.gid };
    return runAsCache;
  }
  const wanted = process.env['SEAMWRIGHT_PG_USER'];
  const names = wanted ? [wanted] : ['postgres', 'nobody'];
  for (const name of names) {
    const id = idOf(name);
    if (!id || id.uid === 0) continue;
    if (onPath('runuser')) {
      runAsCache = { prefix: ['runuser', '-u', name, '--'], ...id };
    } else if (onPath('setpriv')) {
      runAsCache = { prefix: ['setpriv', `--reuid=${id.uid}`, `--regid=${id.gid}`, '--clear-groups', '--'], ...id };
    } else {
      break;
    }
    return runAsCache;
  }
  throw new Error(
    `pg-cluster: running as root and found no way to run initdb as another user (tried ${names.join(', ')} ` +
      'with runuser or setpriv); set SEAMWRIGHT_PG_USER to a non-root user',
  );
}

interface RunResult {
  code: number | null;
  output: string;
}

function run(command: string[], timeoutMs = 60_000): Promise<RunResult> {
  const [file, ...args] = [...runAs().prefix, ...command];
  return new Promise((resolve, reject) => {
    // stdin ignored; pg_ctl's server writes to the -l log, not to our pipes, so 'close' comes at once.
    const child = spawn(file!, args, { stdio: ['ignore', 'pipe', 'pipe'], env: { ...process.env, LC_ALL: 'C' } });
    let output = '';
    child.stdout.on('data', (d: Buffer) => (output += d.toString()));
    child.stderr.on('data', (d: Buffer) => (output += d.toString()));
    const timer = setTimeout(() => child.kill('SIGKILL'), timeoutMs);
    child.on('error', (err) => {
      clearTimeout(timer);
      reject(err);
    });
    child.on('close', (code) => {
      clearTimeout(timer);
      resolve({ code, output });
    });
  });
}

function portIsFree(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const server = createServer();
    server.once('error', () => resolve(false));
    server.listen({ port, host: '127.0.0.1', exclusive: true }, () => server.close(() => resolve(true)));
  });
}

async function freePort(): Promise<number> {
  for (let attempt = 0; attempt < 50; attempt++) {
    const port = PORT_LOW + Math.floor(Math.random() * (PORT_HIGH - PORT_LOW + 1));
    if (await portIsFree(port)) return port;
  }
  throw new Error(`pg-cluster: no free loopback port in ${PORT_LOW}..${PORT_HIGH}`);
}

/** Clusters not stopped yet: shut down when the test process exits, whatever happened. */
const running = new Map<string, { pgCtl: string; dataDir: string }>();
let exitHookInstalled = false;

function installExitHook(): void {
  if (exitHookInstalled) return;
  exitHookInstalled = true;
  process.on('exit', () => {
    for (const [dir, { pgCtl, dataDir }] of running) {
      const [file, ...args] = [...runAs().prefix, pgCtl, '-D', dataDir, '-m', 'immediate', '-w', 'stop'];
      spawnSync(file!, args, { stdio: 'ignore', timeout: 10_000 });
      rmSync(dir, { recursive: true, force: true });
    }
    running.clear();
  });
}

/**
 * `pg_ctl start` of the cluster in `dataDir` on a free loopback port, its unix socket and log in
 * `dir`; tracked in `running` so the exit hook stops it if nobody else does. Returns the port.
 */
async function startServer(bins: PgBinaries, dir: string, dataDir: string): Promise<number> {
  const logFile = join(dir, 'server.log');
  let lastFailure = '';
  for (let attempt = 0; attempt < 5; attempt++) {
    const candidate = await freePort();
    // pg_ctl hands -o to a shell: quote the socket folder.
    const serverOptions =
      `-p ${candidate} -k '${dir}' -c listen_addresses=127.0.0.1 ` +
      '-c fsync=off -c synchronous_commit=off -c full_page_writes=off';
    running.set(dir, { pgCtl: bins.pgCtl, dataDir });
    const start = await run([bins.pgCtl, '-D', dataDir, '-l', logFile, '-o', serverOptions, '-w', '-t', '60', 'start']);
    if (start.code === 0) return candidate;
    // Another process may have taken the port between the check and the start: try another.
    running.delete(dir);
    lastFailure = `${start.output}\n${existsSync(logFile) ? readFileSync(logFile, 'utf8') : ''}`;
  }
  throw new Error(`pg-cluster: pg_ctl start failed:\n${lastFailure}`);
}

function initdbArgs(bins: PgBinaries, dataDir: string): string[] {
  return [bins.initdb, '-D', dataDir, '-A', 'trust', '-U', SUPERUSER, '-E', 'UTF8', '--locale=C', '--no-sync', '--no-instructions'];
}

/**
 * initdb is most of a cluster's start (2–6 s here, against under 1 s to copy its result), so it runs
 * once per machine, user and PostgreSQL build into a template folder under the temporary folder
 * (with the default database already made), and each cluster starts from a copy. The template is made in a private folder and renamed into place,
 * so processes racing to make it never see half of one.
 */
async function ensureTemplate(bins: PgBinaries): Promise<string> {
  const who = runAs();
  const build = statSync(bins.initdb);
  const key = createHash('sha256')
    .update(`${realpathSync(bins.initdb)}:${build.size}:${build.mtimeMs}:${SUPERUSER}:UTF8:C:${TEMPLATE_DATABASE}`)
    .digest('hex')
    .slice(0, 12);
  const templateDir = join(tmpdir(), `seamwright-pg-template-${who.uid}-${key}`);
  const templateData = join(templateDir, 'data');
  if (existsSync(join(templateData, 'PG_VERSION'))) return templateData;

  const scratch = mkdtempSync(join(tmpdir(), `seamwright-pg-template-${who.uid}-${key}.`));
  if (userInfo().uid === 0) chownSync(scratch, who.uid, who.gid);
  try {
    const data = join(scratch, 'data');
    const init = await run(initdbArgs(bins, data));
    if (init.code !== 0) throw new Error(`pg-cluster: initdb failed (${init.code}):\n${init.output}`);
    // The default database is made once here too (CREATE DATABASE costs a checkpoint per cluster).
    installExitHook();
    const port = await startServer(bins, scratch, data);
    const created = await createDatabaseIn(port, TEMPLATE_DATABASE).then(
      () => null,
      (err: unknown) => err,
    );
    const stop = await run([bins.pgCtl, '-D', data, '-m', 'fast', '-w', 'stop']);
    running.delete(scratch);
    if (created) throw created;
    if (stop.code !== 0) throw new Error(`pg-cluster: stopping the template failed (${stop.code}):\n${stop.output}`);
    try {
      renameSync(scratch, templateDir);
    } catch (err) {
      // Another process finished first: use its template.
      if (!existsSync(join(templateData, 'PG_VERSION'))) throw err;
    }
  } finally {
    rmSync(scratch, { recursive: true, force: true });
  }
  return templateData;
}

function quoteIdent(name: string): string {
  return `"${name.replace(/"/g, '""')}"`;
}

function urlFor(port: number, database: string): string {
  return `postgres://${SUPERUSER}@127.0.0.1:${port}/${encodeURIComponent(database)}`;
}

async function createDatabaseIn(port: number, name: string): Promise<string> {
  const client = new pg.Client({ connectionString: urlFor(port, 'postgres') });
  await client.connect();
  try {
    await client.query(`CREATE DATABASE ${quoteIdent(name)}`);
  } finally {
    await client.end();
  }
  return urlFor(port, name);
}

/**
 * Starts a fresh cluster (about 1 s on two cores once the initdb template exists; the first one
 * in a machine's life also runs initdb, 2–5 s) and creates one database in it.
 * Throws with an install hint when PostgreSQL's server binaries are missing.
 */
export async function startPgCluster(options: PgClusterOptions = {}): Promise<PgCluster> {
  const bins = findPgBinaries();
  if (!bins) {
    throw new Error(
      'pg-cluster: initdb/pg_ctl not found (PATH, /usr/lib/postgresql/*/bin): install PostgreSQL ' +
        "(Debian: apt-get install -y --no-install-recommends postgresql) or set SEAMWRIGHT_PG_BIN",
    );
  }
  const who = runAs();
  const database = options.database ?? TEMPLATE_DATABASE;
  const dir = mkdtempSync(join(tmpdir(), 'seamwright-pg-'));
  const dataDir = join(dir, 'data');
  if (userInfo().uid === 0) chownSync(dir, who.uid, who.gid);

  const cleanUp = () => rmSync(dir, { recursive: true, force: true });
  try {
    const template = await ensureTemplate(bins);
    const copy = await run(['cp', '-a', template, dataDir]);
    if (copy.code !== 0) throw new Error(`pg-cluster: copying the initdb template failed (${copy.code}):\n${copy.output}`);

    installExitHook();
    const port = await startServer(bins, dir, dataDir);

    const url = database === TEMPLATE_DATABASE ? urlFor(port, database) : await createDatabaseIn(port, database);
    let stopped = false;
    return {
      url,
      port,
      database,
      user: SUPERUSER,
      dir,
      createDatabase: (name: string) => createDatabaseIn(port, name),
      async stop() {
        if (stopped) return;
        stopped = true;
        const stop = await run([bins.pgCtl, '-D', dataDir, '-m', 'immediate', '-w', 'stop']);
        running.delete(dir);
        cleanUp();
        if (stop.code !== 0) throw new Error(`pg-cluster: pg_ctl stop failed (${stop.code}):\n${stop.output}`);
      },
    };
  } catch (err) {
    if (running.has(dir)) {
      await run([bins.pgCtl, '-D', dataDir, '-m', 'immediate', '-w', 'stop']).catch(() => undefined);
      running.delete(dir);
    }
    cleanUp();
    throw err;
  }
}
