/**
 * Hostile input over the HTTP API with fast-check (issue: benchmarks, load, faults): random and
 * malformed bodies, ids, query strings, uploads and pattern documents, several thousand cases in
 * all, against the real server process. Every answer must be 2xx/4xx — a 4xx with a JSON
 * `{ error, details }` body and no stack trace — never a 5xx, never a hang (each request has a
 * 10 s limit) and never a crash (the process must still be running and answering health checks).
 */
import net from 'node:net';
import fc from 'fast-check';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { ApiClient, type ApiResponse } from '../support/api-client';
import { gridDocument } from '../support/documents';
import { answerProblem, buildWorld, TINY_PNG, uploadForm, type World } from '../support/fixtures';
import { faultSeed } from '../support/random';
import { startServerProcess, waitForHealth, type ServerProcess } from '../support/server-process';

const SEED = faultSeed(8_020_261);
const TIMEOUT_MS = 10_000;

let server: ServerProcess;
let world: World;
let cases = 0;

beforeAll(async () => {
  server = await startServerProcess({
    // Room for thousands of requests from one address without the sign-in limit hiding other answers.
    env: { SIGNIN_LIMIT_PER_ADDRESS: '100000', RESET_LIMIT_PER_ADDRESS: '100000' },
  });
});

afterAll(async () => {
  console.log(`api fuzz: ${cases} requests, seed ${SEED}`);
  await server?.stop();
});

// A fresh world for every property: earlier random requests may have trashed or deleted things.
let anonymous: ApiClient;
beforeEach(async () => {
  expect(server.alive(), server.output()).toBe(true);
  world = await buildWorld(server, `fuzz${Math.random().toString(36).slice(2, 8)}`);
  anonymous = new ApiClient(server.baseUrl);
});

/** Sends one request and checks the answer is well-formed and the server still runs. */
async function send(client: ApiClient, method: string, path: string, init: Parameters<ApiClient['request']>[2] = {}): Promise<ApiResponse> {
  cases++;
  let res: ApiResponse;
  try {
    res = await client.request(method, path, { timeoutMs: TIMEOUT_MS, ...init });
  } catch (err) {
    const e = err as Error & { cause?: { code?: string } };
    if (e.name === 'TimeoutError') throw new Error(`${method} ${path} hung for ${TIMEOUT_MS} ms`);
    throw new Error(`${method} ${path} failed: ${e.message} ${e.cause?.code ?? ''}\n--- server output ---\n${server.output().slice(-2000)}`);
  }
  const problem = answerProblem(res);
  if (problem) throw new Error(`${method} ${path} ${problem}`);
  return res;
}

async function expectHealthy() {
  expect(server.alive(), server.output()).toBe(true);
  await waitForHealth(server.baseUrl, 5_000);
}

const params = (runs: number) => ({ numRuns: runs, seed: SEED, endOnFailure: true, interruptAfterTimeLimit: 120_000 });

// ---- arbitraries ----------------------------------------------------------------------------

/** Ids: well-formed, real ones of the world, and hostile strings (traversal, encodings, huge, unicode). */
const idArb = () =>
  fc.oneof(
    { weight: 3, arbitrary: fc.stringMatching(/^[A-Za-z0-9_-]{1,64}$/) },
    { weight: 3, arbitrary: fc.constantFrom(world.patternId, world.uploadId, world.invitationId, world.printSetId, world.owner.user!.id, world.partner.user!.id, ...world.sectionIds) },
    { weight: 2, arbitrary: fc.string({ maxLength: 80 }).map(encodeURIComponent) },
    { weight: 1, arbitrary: fc.string({ unit: 'grapheme', maxLength: 40 }).map(encodeURIComponent) },
    {
      weight: 2,
      arbitrary: fc.constantFrom(
        '..', '..%2F..%2Fetc%2Fpasswd', '%2e%2e%2f%2e%2e%2f', '%00', '%ZZ', '%', '%c0%af', 'null', 'undefined', '0', '-1',
        '1e309', 'NaN', 'Infinity', '__proto__', 'constructor', 'a'.repeat(65), 'a'.repeat(5000), '%F0%9F%A7%B5', '.%2E', "'%20OR%201%3D1--",
      ),
    },
  );

const numberSegmentArb = fc.oneof(fc.integer({ min: -5, max: 5 }).map(String), fc.constantFrom('1.5', '1e3', '9999999999999', 'abc', '%20', '0x10', '-0', '2'));

