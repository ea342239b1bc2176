/**
 * Two Seamwright servers on one PostgreSQL (issue 18, docs/postgresql.md, README "Running on more than
 * one machine"): two real server processes (`node --import tsx server/main.ts`) started together on a
 * throwaway cluster with the same DATABASE_URL and SEAMWRIGHT_SECRET, different ports and data
 * folders, one fake mail server. A and B stand for two machines behind a load balancer:
 * - a session and a CSRF token made on A are accepted by B, and a sign-out on B ends it on A;
 * - a save on A is read on B, and a stale save on B answers 409 naming A's revision;
 * - a print set asked of B is rendered by either instance and its PDF downloads from both, same bytes;
 * - failed sign-ins split between A and B reach the per-account limit together;
 * - mails asked for on A and B at once are each sent once, whichever outbox takes them;
 * - SIGKILL of the instance rendering a print set: the other instance finishes the set.
 *
 * Everything waits for states (an answer, a set's status), never a fixed time; timeouts are generous
 * because CI runs this on two busy cores.
 */
import crypto from 'node:crypto';
import fs from 'node:fs';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startFakeMailServer, type FakeMailServer } from '../../server/dev/fake-mail-server';
import { ApiClient, newCredentials, type Credentials } from '../support/api-client';
import { gridDocument, manySheetsDocument } from '../support/documents';
import { startPgCluster, type PgCluster } from '../support/pg-cluster';
import { sleep } from '../support/random';
import { startServerProcess, type ServerProcess } from '../support/server-process';

/** Ports of A and B (SW_MULTI_PORT moves them; A and B take the first two, two more the next two). */
const BASE_PORT = Number(process.env['SW_MULTI_PORT'] ?? 4880);
/** Failed sign-ins allowed per account on each instance (and, shared, on both together). */
const SIGNIN_LIMIT = 6;
/**
 * How long a print job may go without its instance showing it alive (every quarter of this) before
 * pg-boss gives it to another instance: short here so the SIGKILL test waits seconds, not a minute
 * (docs/postgresql.md "Print jobs").
 */
const PRINT_JOB_EXPIRE_SECONDS = 15;
const SECRET = 'two-instances-secret-'.padEnd(48, 'z');

let cluster: PgCluster;
let mail: FakeMailServer;
let a: ServerProcess;
let b: ServerProcess;
/** A read-only look at the shared database (what every instance sees). */
let pool: pg.Pool;

function serverEnv(): Record<string, string> {
  return {
    DATABASE_URL: cluster.url,
    SEAMWRIGHT_SECRET: SECRET,
    SIGNIN_LIMIT_PER_ACCOUNT: String(SIGNIN_LIMIT),
    // Every request comes from 127.0.0.1: the per-address limits are not under test.
    SIGNUP_LIMIT_PER_ADDRESS: '200',
    RESET_LIMIT_PER_ADDRESS: '200',
    // One render thread each, so a set renders on one instance at a time and the machine is not oversubscribed.
    PRINT_WORKERS: '1',
    // The print-job settings of server/services/print-sets.ts (printJobOptionsFromEnv): a dead
    // instance's job expires soon, expiry is looked for every 2 s, and it is taken again at once.
    PRINT_JOB_EXPIRE_SECONDS: String(PRINT_JOB_EXPIRE_SECONDS),
    PRINT_JOB_EXPIRY_CHECK_SECONDS: '2',
    PRINT_JOB_RETRY_DELAY_SECONDS: '0',
  };
}

beforeAll(async () => {
  cluster = await startPgCluster();
  pool = new pg.Pool({ connectionString: cluster.url, max: 2 });
  mail = await startFakeMailServer({ host: '127.0.0.1', smtpPort: 0, httpPort: 0 });
  // One after the other (two started at once are a test of their own, below).
  a = await startServerProcess({ port: BASE_PORT, mail, env: serverEnv(), startTimeoutMs: 150_000 });
  b = await startServerProcess({ port: BASE_PORT + 1, mail, env: serverEnv(), startTimeoutMs: 150_000 });
}, 300_000);

afterAll(async () => {
  await a?.stop();
  await b?.stop();
  await mail?.close();
  await pool?.end();
  await cluster?.stop();
});

/** A client on `server` holding the same cookies (session, CSRF) and CSRF token as `from`. */
function sameBrowserOn(server: ServerProcess, from: ApiClient): ApiClient {
  const c = new ApiClient(server.baseUrl);
  for (const [k, v] of from.cookies) c.cookies.set(k, v);
  c.csrfToken = from.csrfToken;
  c.user = from.user;
  return c;
}

