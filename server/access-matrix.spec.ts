import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client, TINY_PNG, sampleDocument, sharedPattern, startTestServer, userClient, type TestServer } from './test/harness';
import { storeFinishedPrintSet } from './test/stored-print-set';

/**
 * The access matrix (docs/design-notes.md#roles-and-access): for every route about one pattern, what the owner, a co-designer,
 * a quilter, a stranger, an administrator who is not a member and a signed-out visitor get. Strangers,
 * administrators (who manage accounts, not patterns: docs/design-notes.md, roles) and visitors always
 * get 404. The admin routes have their own matrix below.
 */
type Actor = 'owner' | 'co' | 'quilter' | 'stranger' | 'admin' | 'anon';
const ACTORS: Actor[] = ['owner', 'co', 'quilter', 'stranger', 'admin', 'anon'];

let t: TestServer;
let clients: Record<Actor, Client>;
let extra: Client; // a further member, for member-removal cases

beforeAll(async () => {
  t = await startTestServer();
  clients = {
    owner: await userClient(t.app, 'owner@matrix.test', 'designer'),
    co: await userClient(t.app, 'co@matrix.test', 'designer'),
    quilter: await userClient(t.app, 'quilter@matrix.test', 'quilter'),
    stranger: await userClient(t.app, 'stranger@matrix.test', 'designer'),
    admin: await userClient(t.app, 'admin@matrix.test', 'designer'),
    anon: await Client.create(t.app),
  };
  // Sign-up never makes an administrator: the role is given in the database, as an operator would.
  const { users } = t.ctx.data.t;
  await t.ctx.data.db.update(users).set({ role: 'admin' }).where(eq(users.id, clients.admin.user!.id));
  extra = await userClient(t.app, 'extra@matrix.test', 'quilter');
});
afterAll(async () => {
  await t.close();
});

interface Fixture {
  id: string;
  uploadId: string;
  invitationId: string;
  printSetId: string;
  /** The quilter's own colourway copy of the pattern (theirs alone: everyone else gets 404). */
  copyId: string;
}

/** A fresh pattern shared with co (co-designer), quilter and extra (quilters), with an upload and an invitation. */
async function fixture(trashed = false): Promise<Fixture> {
  const id = await sharedPattern(t, clients.owner, [
    { client: clients.co, access: 'co-designer' },
    { client: clients.quilter, access: 'quilter' },
    { client: extra, access: 'quilter' },
  ]);
  const up = await clients.owner.req('post', `/api/patterns/${id}/uploads`).attach('file', TINY_PNG, 'ref.png');
  expect(up.status).toBe(201);
  const inv = await clients.owner.post(`/api/patterns/${id}/invitations`, { email: 'later@matrix.test', access: 'quilter' });
  expect(inv.status).toBe(201);
  // A finished print set made by the owner, stored as the renderer stores it (rendering itself has its
  // own tests; here only who may reach it matters).
  const printSetId = await storeFinishedPrintSet(t, id, clients.owner.user!.id);
  const copyId = `cc${Math.random().toString(36).slice(2, 12)}`;
  const now = new Date();
  await t.ctx.data.db
    .insert(t.ctx.data.t.colourwayCopies)
    .values({ id: copyId, userId: clients.quilter.user!.id, patternId: id, name: 'Mine', fabrics: {}, version: 1, createdAt: now, updatedAt: now });
  if (trashed) await clients.owner.post(`/api/patterns/${id}/trash`).expect(200);
  return { id, uploadId: up.body.upload.id, invitationId: inv.body.invitation.id, printSetId, copyId };
}

interface Case {
  name: string;
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  path: (f: Fixture) => string;
  body?: (f: Fixture) => object;
  upload?: boolean;
  trashed?: boolean;
  expect: Record<Actor, number>;
}

const READ = { owner: 200, co: 200, quilter: 200, stranger: 404, admin: 404, anon: 404 };
const EDIT = (ok: number) => ({ owner: ok, co: ok, quilter: 403, stranger: 404, admin: 404, anon: 404 });
const OWNER = (ok: number) => ({ owner: ok, co: 403, quilter: 403, stranger: 404, admin: 404, anon: 404 });
const OWNER_TRASHED = (ok: number) => ({ owner: ok, co: 404, quilter: 404, stranger: 404, admin: 404, anon: 404 });
/** The quilter's own colourway copy: theirs alone, 404 to everyone else, the pattern's owner too. */
const COPY_OWNER = (ok: number) => ({ owner: 404, co: 404, quilter: ok, stranger: 404, admin: 404, anon: 404 });

