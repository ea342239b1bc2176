import { count, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sampleDocument, startTestServer, userClient, type Client, type TestServer } from './test/harness';

let t: TestServer;
let designer: Client;
let quilter: Client;
beforeAll(async () => {
  t = await startTestServer();
  designer = await userClient(t.app, 'designer@patterns.test', 'designer');
  quilter = await userClient(t.app, 'quilter@patterns.test', 'quilter');
});
afterAll(async () => {
  await t.close();
});

const revisionCount = async (id: string) => {
  const { revisions } = t.ctx.data.t;
  return (await t.ctx.data.db.select({ n: count() }).from(revisions).where(eq(revisions.patternId, id)))[0]!.n;
};
const patternCount = async () => (await t.ctx.data.db.select({ n: count() }).from(t.ctx.data.t.patterns))[0]!.n;

describe('patterns', () => {
  it('creates a pattern with revision 1 by its author and reads it back', async () => {
    const res = await designer.post('/api/patterns', { document: sampleDocument('Nine patch') }).expect(201);
    expect(res.body.pattern).toMatchObject({ title: 'Nine patch', access: 'owner', headRevision: 1, trashedAt: null });
    expect(res.body.revision).toMatchObject({ number: 1, author: { id: designer.user!.id }, restoredFrom: null });
    // Defaults of the piecing schema are filled in: ¼ in. seam allowance (common practice).
    expect(res.body.revision.document.seamAllowanceIn).toBe(0.25);
    const read = await designer.get(`/api/patterns/${res.body.pattern.id}`).expect(200);
    expect(read.body.revision.document.sections[0].id).toBe('sec-a');
  });

  it('does not let a quilter account create patterns', async () => {
    const res = await quilter.post('/api/patterns', { document: sampleDocument() });
    expect(res.status).toBe(403);
  });

  it('rejects a bad document with the path of the bad field and stores nothing', async () => {
    const before = await patternCount();
    const bad = { ...sampleDocument(), sections: [{ ...sampleDocument().sections[0], label: 'a1' }] };
    const res = await designer.post('/api/patterns', { document: bad });
    expect(res.status).toBe(400);
    expect(res.body.error).toBe('The pattern document is not valid');
    expect(res.body.details).toContainEqual({ path: 'document.sections.0.label', message: 'must be one to three capital letters' });
    const after = await patternCount();
    expect(after).toBe(before);
  });

  it('saves new revisions on the latest base and answers 409 with the latest on a stale base, losing nothing', async () => {
    const created = await designer.post('/api/patterns', { document: sampleDocument('Stale test') }).expect(201);
    const id = created.body.pattern.id;
    const v2 = await designer.put(`/api/patterns/${id}`, { baseRevision: 1, document: sampleDocument('Stale test v2') }).expect(200);
    expect(v2.body.revision.number).toBe(2);
    expect(v2.body.pattern).toMatchObject({ headRevision: 2, title: 'Stale test v2' });

    const stale = await designer.put(`/api/patterns/${id}`, { baseRevision: 1, document: sampleDocument('Stale overwrite') });
    expect(stale.status).toBe(409);
    expect(stale.body.details.latest).toMatchObject({ number: 2, document: { title: 'Stale test v2' } });
    expect(await revisionCount(id)).toBe(2);

    // A bad document on the right base stores nothing either; the last good revision stays.
    const bad = await designer.put(`/api/patterns/${id}`, { baseRevision: 2, document: { ...sampleDocument(), canvas: { widthIn: -1, heightIn: 4 } } });
    expect(bad.status).toBe(400);
    expect(bad.body.details[0].path).toBe('document.canvas.widthIn');
    const read = await designer.get(`/api/patterns/${id}`).expect(200);
    expect(read.body.revision).toMatchObject({ number: 2, document: { title: 'Stale test v2' } });

    const revs = await designer.get(`/api/patterns/${id}/revisions`).expect(200);
    expect(revs.body.items.map((r: { number: number }) => r.number)).toEqual([2, 1]);
    const r1 = await designer.get(`/api/patterns/${id}/revisions/1`).expect(200);
    expect(r1.body.revision.document.title).toBe('Stale test');
  });

  it('of two concurrent saves on the same base, exactly one wins and the other gets 409', async () => {
    const created = await designer.post('/api/patterns', { document: sampleDocument('Race') }).expect(201);
    const id = created.body.pattern.id;
    for (let round = 1; round <= 5; round++) {
      const [a, b] = await Promise.all([
        designer.put(`/api/patterns/${id}`, { baseRevision: round, document: sampleDocument(`Race A${round}`) }),
        designer.put(`/api/patterns/${id}`, { baseRevision: round, document: sampleDocument(`Race B${round}`) }),
      ]);
      expect([a.status, b.status].sort()).toEqual([200, 409]);
      const loser = a.status === 409 ? a : b;
      const winner = a.status === 200 ? a : b;
      expect(loser.body.details.latest.number).toBe(round + 1);
      expect(loser.body.details.latest.document.title).toBe(winner.body.revision.document.title);
    }
    expect(await revisionCount(id)).toBe(6);
  });

  it('restores an old revision as a new one', async () => {
    const created = await designer.post('/api/patterns', { document: sampleDocument('Restore me') }).expect(201);
    const id = created.body.pattern.id;
    await designer.put(`/api/patterns/${id}`, { baseRevision: 1, document: sampleDocument('Changed') }).expect(200);
    const stale = await designer.post(`/api/patterns/${id}/revisions/1/restore`, { baseRevision: 1 });
    expect(stale.status).toBe(409);
    const res = await designer.post(`/api/patterns/${id}/revisions/1/restore`, { baseRevision: 2 }).expect(201);
    expect(res.body.revision).toMatchObject({ number: 3, restoredFrom: 1, document: { title: 'Restore me' } });
    expect(res.body.pattern.title).toBe('Restore me');
    await designer.get(`/api/patterns/${id}/revisions/9`).expect(404);
  });

  it('duplicates, trashes, restores and deletes for good', async () => {
    const created = await designer.post('/api/patterns', { document: sampleDocument('Original') }).expect(201);
    const id = created.body.pattern.id;
    const dup = await designer.post(`/api/patterns/${id}/duplicate`, {}).expect(201);
    expect(dup.body.pattern.id).not.toBe(id);
    expect(dup.body.pattern.title).toBe('Original (copy)');
    expect(dup.body.revision.number).toBe(1);

    await designer.del(`/api/patterns/${id}`).expect(409); // not in the trash yet
    const trashed = await designer.post(`/api/patterns/${id}/trash`).expect(200);
    expect(trashed.body.pattern.trashedAt).not.toBeNull();
    const trash = await designer.get('/api/patterns?scope=trash').expect(200);
    expect(trash.body.items.map((p: { id: string }) => p.id)).toContain(id);
    const all = await designer.get('/api/patterns').expect(200);
    expect(all.body.items.map((p: { id: string }) => p.id)).not.toContain(id);
    await designer.put(`/api/patterns/${id}`, { baseRevision: 1, document: sampleDocument() }).expect(409);

    await designer.post(`/api/patterns/${id}/restore`).expect(200);
    await designer.post(`/api/patterns/${id}/trash`).expect(200);
    await designer.del(`/api/patterns/${id}`).expect(204);
    await designer.get(`/api/patterns/${id}`).expect(404);
    expect(await revisionCount(id)).toBe(0);
  });

  it('lists paged, sorted and searched by title', async () => {
    const lister = await userClient(t.app, 'lister@patterns.test', 'designer');
    const titles = ['Delta star', 'alpha wheel', 'Charlie gate', 'Bravo 100%_off', 'Echo star'];
    for (const title of titles) await lister.post('/api/patterns', { document: sampleDocument(title) }).expect(201);
    const byTitle = await lister.get('/api/patterns?sort=title&order=asc&pageSize=2').expect(200);
    expect(byTitle.body).toMatchObject({ total: 5, page: 1, pageSize: 2 });
    expect(byTitle.body.items.map((p: { title: string }) => p.title)).toEqual(['alpha wheel', 'Bravo 100%_off']);
    const page3 = await lister.get('/api/patterns?sort=title&order=asc&pageSize=2&page=3').expect(200);
    expect(page3.body.items.map((p: { title: string }) => p.title)).toEqual(['Echo star']);
    const newest = await lister.get('/api/patterns?sort=created&order=desc&pageSize=1').expect(200);
    expect(newest.body.items[0].title).toBe('Echo star');
    const star = await lister.get('/api/patterns?q=STAR&sort=title&order=desc').expect(200);
    expect(star.body.items.map((p: { title: string }) => p.title)).toEqual(['Echo star', 'Delta star']);
    // LIKE wildcards in the search are taken literally.
    const pct = await lister.get('/api/patterns?q=%25_').expect(200);
    expect(pct.body.items.map((p: { title: string }) => p.title)).toEqual(['Bravo 100%_off']);
    const bad = await lister.get('/api/patterns?pageSize=1000&sort=colour');
    expect(bad.status).toBe(400);
    expect(bad.body.details.map((d: { path: string }) => d.path).sort()).toEqual(['pageSize', 'sort']);
  });
});
