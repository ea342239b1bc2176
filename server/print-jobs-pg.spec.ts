/**
 * Print jobs shared by two instances on one PostgreSQL (issue 18, docs/postgresql.md "Print jobs"):
 * two test servers on the same database, each with its own render pool and pg-boss worker. A set is
 * rendered by one of them only; progress and the end are read from either; a set whose instance stops
 * as if killed mid-render is finished by the other once its job expires. Runs on its own throwaway
 * cluster whatever the test project.
 */
import crypto from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { startPgCluster, type PgCluster } from '../tests/support/pg-cluster';
import { manySheetsDocument } from '../tests/support/documents';
import { Client, startTestServer, userClient, type TestServer } from './test/harness';
import { GIVEN_UP_MESSAGE } from './services/print-sets';

let cluster: PgCluster;
const servers: TestServer[] = [];

beforeAll(async () => {
  cluster = await startPgCluster();
}, 120_000);
afterAll(async () => {
  for (const s of servers) await s.close();
  await cluster?.stop();
}, 120_000);

/** Two servers on one new database of the cluster; the first one's schema and queue are made before the second starts. */
async function pair(name: string, env: Record<string, string>): Promise<[TestServer, TestServer]> {
  const url = await cluster.createDatabase(name);
  const a = await startTestServer({ DATABASE_URL: url, PRINT_WORKERS: '1', ...env });
  servers.push(a);
  await a.ctx.printSets.whenIdle(); // the job queue has started
  const b = await startTestServer({ DATABASE_URL: url, PRINT_WORKERS: '1', ...env });
  servers.push(b);
  await b.ctx.printSets.whenIdle();
  return [a, b];
}