/** Signs up on `server`; the credentials and the signed-in client. */
async function signUpOn(server: ServerProcess, name: string): Promise<{ client: ApiClient; credentials: Credentials }> {
  const client = new ApiClient(server.baseUrl);
  const credentials = newCredentials('designer', name);
  await client.signUp(credentials);
  return { client, credentials };
}

/** Calls `read` until `until` holds for its result; throws with the last result after `timeoutMs`. */
async function waitFor<T>(what: string, read: () => Promise<T>, until: (v: T) => boolean, timeoutMs: number, everyMs = 100): Promise<T> {
  const t0 = Date.now();
  let last: T | undefined;
  for (let i = 0; i < 1_000_000; i++) {
    last = await read();
    if (until(last)) return last;
    if (Date.now() - t0 > timeoutMs) break;
    await sleep(everyMs);
  }
  throw new Error(`${what}: not reached within ${timeoutMs} ms; last seen ${JSON.stringify(last)?.slice(0, 500)}`);
}

/** A print set's state as `client` reads it. */
async function printSetOn(client: ApiClient, patternId: string, setId: string) {
  const res = await client.get(`/api/patterns/${patternId}/print-sets/${setId}`);
  expect(res.status, res.text).toBe(200);
  return res.json.printSet as { id: string; status: string; progress: number; sheets: number | null; sha256: string | null; url: string; error: string | null };
}

async function download(client: ApiClient, url: string): Promise<{ status: number; bytes: Buffer; etag: string | null }> {
  const res = await fetch(client.baseUrl + url, { headers: { cookie: client.cookieHeader() }, signal: AbortSignal.timeout(60_000) });
  return { status: res.status, bytes: Buffer.from(await res.arrayBuffer()), etag: res.headers.get('etag') };
}

const sha256 = (bytes: Uint8Array) => crypto.createHash('sha256').update(bytes).digest('hex');

/** The committed PostgreSQL migrations (drizzle-pg/*.sql). */
const migrationFiles = () => fs.readdirSync(new URL('../../drizzle-pg/', import.meta.url)).filter((f) => f.endsWith('.sql'));