/** Route templates; `:id` etc. are filled from the arbitraries. */
const ROUTES: [string, string][] = [
  ['GET', '/api/auth/me'],
  ['GET', '/api/auth/session'],
  ['POST', '/api/auth/change-password'],
  ['POST', '/api/auth/password-reset'],
  ['POST', '/api/auth/password-reset/confirm'],
  ['GET', '/api/admin/users'],
  ['PATCH', '/api/admin/users/:id'],
  ['GET', '/api/admin/dev-inbox'],
  ['GET', '/api/patterns'],
  ['POST', '/api/patterns'],
  ['GET', '/api/patterns/:id'],
  ['PUT', '/api/patterns/:id'],
  ['POST', '/api/patterns/:id/duplicate'],
  ['POST', '/api/patterns/:id/trash'],
  ['POST', '/api/patterns/:id/restore'],
  ['DELETE', '/api/patterns/:id'],
  ['GET', '/api/patterns/:id/revisions'],
  ['GET', '/api/patterns/:id/revisions/:n'],
  ['POST', '/api/patterns/:id/revisions/:n/restore'],
  ['GET', '/api/patterns/:id/members'],
  ['POST', '/api/patterns/:id/invitations'],
  ['DELETE', '/api/patterns/:id/invitations/:id2'],
  ['PATCH', '/api/patterns/:id/members/:id2'],
  ['DELETE', '/api/patterns/:id/members/:id2'],
  ['GET', '/api/invitations/:id'],
  ['POST', '/api/invitations/accept'],
  ['GET', '/api/patterns/:id/sewing-log'],
  ['PUT', '/api/patterns/:id/sewing-log/:id2'],
  ['GET', '/api/patterns/:id/uploads'],
  ['GET', '/api/patterns/:id/uploads/:id2/file'],
  ['DELETE', '/api/patterns/:id/uploads/:id2'],
  ['GET', '/api/patterns/:id/print-sets'],
  ['POST', '/api/patterns/:id/print-sets'],
  ['GET', '/api/patterns/:id/print-sets/:id2'],
  ['GET', '/api/patterns/:id/print-sets/:id2/file'],
  ['GET', '/api/patterns/:id/print-sets/:id2/events'],
  ['DELETE', '/api/patterns/:id/print-sets/:id2'],
];

const fill = (template: string, id: string, id2: string, n: string) => template.replace(':id2', id2).replace(':id', id).replace(':n', n);

/** JSON values of every shape, plus near-valid bodies with one field swapped for a random value. */
const jsonBodyArb = () =>
  fc.oneof(
    { weight: 3, arbitrary: fc.jsonValue({ maxDepth: 4 }) },
    { weight: 2, arbitrary: fc.dictionary(fc.constantFrom('document', 'baseRevision', 'email', 'password', 'token', 'access', 'stage', 'role', 'disabled', 'title', 'options', 'revision', 'currentPassword', 'newPassword', '__proto__', 'constructor'), fc.jsonValue({ maxDepth: 3 }), { maxKeys: 5 }) },
    {
      weight: 2,
      arbitrary: fc.record({
        baseRevision: fc.oneof(fc.integer(), fc.double(), fc.string(), fc.constant(null), fc.constant(2)),
        document: fc.oneof(fc.jsonValue({ maxDepth: 3 }), fc.constant(gridDocument('Fuzzed', 2, 2, 2))),
      }),
    },
  );

// ---- properties ---------------------------------------------------------------------------

