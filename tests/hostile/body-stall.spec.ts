/**
 * A hostile body must not stall anyone else (issue 15, item 2): 4.9 MB of nested `[` sent to the
 * document routes, signed out and without a CSRF token, signed out with a valid anonymous token, and
 * signed in by the pattern's owner. While each is answered, a second connection asks `GET /api/health`
 * back to back; the slowest of those answers is what every other user would have waited.
 *
 * The bound is generous on purpose: 1 s, where a healthy server answers health in a few
 * milliseconds. The machine running the tests has 2 cores shared with other test runs, so a single
 * health answer can take a few hundred milliseconds for reasons unrelated to the body; the stall under
 * test (JSON.parse building millions of nested arrays on the request thread) held every request for
 * about 9 s, an order of magnitude above the bound.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiClient, signedInClient, type ApiResponse } from '../support/api-client';
import { gridDocument } from '../support/documents';
import { startServerProcess, type ServerProcess } from '../support/server-process';

let server: ServerProcess;
let owner: ApiClient;
let patternId: string;

beforeAll(async () => {
  server = await startServerProcess();
  ({ client: owner } = await signedInClient(server.baseUrl, 'designer', 'stall-owner'));
  const made = await owner.post('/api/patterns', { document: gridDocument('Stall block', 2, 2, 2) });
  expect(made.status, made.text).toBe(201);
  patternId = made.json.pattern.id;
});
afterAll(async () => {
  await server?.stop();
});

/** 4.9 MB of `[`: the body of the report. */
const NESTED = '['.repeat(Math.round(4.9 * 1024 * 1024));

/** Slowest `GET /api/health` answered while `work` runs (health is asked back to back). */
async function slowestHealthDuring<T>(work: () => Promise<T>): Promise<{ result: T; slowestMs: number; samples: number }> {
  let done = false;
  let slowestMs = 0;
  let samples = 0;
  const probe = (async () => {
    while (!done) {
      const t0 = performance.now();
      const res = await fetch(`${server.baseUrl}/api/health`, { signal: AbortSignal.timeout(30_000) });
      await res.arrayBuffer();
      slowestMs = Math.max(slowestMs, performance.now() - t0);
      samples++;
    }
  })();
  // Let the probe start its first request before the hostile body goes out.
  await new Promise((r) => setTimeout(r, 20));
  try {
    const result = await work();
    // One more round trip after the answer: a stall that began late shows here.
    await new Promise((r) => setTimeout(r, 50));
    return { result, slowestMs, samples };
  } finally {
    done = true;
    await probe;
  }
}

const sendNested = (client: ApiClient, method: string, path: string, csrf: boolean): Promise<ApiResponse> =>
  client.request(method, path, { body: NESTED, headers: { 'content-type': 'application/json' }, csrf, timeoutMs: 60_000 });

describe('a 4.9 MB nested body does not stall the server', () => {
  it('signed out, without a CSRF token: refused before the body is read, health stays under 1 s', async () => {
    const anonymous = new ApiClient(server.baseUrl);
    for (const [method, path] of [
      ['PUT', `/api/patterns/${patternId}`],
      ['POST', '/api/patterns'],
    ] as const) {
      const { result, slowestMs, samples } = await slowestHealthDuring(() => sendNested(anonymous, method, path, false));
      console.log(`${method} ${path} signed out, no token: ${result.status}; slowest health ${slowestMs.toFixed(0)} ms over ${samples} answers`);
      expect(result.status).toBe(403);
      expect(result.json.error).toBe('Missing or invalid CSRF token');
      expect(slowestMs).toBeLessThan(1000);
    }
  });

  it('signed out with a valid anonymous CSRF token: 404/401 before the body is read', async () => {
    const anonymous = new ApiClient(server.baseUrl);
    await anonymous.fetchCsrf();
    const save = await slowestHealthDuring(() => sendNested(anonymous, 'PUT', `/api/patterns/${patternId}`, true));
    console.log(`PUT signed out with a token: ${save.result.status}; slowest health ${save.slowestMs.toFixed(0)} ms`);
    expect(save.result.status).toBe(404);
    expect(save.slowestMs).toBeLessThan(1000);
    const create = await slowestHealthDuring(() => sendNested(anonymous, 'POST', '/api/patterns', true));
    expect(create.result.status).toBe(401);
    expect(create.slowestMs).toBeLessThan(1000);
  });

  it('signed in as the owner: the nesting is refused by depth before JSON parsing, health stays under 1 s', async () => {
    const { result, slowestMs, samples } = await slowestHealthDuring(() => sendNested(owner, 'PUT', `/api/patterns/${patternId}`, true));
    console.log(`PUT signed in: ${result.status} ${result.text.slice(0, 120)}; slowest health ${slowestMs.toFixed(0)} ms over ${samples} answers`);
    expect(result.status).toBe(400);
    expect(result.json.error).toMatch(/nested too deeply/);
    expect(slowestMs).toBeLessThan(1000);
    // A route that takes no document refuses a body this size by its length.
    const small = await owner.request('PUT', `/api/patterns/${patternId}/sewing-log/x`, { body: NESTED, headers: { 'content-type': 'application/json' } });
    expect(small.status).toBe(413);
    // The pattern is unchanged and still saves.
    const read = await owner.get(`/api/patterns/${patternId}`);
    expect(read.json.pattern.headRevision).toBe(1);
  });
});
