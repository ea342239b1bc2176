import fs from 'node:fs';
import path from 'node:path';
import crypto from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';
import { misnumberedStrip } from '../tests/fixtures/documents';
import { manySheetsDocument } from '../tests/support/documents';
import { MAX_PRINT_SHEETS } from './print/print-budget';
import { and, count, eq, like } from 'drizzle-orm';
import { TINY_PNG, sharedPattern, startTestServer, testDatabase, userClient, type Client, type TestServer } from './test/harness';

let t: TestServer;
let owner: Client;
let quilter: Client;
let stranger: Client;
let patternId: string;

beforeAll(async () => {
  // Two render threads, whatever the machine: the fairness test needs a second one to be free.
  t = await startTestServer({ PRINT_QUEUE_PER_USER: '4', PRINT_WORKERS: '2' });
  owner = await userClient(t.app, 'owner@print.test', 'designer');
  quilter = await userClient(t.app, 'quilter@print.test', 'quilter');
  stranger = await userClient(t.app, 'stranger@print.test', 'designer');
  patternId = await sharedPattern(t, owner, [{ client: quilter, access: 'quilter' }], 'Print block');
});
afterAll(async () => {
  await t.close();
});

/** The pattern's first revision. */
async function firstRevision() {
  const { revisions } = t.ctx.data.t;
  return (await t.ctx.data.db.select({ id: revisions.id }).from(revisions).where(and(eq(revisions.patternId, patternId), eq(revisions.number, 1))))[0];
}

