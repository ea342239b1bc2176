/**
 * Test harness: a real app on a real SQLite file in a temporary folder, mail to the in-process fake.
 * With SEAMWRIGHT_TEST_DATABASE=postgres (the `server-pg` test project), the same app on a fresh
 * database in a throwaway PostgreSQL cluster, one cluster per test file (docs/postgresql.md).
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import type { Express } from 'express';
import { createApp } from '../app';
import type { AppContext } from '../app-context';
import { closeAppContext, createAppContext } from '../app-services';
import { loadConfig } from '../config';
import { openData } from '../db/open-data';
import { startPgCluster, type PgCluster } from '../../tests/support/pg-cluster';
import { createSmtpMailer } from '../services/mailer';
import { sampleBlock } from '../../tests/fixtures/documents';
import { startFakeMailServer, type FakeMailServer } from '../dev/fake-mail-server';

export interface TestServer {
  app: Express;
  ctx: AppContext;
  mail: FakeMailServer;
  dataDir: string;
  close(): Promise<void>;
}

/** Starts an app with its own data folder and fake mail server. `env` overrides settings. */
export async function startTestServer(env: Record<string, string> = {}): Promise<TestServer> {
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'seamwright-test-'));
  const mail = await startFakeMailServer({ smtpPort: 0, httpPort: 0 });
  const config = loadConfig({
    NODE_ENV: 'test',
    SEAMWRIGHT_DATA_DIR: dataDir,
    SEAMWRIGHT_STATIC_DIR: path.join(dataDir, 'no-app'),
    SMTP_PORT: String(mail.smtpPort),
    MAIL_INBOX_URL: `http://127.0.0.1:${mail.httpPort}`,
    PUBLIC_URL: 'http://localhost:4200',
    BCRYPT_ROUNDS: '4',
    ...env,
  });
  const databaseUrl = config.databaseUrl ?? (await testDatabaseUrl());
  const opened = await openData({ dataDir: config.dataDir, databaseUrl }, { poolSize: 5 });
  const mailer = createSmtpMailer(config);
  const errors: unknown[] = [];
  const log = (_m: string, err?: unknown) => errors.push(err);
  // Retries come quickly in tests; the first attempt always goes at once.
  const ctx = createAppContext(config, opened, { mailer, log, env, databaseUrl, outbox: { pollMs: 200, firstRetryMs: 200, maxRetryMs: 1000 } });
  ctx.mailOutbox.start();
  const app = createApp(ctx);
  return {
    app,
    ctx,
    mail,
    dataDir,
    async close() {
      await closeAppContext(ctx, opened);
      await mail.close();
      fs.rmSync(dataDir, { recursive: true, force: true });
    },
  };
}

/** Which database the API tests run on: SQLite unless SEAMWRIGHT_TEST_DATABASE=postgres. */
export const testDatabase: 'sqlite' | 'postgres' = process.env['SEAMWRIGHT_TEST_DATABASE'] === 'postgres' ? 'postgres' : 'sqlite';

let cluster: Promise<PgCluster> | undefined;
let databases = 0;

/** With PostgreSQL: a fresh database in this test file's cluster (started on first use); undefined on SQLite. */
export async function testDatabaseUrl(): Promise<string | undefined> {
  if (testDatabase !== 'postgres') return undefined;
  cluster ??= startPgCluster();
  return (await cluster).createDatabase(`api_${process.pid}_${++databases}`);
}

/**
 * Stops this test file's cluster, if one was started. Run after the file's own hooks (the `server-pg`
 * project's setup file, tests/support/stop-test-cluster.ts): vitest may end a test process without
 * the exit hook that would otherwise stop it.
 */
export async function stopTestCluster(): Promise<void> {
  const started = cluster;
  cluster = undefined;
  if (started) await (await started).stop();
}

type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';

/** A browser-like client: keeps cookies and sends the CSRF token on every request. */
export class Client {
  csrfToken = '';
  user: { id: string; email: string; role: string; displayName: string } | undefined;
  readonly agent: ReturnType<typeof request.agent>;

  constructor(readonly app: Express) {
    this.agent = request.agent(app);
  }

  static async create(app: Express): Promise<Client> {
    const c = new Client(app);
    await c.refreshCsrf();
    return c;
  }

  async refreshCsrf(): Promise<void> {
    const res = await this.agent.get('/api/auth/csrf').expect(200);
    this.csrfToken = res.body.csrfToken;
  }

  req(method: Method, url: string) {
    return this.agent[method](url).set('X-CSRF-Token', this.csrfToken);
  }
  get(url: string) {
    return this.req('get', url);
  }
  post(url: string, body?: object) {
    const r = this.req('post', url);
    return body === undefined ? r : r.send(body);
  }
  put(url: string, body?: object) {
    const r = this.req('put', url);
    return body === undefined ? r : r.send(body);
  }
  patch(url: string, body?: object) {
    const r = this.req('patch', url);
    return body === undefined ? r : r.send(body);
  }
  del(url: string) {
    return this.req('delete', url);
  }

  async signUp(email: string, role: 'designer' | 'quilter' = 'designer', password = 'correct horse battery'): Promise<this> {
    const res = await this.post('/api/auth/sign-up', { email, password, displayName: email.split('@')[0], role });
    if (res.status !== 201) throw new Error(`sign-up failed: ${res.status} ${JSON.stringify(res.body)}`);
    this.csrfToken = res.body.csrfToken;
    this.user = res.body.user;
    return this;
  }

  async signIn(email: string, password = 'correct horse battery') {
    const res = await this.post('/api/auth/sign-in', { email, password });
    if (res.status === 200) {
      this.csrfToken = res.body.csrfToken;
      this.user = res.body.user;
    }
    return res;
  }
}

/** A new client signed up with `email` and `role`. */
export async function userClient(app: Express, email: string, role: 'designer' | 'quilter' = 'designer'): Promise<Client> {
  const c = await Client.create(app);
  return c.signUp(email, role);
}

/** A small valid pattern document: the shared sample block, one 4 × 4 in. section split into two patches. */
export function sampleDocument(title = 'Test block') {
  return sampleBlock(title);
}

/** Pulls the first link with `?token=` out of an e-mail body. */
export function tokenFromMail(text: string): { link: string; token: string } {
  const m = /(https?:\/\/\S+\?token=([A-Za-z0-9_%-]+))/.exec(text);
  if (!m) throw new Error(`no token link in mail: ${text}`);
  return { link: m[1], token: decodeURIComponent(m[2]) };
}

/** A 1 × 1 pixel PNG (a valid file: signature, IHDR, IDAT, IEND). */
export const TINY_PNG = Buffer.from(
  'iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8DwHwAFBQIAX8jx0gAAAABJRU5ErkJggg==',
  'base64',
);

/** Creates a pattern owned by `owner` and adds members directly (the invitation flow has its own tests). */
export async function sharedPattern(
  t: TestServer,
  owner: Client,
  shares: { client: Client; access: 'co-designer' | 'quilter' }[] = [],
  title = 'Shared block',
): Promise<string> {
  const res = await owner.post('/api/patterns', { document: sampleDocument(title) });
  if (res.status !== 201) throw new Error(`create failed: ${res.status} ${JSON.stringify(res.body)}`);
  const id: string = res.body.pattern.id;
  const { members } = t.ctx.data.t;
  for (const s of shares) await t.ctx.data.db.insert(members).values({ patternId: id, userId: s.client.user!.id, access: s.access, createdAt: new Date() });
  return id;
}
