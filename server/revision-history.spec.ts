import { count, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sampleDocument, sharedPattern, startTestServer, userClient, type Client, type TestServer } from './test/harness';

/*
 * History's runs of saves (one editing session, one author) and named versions (docs/api.md, "Revisions").
 */

let t: TestServer;
let owner: Client;
let coDesigner: Client;
let quilter: Client;
let stranger: Client;
beforeAll(async () => {
  t = await startTestServer();
  owner = await userClient(t.app, 'owner@history.test');
  coDesigner = await userClient(t.app, 'co@history.test');
  quilter = await userClient(t.app, 'quilter@history.test', 'quilter');
  stranger = await userClient(t.app, 'stranger@history.test');
});
afterAll(async () => {
  await t.close();
});

const SESSION_A = 'board-session-aaaa';
const SESSION_B = 'board-session-bbbb';

interface Group {
  first: number;
  last: number;
  count: number;
  author: { id: string; displayName: string };
  startedAt: string;
  endedAt: string;
  version: { name: string; note: string | null } | null;
  restoredFrom: number | null;
}

const revisionCount = async (id: string) => {
  const { revisions } = t.ctx.data.t;
  return (await t.ctx.data.db.select({ n: count() }).from(revisions).where(eq(revisions.patternId, id)))[0]!.n;
};

/** Saves the sample document (title `title`) on top of `base` as `who`; returns the new revision number. */
async function save(who: Client, id: string, base: number, title: string, editSession?: string): Promise<number> {
  const body = editSession ? { baseRevision: base, document: sampleDocument(title), editSession } : { baseRevision: base, document: sampleDocument(title) };
  const res = await who.put(`/api/patterns/${id}`, body);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body.revision.number;
}

/** The runs as `first–last×count by author`, newest first: easy to read in a failure. */
const brief = (groups: Group[]) =>
  groups.map((g) => `${g.first}-${g.last}x${g.count} ${g.author.displayName}${g.version ? ` [${g.version.name}]` : ''}${g.restoredFrom ? ` <${g.restoredFrom}` : ''}`);

