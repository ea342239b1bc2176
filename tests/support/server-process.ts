/**
 * Starts the REAL Seamwright server as a child process for fault, hostile-input and load tests:
 * `node --import tsx server/main.ts` (what `npx tsx server/main.ts` runs, without the extra wrapper
 * process, so a SIGKILL hits the server itself), on 127.0.0.1, with a fresh temporary data folder,
 * NODE_ENV=test and SMTP pointed at an in-process fake mail server. It waits for `GET /api/health`,
 * and can SIGKILL and restart the server on the same port and data folder.
 *
 * Every child is started in its own process group and killed with its group; `stop()` (call it in
 * `afterAll`) also removes the data folder unless `keepDataDir` is set. A process-exit hook kills any
 * child still running if a test run dies early.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { startFakeMailServer, type FakeMailServer } from '../../server/dev/fake-mail-server';

/** Root of the repository (two folders up from this file). */
export const REPO_ROOT = fileURLToPath(new URL('../../', import.meta.url));

export interface StartServerOptions {
  /** Extra environment for the server (wins over the defaults below). */
  env?: Record<string, string>;
  /** Use this data folder instead of a fresh temporary one (it is then not removed on stop). */
  dataDir?: string;
  /** Fixed port; a free one is picked otherwise. The port stays the same across restarts. */
  port?: number;
  /**
   * Words put in front of the node command, e.g. `['prlimit', '--fsize=2000000', '--']` to start
   * the server under a resource limit. The wrapper must exec the command (keep the same pid).
   */
  wrapper?: string[];
  /** How long to wait for the first answered health check. */
  startTimeoutMs?: number;
  /** Reuse a running fake mail server instead of starting one. */
  mail?: FakeMailServer;
  keepDataDir?: boolean;
}

export interface ServerProcess {
  readonly baseUrl: string;
  readonly port: number;
  readonly dataDir: string;
  readonly mail: FakeMailServer;
  /** The running child (undefined between kill and restart). */
  readonly child: ChildProcess | undefined;
  /** The last lines the server wrote to stdout/stderr (for failure messages). */
  output(): string;
  /** How many times the server was started (1 after `startServerProcess`). */
  readonly starts: number;
  /** True while the child has not exited. */
  alive(): boolean;
  /** Sends `signal` (SIGKILL by default) to the server's process group and waits for it to exit. */
  kill(signal?: NodeJS.Signals): Promise<{ code: number | null; signal: NodeJS.Signals | null }>;
  /** Starts the server again (same port, same data folder, same environment) and waits for health. */
  restart(): Promise<void>;
  /** Kills the server, closes the fake mail server (when ours) and removes the temporary data folder. */
  stop(): Promise<void>;
  /** Resolves when the child exits on its own (a crash); never when it is killed through `kill`. */
  readonly crashed: Promise<{ code: number | null; signal: NodeJS.Signals | null; output: string }>;
}

const running = new Set<ChildProcess>();
let exitHookInstalled = false;
function installExitHook() {
  if (exitHookInstalled) return;
  exitHookInstalled = true;
  process.once('exit', () => {
    for (const child of running) killGroup(child, 'SIGKILL');
  });
}

function killGroup(child: ChildProcess, signal: NodeJS.Signals) {
  if (child.pid === undefined) return;
  try {
    process.kill(-child.pid, signal);
  } catch {
    try {
      child.kill(signal);
    } catch {
      // already gone
    }
  }
}

/** A free TCP port on 127.0.0.1 (asks the kernel for one, then closes it). */
export async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.once('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const addr = srv.address();
      const port = typeof addr === 'object' && addr ? addr.port : 0;
      srv.close(() => resolve(port));
    });
  });
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Polls `GET /api/health` until it answers 200 or `timeoutMs` passes. */
export async function waitForHealth(baseUrl: string, timeoutMs: number, isAlive: () => boolean = () => true): Promise<number> {
  const t0 = performance.now();
  for (let attempt = 0; attempt < 10_000; attempt++) {
    if (!isAlive()) throw new Error('the server exited before answering /api/health');
    try {
      const res = await fetch(`${baseUrl}/api/health`, { signal: AbortSignal.timeout(1000) });
      if (res.ok) {
        await res.arrayBuffer();
        return performance.now() - t0;
      }
    } catch {
      // not listening yet
    }
    if (performance.now() - t0 > timeoutMs) break;
    await sleep(25);
  }
  throw new Error(`no answer from ${baseUrl}/api/health within ${timeoutMs} ms`);
}

