/**
 * Two saves on the same base revision at the same moment (issue 18): exactly one stores the next
 * revision and the other gets 409 with the latest, on SQLite and on PostgreSQL, where both
 * transactions really run at once (READ COMMITTED, one pool): never two revisions with one number,
 * never a 500.
 */
import { eq, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { HttpError } from './http/errors';
import { saveRevision, validDocument } from './services/revisions';
import { sampleDocument, startTestServer, testDatabase, userClient, type Client, type TestServer } from './test/harness';

let t: TestServer;
let designer: Client;
beforeAll(async () => {
  t = await startTestServer();
  designer = await userClient(t.app, 'racer@race.test', 'designer');
});
afterAll(async () => {
  await t.close();
});

async function newPattern(title: string): Promise<string> {
  const res = await designer.post('/api/patterns', { document: sampleDocument(title) }).expect(201);
  return res.body.pattern.id as string;
}

async function revisionNumbers(id: string): Promise<number[]> {
  const { revisions } = t.ctx.data.t;
  const rows = await t.ctx.data.db.select({ n: revisions.number }).from(revisions).where(eq(revisions.patternId, id)).orderBy(revisions.number);
  return rows.map((r) => r.n);
}

describe('two saves on one base', () => {
  it('over HTTP, fired together: one 200, the others 409 with the winner as latest, numbers unique', async () => {
    const id = await newPattern('Race over HTTP');
    for (let round = 1; round <= 4; round++) {
      const answers = await Promise.all(
        ['A', 'B', 'C', 'D'].map((who) => designer.put(`/api/patterns/${id}`, { baseRevision: round, document: sampleDocument(`Race ${who}${round}`) })),
      );
      const statuses = answers.map((a) => a.status).sort();
      expect(statuses).toEqual([200, 409, 409, 409]);
      const winner = answers.find((a) => a.status === 200)!;
      expect(winner.body.revision.number).toBe(round + 1);
      for (const loser of answers.filter((a) => a.status === 409)) {
        expect(loser.body.details.latest.number).toBe(round + 1);
        expect(loser.body.details.latest.document.title).toBe(winner.body.revision.document.title);
      }
    }
    expect(await revisionNumbers(id)).toEqual([1, 2, 3, 4, 5]);
  });

  it('in two transactions open at once: the second waits for the first and then gets 409, never a second revision 2', async () => {
    const id = await newPattern('Race in transactions');
    const d = t.ctx.data;
    const first = validDocument(sampleDocument('First'));
    const second = validDocument(sampleDocument('Second'));
    if (testDatabase === 'postgres') {
      // The first transaction has saved but not committed while the second one starts its save.
      let release!: () => void;
      const held = new Promise<void>((resolve) => (release = resolve));
      let firstSaved!: () => void;
      const saved = new Promise<void>((resolve) => (firstSaved = resolve));
      const a = d.transaction(async (tx) => {
        const s = await saveRevision(tx, id, 1, first, designer.user!.id);
        firstSaved();
        await held;
        return s;
      });
      await saved;
      const b = d.transaction((tx) => saveRevision(tx, id, 1, second, designer.user!.id)).then(
        () => 'saved',
        (err: unknown) => err,
      );
      // The second save waits on the first one's row lock (pg_stat_activity shows it waiting).
      await expect.poll(async () => waitingOnLocks(), { timeout: 10_000 }).toBe(1);
      release();
      expect((await a).revision.number).toBe(2);
      const outcome = await b;
      expect(outcome).toBeInstanceOf(HttpError);
      expect((outcome as HttpError).status).toBe(409);
      expect((outcome as HttpError).details).toMatchObject({ latest: { number: 2, document: { title: 'First' } } });
    } else {
      // SQLite: the second transaction begins once the first has committed (one writer).
      const [a, b] = await Promise.allSettled([
        d.transaction((tx) => saveRevision(tx, id, 1, first, designer.user!.id)),
        d.transaction((tx) => saveRevision(tx, id, 1, second, designer.user!.id)),
      ]);
      expect(a.status).toBe('fulfilled');
      expect(b.status).toBe('rejected');
      expect(((b as PromiseRejectedResult).reason as HttpError).status).toBe(409);
    }
    expect(await revisionNumbers(id)).toEqual([1, 2]);
    const read = await designer.get(`/api/patterns/${id}`).expect(200);
    expect(read.body.pattern).toMatchObject({ headRevision: 2, title: 'First' });
  });
});

/** PostgreSQL backends of this database waiting for a lock. */
async function waitingOnLocks(): Promise<number> {
  const rows = await t.ctx.data.rows<{ n: number | string }>(
    sql`SELECT count(*) AS "n" FROM pg_stat_activity WHERE datname = current_database() AND wait_event_type = 'Lock'`,
  );
  return Number(rows[0]?.n ?? 0);
}