describe('runs of saves in History', () => {
  let id: string;
  let groups: Group[];

  beforeAll(async () => {
    id = await sharedPattern(t, owner, [
      { client: coDesigner, access: 'co-designer' },
      { client: quilter, access: 'quilter' },
    ]);
    let n = 1;
    // 2–4: one board session of the owner.
    for (const title of ['a', 'b', 'c']) n = await save(owner, id, n, title, SESSION_A);
    // 5: a save without a session (an API client).
    n = await save(owner, id, n, 'plain');
    // 6–7: session A again; revision 5 broke the run, so a new one starts.
    n = await save(owner, id, n, 'd', SESSION_A);
    n = await save(owner, id, n, 'e', SESSION_A);
    // 8: a named version, from the same board session right after its saves: a row of its own all the same.
    const v = await owner.post(`/api/patterns/${id}/revisions`, { baseRevision: n, name: 'First fitting', note: 'Before the border', editSession: SESSION_A });
    expect(v.status).toBe(201);
    n = v.body.revision.number;
    // 9–10: session A after the version is a new run.
    n = await save(owner, id, n, 'g', SESSION_A);
    n = await save(owner, id, n, 'h', SESSION_A);
    // 11: another author with the same session id starts a run of their own; 12: another session.
    n = await save(coDesigner, id, n, 'f', SESSION_A);
    n = await save(owner, id, n, 'i', SESSION_B);
    // 13: a restore.
    const r = await owner.post(`/api/patterns/${id}/revisions/3/restore`, { baseRevision: n });
    expect(r.status).toBe(201);
    const res = await owner.get(`/api/patterns/${id}/revisions/groups?pageSize=100`).expect(200);
    expect(res.body.total).toBe(9);
    groups = res.body.items;
  });

  it('groups consecutive saves of one session and author, and keeps versions, restores and other saves apart', async () => {
    expect(brief(groups)).toEqual([
      '13-13x1 owner <3',
      '12-12x1 owner',
      '11-11x1 co',
      '9-10x2 owner',
      '8-8x1 owner [First fitting]',
      '6-7x2 owner',
      '5-5x1 owner',
      '2-4x3 owner',
      '1-1x1 owner',
    ]);
    expect(groups[4].version).toEqual({ name: 'First fitting', note: 'Before the border' });
    // Every save stays a revision.
    expect(await revisionCount(id)).toBe(13);
  });

  it('spans a run from its first save to its last', async () => {
    const run = groups.find((g) => g.first === 2)!;
    const all = await owner.get(`/api/patterns/${id}/revisions?pageSize=100`).expect(200);
    const at = (n: number) => all.body.items.find((r: { number: number }) => r.number === n).createdAt;
    expect(run.startedAt).toBe(at(2));
    expect(run.endedAt).toBe(at(4));
    expect(Date.parse(run.startedAt)).toBeLessThanOrEqual(Date.parse(run.endedAt));
  });

  it('pages the runs, newest first', async () => {
    const res = await owner.get(`/api/patterns/${id}/revisions/groups?page=2&pageSize=4`).expect(200);
    expect(res.body).toMatchObject({ total: 9, page: 2, pageSize: 4 });
    expect(brief(res.body.items)).toEqual(['8-8x1 owner [First fitting]', '6-7x2 owner', '5-5x1 owner', '2-4x3 owner']);
  });

  it('lists the revisions of one run by number range', async () => {
    const res = await owner.get(`/api/patterns/${id}/revisions?from=2&to=4`).expect(200);
    expect(res.body.total).toBe(3);
    expect(res.body.items.map((r: { number: number }) => r.number)).toEqual([4, 3, 2]);
    expect(res.body.items.every((r: { version: unknown }) => r.version === null)).toBe(true);
  });

  it('shows the runs to every member and hides them from strangers', async () => {
    const q = await quilter.get(`/api/patterns/${id}/revisions/groups`).expect(200);
    expect(q.body.total).toBe(9);
    const s = await stranger.get(`/api/patterns/${id}/revisions/groups`);
    expect(s.status).toBe(404);
    expect(s.body.error).toBe('Pattern not found');
  });

  it('counts a revision stored before grouping (no group_start) as a run of its own', async () => {
    const other = await sharedPattern(t, owner, [], 'Old history');
    let n = 1;
    for (const title of ['a', 'b', 'c']) n = await save(owner, other, n, title, SESSION_A);
    // As the migration leaves revisions saved before it: no session, no run.
    const { revisions } = t.ctx.data.t;
    await t.ctx.data.db.update(revisions).set({ groupStart: null, editSession: null }).where(eq(revisions.patternId, other));
    const before = await owner.get(`/api/patterns/${other}/revisions/groups`).expect(200);
    expect(brief(before.body.items)).toEqual(['4-4x1 owner', '3-3x1 owner', '2-2x1 owner', '1-1x1 owner']);
    // A save without a session stays alone too; new saves of a session start a run after them.
    n = await save(owner, other, n, 'plain');
    n = await save(owner, other, n, 'd', SESSION_A);
    n = await save(owner, other, n, 'e', SESSION_A);
    const after = await owner.get(`/api/patterns/${other}/revisions/groups`).expect(200);
    expect(brief(after.body.items)).toEqual(['6-7x2 owner', '5-5x1 owner', '4-4x1 owner', '3-3x1 owner', '2-2x1 owner', '1-1x1 owner']);
  });
});