const CASES: Case[] = [
  { name: 'read pattern', method: 'get', path: (f) => `/api/patterns/${f.id}`, expect: READ },
  { name: 'save pattern', method: 'put', path: (f) => `/api/patterns/${f.id}`, body: () => ({ baseRevision: 1, document: sampleDocument('edit') }), expect: EDIT(200) },
  { name: 'duplicate', method: 'post', path: (f) => `/api/patterns/${f.id}/duplicate`, body: () => ({}), expect: EDIT(201) },
  { name: 'trash', method: 'post', path: (f) => `/api/patterns/${f.id}/trash`, expect: OWNER(200) },
  { name: 'restore from trash', method: 'post', path: (f) => `/api/patterns/${f.id}/restore`, trashed: true, expect: OWNER_TRASHED(200) },
  { name: 'read trashed pattern', method: 'get', path: (f) => `/api/patterns/${f.id}`, trashed: true, expect: OWNER_TRASHED(200) },
  { name: 'delete for good', method: 'delete', path: (f) => `/api/patterns/${f.id}`, trashed: true, expect: OWNER_TRASHED(204) },
  { name: 'list revisions', method: 'get', path: (f) => `/api/patterns/${f.id}/revisions`, expect: READ },
  { name: 'list runs of saves', method: 'get', path: (f) => `/api/patterns/${f.id}/revisions/groups`, expect: READ },
  { name: 'save a named version', method: 'post', path: (f) => `/api/patterns/${f.id}/revisions`, body: () => ({ baseRevision: 1, name: 'x' }), expect: EDIT(201) },
  { name: 'read revision', method: 'get', path: (f) => `/api/patterns/${f.id}/revisions/1`, expect: READ },
  { name: 'restore revision', method: 'post', path: (f) => `/api/patterns/${f.id}/revisions/1/restore`, body: () => ({ baseRevision: 1 }), expect: EDIT(201) },
  { name: 'list members', method: 'get', path: (f) => `/api/patterns/${f.id}/members`, expect: READ },
  { name: 'invite', method: 'post', path: (f) => `/api/patterns/${f.id}/invitations`, body: () => ({ email: 'new@matrix.test', access: 'quilter' }), expect: OWNER(201) },
  { name: 'revoke invitation', method: 'delete', path: (f) => `/api/patterns/${f.id}/invitations/${f.invitationId}`, expect: OWNER(204) },
  { name: 'change member access', method: 'patch', path: (f) => `/api/patterns/${f.id}/members/${extra.user!.id}`, body: () => ({ access: 'co-designer' }), expect: OWNER(200) },
  { name: 'remove another member', method: 'delete', path: (f) => `/api/patterns/${f.id}/members/${extra.user!.id}`, expect: OWNER(204) },
  { name: 'read sewing log', method: 'get', path: (f) => `/api/patterns/${f.id}/sewing-log`, expect: READ },
  { name: 'write sewing log', method: 'put', path: (f) => `/api/patterns/${f.id}/sewing-log/sec-a`, body: () => ({ stage: 'trimmed' }), expect: READ },
  { name: 'upload image', method: 'post', path: (f) => `/api/patterns/${f.id}/uploads`, upload: true, expect: EDIT(201) },
  { name: 'list uploads', method: 'get', path: (f) => `/api/patterns/${f.id}/uploads`, expect: READ },
  { name: 'read upload file', method: 'get', path: (f) => `/api/patterns/${f.id}/uploads/${f.uploadId}/file`, expect: READ },
  { name: 'delete upload', method: 'delete', path: (f) => `/api/patterns/${f.id}/uploads/${f.uploadId}`, expect: EDIT(204) },
  { name: 'list print sets', method: 'get', path: (f) => `/api/patterns/${f.id}/print-sets`, expect: READ },
  { name: 'read print set', method: 'get', path: (f) => `/api/patterns/${f.id}/print-sets/${f.printSetId}`, expect: READ },
  { name: 'follow print set events', method: 'get', path: (f) => `/api/patterns/${f.id}/print-sets/${f.printSetId}/events`, expect: READ },
  { name: 'download print set', method: 'get', path: (f) => `/api/patterns/${f.id}/print-sets/${f.printSetId}/file`, expect: READ },
  { name: "delete the owner's print set", method: 'delete', path: (f) => `/api/patterns/${f.id}/print-sets/${f.printSetId}`, expect: { owner: 204, co: 403, quilter: 403, stranger: 404, admin: 404, anon: 404 } },
  { name: 'list own colourway copies', method: 'get', path: (f) => `/api/patterns/${f.id}/colourway-copies`, expect: READ },
  { name: 'copy a colourway', method: 'post', path: (f) => `/api/patterns/${f.id}/colourway-copies`, body: () => ({ colourwayId: null }), expect: { owner: 201, co: 201, quilter: 201, stranger: 404, admin: 404, anon: 404 } },
  { name: "read the quilter's copy", method: 'get', path: (f) => `/api/patterns/${f.id}/colourway-copies/${f.copyId}`, expect: COPY_OWNER(200) },
  { name: "save the quilter's copy", method: 'patch', path: (f) => `/api/patterns/${f.id}/colourway-copies/${f.copyId}`, body: () => ({ version: 1, name: 'Renamed' }), expect: COPY_OWNER(200) },
  { name: "delete the quilter's copy", method: 'delete', path: (f) => `/api/patterns/${f.id}/colourway-copies/${f.copyId}`, expect: COPY_OWNER(204) },
  { name: "request print set in the quilter's copy", method: 'post', path: (f) => `/api/patterns/${f.id}/print-sets`, body: (f) => ({ colourwayCopyId: f.copyId, options: {} }), expect: COPY_OWNER(202) },
  { name: 'request print set', method: 'post', path: (f) => `/api/patterns/${f.id}/print-sets`, body: () => ({ options: {} }), expect: { owner: 202, co: 202, quilter: 202, stranger: 404, admin: 404, anon: 404 } },
];