async function waitDone(c: Client, setId: string) {
  for (let i = 0; i < 600; i++) {
    const res = await c.get(`/api/patterns/${patternId}/print-sets/${setId}`).expect(200);
    if (res.body.printSet.status === 'done' || res.body.printSet.status === 'failed') return res.body.printSet;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error('print set did not finish');
}

/** The stored file under `key` (the data folder with SQLite, the database with PostgreSQL), or undefined. */
async function storedBytes(key: string): Promise<Buffer | undefined> {
  const stream = await t.ctx.files.openRead(key);
  if (!stream) return undefined;
  const chunks: Buffer[] = [];
  for await (const c of stream) chunks.push(Buffer.from(c as Uint8Array));
  return Buffer.concat(chunks);
}
const isStored = async (key: string) => (await t.ctx.files.stat(key)) !== undefined;

/** A set's status as stored, or undefined when its row is gone. */
async function statusOf(id: string) {
  const { printSets } = t.ctx.data.t;
  return (await t.ctx.data.db.select({ status: printSets.status, progress: printSets.progress }).from(printSets).where(eq(printSets.id, id)))[0];
}

const binary = (res: import('superagent').Response, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
};

describe('print sets', () => {
  it('renders a stored revision in a worker, stores the PDF under its maker and serves it to members only', async () => {
    const made = await quilter.post(`/api/patterns/${patternId}/print-sets`, { options: { paper: 'a4' } }).expect(202);
    expect(made.body.printSet).toMatchObject({ status: 'queued', revision: 1, options: { paper: 'a4', mirrored: true } });
    const set = await waitDone(quilter, made.body.printSet.id);
    expect(set.error).toBeNull();
    expect(set.status).toBe('done');
    expect(set.sheets).toBeGreaterThanOrEqual(2);
    expect(set.lowerBoundSheets).toBeGreaterThanOrEqual(1);

    const file = await quilter.get(set.url).buffer(true).parse(binary).expect(200);
    expect(file.headers['content-type']).toBe('application/pdf');
    expect(file.headers['content-disposition']).toBe('attachment; filename="Print-block-r1.pdf"');
    const bytes: Buffer = file.body;
    expect(bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(bytes.length).toBe(set.bytes);
    expect(crypto.createHash('sha256').update(bytes).digest('hex')).toBe(set.sha256);
    // Read back with Mozilla's reader (pdfjs-dist), not our writer: the page count is what we stored,
    // and an A4 page is 595.28 × 841.89 pt (ISO 216: 210 × 297 mm; 1 pt = 1/72 in., ISO 32000-1 8.3.2.3).
    const pdf = await getDocument({ data: new Uint8Array(bytes) }).promise;
    expect(pdf.numPages).toBe(set.sheets);
    const [, , w, h] = (await pdf.getPage(1)).view;
    expect(Math.abs(w - (210 / 25.4) * 72)).toBeLessThan(0.01);
    expect(Math.abs(h - (297 / 25.4) * 72)).toBeLessThan(0.01);
    await pdf.destroy();

    // Stored under the user who made it (the data folder, or the database with PostgreSQL).
    expect((await storedBytes(`print-sets/${quilter.user!.id}/${set.id}.pdf`))?.equals(bytes)).toBe(true);
    if (testDatabase === 'sqlite') {
      const stored = path.join(t.dataDir, 'print-sets', quilter.user!.id, `${set.id}.pdf`);
      expect(fs.readdirSync(path.dirname(stored)).filter((f) => f.endsWith('.tmp'))).toEqual([]);
    }

    await stranger.get(set.url).expect(404);
    await stranger.get(`/api/patterns/${patternId}/print-sets/${set.id}`).expect(404);
    await stranger.del(`/api/patterns/${patternId}/print-sets/${set.id}`).expect(404);
    const list = await owner.get(`/api/patterns/${patternId}/print-sets`).expect(200);
    expect(list.body.items.map((s: { id: string }) => s.id)).toContain(set.id);
  });

  it('gives the same bytes for the same revision and options', async () => {
    const a = await owner.post(`/api/patterns/${patternId}/print-sets`, { options: { paper: 'letter' } }).expect(202);
    const b = await owner.post(`/api/patterns/${patternId}/print-sets`, { options: { paper: 'letter' } }).expect(202);
    const [sa, sb] = [await waitDone(owner, a.body.printSet.id), await waitDone(owner, b.body.printSet.id)];
    expect(sa.status).toBe('done');
    expect(sa.sha256).toBe(sb.sha256);
    const front = await owner.post(`/api/patterns/${patternId}/print-sets`, { options: { paper: 'letter', mirrored: false } }).expect(202);
    const sf = await waitDone(owner, front.body.printSet.id);
    expect(sf.sha256).not.toBe(sa.sha256);
  });

  it('streams progress as server-sent events until done', async () => {
    const made = await owner.post(`/api/patterns/${patternId}/print-sets`, { options: {} }).expect(202);
    const res = await owner.get(`/api/patterns/${patternId}/print-sets/${made.body.printSet.id}/events`).buffer(true).parse((r, cb) => {
      let text = '';
      r.setEncoding('utf8');
      r.on('data', (c: string) => (text += c));
      r.on('end', () => cb(null, text));
    });
    expect(res.headers['content-type']).toContain('text/event-stream');
    const events = String(res.body)
      .split('\n\n')
      .filter((e) => e.startsWith('event: progress'))
      .map((e) => JSON.parse(e.split('\ndata: ')[1]));
    expect(events.length).toBeGreaterThanOrEqual(1);
    expect(events.at(-1).status).toBe('done');
    const progress = events.map((e) => e.progress);
    expect([...progress].sort((x, y) => x - y)).toEqual(progress);
  });

  it('rejects bad options with their path, and an unknown revision', async () => {
    const bad = await owner.post(`/api/patterns/${patternId}/print-sets`, { options: { paper: 'napkin', marginIn: 'wide' } });
    expect(bad.status).toBe(400);
    expect(bad.body.details.map((d: { path: string }) => d.path).sort()).toEqual(['options.marginIn', 'options.paper']);
    await owner.post(`/api/patterns/${patternId}/print-sets`, { revision: 99, options: {} }).expect(404);
    const notReady = await owner.post(`/api/patterns/${patternId}/print-sets`, { options: {} }).expect(202);
    const early = await owner.get(notReady.body.printSet.url);
    expect([200, 409]).toContain(early.status); // 409 while rendering; a fast machine may finish first
    await waitDone(owner, notReady.body.printSet.id);
  });

  it('deletes a print set and its file; only the maker or the owner may', async () => {
    const made = await quilter.post(`/api/patterns/${patternId}/print-sets`, { options: {} }).expect(202);
    const set = await waitDone(quilter, made.body.printSet.id);
    const stored = `print-sets/${quilter.user!.id}/${set.id}.pdf`;
    expect(await isStored(stored)).toBe(true);
    const byOwner = await owner.post(`/api/patterns/${patternId}/print-sets`, { options: {} }).expect(202);
    await waitDone(owner, byOwner.body.printSet.id);
    await quilter.del(`/api/patterns/${patternId}/print-sets/${byOwner.body.printSet.id}`).expect(403);
    await owner.del(`/api/patterns/${patternId}/print-sets/${set.id}`).expect(204);
    expect(await isStored(stored)).toBe(false);
    await quilter.get(set.url).expect(404);
  });

  it('deleting the pattern for good removes its print-set and upload files', async () => {
    const id = await sharedPattern(t, owner, [], 'Doomed');
    const up = await owner.req('post', `/api/patterns/${id}/uploads`).attach('file', TINY_PNG, 'ref.png').expect(201);
    const image = `uploads/${owner.user!.id}/${up.body.upload.id}.png`;
    expect(await isStored(image)).toBe(true);
    const made = await owner.post(`/api/patterns/${id}/print-sets`, { options: {} }).expect(202);
    for (let i = 0; i < 600; i++) {
      const r = await owner.get(`/api/patterns/${id}/print-sets/${made.body.printSet.id}`);
      if (r.body.printSet.status === 'done') break;
      await new Promise((res) => setTimeout(res, 100));
    }
    const stored = `print-sets/${owner.user!.id}/${made.body.printSet.id}.pdf`;
    expect(await isStored(stored)).toBe(true);
    await owner.post(`/api/patterns/${id}/trash`).expect(200);
    await owner.del(`/api/patterns/${id}`).expect(204);
    expect(await isStored(stored)).toBe(false);
    expect(await isStored(image)).toBe(false);
  });

  it('refuses a pattern with a section not sewable as numbered (422, the reason), and queues it when the request prints anyway', async () => {
    const document = misnumberedStrip('Misnumbered');

    const created = await owner.post('/api/patterns', { document }).expect(201);
    const id: string = created.body.pattern.id;
    const refused = await owner.post(`/api/patterns/${id}/print-sets`, { options: {} }).expect(422);
    expect(refused.body.error).toContain('Section A is not sewable as numbered: A2 shares no seam with the patches sewn before it (A1)');
    expect(refused.body.details.sections).toEqual([expect.objectContaining({ sectionId: 'a', label: 'A' })]);
    const none = await owner.get(`/api/patterns/${id}/print-sets`).expect(200);
    expect(none.body.items).toEqual([]);

    const anyway = await owner.post(`/api/patterns/${id}/print-sets`, { options: {}, printUnsewable: true }).expect(202);
    expect(anyway.body.printSet.options.printUnsewable).toBe(true);
    await owner.post(`/api/patterns/${id}/print-sets`, { options: { printUnsewable: true } }).expect(202);
    await owner.post(`/api/patterns/${id}/print-sets`, { options: {}, printUnsewable: 'yes' }).expect(400);
  });

  it('marks a set failed, with the reason, when its revision cannot be rendered; the file answers 409', async () => {
    const id = await sharedPattern(t, owner, [], 'Broken');
    // A stored document the current schema refuses (as an old, damaged row would be).
    const { revisions } = t.ctx.data.t;
    await t.ctx.data.db.update(revisions).set({ document: '{"formatVersion": 99}' }).where(eq(revisions.patternId, id));
    const made = await owner.post(`/api/patterns/${id}/print-sets`, { options: {} }).expect(202);
    let set = made.body.printSet;
    for (let i = 0; i < 600 && set.status !== 'done' && set.status !== 'failed'; i++) {
      await new Promise((r) => setTimeout(r, 100));
      set = (await owner.get(`/api/patterns/${id}/print-sets/${set.id}`).expect(200)).body.printSet;
    }
    expect(set.status).toBe('failed');
    expect(set.error).toContain('formatVersion');
    const file = await owner.get(set.url);
    expect(file.status).toBe(409);
    expect(file.body.error).toBe('This print set failed to render');
    // The worker survived: the next set renders.
    const next = await owner.post(`/api/patterns/${patternId}/print-sets`, { options: {} }).expect(202);
    expect((await waitDone(owner, next.body.printSet.id)).status).toBe('done');
  });

  it('picks up sets left queued by a stopped process when the next one starts', async () => {
    const { PrintSetService } = await import('./services/print-sets');
    const rev = await firstRevision();
    const setId = 'leftoverQueuedSet01';
    await t.ctx.data.db.insert(t.ctx.data.t.printSets).values({
      id: setId,
      patternId,
      revisionId: rev.id,
      revisionNumber: 1,
      createdBy: owner.user!.id,
      options: JSON.stringify({ paper: 'letter', createdAt: '2026-01-01T00:00:00.000Z' }),
      status: 'rendering',
      progress: 0.4,
      createdAt: new Date(),
    });
    const fresh = new PrintSetService(t.ctx.data, t.ctx.config, () => undefined, t.ctx.files, t.ctx.printSets.jobOptions);
    try {
      await fresh.resumeUnfinished();
      await new Promise((r) => setTimeout(r, 50));
      await fresh.whenIdle();
    } finally {
      await fresh.close();
    }
    const set = (await owner.get(`/api/patterns/${patternId}/print-sets/${setId}`).expect(200)).body.printSet;
    expect(set.status).toBe('done');
    expect(await isStored(`print-sets/${owner.user!.id}/${setId}.pdf`)).toBe(true);
  });

  it('answers 429 when a user already has as many sets waiting as allowed', async () => {
    const { db, t: tables } = t.ctx.data;
    const { printSets, members } = tables;
    const rev = await firstRevision();
    // Four sets waiting (rows only, so none finishes during the test); PRINT_QUEUE_PER_USER=4.
    for (let i = 0; i < 4; i++) {
      await db.insert(printSets).values({
        id: `waitingSet${i}`,
        patternId,
        revisionId: rev.id,
        revisionNumber: 1,
        createdBy: stranger.user!.id,
        options: '{}',
        status: 'queued',
        progress: 0,
        createdAt: new Date(),
      });
    }
    await db.insert(members).values({ patternId, userId: stranger.user!.id, access: 'quilter', createdAt: new Date() });
    try {
      const refused = await stranger.post(`/api/patterns/${patternId}/print-sets`, { options: {} });
      expect(refused.status).toBe(429);
      expect(refused.body.details).toEqual({ waiting: 4 });
      // The limit is per user: another user may still queue a set.
      await owner.post(`/api/patterns/${patternId}/print-sets`, { options: {} }).expect(202);
      await db.delete(printSets).where(eq(printSets.id, 'waitingSet0'));
      await stranger.post(`/api/patterns/${patternId}/print-sets`, { options: {} }).expect(202);
      await t.ctx.printSets.whenIdle();
    } finally {
      await db.delete(printSets).where(like(printSets.id, 'waitingSet%'));
      await db.delete(members).where(and(eq(members.patternId, patternId), eq(members.userId, stranger.user!.id)));
    }
  });

  it("renders one user's small set while another user's huge set renders, and a deleted set's render stops", async () => {
    // User A (owner) queues two huge sets (100 sections made twice: two prints of each, about 400
    // template sheets, over a minute of rendering); then user B (stranger) queues a small one. A's second
    // set waits behind A's first and does not take the second thread; B's set takes it and is done while
    // A's first still renders.
    const huge = (await owner.post('/api/patterns', { document: { ...manySheetsDocument(100, 'Huge'), blockCount: 2 } }).expect(201)).body.pattern.id as string;
    const small = (await stranger.post('/api/patterns', { document: { ...manySheetsDocument(1, 'Small') } }).expect(201)).body.pattern.id as string;
    const a1 = (await owner.post(`/api/patterns/${huge}/print-sets`, { options: {} }).expect(202)).body.printSet.id as string;
    const a2 = (await owner.post(`/api/patterns/${huge}/print-sets`, { options: {} }).expect(202)).body.printSet.id as string;
    const b = (await stranger.post(`/api/patterns/${small}/print-sets`, { options: {} }).expect(202)).body.printSet.id as string;
    const status = async (id: string) => (await statusOf(id))?.status;
    let bSet;
    for (let i = 0; i < 1200; i++) {
      bSet = (await stranger.get(`/api/patterns/${small}/print-sets/${b}`).expect(200)).body.printSet;
      if (bSet.status === 'done' || bSet.status === 'failed') break;
      await new Promise((r) => setTimeout(r, 100));
    }
    expect(bSet.status).toBe('done');
    expect(await status(a1)).toBe('rendering');
    expect(await status(a2)).toBe('queued');
    expect(t.ctx.printSets.activeCount).toBe(1);

    // Deleting A's rendering set stops its render: the pool has nothing left running within the grace
    // (the render stops at its next sheet, or its worker is stopped), long before the render would have
    // ended, and no PDF is ever written. A's queued set leaves the queue the same way when deleted first.
    const progressAtDelete = (await statusOf(a1))!.progress;
    expect(progressAtDelete).toBeLessThan(0.5);
    await owner.del(`/api/patterns/${huge}/print-sets/${a2}`).expect(204);
    const deletedAt = Date.now();
    await owner.del(`/api/patterns/${huge}/print-sets/${a1}`).expect(204);
    while (t.ctx.printSets.activeCount > 0 && Date.now() - deletedAt < 5_000) await new Promise((r) => setTimeout(r, 20));
    const stoppedAfterMs = Date.now() - deletedAt;
    console.log(`deleted set's render stopped ${stoppedAfterMs} ms after the delete, at progress ${progressAtDelete.toFixed(2)}`);
    expect(t.ctx.printSets.activeCount).toBe(0);
    // Nothing else was started in its place: the queued set left the queue.
    await t.ctx.printSets.whenIdle();
    expect(await status(a1)).toBeUndefined();
    expect(await isStored(`print-sets/${owner.user!.id}/${a1}.pdf`)).toBe(false);
    expect(await isStored(`print-sets/${owner.user!.id}/${a2}.pdf`)).toBe(false);
  });

  it('refuses with 422, before queueing, a set whose templates need more sheets than the budget', async () => {
    // 100 sections of 6.5 × 9 in. made 1,000 times: a print of each per block, by area alone
    // about 89,000 Letter sheets.
    const doc = { ...manySheetsDocument(100, 'Too big'), blockCount: 1000 };
    const id = (await owner.post('/api/patterns', { document: doc }).expect(201)).body.pattern.id as string;
    const { printSets } = t.ctx.data.t;
    const setCount = async () => Number((await t.ctx.data.db.select({ n: count() }).from(printSets))[0].n);
    const before = await setCount();
    const res = await owner.post(`/api/patterns/${id}/print-sets`, { options: { paper: 'letter' } });
    expect(res.status).toBe(422);
    expect(res.body.error).toMatch(new RegExp(`at most ${MAX_PRINT_SHEETS}`));
    expect(res.body.details.maxSheets).toBe(MAX_PRINT_SHEETS);
    expect(res.body.details.sheets).toBeGreaterThan(MAX_PRINT_SHEETS);
    const after = await setCount();
    expect(after).toBe(before);
    // One copy of each fits the budget.
    await owner.post(`/api/patterns/${id}/print-sets`, { options: { paper: 'letter', copies: 'single' } }).expect(202);
    const [last] = await t.ctx.data.db.select({ id: printSets.id }).from(printSets).where(eq(printSets.patternId, id));
    await owner.del(`/api/patterns/${id}/print-sets/${last.id}`).expect(204);
  });
});
