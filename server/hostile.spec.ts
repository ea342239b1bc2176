import { count, eq, max, min } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import request from 'supertest';
import { sampleDocument, sharedPattern, startTestServer, userClient, type Client, type TestServer } from './test/harness';

let t: TestServer;
let owner: Client;
let id: string;
beforeAll(async () => {
  t = await startTestServer();
  owner = await userClient(t.app, 'owner@hostile.test', 'designer');
  id = await sharedPattern(t, owner, [], 'Hostile block');
});
afterAll(async () => {
  await t.close();
});

/** An error answer in our shape, with nothing of the server's insides. */
function expectCleanError(res: request.Response, status?: number) {
  if (status !== undefined) expect(res.status).toBe(status);
  expect(res.status).toBeGreaterThanOrEqual(400);
  expect(res.status).toBeLessThan(500);
  expect(res.headers['content-type']).toContain('application/json');
  expect(Object.keys(res.body).sort()).toEqual(['details', 'error']);
  const text = JSON.stringify(res.body);
  expect(text).not.toMatch(/\bat .+\.(ts|js):\d+/);
  expect(text).not.toContain('node_modules');
  expect(text).not.toContain(t.dataDir);
}

describe('hostile input', () => {
  it('answers malformed JSON with 400', async () => {
    const res = await owner.req('put', `/api/patterns/${id}`).set('Content-Type', 'application/json').send('{"baseRevision": 1, "document": {');
    expectCleanError(res, 400);
    expect(res.body.error).toBe('Malformed JSON body');
  });

  it('answers wrong types with 400 naming the field', async () => {
    const res = await owner.put(`/api/patterns/${id}`, { baseRevision: '1', document: sampleDocument() });
    expectCleanError(res, 400);
    expect(res.body.details).toMatchObject([{ path: 'baseRevision' }]);
    const arr = await owner.put(`/api/patterns/${id}`, [1, 2, 3] as unknown as object);
    expectCleanError(arr, 400);
    const nul = await owner.req('put', `/api/patterns/${id}`).set('Content-Type', 'application/json').send('null');
    expectCleanError(nul, 400);
  });

  it('refuses unknown fields and prototype keys', async () => {
    const res = await owner.req('put', `/api/patterns/${id}`).set('Content-Type', 'application/json').send('{"baseRevision":1,"document":{},"__proto__":{"admin":true}}');
    expectCleanError(res, 400);
    const role = await owner.post('/api/auth/change-password', { currentPassword: 'x', newPassword: 'long enough pass', role: 'admin' });
    expectCleanError(role, 400);
  });

  it('answers a huge body with 413 and stores nothing', async () => {
    const doc = { ...sampleDocument(), sections: [], padding: 'x'.repeat(9 * 1024 * 1024) };
    const res = await owner.put(`/api/patterns/${id}`, { baseRevision: 1, document: doc });
    expectCleanError(res, 413);
    const read = await owner.get(`/api/patterns/${id}`).expect(200);
    expect(read.body.pattern.headRevision).toBe(1);
  });

  it('never walks a path out of an id', async () => {
    const attempts = [
      `/api/patterns/..%2F..%2Fseamwright.db`,
      `/api/patterns/%2e%2e`,
      `/api/patterns/${id}/uploads/..%2F..%2Fseamwright.db/file`,
      `/api/patterns/${id}/uploads/..%2F..%2F..%2Fetc%2Fpasswd/file`,
      `/api/patterns/${id}/print-sets/..%5C..%5Cseamwright.db/file`,
      `/api/patterns/${id}/revisions/..%2F1`,
      `/api/patterns/${id}/sewing-log/..%2F..`,
      `/api/patterns/${'a'.repeat(500)}`,
      `/api/patterns/${id}%00.png`,
    ];
    for (const url of attempts) {
      const res = await owner.get(url);
      expectCleanError(res);
      expect([400, 404]).toContain(res.status);
    }
    const put = await owner.put(`/api/patterns/${id}/sewing-log/..%2F..%2Fx`, { stage: 'cut' });
    expectCleanError(put, 400);
  });

  it('refuses repeated query parameters and unknown ones', async () => {
    expectCleanError(await owner.get('/api/patterns?page=1&page=2'), 400);
    expectCleanError(await owner.get('/api/patterns?sort[$gt]=1'), 400);
    expectCleanError(await owner.get('/api/patterns?debug=1'), 400);
  });

  it('answers unknown API routes with a JSON 404', async () => {
    const res = await request(t.app).get('/api/does/not/exist');
    expectCleanError(res, 404);
  });

  it('keeps answering 2xx/4xx, never 5xx, for random bodies on every write route', async () => {
    const routes: Array<['post' | 'put' | 'patch', string]> = [
      ['post', '/api/patterns'],
      ['put', `/api/patterns/${id}`],
      ['post', `/api/patterns/${id}/duplicate`],
      ['post', `/api/patterns/${id}/invitations`],
      ['patch', `/api/patterns/${id}/members/nobody`],
      ['put', `/api/patterns/${id}/sewing-log/sec-a`],
      ['post', `/api/patterns/${id}/revisions/1/restore`],
      ['post', `/api/patterns/${id}/print-sets`],
      ['post', '/api/auth/change-password'],
      ['post', '/api/invitations/accept'],
    ];
    const body = fc.oneof(
      fc.jsonValue({ maxDepth: 4 }),
      fc.record({ baseRevision: fc.oneof(fc.integer(), fc.string(), fc.constant(null)), document: fc.jsonValue({ maxDepth: 4 }) }),
      fc.record({ email: fc.string(), access: fc.string(), stage: fc.string(), options: fc.jsonValue({ maxDepth: 4 }) }),
    );
    await fc.assert(
      fc.asyncProperty(fc.constantFrom(...routes), body, async ([method, url], b) => {
        const res = await owner.req(method, url).set('Content-Type', 'application/json').timeout(10_000).send(JSON.stringify(b));
        expect(res.status).toBeLessThan(500);
        if (res.status >= 400) expect(typeof res.body.error).toBe('string');
      }),
      { numRuns: 250 },
    );
    // Nothing the random bodies did damaged the pattern.
    const read = await owner.get(`/api/patterns/${id}`).expect(200);
    expect(read.body.revision.document.sections[0].id).toBe('sec-a');
  }, 180_000);

  it('keeps the database sound afterwards', async () => {
    // Every pattern's revisions are numbered 1…head with none missing and none twice.
    const { patterns, revisions } = t.ctx.data.t;
    const chains = await t.ctx.data.db
      .select({ head: patterns.headRevision, n: count(revisions.id), low: min(revisions.number), high: max(revisions.number) })
      .from(patterns)
      .leftJoin(revisions, eq(revisions.patternId, patterns.id))
      .groupBy(patterns.id, patterns.headRevision);
    expect(chains.length).toBeGreaterThan(0);
    for (const c of chains) expect({ n: c.n, low: c.low, high: c.high }).toEqual({ n: c.head, low: 1, high: c.head });
    const sqlite = t.ctx.data.sqlite;
    if (!sqlite) return;
    const rows = sqlite.pragma('integrity_check') as { integrity_check: string }[];
    expect(rows).toEqual([{ integrity_check: 'ok' }]);
    expect(sqlite.pragma('foreign_key_check')).toEqual([]);
    expect(sqlite.pragma('journal_mode', { simple: true })).toBe('wal');
    expect(sqlite.pragma('foreign_keys', { simple: true })).toBe(1);
  });
});