describe('access matrix', () => {
  for (const c of CASES) {
    it(`${c.name}: ${ACTORS.map((a) => `${a} ${c.expect[a]}`).join(', ')}`, async () => {
      const got: Record<string, number> = {};
      // Each actor gets a fresh fixture so one actor's write cannot change another's answer.
      for (const actor of ACTORS) {
        const f = await fixture(c.trashed);
        let r = clients[actor].req(c.method, c.path(f));
        if (c.upload) r = r.attach('file', TINY_PNG, 'ref.png');
        else if (c.body) r = r.send(c.body(f));
        const res = await r;
        got[actor] = res.status;
        if (res.status >= 400) {
          expect(Object.keys(res.body).sort()).toEqual(['details', 'error']);
          if (res.status === 404) expect(JSON.stringify(res.body)).not.toContain(f.id);
        }
      }
      expect(got).toEqual(c.expect);
    });
  }

  it('an id of another pattern under a pattern one may see is still 404', async () => {
    const theirs = await fixture();
    const mine = await sharedPattern(t, clients.stranger, [], 'Stranger own');
    const s = clients.stranger;
    await s.get(`/api/patterns/${mine}/uploads/${theirs.uploadId}/file`).expect(404);
    await s.del(`/api/patterns/${mine}/uploads/${theirs.uploadId}`).expect(404);
    await s.del(`/api/patterns/${mine}/invitations/${theirs.invitationId}`).expect(404);
    await s.patch(`/api/patterns/${mine}/members/${clients.quilter.user!.id}`, { access: 'co-designer' }).expect(404);
    await s.get(`/api/patterns/${mine}/print-sets/${theirs.printSetId}`).expect(404);
    await s.get(`/api/patterns/${mine}/print-sets/${theirs.printSetId}/file`).expect(404);
    await s.del(`/api/patterns/${mine}/print-sets/${theirs.printSetId}`).expect(404);
  });

  it('the admin routes: administrators only; signed-in others 403, visitors 401', async () => {
    const got: Record<string, [number, number, number]> = {};
    for (const actor of ACTORS) {
      const c = clients[actor];
      const list = await c.get('/api/admin/users');
      const change = await c.patch(`/api/admin/users/${extra.user!.id}`, { role: 'quilter' });
      const inbox = await c.get('/api/admin/dev-inbox');
      got[actor] = [list.status, change.status, inbox.status === 502 ? 200 : inbox.status];
      if (list.status >= 400) expect(Object.keys(list.body).sort()).toEqual(['details', 'error']);
    }
    // The development inbox answers 502 when the fake mail server's inbox is not reachable; it is the
    // access decision that is checked here, so 502 counts as let through.
    expect(got).toEqual({
      owner: [403, 403, 403],
      co: [403, 403, 403],
      quilter: [403, 403, 403],
      stranger: [403, 403, 403],
      admin: [200, 200, 200],
      anon: [401, 401, 401],
    });
    // An administrator sees no pattern list of others either.
    const list = await clients.admin.get('/api/patterns').expect(200);
    expect(list.body.total).toBe(0);
  });

  it('signed-out visitors get 401 on the list and create routes', async () => {
    await clients.anon.get('/api/patterns').expect(401);
    await clients.anon.post('/api/patterns', { document: sampleDocument() }).expect(401);
  });
});