/** Starts the real server as a child process and waits until it answers health checks. */
export async function startServerProcess(options: StartServerOptions = {}): Promise<ServerProcess> {
  installExitHook();
  const ownMail = !options.mail;
  const mail = options.mail ?? (await startFakeMailServer({ host: '127.0.0.1', smtpPort: 0, httpPort: 0 }));
  const ownDataDir = !options.dataDir;
  const dataDir = options.dataDir ?? fs.mkdtempSync(path.join(os.tmpdir(), 'seamwright-faults-'));
  const port = options.port ?? (await freePort());
  const baseUrl = `http://127.0.0.1:${port}`;
  const env: NodeJS.ProcessEnv = {
    PATH: process.env['PATH'],
    HOME: process.env['HOME'],
    TMPDIR: process.env['TMPDIR'],
    NODE_ENV: 'test',
    PORT: String(port),
    HOST: '127.0.0.1',
    PUBLIC_URL: baseUrl,
    SEAMWRIGHT_DATA_DIR: dataDir,
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(mail.smtpPort),
    MAIL_INBOX_URL: `http://127.0.0.1:${mail.httpPort}`,
    // Cheap hashing keeps sign-ups fast; the cost factor is not under test here.
    BCRYPT_ROUNDS: '4',
    ...options.env,
  };
  const startTimeoutMs = options.startTimeoutMs ?? 60_000;
  const wrapper = options.wrapper ?? [];
  const logLines: string[] = [];
  let child: ChildProcess | undefined;
  let starts = 0;
  let expectedExit = false;
  let resolveCrash!: (v: { code: number | null; signal: NodeJS.Signals | null; output: string }) => void;
  const crashed = new Promise<{ code: number | null; signal: NodeJS.Signals | null; output: string }>((r) => (resolveCrash = r));
  const output = () => logLines.join('');

  const spawnOnce = async () => {
    const [cmd, ...args] = [...wrapper, process.execPath, '--import', 'tsx', 'server/main.ts'];
    expectedExit = false;
    const c = spawn(cmd, args, { cwd: REPO_ROOT, env, detached: true, stdio: ['ignore', 'pipe', 'pipe'] });
    child = c;
    starts++;
    running.add(c);
    const keep = (chunk: Buffer) => {
      logLines.push(chunk.toString());
      if (logLines.length > 200) logLines.splice(0, logLines.length - 200);
    };
    c.stdout?.on('data', keep);
    c.stderr?.on('data', keep);
    c.once('exit', (code, signal) => {
      running.delete(c);
      if (!expectedExit) resolveCrash({ code, signal, output: output() });
    });
    let exited = false;
    c.once('exit', () => (exited = true));
    try {
      await waitForHealth(baseUrl, startTimeoutMs, () => !exited);
    } catch (err) {
      killGroup(c, 'SIGKILL');
      throw new Error(`${(err as Error).message}\n--- server output ---\n${output()}`);
    }
  };

  const kill = async (signal: NodeJS.Signals = 'SIGKILL') => {
    const c = child;
    if (!c || c.exitCode !== null || c.signalCode !== null) {
      child = undefined;
      return { code: c?.exitCode ?? null, signal: c?.signalCode ?? null };
    }
    expectedExit = true;
    const done = new Promise<{ code: number | null; signal: NodeJS.Signals | null }>((resolve) =>
      c.once('exit', (code, sig) => resolve({ code, signal: sig })),
    );
    killGroup(c, signal);
    const timer = setTimeout(() => killGroup(c, 'SIGKILL'), 10_000);
    const result = await done;
    clearTimeout(timer);
    child = undefined;
    return result;
  };

  try {
    await spawnOnce();
  } catch (err) {
    if (ownMail) await mail.close();
    if (ownDataDir && !options.keepDataDir) fs.rmSync(dataDir, { recursive: true, force: true });
    throw err;
  }

  return {
    baseUrl,
    port,
    dataDir,
    mail,
    get child() {
      return child;
    },
    get starts() {
      return starts;
    },
    output,
    alive: () => !!child && child.exitCode === null && child.signalCode === null,
    kill,
    restart: async () => {
      await kill('SIGKILL');
      await spawnOnce();
    },
    stop: async () => {
      await kill('SIGKILL');
      if (ownMail) await mail.close();
      if (ownDataDir && !options.keepDataDir) fs.rmSync(dataDir, { recursive: true, force: true });
    },
    crashed,
  };
}