async function waitEnded(c: Client, patternId: string, setId: string, seconds = 180) {
  for (let i = 0; i < seconds * 10; i++) {
    const set = (await c.get(`/api/patterns/${patternId}/print-sets/${setId}`).expect(200)).body.printSet;
    if (set.status === 'done' || set.status === 'failed') return set;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error('print set did not finish');
}

/** Waits until one of the two renders the set and has written progress; that one, the other, and a reader of the set's row. */
async function whileRendering(a: TestServer, b: TestServer, setId: string) {
  const { printSets } = a.ctx.data.t;
  const row = async () => (await a.ctx.data.db.select().from(printSets).where(eq(printSets.id, setId)))[0]!;
  for (let i = 0; i < 1200; i++) {
    const r = await row();
    if (r.status === 'done' || r.status === 'failed') throw new Error(`the set ended before the test could stop its instance: ${r.status}`);
    const renderer = r.status === 'rendering' && r.progress > 0 ? [a, b].find((s) => s.ctx.printSets.activeCount > 0) : undefined;
    if (renderer) return { row, renderer, survivor: renderer === a ? b : a };
    await new Promise((res) => setTimeout(res, 100));
  }
  throw new Error('no instance took the set');
}

async function storedSha(t: TestServer, key: string): Promise<string | undefined> {
  const stream = await t.ctx.files.openRead(key);
  if (!stream) return undefined;
  const hash = crypto.createHash('sha256');
  for await (const c of stream) hash.update(c as Uint8Array);
  return hash.digest('hex');
}

describe('print jobs on PostgreSQL with two instances', () => {
  it('renders each set once, on either instance, and both answer its progress and file', async () => {
    const [a, b] = await pair('jobs_once', { PRINT_JOB_POLL_MS: '200' });
    const owner = await userClient(a.app, 'owner@jobs.test', 'designer');
    const other = await userClient(b.app, 'other@jobs.test', 'designer');
    // Sets of some 70 sheets: each render outlasts a poll, so while one instance renders (one thread
    // each here) the other takes the next job, however quickly a set renders on this machine.
    const mine = (await owner.post('/api/patterns', { document: manySheetsDocument(25, 'Jobs A') }).expect(201)).body.pattern.id as string;
    const theirs = (await other.post('/api/patterns', { document: manySheetsDocument(25, 'Jobs B') }).expect(201)).body.pattern.id as string;
    // Four sets asked of A and two of B: either instance takes any of them.
    const asked: [Client, string, string][] = [];
    for (const paper of ['letter', 'a4', 'legal', 'a3']) asked.push([owner, mine, (await owner.post(`/api/patterns/${mine}/print-sets`, { options: { paper } }).expect(202)).body.printSet.id]);
    for (const paper of ['letter', 'a4']) asked.push([other, theirs, (await other.post(`/api/patterns/${theirs}/print-sets`, { options: { paper } }).expect(202)).body.printSet.id]);
    const ended = [];
    for (const [c, p, id] of asked) ended.push(await waitEnded(c, p, id));
    expect(ended.map((s) => s.status)).toEqual(['done', 'done', 'done', 'done', 'done', 'done']);
    await a.ctx.printSets.whenIdle();
    await b.ctx.printSets.whenIdle();
    const [ra, rb] = [a.ctx.printSets.renders, b.ctx.printSets.renders];
    console.log(`six sets: instance A rendered ${ra.stored}, instance B ${rb.stored}`);
    // Each set rendered exactly once between the two, and both instances took work.
    expect(ra.started + rb.started).toBe(6);
    expect(ra.stored + rb.stored).toBe(6);
    expect(ra.stored).toBeGreaterThan(0);
    expect(rb.stored).toBeGreaterThan(0);
    // The file is read from the shared store by either instance, the bytes the row names.
    for (const s of ended) {
      const key = `print-sets/${s.createdBy.id}/${s.id}.pdf`;
      expect(await storedSha(a, key)).toBe(s.sha256);
      expect(await storedSha(b, key)).toBe(s.sha256);
    }
  }, 300_000);

  it('a set whose instance stops as if killed mid-render is rendered again and finished by the other', async () => {
    // Short expiry: a job still active 4 s after it was taken goes to the other instance.
    const [a, b] = await pair('jobs_killed', {
      PRINT_JOB_EXPIRE_SECONDS: '4',
      PRINT_JOB_EXPIRY_CHECK_SECONDS: '1',
      PRINT_JOB_RETRY_DELAY_SECONDS: '0',
      PRINT_JOB_POLL_MS: '200',
    });
    const owner = await userClient(a.app, 'owner@killed.test', 'designer');
    // Enough sheets that the render is still going when its instance stops.
    const id = (await owner.post('/api/patterns', { document: manySheetsDocument(80, 'Killed') }).expect(201)).body.pattern.id as string;
    const setId = (await owner.post(`/api/patterns/${id}/print-sets`, { options: {} }).expect(202)).body.printSet.id as string;
    const { row, renderer, survivor } = await whileRendering(a, b, setId);
    const progressAtKill = (await row()).progress;
    await renderer.ctx.printSets.stopAsIfKilled();
    // Nothing was stored by the stopped instance: no file, the row still rendering.
    expect(await a.ctx.files.stat(`print-sets/${owner.user!.id}/${setId}.pdf`)).toBeUndefined();
    expect((await row()).status).toBe('rendering');

    const viaSurvivor = await Client.create(survivor.app);
    await viaSurvivor.signIn('owner@killed.test');
    const set = await waitEnded(viaSurvivor, id, setId);
    console.log(`stopped at progress ${progressAtKill.toFixed(2)}; finished by the other instance`);
    expect(set.status).toBe('done');
    expect(survivor.ctx.printSets.renders.stored).toBe(1);
    expect(renderer.ctx.printSets.renders.stored).toBe(0);
    expect(await storedSha(survivor, `print-sets/${owner.user!.id}/${setId}.pdf`)).toBe(set.sha256);
  }, 300_000);

  it('a set whose every try is stopped as if killed is marked failed by the other instance, not left rendering', async () => {
    // No retry: the first expiry uses up the job, and pg-boss moves it to the given-up queue.
    const [a, b] = await pair('jobs_given_up', {
      PRINT_JOB_EXPIRE_SECONDS: '4',
      PRINT_JOB_EXPIRY_CHECK_SECONDS: '1',
      PRINT_JOB_RETRY_LIMIT: '0',
      PRINT_JOB_POLL_MS: '200',
    });
    const owner = await userClient(a.app, 'owner@given-up.test', 'designer');
    const id = (await owner.post('/api/patterns', { document: manySheetsDocument(80, 'Given up') }).expect(201)).body.pattern.id as string;
    const setId = (await owner.post(`/api/patterns/${id}/print-sets`, { options: {} }).expect(202)).body.printSet.id as string;
    const { row, renderer, survivor } = await whileRendering(a, b, setId);
    await renderer.ctx.printSets.stopAsIfKilled();
    expect((await row()).status).toBe('rendering');

    const viaSurvivor = await Client.create(survivor.app);
    await viaSurvivor.signIn('owner@given-up.test');
    const set = await waitEnded(viaSurvivor, id, setId, 120);
    expect(set.status).toBe('failed');
    expect(set.error).toBe(GIVEN_UP_MESSAGE);
    // Nobody rendered it again, and nothing was stored.
    expect(survivor.ctx.printSets.renders.started).toBe(0);
    expect(await a.ctx.files.stat(`print-sets/${owner.user!.id}/${setId}.pdf`)).toBeUndefined();
  }, 300_000);
});
