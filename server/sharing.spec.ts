import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client, sampleDocument, startTestServer, tokenFromMail, userClient, type TestServer } from './test/harness';

let t: TestServer;
let owner: Client;
beforeAll(async () => {
  t = await startTestServer();
  owner = await userClient(t.app, 'owner@share.test', 'designer');
});
afterAll(async () => {
  await t.close();
});

async function invite(patternId: string, email: string, access: 'co-designer' | 'quilter') {
  const arrives = t.mail.waitFor(email);
  const res = await owner.post(`/api/patterns/${patternId}/invitations`, { email, access });
  expect(res.status).toBe(201);
  const mail = await arrives;
  return { res, mail, ...tokenFromMail(mail.text) };
}

describe('sharing by e-mail', () => {
  it('invites a quilter by a real e-mail whose link, followed, makes them a member', async () => {
    const p = await owner.post('/api/patterns', { document: sampleDocument('Shared star') }).expect(201);
    const id = p.body.pattern.id;
    const { mail, link, token } = await invite(id, 'Quinn@Share.test', 'quilter');
    expect(mail.from).toContain('no-reply@seamwright.localhost');
    expect(mail.subject).toBe('owner shared "Shared star" with you');
    expect(mail.text).toContain('as a quilter');
    expect(link.startsWith('http://localhost:4200/invitations/accept?token=')).toBe(true);

    // The invitee has no account yet: the link's preview works signed out.
    const anon = await Client.create(t.app);
    const preview = await anon.get(`/api/invitations/${token}`).expect(200);
    expect(preview.body.invitation).toMatchObject({ patternTitle: 'Shared star', email: 'quinn@share.test', access: 'quilter' });
    await anon.post('/api/invitations/accept', { token }).expect(401);

    // Someone else signed in cannot use the link.
    const other = await userClient(t.app, 'other@share.test', 'quilter');
    const wrongUser = await other.post('/api/invitations/accept', { token });
    expect(wrongUser.status).toBe(403);
    await other.get(`/api/patterns/${id}`).expect(404);

    const quinn = await userClient(t.app, 'quinn@share.test', 'quilter');
    await quinn.get(`/api/patterns/${id}`).expect(404);
    const accepted = await quinn.post('/api/invitations/accept', { token }).expect(200);
    expect(accepted.body.pattern).toMatchObject({ id, access: 'quilter' });
    const read = await quinn.get(`/api/patterns/${id}`).expect(200);
    expect(read.body.pattern.access).toBe('quilter');
    // Quilters view, not edit.
    await quinn.put(`/api/patterns/${id}`, { baseRevision: 1, document: sampleDocument('mine now') }).expect(403);
    const shared = await quinn.get('/api/patterns?scope=shared').expect(200);
    expect(shared.body.items.map((x: { id: string }) => x.id)).toEqual([id]);
    // Used once.
    await quinn.post('/api/invitations/accept', { token }).expect(404);

    const list = await owner.get(`/api/patterns/${id}/members`).expect(200);
    expect(list.body.members).toMatchObject([{ email: 'quinn@share.test', access: 'quilter' }]);

    // The owner promotes, then revokes.
    const quinnId = quinn.user!.id;
    await owner.patch(`/api/patterns/${id}/members/${quinnId}`, { access: 'co-designer' }).expect(200);
    await quinn.put(`/api/patterns/${id}`, { baseRevision: 1, document: sampleDocument('Quinn edit') }).expect(200);
    await owner.del(`/api/patterns/${id}/members/${quinnId}`).expect(204);
    await quinn.get(`/api/patterns/${id}`).expect(404);
    const after = await owner.get(`/api/patterns/${id}`).expect(200);
    expect(after.body.revision.author.id).toBe(quinnId); // the co-designer's save was kept with its author
  });

  it('invites a co-designer who may edit; expired and revoked invitations do not work', async () => {
    const p = await owner.post('/api/patterns', { document: sampleDocument('Co block') }).expect(201);
    const id = p.body.pattern.id;
    const cody = await userClient(t.app, 'cody@share.test', 'designer');

    const expired = await invite(id, 'cody@share.test', 'co-designer');
    const { invitations } = t.ctx.data.t;
    await t.ctx.data.db.update(invitations).set({ expiresAt: new Date(Date.now() - 1) }).where(eq(invitations.patternId, id));
    await cody.post('/api/invitations/accept', { token: expired.token }).expect(404);
    await cody.get(`/api/invitations/${expired.token}`).expect(404);

    const revoked = await invite(id, 'cody@share.test', 'co-designer');
    const pending = await owner.get(`/api/patterns/${id}/members`).expect(200);
    expect(pending.body.invitations).toHaveLength(1);
    await owner.del(`/api/patterns/${id}/invitations/${revoked.res.body.invitation.id}`).expect(204);
    await cody.post('/api/invitations/accept', { token: revoked.token }).expect(404);

    const good = await invite(id, 'cody@share.test', 'co-designer');
    await cody.post('/api/invitations/accept', { token: good.token }).expect(200);
    const saved = await cody.put(`/api/patterns/${id}`, { baseRevision: 1, document: sampleDocument('Co edit') }).expect(200);
    expect(saved.body.revision.author.id).toBe(cody.user!.id);
    // Co-designers cannot share or trash.
    await cody.post(`/api/patterns/${id}/invitations`, { email: 'x@share.test', access: 'quilter' }).expect(403);
    await cody.post(`/api/patterns/${id}/trash`).expect(403);
    // A member may leave.
    await cody.del(`/api/patterns/${id}/members/${cody.user!.id}`).expect(204);
    await cody.get(`/api/patterns/${id}`).expect(404);
  });

  it('keeps a sewing log per user and per pattern', async () => {
    const p = await owner.post('/api/patterns', { document: sampleDocument('Log block') }).expect(201);
    const id = p.body.pattern.id;
    const sewer = await userClient(t.app, 'sewer@share.test', 'quilter');
    const { token } = await invite(id, 'sewer@share.test', 'quilter');
    await sewer.post('/api/invitations/accept', { token }).expect(200);

    const put = await sewer.put(`/api/patterns/${id}/sewing-log/sec-a`, { stage: 'pieced' }).expect(200);
    expect(put.body.entry).toMatchObject({ sectionId: 'sec-a', copy: 1, stage: 'pieced' });
    await sewer.put(`/api/patterns/${id}/sewing-log/sec-a`, { stage: 'trimmed' }).expect(200);
    const mine = await sewer.get(`/api/patterns/${id}/sewing-log`).expect(200);
    expect(mine.body.entries).toMatchObject([{ sectionId: 'sec-a', copy: 1, stage: 'trimmed' }]);
    const ownerLog = await owner.get(`/api/patterns/${id}/sewing-log`).expect(200);
    expect(ownerLog.body.entries).toEqual([]);
    const unknown = await sewer.put(`/api/patterns/${id}/sewing-log/sec-zz`, { stage: 'pieced' });
    expect(unknown.status).toBe(400);
    const badStage = await sewer.put(`/api/patterns/${id}/sewing-log/sec-a`, { stage: 'ironed' });
    expect(badStage.status).toBe(400);
    expect(badStage.body.details[0].path).toBe('stage');
    const cleared = await sewer.put(`/api/patterns/${id}/sewing-log/sec-a`, { stage: null }).expect(200);
    expect(cleared.body.entry).toBeNull();
    expect((await sewer.get(`/api/patterns/${id}/sewing-log`)).body.entries).toEqual([]);
  });
});