describe('two servers on one PostgreSQL', () => {
  it('both answer from the same database (one migration history, applied once)', async () => {
    const migrations = await pool.query<{ n: string }>('SELECT count(*) AS n FROM drizzle.__drizzle_migrations');
    expect(Number(migrations.rows[0].n)).toBe(migrationFiles().length);
    for (const s of [a, b]) expect((await fetch(`${s.baseUrl}/api/health`)).status).toBe(200);
  });

  it('two servers started at the same moment on an empty database both come up (migrations and the print queue made once)', async () => {
    const url = await cluster.createDatabase('started_together');
    const env = { ...serverEnv(), DATABASE_URL: url };
    const started = await Promise.allSettled([
      startServerProcess({ port: BASE_PORT + 2, mail, env, startTimeoutMs: 150_000 }),
      startServerProcess({ port: BASE_PORT + 3, mail, env, startTimeoutMs: 150_000 }),
    ]);
    try {
      for (const s of started) if (s.status === 'rejected') throw s.reason;
      const fresh = new pg.Client({ connectionString: url });
      await fresh.connect();
      try {
        const migrations = await fresh.query<{ n: string }>('SELECT count(*) AS n FROM drizzle.__drizzle_migrations');
        expect(Number(migrations.rows[0].n)).toBe(migrationFiles().length);
        // Both instances answer a signed-in request from the new database.
        const { client } = await signUpOn((started[0] as PromiseFulfilledResult<ServerProcess>).value, 'together');
        const other = sameBrowserOn((started[1] as PromiseFulfilledResult<ServerProcess>).value, client);
        expect((await other.get('/api/auth/me')).status).toBe(200);
      } finally {
        await fresh.end();
      }
    } finally {
      for (const s of started) if (s.status === 'fulfilled') await s.value.stop();
    }
  });

  it('a session and CSRF token made on A are accepted by B; a sign-out on B ends the session on A', async () => {
    const { client: onA, credentials } = await signUpOn(a, 'session');
    const onB = sameBrowserOn(b, onA);
    const me = await onB.get('/api/auth/me');
    expect(me.status, me.text).toBe(200);
    expect(me.json.user.email).toBe(credentials.email);

    // B checks CSRF (no header: 403) and accepts the token A issued.
    const withoutToken = await onB.post('/api/auth/change-password', { currentPassword: credentials.password, newPassword: `${credentials.password}-2` }, { csrf: false });
    expect(withoutToken.status, withoutToken.text).toBe(403);
    const tokenFromA = onA.csrfToken;
    const changed = await onB.post('/api/auth/change-password', { currentPassword: credentials.password, newPassword: `${credentials.password}-2` });
    expect(changed.status, changed.text).toBe(200);
    expect(onB.csrfToken).toBe(tokenFromA);
    // The new password works on A.
    const fresh = new ApiClient(a.baseUrl);
    expect((await fresh.signIn(credentials.email, `${credentials.password}-2`)).status).toBe(200);

    // Signing out on B ends the session everywhere: A no longer knows it.
    expect((await onA.get('/api/auth/me')).status).toBe(200);
    const out = await onB.signOut();
    expect(out.status, out.text).toBe(200);
    const afterOnA = await new ApiClient(a.baseUrl).get('/api/auth/me', { headers: { cookie: onA.cookieHeader() } });
    expect(afterOnA.status).toBe(401);
  });

  it('failed sign-ins split between A and B reach the per-account limit together', async () => {
    const { credentials } = await signUpOn(a, 'limited');
    const statuses: number[] = [];
    // SIGNIN_LIMIT failures, alternating: each instance alone sees only half of the limit.
    for (let i = 0; i < SIGNIN_LIMIT; i++) {
      const res = await new ApiClient((i % 2 === 0 ? a : b).baseUrl).signIn(credentials.email, 'not-the-password-at-all');
      statuses.push(res.status);
    }
    expect(statuses).toEqual(Array.from({ length: SIGNIN_LIMIT }, () => 401));
    // The next attempt is refused on both, even with the right password.
    for (const s of [a, b]) {
      const res = await new ApiClient(s.baseUrl).signIn(credentials.email, credentials.password);
      expect(res.status, res.text).toBe(429);
    }
  });

  it('password-reset mails asked for on A and B at once are each sent once', async () => {
    // Twelve accounts; their resets are asked for all at once, alternately of A and B, so both
    // instances' outboxes send at the same time: each mail must be taken by one of them only.
    const accounts = await Promise.all(Array.from({ length: 12 }, (_, i) => signUpOn(i % 2 === 0 ? a : b, `reset${i}`)));
    const emails = accounts.map((x) => x.credentials.email);
    const asked = await Promise.all(emails.map((email, i) => new ApiClient((i % 2 === 0 ? b : a).baseUrl).post('/api/auth/password-reset', { email })));
    for (const res of asked) expect(res.status, res.text).toBeLessThan(300);
    await Promise.all(emails.map((email) => mail.waitFor(email, 60_000)));
    // Every outbox row is marked sent (by whichever instance sent it); a second sending of any would
    // have reached the inbox by then.
    await waitFor(
      'the outbox rows sent',
      async () => (await pool.query<{ sent: boolean }>('SELECT sent_at IS NOT NULL AS sent FROM mail_outbox WHERE to_address = ANY($1)', [emails])).rows,
      (rows) => rows.length === emails.length && rows.every((r) => r.sent),
      60_000,
    );
    const received = emails.map((email) => mail.messages.filter((m) => m.to.includes(email.toLowerCase())).length);
    expect(received).toEqual(emails.map(() => 1));
  });

  it('a save on A is read on B; a stale save on B answers 409 with A\'s revision', async () => {
    const { client: onA } = await signUpOn(a, 'saver');
    const onB = sameBrowserOn(b, onA);
    const made = await onA.post('/api/patterns', { document: gridDocument('Made on A') });
    expect(made.status, made.text).toBe(201);
    const id = made.json.pattern.id as string;

    const readB = await onB.get(`/api/patterns/${id}`);
    expect(readB.status, readB.text).toBe(200);
    expect(readB.json.pattern.headRevision).toBe(1);

    const saved = await onA.put(`/api/patterns/${id}`, { baseRevision: 1, document: gridDocument('Saved on A') });
    expect(saved.status, saved.text).toBe(200);
    expect(saved.json.revision.number).toBe(2);
    const afterSave = await onB.get(`/api/patterns/${id}`);
    expect(afterSave.json.pattern.headRevision).toBe(2);
    expect(afterSave.json.revision.document.title).toBe('Saved on A');

    // B's editor still holds revision 1: its save is refused, nothing stored.
    const stale = await onB.put(`/api/patterns/${id}`, { baseRevision: 1, document: gridDocument('Stale save on B') });
    expect(stale.status, stale.text).toBe(409);
    expect(stale.json.details.latest.number).toBe(2);
    const onAAfter = await onA.get(`/api/patterns/${id}`);
    expect(onAAfter.json.pattern.headRevision).toBe(2);
    expect(onAAfter.json.revision.document.title).toBe('Saved on A');

    // Saved on top of A's revision, B's save goes through and A reads it.
    const fresh = await onB.put(`/api/patterns/${id}`, { baseRevision: 2, document: gridDocument('Saved on B') });
    expect(fresh.status, fresh.text).toBe(200);
    expect((await onA.get(`/api/patterns/${id}`)).json.revision.document.title).toBe('Saved on B');
  });

  it('a print set asked of B is rendered and downloads from both with the same bytes', async () => {
    const { client: onB } = await signUpOn(b, 'printer');
    const onA = sameBrowserOn(a, onB);
    const made = await onB.post('/api/patterns', { document: gridDocument('Printed on either') });
    expect(made.status, made.text).toBe(201);
    const patternId = made.json.pattern.id as string;
    const asked = await onB.post(`/api/patterns/${patternId}/print-sets`, { options: { copies: 'single' } });
    expect(asked.status, asked.text).toBe(202);
    const setId = asked.json.printSet.id as string;

    // Progress is read from the database: both instances answer the same state while it renders.
    let turn = 0;
    const done = await waitFor(
      'the print set done',
      () => printSetOn(turn++ % 2 === 0 ? onA : onB, patternId, setId),
      (s) => s.status === 'done' || s.status === 'failed',
      180_000,
      200,
    );
    expect(done.status, done.error ?? '').toBe('done');
    const fromA = await printSetOn(onA, patternId, setId);
    expect(fromA).toEqual(await printSetOn(onB, patternId, setId));

    const [fileA, fileB] = await Promise.all([download(onA, done.url), download(onB, done.url)]);
    expect(fileA.status).toBe(200);
    expect(fileB.status).toBe(200);
    expect(fileA.bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(sha256(fileA.bytes)).toBe(done.sha256);
    expect(fileB.bytes.equals(fileA.bytes)).toBe(true);
    expect(fileB.etag).toBe(fileA.etag);
  });

  it('SIGKILL of the instance rendering a print set: the other instance finishes it', async () => {
    const { client: onA } = await signUpOn(a, 'killed');
    const onB = sameBrowserOn(b, onA);
    // About 430 sheets (seconds of rendering): long enough to be caught rendering, even on a quiet machine.
    const made = await onA.post('/api/patterns', { document: manySheetsDocument(150, 'Finished by the other') });
    expect(made.status, made.text).toBe(201);
    const patternId = made.json.pattern.id as string;
    const asked = await onA.post(`/api/patterns/${patternId}/print-sets`, { options: { copies: 'single' } });
    expect(asked.status, asked.text).toBe(202);
    const setId = asked.json.printSet.id as string;

    await waitFor('the print set rendering', () => printSetOn(onA, patternId, setId), (s) => {
      if (s.status === 'done' || s.status === 'failed') throw new Error(`the set ended (${s.status}) before it was seen rendering`);
      return s.status === 'rendering' && s.progress > 0;
    }, 120_000, 50);

    // Which instance renders: the one that logged taking the set's job (print-sets.ts logs it as it
    // starts the render).
    const serverOf = { a, b };
    const taken = `print set ${setId}: rendering here`;
    const renderer = await waitFor(
      'one instance logging that it renders the set',
      async () => ({ a: a.output().includes(taken), b: b.output().includes(taken) }),
      (s) => s.a !== s.b,
      60_000,
      20,
    );
    const lead = renderer.a ? 'a' : 'b';
    const killed = serverOf[lead];
    const onSurvivor = killed === a ? onB : onA;
    await killed.kill('SIGKILL');
    const killedAt = Date.now();
    const atKill = await printSetOn(onSurvivor, patternId, setId);
    expect(atKill.status, 'the set finished before the kill').toBe('rendering');

    // The survivor takes the job over once the dead instance's hold on it ends, and finishes it.
    const done = await waitFor('the print set finished by the survivor', () => printSetOn(onSurvivor, patternId, setId), (s) => s.status === 'done' || s.status === 'failed', 300_000, 250);
    console.log(
      `killed ${killed === a ? 'A' : 'B'} at progress ${atKill.progress.toFixed(2)}; ` +
        `the other finished the set (${done.sheets} sheets) ${((Date.now() - killedAt) / 1000).toFixed(1)} s later (job expiry ${PRINT_JOB_EXPIRE_SECONDS} s)`,
    );
    expect(done.status, done.error ?? '').toBe('done');
    expect(serverOf[lead === 'a' ? 'b' : 'a'].output(), 'the survivor logs taking the job over').toContain(taken);
    expect(done.sheets).toBeGreaterThanOrEqual(150);
    const file = await download(onSurvivor, done.url);
    expect(file.status).toBe(200);
    expect(sha256(file.bytes)).toBe(done.sha256);
    expect(file.bytes.subarray(-32).toString('latin1')).toMatch(/%%EOF\s*$/);

    // The killed instance comes back and serves the same file.
    await killed.restart();
    const again = await download(sameBrowserOn(killed, onA), done.url);
    expect(again.bytes.equals(file.bytes)).toBe(true);
  });
});