describe('named versions', () => {
  it('keeps the latest document as a named version when no document is sent', async () => {
    const id = await sharedPattern(t, owner, [], 'Named');
    const n = await save(owner, id, 1, 'Named, drawn', SESSION_A);
    const res = await owner.post(`/api/patterns/${id}/revisions`, { baseRevision: n, name: '  Ready to test-sew  ', note: '' });
    expect(res.status).toBe(201);
    expect(res.body.revision).toMatchObject({ number: 3, version: { name: 'Ready to test-sew', note: null }, author: { id: owner.user!.id } });
    expect(res.body.revision.document.title).toBe('Named, drawn');
    expect(res.body.pattern.headRevision).toBe(3);
    const read = await owner.get(`/api/patterns/${id}/revisions/3`).expect(200);
    expect(read.body.revision.version).toEqual({ name: 'Ready to test-sew', note: null });
    const plain = await owner.get(`/api/patterns/${id}/revisions/2`).expect(200);
    expect(plain.body.revision.version).toBeNull();
  });

  it('keeps a sent document as the version, so unsaved board changes go into it', async () => {
    const id = await sharedPattern(t, owner, [], 'Sent');
    const res = await coDesigner.post(`/api/patterns/${id}/revisions`, { baseRevision: 1, name: 'x', document: sampleDocument('Sent, changed') });
    // Not a member of this one.
    expect(res.status).toBe(404);
    const mine = await owner.post(`/api/patterns/${id}/revisions`, { baseRevision: 1, name: 'Border added', note: 'Wider border', document: sampleDocument('Sent, changed') });
    expect(mine.status).toBe(201);
    expect(mine.body.revision).toMatchObject({ number: 2, version: { name: 'Border added', note: 'Wider border' }, document: { title: 'Sent, changed' } });
    expect(mine.body.pattern.title).toBe('Sent, changed');
  });

  it('answers a stale base with 409 and the latest revision, storing nothing (versions and session saves alike)', async () => {
    const id = await sharedPattern(t, owner, [], 'Stale');
    await save(owner, id, 1, 'Stale v2', SESSION_A);
    const version = await owner.post(`/api/patterns/${id}/revisions`, { baseRevision: 1, name: 'Too late' });
    expect(version.status).toBe(409);
    expect(version.body.error).toBe('This pattern was saved by someone else since revision 1');
    expect(version.body.details.latest).toMatchObject({ number: 2, version: null, document: { title: 'Stale v2' } });
    const put = await owner.put(`/api/patterns/${id}`, { baseRevision: 1, document: sampleDocument('Stale v3'), editSession: SESSION_A });
    expect(put.status).toBe(409);
    expect(put.body.details.latest.number).toBe(2);
    expect(await revisionCount(id)).toBe(2);
  });

  it('lets owners and co-designers name versions, refuses quilters (403) and hides the pattern from strangers (404)', async () => {
    const id = await sharedPattern(t, owner, [
      { client: coDesigner, access: 'co-designer' },
      { client: quilter, access: 'quilter' },
    ]);
    const q = await quilter.post(`/api/patterns/${id}/revisions`, { baseRevision: 1, name: 'Mine' });
    expect(q.status).toBe(403);
    expect(q.body.error).toBe('Quilter access cannot change this pattern');
    const s = await stranger.post(`/api/patterns/${id}/revisions`, { baseRevision: 1, name: 'Mine' });
    expect(s.status).toBe(404);
    expect(s.body.error).toBe('Pattern not found');
    expect(await revisionCount(id)).toBe(1);
    const c = await coDesigner.post(`/api/patterns/${id}/revisions`, { baseRevision: 1, name: 'Co-designer’s pick' });
    expect(c.status).toBe(201);
    expect(c.body.pattern.access).toBe('co-designer');
    expect(c.body.revision.author.displayName).toBe('co');
  });

  it('rejects bad names, notes, fields and documents with the field and the reason', async () => {
    const id = await sharedPattern(t, owner, [], 'Checked');
    const post = (body: object) => owner.post(`/api/patterns/${id}/revisions`, body);
    const cases: Array<[object, { path: string; message: string }]> = [
      [{ baseRevision: 1, name: '   ' }, { path: 'name', message: 'must not be empty' }],
      [{ baseRevision: 1, name: 'n'.repeat(81) }, { path: 'name', message: 'must be at most 80 characters' }],
      [{ baseRevision: 1, name: 'ok', note: 'n'.repeat(501) }, { path: 'note', message: 'must be at most 500 characters' }],
    ];
    for (const [body, detail] of cases) {
      const res = await post(body);
      expect(res.status).toBe(400);
      expect(res.body.error).toBe('Invalid request');
      expect(res.body.details).toContainEqual(detail);
    }
    // 80 characters and a 500-character note are allowed.
    const edge = await post({ baseRevision: 1, name: 'n'.repeat(80), note: 'n'.repeat(500) });
    expect(edge.status).toBe(201);

    const missing = await post({ baseRevision: 2 });
    expect(missing.status).toBe(400);
    expect(missing.body.details.map((d: { path: string }) => d.path)).toEqual(['name']);
    const extra = await post({ baseRevision: 2, name: 'x', colour: 'red' });
    expect(extra.status).toBe(400);
    const badDoc = await post({ baseRevision: 2, name: 'x', document: { ...sampleDocument(), canvas: { widthIn: -1, heightIn: 4 } } });
    expect(badDoc.status).toBe(400);
    expect(badDoc.body.error).toBe('The pattern document is not valid');
    expect(badDoc.body.details[0].path).toBe('document.canvas.widthIn');
    expect(await revisionCount(id)).toBe(2);
  });

  it('rejects a malformed editing session on a save, and a reversed range on the list', async () => {
    const id = await sharedPattern(t, owner, [], 'Sessions');
    const res = await owner.put(`/api/patterns/${id}`, { baseRevision: 1, document: sampleDocument(), editSession: 'no spaces!' });
    expect(res.status).toBe(400);
    expect(res.body.details).toContainEqual({ path: 'editSession', message: 'must be 8 to 64 letters, digits, "-" or "_"' });
    const range = await owner.get(`/api/patterns/${id}/revisions?from=5&to=2`);
    expect(range.status).toBe(400);
    expect(range.body.details).toContainEqual({ path: 'from', message: 'from must not be after to' });
    const groups = await owner.get(`/api/patterns/${id}/revisions/groups?pageSize=0`);
    expect(groups.status).toBe(400);
    expect(groups.body.details[0].path).toBe('pageSize');
    expect(await revisionCount(id)).toBe(1);
  });
});