describe('fast-check over the API', () => {
  it('random JSON bodies and ids on every route: 2xx/4xx with JSON errors, never 5xx', async () => {
    await fc.assert(
      fc.asyncProperty(fc.constantFrom(...ROUTES), idArb(), idArb(), numberSegmentArb, jsonBodyArb(), fc.constantFrom('owner', 'partner', 'anonymous'), async ([method, template], id, id2, n, body, who) => {
        const client = who === 'owner' ? world.owner : who === 'partner' ? world.partner : anonymous;
        await send(client, method, fill(template, id, id2, n), method === 'GET' ? {} : { json: body });
      }),
      params(1500),
    );
    await expectHealthy();
  });

  it('random query strings on the list routes', async () => {
    const key = fc.oneof(fc.constantFrom('q', 'sort', 'order', 'scope', 'page', 'pageSize', 'q[]', 'page[0]', '__proto__', 'constructor'), fc.string({ maxLength: 10 }));
    const value = fc.oneof(fc.string({ maxLength: 30 }), fc.constantFrom('0', '-1', '101', '1e9', '9007199254740993', 'NaN', 'asc', 'desc', 'title', 'trash', 'shared', '%', '_', "'", '"', '\\', '%00'), fc.integer().map(String));
    const query = fc.array(fc.tuple(key, value), { maxLength: 6 }).map((pairs) => pairs.map(([k, v]) => `${encodeURIComponent(k)}=${encodeURIComponent(v)}`).join('&'));
    const rawQuery = fc.string({ maxLength: 60 }).map((s) => encodeURI(s).replace(/#/g, '%23'));
    const path = fc.constantFrom('/api/patterns', '/api/patterns/:id/revisions', '/api/admin/users', '/api/patterns/:id', '/api/patterns/:id/uploads');
    await fc.assert(
      fc.asyncProperty(path, fc.oneof(query, rawQuery), async (p, q) => {
        const res = await send(world.owner, 'GET', `${p.replace(':id', world.patternId)}?${q}`);
        if (p === '/api/patterns' && res.status === 200) {
          expect(Array.isArray(res.json.items)).toBe(true);
          expect(res.json.pageSize).toBeGreaterThanOrEqual(1);
          expect(res.json.pageSize).toBeLessThanOrEqual(100);
        }
      }),
      params(700),
    );
    await expectHealthy();
  });

  it('malformed raw bodies and odd content types', async () => {
    const raw = fc.oneof(
      fc.string({ maxLength: 200 }),
      fc.string({ maxLength: 200 }).map((s) => `{"document": ${s}`),
      fc.uint8Array({ maxLength: 300 }),
      fc.constantFrom('{', '[', '{"a":', 'null', 'true', '"x"', '1e999', '{"__proto__":{"isAdmin":true}}', '{"a":1,"a":2}', '\uFEFF{}', '{"baseRevision":1e400}'),
    );
    const type = fc.constantFrom(
      'application/json', 'application/json; charset=utf-16', 'application/json; charset=latin1', 'text/plain', 'application/x-www-form-urlencoded',
      'multipart/form-data', 'multipart/form-data; boundary=x', 'application/xml', '', 'application/merge-patch+json', 'image/png',
    );
    const encoding = fc.constantFrom(undefined, 'gzip', 'deflate', 'br', 'identity', 'bogus');
    await fc.assert(
      fc.asyncProperty(fc.constantFrom(...ROUTES.filter(([m]) => m !== 'GET')), raw, type, encoding, async ([method, template], body, contentType, contentEncoding) => {
        const headers: Record<string, string> = {};
        if (contentType) headers['content-type'] = contentType;
        if (contentEncoding) headers['content-encoding'] = contentEncoding;
        await send(world.owner, method, fill(template, world.patternId, world.uploadId, '1'), { body: typeof body === 'string' ? body : Buffer.from(body), headers });
      }),
      params(600),
    );
    await expectHealthy();
  });

  it('uploads: random bytes, spoofed names and types, real magic numbers with junk', async () => {
    const magic = fc.constantFrom(
      Buffer.alloc(0),
      TINY_PNG.subarray(0, 8), // PNG signature only
      TINY_PNG.subarray(0, 30), // truncated PNG
      Buffer.from([0xff, 0xd8, 0xff]), // JPEG start
      Buffer.from('RIFF\x10\x00\x00\x00WEBPVP8 ', 'latin1'),
      Buffer.from('GIF89a'),
      Buffer.from('%PDF-1.7\n'),
      Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>'),
      Buffer.from('just text renamed to png'),
    );
    const name = fc.oneof(
      fc.string({ maxLength: 60 }),
      fc.constantFrom('../../../etc/passwd', '..\\..\\boot.ini', 'a.png\u0000.exe', 'CON', '.htaccess', 'x'.repeat(500) + '.png', 'image.png', 'a/b/c.png', '😀.webp'),
    );
    const mime = fc.constantFrom('image/png', 'image/jpeg', 'image/webp', 'text/plain', 'application/octet-stream', 'image/svg+xml', '');
    const field = fc.constantFrom('file', 'file', 'file', 'image', 'files[]', '');
    await fc.assert(
      fc.asyncProperty(magic, fc.uint8Array({ maxLength: 2000 }), name, mime, field, fc.boolean(), async (head, tail, fileName, type, fieldName, extraField) => {
        const bytes = Buffer.concat([head, Buffer.from(tail)]);
        const form = uploadForm(bytes, fileName || 'x', type || 'application/octet-stream', fieldName || 'file');
        if (extraField) form.append('file', new Blob([TINY_PNG], { type: 'image/png' }), 'second.png');
        const res = await send(world.owner, 'POST', `/api/patterns/${world.patternId}/uploads`, { body: form });
        if (res.status === 201) {
          expect(['image/png', 'image/jpeg', 'image/webp']).toContain(res.json.upload.mimeType);
          expect(res.json.upload.fileName).not.toMatch(/[/\\]/);
          expect(res.json.upload.fileName.includes(String.fromCharCode(0))).toBe(false);
          const file = await send(world.owner, 'GET', res.json.upload.url);
          expect(file.status).toBe(200);
          expect(file.headers.get('x-content-type-options')).toBe('nosniff');
          await send(world.owner, 'DELETE', `/api/patterns/${world.patternId}/uploads/${res.json.upload.id}`);
        } else {
          expect([400, 413, 415]).toContain(res.status);
        }
      }),
      params(300),
    );
    await expectHealthy();
  });

  it('random pattern documents: stored when valid, 400 with document paths when not, the last good revision kept', async () => {
    const finiteOrNot = fc.oneof(fc.double(), fc.integer({ min: -300, max: 300 }), fc.constantFrom(0, -0, 1e-12, 200, 200.0001, 1e308));
    const mutate = fc.record({
      path: fc.constantFrom(
        ['title'], ['formatVersion'], ['canvas', 'widthIn'], ['seamAllowanceIn'], ['sections'], ['sections', 0, 'geometry', 'vertices'],
        ['sections', 0, 'geometry', 'vertices', 1, 'x'], ['sections', 0, 'seams', 0, 'a'], ['sections', 0, 'patches', 0, 'number'],
        ['sections', 0, 'patches', 0, 'fabricId'], ['sections', 4, 'geometry', 'sweepDeg'], ['sections', 4, 'geometry', 'innerRadiusIn'],
        ['sections', 1, 'label'], ['sections', 1, 'id'], ['fabrics', 0, 'colour'], ['fabrics'], ['referenceImage'], ['sections', 0, 'ringRepeat'],
      ),
      value: fc.oneof(fc.jsonValue({ maxDepth: 2 }), finiteOrNot, fc.string({ maxLength: 130 }), fc.constant(undefined)),
    });
    let head = 2;
    await fc.assert(
      fc.asyncProperty(fc.array(mutate, { minLength: 1, maxLength: 3 }), fc.boolean(), async (changes, save) => {
        const doc = structuredClone(gridDocument('Mutated block', 2, 2, 2)) as any;
        for (const { path, value } of changes) {
          let at = doc;
          for (const k of path.slice(0, -1)) at = at?.[k as never];
          if (at && typeof at === 'object') at[path[path.length - 1] as never] = value as never;
        }
        const res = save
          ? await send(world.owner, 'PUT', `/api/patterns/${world.patternId}`, { json: { baseRevision: head, document: doc } })
          : await send(world.owner, 'POST', '/api/patterns', { json: { document: doc } });
        if (res.status === 400) {
          expect(Array.isArray(res.json.details), res.text).toBe(true);
          for (const d of res.json.details) {
            expect(typeof d.path).toBe('string');
            expect(typeof d.message).toBe('string');
          }
          if (save) {
            const latest = await send(world.owner, 'GET', `/api/patterns/${world.patternId}`);
            expect(latest.json.pattern.headRevision).toBe(head);
          }
        } else {
          expect([200, 201]).toContain(res.status);
          if (save) head = res.json.revision.number;
        }
      }),
      params(500),
    );
    await expectHealthy();
  });

  it('random print-set options: 202 and a finished PDF, or 400 naming the option', async () => {
    const accepted: string[] = [];
    const validOption = fc.record(
      {
        paper: fc.constantFrom('letter', 'a4', 'a3', 'legal', 'tabloid'),
        marginIn: fc.integer({ min: 25, max: 150 }).map((v) => v / 100),
        mirrored: fc.boolean(),
        tileOverlapIn: fc.integer({ min: 50, max: 200 }).map((v) => v / 100),
        foundation: fc.constantFrom('paper', 'freezer-paper'),
        copies: fc.constantFrom('plan', 'single'),
        sectionIds: fc.subarray(world.sectionIds, { minLength: 1 }),
        includeCuttingList: fc.boolean(),
      },
      { requiredKeys: [] },
    );
    const hostileOption = fc.record(
      {
        paper: fc.oneof(fc.constantFrom('letter', 'a4', 'a3', 'legal', 'tabloid'), fc.string({ maxLength: 8 }), fc.integer()),
        marginIn: fc.oneof(fc.double({ min: 0, max: 3, noNaN: true }), fc.constantFrom(0.25, 0.5, 1.5, -1, 1e9), fc.string()),
        mirrored: fc.oneof(fc.boolean(), fc.constantFrom('yes', 0, null)),
        tileOverlapIn: fc.oneof(fc.double({ min: 0, max: 3, noNaN: true }), fc.constant(0.75)),
        foundation: fc.constantFrom('paper', 'freezer-paper', 'vellum', ''),
        copies: fc.constantFrom('plan', 'single', 'all', 3),
        sectionIds: fc.oneof(fc.constant(world.sectionIds.slice(0, 2)), fc.array(fc.string({ maxLength: 70 }), { maxLength: 3 }), fc.constant([])),
        includeCuttingList: fc.boolean(),
        createdAt: fc.constantFrom('2020-01-01T00:00:00Z', 'yesterday'),
        fontSize: fc.integer(),
      },
      { requiredKeys: [] },
    );
    const option = fc.oneof(validOption, hostileOption);
    const revisionArb = fc.oneof(fc.constant(undefined), fc.constantFrom(1, 2), fc.integer({ min: -2, max: 4 }), fc.string({ maxLength: 4 }));
    await fc.assert(
      fc.asyncProperty(option, revisionArb, async (options, revision) => {
        const res = await send(world.owner, 'POST', `/api/patterns/${world.patternId}/print-sets`, { json: revision === undefined ? { options } : { options, revision } });
        if (res.status === 202) accepted.push(res.json.printSet.id);
        else {
          expect([400, 404], res.text).toContain(res.status);
          if (res.status === 400) expect(res.json.details.length, res.text).toBeGreaterThan(0);
        }
      }),
      params(150),
    );
    // Every accepted print set finishes (bounded wait): none stuck queued or rendering.
    const statuses = new Map<string, string>();
    const t0 = Date.now();
    while (Date.now() - t0 < 180_000) {
      for (const id of accepted) {
        if (['done', 'failed'].includes(statuses.get(id) ?? '')) continue;
        const r = await send(world.owner, 'GET', `/api/patterns/${world.patternId}/print-sets/${id}`);
        statuses.set(id, r.json.printSet.status);
        if (r.json.printSet.status === 'failed') console.log(`print set with options ${JSON.stringify(r.json.printSet.options)} failed: ${r.json.printSet.error}`);
      }
      if (accepted.every((id) => ['done', 'failed'].includes(statuses.get(id) ?? ''))) break;
      await new Promise((r) => setTimeout(r, 500));
    }
    console.log(`print-set options: ${accepted.length} accepted of 150; ${[...statuses.values()].filter((v) => v === 'done').length} done`);
    expect(accepted.length).toBeGreaterThan(0);
    // Options the schema accepted on a valid document render to a PDF.
    for (const id of accepted) expect(statuses.get(id), id).toBe('done');
    await expectHealthy();
  });

  it('a few hand-made nasty requests', async () => {
    const c = world.owner;
    const id = world.patternId;
    // 9 MB of JSON is over the 8 MB limit: 413, not a crash.
    const big = await send(c, 'PUT', `/api/patterns/${id}`, { body: JSON.stringify({ baseRevision: 2, document: { title: 'x'.repeat(9 * 1024 * 1024) } }), headers: { 'content-type': 'application/json' } });
    expect(big.status).toBe(413);
    // Deep nesting: refused by depth, and nobody else waits for it. Health is asked back to back while
    // the 4.9 MB body is answered; the slowest answer must stay under 1 s (generous: a healthy answer
    // takes milliseconds, the machine is shared, and parsing this body on the request thread held
    // everyone for seconds). tests/hostile/body-stall.spec.ts measures the signed-out cases.
    let probing = true;
    let slowestHealthMs = 0;
    const probe = (async () => {
      while (probing) {
        const t0 = performance.now();
        await (await fetch(`${server.baseUrl}/api/health`, { signal: AbortSignal.timeout(TIMEOUT_MS) })).arrayBuffer();
        slowestHealthMs = Math.max(slowestHealthMs, performance.now() - t0);
      }
    })();
    const deep = await send(c, 'PUT', `/api/patterns/${id}`, { body: '['.repeat(4_900_000), headers: { 'content-type': 'application/json' } });
    probing = false;
    await probe;
    expect(deep.status).toBe(400);
    expect(deep.json.error).toMatch(/nested too deeply/);
    expect(slowestHealthMs, 'slowest health answer while the nested body was handled').toBeLessThan(1000);
    const deepDoc = await send(c, 'POST', '/api/patterns', { body: `{"document":${'{"a":'.repeat(50_000)}1${'}'.repeat(50_000)}}`, headers: { 'content-type': 'application/json' } });
    expect(deepDoc.status).toBe(400);
    // 2000 sections of 2000 vertices each would be huge; the schema caps and the body limit answer first.
    const many = await send(c, 'POST', '/api/patterns', { json: { document: { ...gridDocument('Many', 1, 1, 0), sections: Array.from({ length: 2001 }, (_, i) => ({ id: `s${i}`, label: 'A' })) } } });
    expect(many.status).toBe(400);
    // Prototype pollution attempts change nothing.
    const proto = await send(c, 'PUT', `/api/patterns/${id}`, { body: '{"baseRevision":2,"document":{"__proto__":{"formatVersion":1}},"__proto__":{"admin":true}}', headers: { 'content-type': 'application/json' } });
    expect(proto.status).toBe(400);
    const me = await send(c, 'GET', '/api/auth/me');
    expect(me.json.user.role).toBe('designer');
    // 100 connections that stall half-way (headers never finished, or a body shorter than its
    // Content-Length) do not hold up anyone else.
    const sockets: net.Socket[] = [];
    for (let i = 0; i < 100; i++) {
      const sock = net.connect(server.port, '127.0.0.1');
      sock.on('error', () => undefined);
      sock.write(
        i % 2 === 0
          ? `PUT /api/patterns/${id} HTTP/1.1\r\nHost: 127.0.0.1\r\nContent-Type: application/json\r\nContent-Length: 100000\r\n\r\n{"baseRevision":`
          : `GET /api/patterns HTTP/1.1\r\nHost: 127.0.0.1\r\nX-Slow: `,
      );
      sockets.push(sock);
    }
    try {
      await expectHealthy();
      const stillServing = await send(c, 'GET', `/api/patterns/${id}`);
      expect(stillServing.status).toBe(200);
    } finally {
      for (const sock of sockets) sock.destroy();
    }
    const unknownRoute = await send(c, 'GET', '/api/this/does/not/exist');
    expect(unknownRoute.status).toBe(404);
    await expectHealthy();
  });
});

describe('the answer checker itself', () => {
  const answer = (status: number, body: string, contentType = 'application/json; charset=utf-8'): ApiResponse => {
    let json: any;
    try {
      json = JSON.parse(body);
    } catch {
      json = undefined;
    }
    return { status, headers: new Headers(), json, text: body, contentType };
  };
  it('flags 5xx, 4xx without JSON error bodies, and leaked stack traces; passes clean answers', () => {
    expect(answerProblem(answer(500, '{"error":"Internal server error","details":null}'))).toMatch(/answered 500/);
    expect(answerProblem(answer(404, '<html>Cannot GET</html>', 'text/html'))).toMatch(/without JSON/);
    expect(answerProblem(answer(400, '{"message":"bad"}'))).toMatch(/without an error message/);
    expect(answerProblem(answer(400, '{"error":"bad"}'))).toMatch(/without details/);
    expect(answerProblem(answer(400, '{"error":"bad","details":"at parse (/srv/server/app.ts:12:3)"}'))).toMatch(/stack trace/);
    expect(answerProblem(answer(400, '{"error":"Invalid request","details":[{"path":"email","message":"must be an e-mail address"}]}'))).toBeUndefined();
    expect(answerProblem(answer(200, '{"ok":true}'))).toBeUndefined();
  });
});
