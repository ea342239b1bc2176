import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { spawn, type ChildProcess } from 'node:child_process';
import pg from 'pg';
import { afterAll, describe, expect, it } from 'vitest';
import { startPgCluster, type PgCluster } from '../tests/support/pg-cluster';
import { DEMO_ACCOUNTS } from './db/demo-accounts';

const root = path.resolve(import.meta.dirname, '..');
const pkg = JSON.parse(fs.readFileSync(path.join(root, 'package.json'), 'utf8')) as { version: string };
/** The `server-pg` project runs this file again with PostgreSQL (vitest.config.ts). */
const onPostgres = process.env['SEAMWRIGHT_TEST_DATABASE'] === 'postgres';

interface Started {
  child: ChildProcess;
  port: number;
  /** Everything the process printed so far. */
  output(): string;
  /** Sends SIGTERM and resolves with the exit code. */
  stop(): Promise<number | null>;
}

/** Starts `tsx server/main.ts` with `env` and resolves once it listens. */
async function startProcess(env: Record<string, string>, args: string[] = []): Promise<Started> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/main.ts', ...args], {
    cwd: root,
    env: { ...process.env, PORT: '0', BCRYPT_ROUNDS: '4', NODE_ENV: 'test', ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  const exited = new Promise<number | null>((resolve) => child.once('exit', (code) => resolve(code)));
  const port = await new Promise<number>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`no start within 90 s:\n${output}`)), 90_000);
    const onData = (chunk: Buffer) => {
      output += chunk.toString();
      const m = /listening on http:\/\/127\.0\.0\.1:(\d+)/.exec(output);
      if (m) {
        clearTimeout(timer);
        resolve(Number(m[1]));
      }
    };
    child.stdout.on('data', onData);
    child.stderr.on('data', onData);
    void exited.then((code) => reject(new Error(`exited ${code}:\n${output}`)));
  });
  return {
    child,
    port,
    output: () => output,
    stop: () => {
      child.kill('SIGTERM');
      return exited;
    },
  };
}

async function health(port: number) {
  const res = await fetch(`http://127.0.0.1:${port}/api/health`);
  expect(res.status).toBe(200);
  expect(await res.json()).toEqual({ ok: true, version: pkg.version });
  return res;
}

/** Signs the demo designer in over HTTP (cookies and CSRF token by hand) and lists the titles of their patterns. */
async function demoDesignerPatterns(port: number): Promise<string[]> {
  const base = `http://127.0.0.1:${port}`;
  const cookies = new Map<string, string>();
  const keep = (res: Response) => {
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(';');
      const eq = pair!.indexOf('=');
      cookies.set(pair!.slice(0, eq), pair!.slice(eq + 1));
    }
    return res;
  };
  const cookie = () => [...cookies].map(([k, v]) => `${k}=${v}`).join('; ');
  const csrf = keep(await fetch(`${base}/api/auth/csrf`));
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const designer = DEMO_ACCOUNTS.find((a) => a.role === 'designer')!;
  const signIn = keep(
    await fetch(`${base}/api/auth/sign-in`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', 'x-csrf-token': csrfToken, cookie: cookie() },
      body: JSON.stringify({ email: designer.email, password: designer.password }),
    }),
  );
  expect(signIn.status).toBe(200);
  const list = await fetch(`${base}/api/patterns?scope=owned&sort=title&order=asc`, { headers: { cookie: cookie() } });
  expect(list.status).toBe(200);
  return ((await list.json()) as { items: { title: string }[] }).items.map((p) => p.title);
}

// One database per run: SQLite in the `server` project, PostgreSQL in `server-pg`.
if (!onPostgres) {
  describe('server process on SQLite', () => {
    it('starts with `tsx server/main.ts`, migrates, seeds on --seed-demo, answers /api/health and stops on SIGTERM', async () => {
      const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'seamwright-main-'));
      const server = await startProcess({ SEAMWRIGHT_DATA_DIR: dataDir }, ['--seed-demo']);
      try {
        const res = await health(server.port);
        expect(res.headers.get('content-security-policy')).toContain("default-src 'self'");
        expect(server.output()).toContain('demo sign-in: designer@fernbrook.example');
        expect(await demoDesignerPatterns(server.port)).toEqual(['Garden Gate', 'Orchard Wheel']);
        expect(server.output()).toContain(`(data in ${dataDir})`);
        expect(fs.existsSync(path.join(dataDir, 'seamwright.db'))).toBe(true);
        expect(fs.existsSync(path.join(dataDir, 'seamwright.db-wal'))).toBe(true);
      } finally {
        expect(await server.stop()).toBe(0);
        fs.rmSync(dataDir, { recursive: true, force: true });
      }
    });
  });
}

if (onPostgres) {
  describe('server process on PostgreSQL (DATABASE_URL)', () => {
    let cluster: PgCluster | undefined;
    afterAll(async () => {
      await cluster?.stop();
    });

    it('two instances started together on one empty database migrate it, seed the demo once, name it without its password, answer and stop', async () => {
      cluster = await startPgCluster();
      // A role with a password, so the URL has one to hide (the throwaway cluster trusts loopback, so it is not checked).
      const admin = new pg.Client({ connectionString: cluster.url });
      await admin.connect();
      await admin.query("CREATE ROLE studio LOGIN SUPERUSER PASSWORD 'hush-hush-42'");
      await admin.end();
      const databaseUrl = (await cluster.createDatabase('main_spec')).replace('//seamwright@', '//studio:hush-hush-42@');
      const dirs = [0, 1].map(() => fs.mkdtempSync(path.join(os.tmpdir(), 'seamwright-main-pg-')));
      const servers = await Promise.all(dirs.map((dir) => startProcess({ SEAMWRIGHT_DATA_DIR: dir, DATABASE_URL: databaseUrl, SEAMWRIGHT_SEED_DEMO: '1' })));
      try {
        for (const s of servers) {
          await health(s.port);
          expect(s.output()).toContain(`(data in ${databaseUrl.replace(':hush-hush-42@', ':***@')})`);
          expect(s.output()).not.toContain('hush-hush-42');
          // Nothing of the database lands in the data folder.
          expect(fs.existsSync(path.join(dirs[servers.indexOf(s)]!, 'seamwright.db'))).toBe(false);
        }
        expect(servers.filter((s) => s.output().includes('Seeded demo data')).length).toBe(1);
        // Either instance signs the demo designer in, and lists the designer's two demo patterns.
        for (const s of servers) expect(await demoDesignerPatterns(s.port)).toEqual(['Garden Gate', 'Orchard Wheel']);
        const check = new pg.Client({ connectionString: databaseUrl });
        await check.connect();
        const { rows } = await check.query<{ users: string; patterns: string }>('SELECT (SELECT count(*) FROM users) AS users, (SELECT count(*) FROM patterns) AS patterns');
        await check.end();
        expect(rows[0]).toEqual({ users: '3', patterns: '2' });
      } finally {
        expect(await Promise.all(servers.map((s) => s.stop()))).toEqual([0, 0]);
        for (const dir of dirs) fs.rmSync(dir, { recursive: true, force: true });
      }
    });
  });
}
