/**
 * The hot routes (server/http/hot-routes.ts) answer reads, lists and small saves in front of Express.
 * Each request here goes through a real listening server twice — once with the hot routes, once
 * through Express alone (`expressOnly`) — and the two answers must match: status, every header (names,
 * case and order; only Date differs) and the body, byte for byte. A spy on Express's router shows
 * which requests the hot routes answered themselves and which they handed on.
 */
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { expressOnly } from './http/hot-routes';
import { INLINE_DOCUMENT_BYTES } from './http/json-bodies';
import { sampleDocument, startTestServer, type TestServer } from './test/harness';
import { ApiClient, signedInClient } from '../tests/support/api-client';

interface Answer {
  status: number;
  /** Raw header lines as sent, Date left out. */
  headers: string[];
  body: string;
}

function call(base: string, method: string, path: string, headers: Record<string, string> = {}, body?: string): Promise<Answer> {
  return new Promise((resolve, reject) => {
    const req = http.request(base + path, { method, headers: body === undefined ? headers : { 'content-length': String(Buffer.byteLength(body)), ...headers } }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => {
        const lines: string[] = [];
        for (let i = 0; i < res.rawHeaders.length; i += 2) {
          if (res.rawHeaders[i].toLowerCase() !== 'date') lines.push(`${res.rawHeaders[i]}: ${res.rawHeaders[i + 1]}`);
        }
        resolve({ status: res.statusCode ?? 0, headers: lines, body: Buffer.concat(chunks).toString('utf8') });
      });
    });
    req.on('error', reject);
    req.end(body);
  });
}

async function listen(handler: http.RequestListener): Promise<{ server: http.Server; base: string }> {
  const server = http.createServer(handler);
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  return { server, base: `http://127.0.0.1:${(server.address() as AddressInfo).port}` };
}

