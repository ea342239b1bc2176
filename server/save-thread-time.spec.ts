/**
 * Issue 15, item 3: saving the largest valid document (100 sections of 2,000-vertex outlines, the
 * schema's limit; tests/fixtures/largest-document.ts) must not hold the request thread. While the save
 * is parsed and checked (in the validation pool, server/validation/document-checks.ts), the event loop
 * keeps turning and /api/health keeps answering. Also: the pool stores exactly what the inline check
 * would, and answers errors (zod and geometry details, malformed JSON, deep nesting, stale base) as
 * the inline path does.
 */
import { monitorEventLoopDelay } from 'node:perf_hooks';
import { and, eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { largestDocument } from '../tests/fixtures/largest-document';
import { HttpError } from './http/errors';
import { sampleDocument, startTestServer, userClient, type Client, type TestServer } from './test/harness';
import { checkDocumentBody, checkVersionBody } from './validation/document-body';
import { validDocument } from './validation/valid-document';

let t: TestServer;
let owner: Client;
beforeAll(async () => {
  t = await startTestServer();
  owner = await userClient(t.app, 'owner@save-thread.test', 'designer');
});
afterAll(async () => {
  await t.close();
});

/** A stored revision's document and version fields, read through the data layer. */
async function storedRevision(id: string, number: number) {
  const { revisions } = t.ctx.data.t;
  const [row] = await t.ctx.data.db
    .select({ document: revisions.document, name: revisions.versionName, note: revisions.versionNote, session: revisions.editSession })
    .from(revisions)
    .where(and(eq(revisions.patternId, id), eq(revisions.number, number)));
  if (!row) throw new Error(`no revision ${number}`);
  return row;
}

async function newPattern(title: string): Promise<string> {
  const res = await owner.post('/api/patterns', { document: sampleDocument(title) });
  expect(res.status).toBe(201);
  return res.body.pattern.id as string;
}

/** Keeps the answer as bytes: parsing a 6 MB answer here would block this (the server's) thread too. */
function rawBody(res: request.Response, done: (err: Error | null, body: Buffer) => void) {
  const chunks: Buffer[] = [];
  const stream = res as unknown as NodeJS.ReadableStream;
  stream.on('data', (c: Buffer) => chunks.push(c));
  stream.on('end', () => done(null, Buffer.concat(chunks)));
}

function putText(id: string, text: string) {
  return owner.req('put', `/api/patterns/${id}`).set('Content-Type', 'application/json').buffer(true).parse(rawBody).send(text);
}

/** The 400 the inline check gives for `document`. */
function inlineError(document: unknown): { error: string; details: unknown } {
  try {
    validDocument(document);
  } catch (err) {
    if (err instanceof HttpError) return { error: err.message, details: err.details };
    throw err;
  }
  throw new Error('the document is valid');
}

/**
 * Sends a large body while measuring what everyone else sees: the longest event-loop stall (the test's
 * client runs on the server's thread, so the histogram sees both; the client's own work — sending bytes,
 * keeping the answer as bytes, tiny health answers — is a few milliseconds) and /api/health answering.
 * Asserts the stall stays under the bound and health kept answering; returns the answer.
 */
async function expectThreadFreeDuring(what: string, send: () => Promise<request.Response>, inlineCheck: () => void): Promise<request.Response> {
  const delay = monitorEventLoopDelay({ resolution: 10 });
  const healthMs: number[] = [];
  let saving = true;
  const probes = (async () => {
    while (saving) {
      const t0 = performance.now();
      await request(t.app).get('/api/health').expect(200);
      healthMs.push(performance.now() - t0);
      await new Promise((r) => setTimeout(r, 20));
    }
  })();
  delay.enable();
  const saveStarted = performance.now();
  const res = await send();
  const saveMs = performance.now() - saveStarted;
  saving = false;
  await probes;
  delay.disable();
  const maxBlockedMs = delay.max / 1e6;
  // What the old route would have blocked this thread for, measured now, on the same machine under the
  // same load: parsing and checking the body here (the database write not even counted).
  const inlineStarted = performance.now();
  inlineCheck();
  const inlineMs = performance.now() - inlineStarted;
  // The target is 100 ms of request-thread time (issue 15); the bound asserted is generous because CI
  // shares 2 cores between the worker thread doing the check, this thread and the rest of the suite, so
  // the thread is sometimes simply not scheduled (and this thread's own test data is collected). On a
  // machine so loaded that the check alone takes seconds, the bound grows to a quarter of the inline
  // time: checking inline stalls the loop for all of it (1.5–7 s seen), so it still fails.
  const bound = Math.max(500, inlineMs / 4);
  expect(maxBlockedMs, `longest event-loop stall ${maxBlockedMs.toFixed(0)} ms during a ${saveMs.toFixed(0)} ms ${what} (inline check ${inlineMs.toFixed(0)} ms)`).toBeLessThan(bound);
  // Health answered all along, each answer well under a second, while the save took its time.
  expect(healthMs.length).toBeGreaterThanOrEqual(Math.min(5, Math.floor(saveMs / 200)));
  expect(Math.max(...healthMs)).toBeLessThan(1000);
  return res;
}

describe('saving the largest valid document', () => {
  it('leaves the request thread free: the event loop never stalls and health keeps answering', async () => {
    // Small saves are checked inline: no worker thread is started for them.
    const id = await newPattern('Largest save');
    expect((await owner.put(`/api/patterns/${id}`, { baseRevision: 1, document: sampleDocument('Still small') })).status).toBe(200);
    expect(t.ctx.documentChecks.started).toBe(false);

    // Straight edges, 4.9 MB (bench/save-validation.bench.ts also saves the curved one, about 5.9 MB).
    const document = largestDocument('Largest save', 0);
    const text = JSON.stringify({ baseRevision: 2, document });
    expect(text.length).toBeGreaterThan(4_500_000);

    const res = await expectThreadFreeDuring('save', () => putText(id, text), () => checkDocumentBody('save', JSON.parse(text) as unknown));
    expect(res.status, res.body.toString().slice(0, 300)).toBe(200);
    expect(JSON.parse(res.body.toString()).pattern.headRevision).toBe(3);
    expect(t.ctx.documentChecks.started).toBe(true);

    // What the pool stored is exactly what the inline check would store.
    const stored = await storedRevision(id, 3);
    expect(stored.document).toBe(JSON.stringify(validDocument(JSON.parse(text).document)));
  }, 120_000);

  it('answers a large invalid document as the inline check does (zod and geometry details)', async () => {
    const id = await newPattern('Large invalid');
    const badField = largestDocument('Large invalid', 0) as { sections: Array<{ geometry: { vertices: Array<{ x: unknown; y: number }> } }> };
    badField.sections[7].geometry.vertices[3].x = 'three';
    const crossing = largestDocument('Large crossing', 0);
    // Two neighbouring vertices swapped: the outline crosses itself there.
    const v = crossing.sections[42].geometry.vertices;
    [v[10], v[11]] = [v[11], v[10]];
    for (const document of [badField, crossing]) {
      const res = await putText(id, JSON.stringify({ baseRevision: 1, document }));
      expect(res.status).toBe(400);
      const answer = JSON.parse(res.body.toString());
      const expected = inlineError(document);
      expect(answer).toEqual({ error: expected.error, details: expected.details });
      expect(JSON.stringify(answer.details)).toMatch(/sections\.(7|42)/);
    }
    const head = await owner.get(`/api/patterns/${id}`).expect(200);
    expect(head.body.pattern.headRevision).toBe(1);
  }, 120_000);

  it('answers malformed, deeply nested, wrongly typed and stale large bodies as before', async () => {
    const id = await newPattern('Large errors');
    const big = JSON.stringify({ baseRevision: 1, document: largestDocument('Large errors', 0) });
    const malformed = await putText(id, big.slice(0, -1));
    expect(malformed.status).toBe(400);
    expect(JSON.parse(malformed.body.toString())).toEqual({ error: 'Malformed JSON body', details: null });
    const notObject = await putText(id, `"${'x'.repeat(100_000)}"`);
    expect(JSON.parse(notObject.body.toString())).toEqual({ error: 'Malformed JSON body', details: null });
    const deep = await putText(id, `{"baseRevision":1,"document":${'['.repeat(70)}${']'.repeat(70)},"pad":"${'x'.repeat(100_000)}"}`);
    expect(deep.status).toBe(400);
    expect(JSON.parse(deep.body.toString()).error).toMatch(/nested too deeply/);
    const wrongBase = await putText(id, big.replace('"baseRevision":1', '"baseRevision":"1"'));
    expect(wrongBase.status).toBe(400);
    expect(JSON.parse(wrongBase.body.toString())).toMatchObject({ error: 'Invalid request', details: [{ path: 'baseRevision' }] });

    // Saved once on revision 1; the same base again is stale: 409 with the latest revision.
    expect((await putText(id, big)).status).toBe(200);
    const stale = await putText(id, big);
    expect(stale.status).toBe(409);
    const answer = JSON.parse(stale.body.toString());
    expect(answer.error).toBe('This pattern was saved by someone else since revision 1');
    expect(answer.details.latest.number).toBe(2);
    expect(answer.details.latest.document.sections).toHaveLength(100);
  }, 120_000);

  it('creates a pattern from a large document through the pool too', async () => {
    const res = await owner
      .req('post', '/api/patterns')
      .set('Content-Type', 'application/json')
      .buffer(true)
      .parse(rawBody)
      .send(JSON.stringify({ document: largestDocument('Large new', 0) }));
    expect(res.status).toBe(201);
    const created = JSON.parse(res.body.toString());
    expect(created.pattern.title).toBe('Large new');
    expect(created.revision.document.sections).toHaveLength(100);
  }, 120_000);
});

function postVersionText(id: string, text: string) {
  return owner.req('post', `/api/patterns/${id}/revisions`).set('Content-Type', 'application/json').buffer(true).parse(rawBody).send(text);
}

describe('saving the largest valid document as a named version', () => {
  it('leaves the request thread free and stores what the inline path stores', async () => {
    const id = await newPattern('Largest version');
    // A small version body (of the latest revision) is still checked inline.
    const small = await owner.post(`/api/patterns/${id}/revisions`, { baseRevision: 1, name: 'First' });
    expect(small.status).toBe(201);
    expect(small.body.revision.version.name).toBe('First');

    const document = largestDocument('Largest version', 0);
    const text = JSON.stringify({ baseRevision: 2, name: '  Quilt\u0007 top ', note: 'Before the border\u0000', editSession: 'version-session-1', document });
    expect(text.length).toBeGreaterThan(4_500_000);

    const res = await expectThreadFreeDuring('version save', () => postVersionText(id, text), () => checkVersionBody(JSON.parse(text) as unknown));
    expect(res.status, res.body.toString().slice(0, 300)).toBe(201);
    const answer = JSON.parse(res.body.toString());
    expect(answer.pattern.headRevision).toBe(3);
    // The version fields went through the same schema: control characters stripped, trimmed.
    expect(answer.revision.version).toMatchObject({ name: 'Quilt top', note: 'Before the border' });

    const row = (n: number) => storedRevision(id, n);
    expect(await row(3)).toEqual({ document: JSON.stringify(validDocument(JSON.parse(text).document)), name: 'Quilt top', note: 'Before the border', session: 'version-session-1' });

    // A small version body without a document keeps the latest revision's stored text as it is.
    const ofHead = await owner.post(`/api/patterns/${id}/revisions`, { baseRevision: 3, name: 'Again' });
    expect(ofHead.status).toBe(201);
    expect(ofHead.body.pattern.title).toBe('Largest version');
    expect((await row(4)).document).toBe((await row(3)).document);
  }, 120_000);

  it('answers large bad version bodies as the inline path does', async () => {
    const id = await newPattern('Large version errors');
    const document = largestDocument('Large version errors', 0);
    const body = (fields: Record<string, unknown>) => ({ baseRevision: 1, name: 'Kept', document, ...fields });
    const pad = 'x'.repeat(70_000);
    const cases: Array<Record<string, unknown>> = [
      body({ name: '  \u0001 ' }),
      body({ note: 'n'.repeat(501) }),
      body({ extra: true }),
      body({ document: null }),
      // No document but padded past the inline size by an unknown field: refused by the schema.
      { baseRevision: 1, name: 'Padded', pad },
    ];
    const crossing = largestDocument('Large version crossing', 0);
    const v = crossing.sections[42].geometry.vertices;
    [v[10], v[11]] = [v[11], v[10]];
    cases.push(body({ document: crossing }));
    for (const fields of cases) {
      // JSON's trailing whitespace takes a body without a large document past the inline size.
      const text = JSON.stringify(fields).padEnd(70_000, ' ');
      expect(text.length).toBeGreaterThan(64 * 1024);
      const large = await postVersionText(id, text);
      expect(large.status).toBe(400);
      // The inline answer to the same body (the check the request thread runs for a small one).
      let inline: { error: string; details: unknown } | undefined;
      try {
        checkVersionBody(fields);
      } catch (err) {
        if (err instanceof HttpError) inline = { error: err.message, details: err.details ?? null };
        else throw err;
      }
      expect(JSON.parse(large.body.toString())).toEqual(inline);
    }
    const malformed = await postVersionText(id, JSON.stringify(body({})).slice(0, -1));
    expect(JSON.parse(malformed.body.toString())).toEqual({ error: 'Malformed JSON body', details: null });

    // A large body without a document, padded with JSON whitespace, is a version of the latest revision.
    const spaced = await postVersionText(id, `{"baseRevision":1,"name":"Spaced"${' '.repeat(70_000)}}`);
    expect(spaced.status).toBe(201);
    expect(JSON.parse(spaced.body.toString()).revision.version.name).toBe('Spaced');

    // Stale base: 409 with the latest revision, as a small body gets it.
    const stale = await postVersionText(id, JSON.stringify(body({})));
    expect(stale.status).toBe(409);
    const answer = JSON.parse(stale.body.toString());
    const inlineStale = await owner.post(`/api/patterns/${id}/revisions`, { baseRevision: 1, name: 'Small' });
    expect(inlineStale.status).toBe(409);
    expect(answer).toEqual(inlineStale.body);
    expect(answer.details.latest.number).toBe(2);
  }, 120_000);
});

describe('restoring a revision with the largest document', () => {
  it('stores the old revision\'s text as it is, with its title, as parsing and writing it out would', async () => {
    const id = await newPattern('Restore target');
    const large = await putText(id, JSON.stringify({ baseRevision: 1, document: largestDocument('Large "quoted" title', 0) }));
    expect(large.status).toBe(200);
    expect((await owner.put(`/api/patterns/${id}`, { baseRevision: 2, document: sampleDocument('Small again') })).status).toBe(200);
    const text = async (n: number) => (await storedRevision(id, n)).document;

    const delay = monitorEventLoopDelay({ resolution: 10 });
    delay.enable();
    const restored = await owner.req('post', `/api/patterns/${id}/revisions/2/restore`).send({ baseRevision: 3 }).buffer(true).parse(rawBody);
    delay.disable();
    expect(restored.status).toBe(201);
    const answer = JSON.parse(restored.body.toString());
    expect(answer.pattern.title).toBe('Large "quoted" title');
    expect(answer.revision).toMatchObject({ number: 4, restoredFrom: 2 });
    // What the old route stored: the text parsed and written out again.
    expect(await text(4)).toBe(JSON.stringify(JSON.parse(await text(2))));
    expect(await text(4)).toBe(await text(2));
    expect(delay.max / 1e6).toBeLessThan(500);

    // A named version of that head (no document) keeps its text and title too.
    const version = await owner.post(`/api/patterns/${id}/revisions`, { baseRevision: 4, name: 'Restored' });
    expect(version.status).toBe(201);
    expect(version.body.pattern.title).toBe('Large "quoted" title');
    expect(await text(5)).toBe(await text(2));
  }, 120_000);
});