describe('admin', () => {
  it('lists users, changes a role and disables a user (ending their sessions); others get 403', async () => {
    const admin = await userClient(t.app, 'admin@share.test', 'designer');
    const { users } = t.ctx.data.t;
    await t.ctx.data.db.update(users).set({ role: 'admin' }).where(eq(users.email, 'admin@share.test'));
    const target = await userClient(t.app, 'target@share.test', 'quilter');
    await target.get('/api/admin/users').expect(403);
    await (await Client.create(t.app)).get('/api/admin/users').expect(401);

    const list = await admin.get('/api/admin/users?q=target').expect(200);
    expect(list.body.items).toMatchObject([{ email: 'target@share.test', role: 'quilter' }]);
    expect(list.body.items[0].passwordHash).toBeUndefined();
    // The search ignores case on both databases, as SQLite's LIKE does for ASCII.
    expect((await admin.get('/api/admin/users?q=TARGET@SHARE').expect(200)).body.items).toMatchObject([{ email: 'target@share.test' }]);
    const promoted = await admin.patch(`/api/admin/users/${target.user!.id}`, { role: 'designer' }).expect(200);
    expect(promoted.body.user.role).toBe('designer');
    await target.post('/api/patterns', { document: sampleDocument('Now allowed') }).expect(201);

    await admin.patch(`/api/admin/users/${target.user!.id}`, { disabled: true }).expect(200);
    await target.get('/api/auth/me').expect(401);
    const again = await Client.create(t.app);
    expect((await again.signIn('target@share.test')).status).toBe(403);
    await admin.patch(`/api/admin/users/${admin.user!.id}`, { disabled: true }).expect(400);
    await admin.patch(`/api/admin/users/${target.user!.id}`, { role: 'wizard' }).expect(400);
    await admin.patch('/api/admin/users/nobody', { role: 'designer' }).expect(404);

    const inbox = await admin.get('/api/admin/dev-inbox').expect(200);
    expect(Array.isArray(inbox.body.messages)).toBe(true);
  });
});