describe('hot routes in front of Express', () => {
  let t: TestServer;
  let hot: { server: http.Server; base: string };
  let plain: { server: http.Server; base: string };
  let routerCalls: ReturnType<typeof vi.fn<(...a: unknown[]) => unknown>>;
  let owner: ApiClient;
  let quilter: ApiClient;
  let stranger: ApiClient;
  let patternId: string;

  const as = (c: ApiClient, extra: Record<string, string> = {}) => ({ cookie: c.cookieHeader(), accept: 'application/json', ...extra });
  const writeAs = (c: ApiClient, extra: Record<string, string> = {}) => as(c, { 'content-type': 'application/json', 'x-csrf-token': c.csrfToken ?? '', ...extra });

  /**
   * Sends the same request to both servers (hot routes first) and expects the same answer; `by` says
   * whether the hot routes must have answered it themselves or handed it to Express.
   */
  async function same(by: 'hot' | 'express', method: string, path: string, headers: Record<string, string>, body?: string): Promise<Answer> {
    routerCalls.mockClear();
    const fast = await call(hot.base, method, path, headers, body);
    expect(routerCalls.mock.calls.length, `${method} ${path} through the hot server reached Express's router`).toBe(by === 'hot' ? 0 : 1);
    routerCalls.mockClear();
    const slow = await call(plain.base, method, path, headers, body);
    expect(routerCalls).toHaveBeenCalledTimes(1);
    expect(fast).toEqual(slow);
    return fast;
  }

  beforeAll(async () => {
    t = await startTestServer();
    hot = await listen(t.app);
    plain = await listen(expressOnly(t.app));
    const router = (t.app as unknown as { router: { handle: (...a: unknown[]) => unknown } }).router;
    const original = router.handle.bind(router);
    routerCalls = vi.fn<(...a: unknown[]) => unknown>((...a) => original(...a));
    router.handle = routerCalls;
    ({ client: owner } = await signedInClient(hot.base, 'designer', 'owner'));
    ({ client: quilter } = await signedInClient(hot.base, 'quilter', 'quilter'));
    ({ client: stranger } = await signedInClient(hot.base, 'designer', 'stranger'));
    for (const c of [owner, quilter, stranger]) await c.fetchCsrf();
    const created = await owner.post('/api/patterns', { document: sampleDocument('Hot block') });
    expect(created.status).toBe(201);
    patternId = created.json.pattern.id;
    t.ctx.data.sqlite!.prepare('INSERT INTO members (pattern_id, user_id, access, created_at) VALUES (?, ?, ?, ?)').run(patternId, quilter.user!.id, 'quilter', Date.now());
  });

  afterAll(async () => {
    await new Promise((r) => hot.server.close(r));
    await new Promise((r) => plain.server.close(r));
    await t.close();
  });

  it('reads a pattern with the same headers and bytes as Express, and the same 404 to strangers and visitors', async () => {
    const read = await same('hot', 'GET', `/api/patterns/${patternId}`, as(owner));
    expect(read.status).toBe(200);
    expect(JSON.parse(read.body)).toMatchObject({ pattern: { id: patternId, title: 'Hot block', access: 'owner' }, revision: { number: 1 } });
    expect(read.headers).toEqual(expect.arrayContaining(['Cache-Control: no-store', "X-Frame-Options: SAMEORIGIN", 'Content-Type: application/json; charset=utf-8']));
    expect(read.headers.find((h) => h.startsWith('Content-Security-Policy:'))).toContain("default-src 'self'");
    expect((await same('hot', 'GET', `/api/patterns/${patternId}`, as(quilter))).status).toBe(200);
    expect((await same('hot', 'GET', `/api/patterns/${patternId}?x=1`, as(owner))).status).toBe(200);
    const visitors: Record<string, string>[] = [as(stranger), { accept: 'application/json' }, { cookie: 'seamwright.sid=not-a-session' }];
    for (const headers of visitors) {
      const refused = await same('hot', 'GET', `/api/patterns/${patternId}`, headers);
      expect(refused).toMatchObject({ status: 404, body: '{"error":"Pattern not found","details":null}' });
    }
    expect((await same('hot', 'GET', '/api/patterns/no-such-pattern', as(owner))).status).toBe(404);
    // An id the routes never accept, another spelling of the path and HEAD go to Express.
    expect((await same('express', 'GET', `/api/patterns/${'x'.repeat(65)}`, as(owner))).status).toBe(404);
    expect((await same('express', 'GET', `/api/patterns/${patternId}/`, as(owner))).status).toBe(200);
    expect((await same('express', 'HEAD', `/api/patterns/${patternId}`, as(owner))).status).toBe(200);
    expect((await same('express', 'GET', `/api/patterns/${patternId}/revisions`, as(owner))).status).toBe(200);
  });

  it('lists with the same answers as Express: pages, queries, 400 for a bad query, 401 for visitors', async () => {
    const list = await same('hot', 'GET', '/api/patterns', as(owner));
    expect(JSON.parse(list.body)).toMatchObject({ total: 1, page: 1, pageSize: 20, items: [{ id: patternId, sectionCount: 1 }] });
    expect(JSON.parse((await same('hot', 'GET', '/api/patterns?scope=shared', as(quilter))).body)).toMatchObject({ total: 1, items: [{ id: patternId, access: 'quilter' }] });
    expect(JSON.parse((await same('hot', 'GET', '/api/patterns?page=2&pageSize=5&sort=title&order=asc&q=Hot', as(owner))).body)).toMatchObject({ total: 1, page: 2, items: [] });
    expect(JSON.parse((await same('hot', 'GET', '/api/patterns?', as(stranger))).body)).toMatchObject({ total: 0, items: [] });
    const bad = await same('hot', 'GET', '/api/patterns?pageSize=101&scope=everyone', as(owner));
    expect(bad.status).toBe(400);
    expect(JSON.parse(bad.body)).toMatchObject({ error: 'Invalid query', details: [{ path: 'pageSize' }, { path: 'scope' }] });
    expect(await same('hot', 'GET', '/api/patterns', {})).toMatchObject({ status: 401, body: '{"error":"Sign in first","details":null}' });
    expect((await same('express', 'GET', '/api/patterns/', as(owner))).status).toBe(200);
  });

  it('refuses saves as Express does: CSRF 403, 404 to strangers, quilter 403, bad bodies 400, stale 409', async () => {
    const path = `/api/patterns/${patternId}`;
    const good = JSON.stringify({ baseRevision: 1, document: sampleDocument('Hot block') });
    const csrf403 = '{"error":"Missing or invalid CSRF token","details":null}';
    expect(await same('hot', 'PUT', path, writeAs(owner, { 'x-csrf-token': '' }), good)).toMatchObject({ status: 403, body: csrf403 });
    expect(await same('hot', 'PUT', path, writeAs(owner, { 'x-csrf-token': stranger.csrfToken! }), good)).toMatchObject({ status: 403, body: csrf403 });
    expect(await same('hot', 'PUT', path, { 'content-type': 'application/json' }, good)).toMatchObject({ status: 403, body: csrf403 });
    expect(await same('hot', 'PUT', path, writeAs(stranger), good)).toMatchObject({ status: 404, body: '{"error":"Pattern not found","details":null}' });
    expect(await same('hot', 'PUT', path, writeAs(quilter), good)).toMatchObject({ status: 403, body: '{"error":"Quilter access cannot change this pattern","details":null}' });
    // The body is read before the route's access need: a quilter's malformed body is a 400, as in Express.
    expect((await same('hot', 'PUT', path, writeAs(quilter), '{"baseRevision":')).status).toBe(400);
    const bodies = ['{"baseRevision":', '"text"', '', '{}', '{"baseRevision":1}', JSON.stringify({ baseRevision: 'one', document: sampleDocument() }), `${'['.repeat(70)}${']'.repeat(70)}`, JSON.stringify({ baseRevision: 1, document: { ...sampleDocument(), sections: 'none' } }), `\uFEFF${good.replace('"baseRevision":1', '"baseRevision":"x"')}`];
    for (const body of bodies) {
      const refused = await same('hot', 'PUT', path, writeAs(owner), body);
      expect(refused.status, body.slice(0, 40)).toBe(400);
      expect(JSON.parse(refused.body).error).toMatch(/Malformed JSON body|Invalid request|nested too deeply|not valid/);
    }
    const stale = await same('hot', 'PUT', path, writeAs(owner), JSON.stringify({ baseRevision: 7, document: sampleDocument('Hot block') }));
    expect(stale.status).toBe(409);
    expect(JSON.parse(stale.body)).toMatchObject({ details: { latest: { number: 1 } } });
    // Another content type, an encoded body and a body over the inline size go to Express.
    expect((await same('express', 'PUT', path, writeAs(owner, { 'content-type': 'text/plain' }), good)).status).toBe(400);
    expect((await same('express', 'PUT', path, writeAs(owner, { 'content-encoding': 'identity' }), JSON.stringify({ baseRevision: 9, document: sampleDocument() }))).status).toBe(409);
    const large = JSON.stringify({ baseRevision: 9, document: { ...sampleDocument(), notes: 'n'.repeat(INLINE_DOCUMENT_BYTES) } });
    expect((await same('express', 'PUT', path, writeAs(owner), large)).status).toBeGreaterThanOrEqual(400);
  });

  it('saves with the answer Express gives: the saved pattern and revision, the same bytes a read gives next', async () => {
    const path = `/api/patterns/${patternId}`;
    const head = JSON.parse((await call(hot.base, 'GET', path, as(owner))).body).pattern.headRevision as number;
    routerCalls.mockClear();
    const saved = await call(hot.base, 'PUT', path, writeAs(owner), JSON.stringify({ baseRevision: head, document: sampleDocument('Saved hot'), editSession: 'hot-session-1' }));
    expect(routerCalls).not.toHaveBeenCalled();
    expect(saved.status).toBe(200);
    expect(JSON.parse(saved.body)).toMatchObject({ pattern: { title: 'Saved hot', headRevision: head + 1 }, revision: { number: head + 1, document: { title: 'Saved hot' } } });
    // Express reads the saved revision back with the same bytes and headers (saves and reads share one answer form).
    const readBack = await call(plain.base, 'GET', path, as(owner));
    expect(readBack.body).toBe(saved.body);
    expect(readBack.headers).toEqual(saved.headers);
    // And the other way round: Express saves, the hot route reads.
    const expressSaved = await call(plain.base, 'PUT', path, writeAs(owner), JSON.stringify({ baseRevision: head + 1, document: sampleDocument('Saved by Express') }));
    expect(expressSaved.status).toBe(200);
    routerCalls.mockClear();
    const hotRead = await call(hot.base, 'GET', path, as(owner));
    expect(routerCalls).not.toHaveBeenCalled();
    expect(hotRead).toEqual(expressSaved);
    // The now-stale base gets Express's 409 with the latest revision.
    const stale = await same('hot', 'PUT', path, writeAs(owner), JSON.stringify({ baseRevision: head, document: sampleDocument('Too late') }));
    expect(stale.status).toBe(409);
    expect(JSON.parse(stale.body)).toMatchObject({ details: { latest: { number: head + 2 } } });
  });
});
