/**
 * Sessions and access under attack (issue: benchmarks, load, faults — hostile input), against the
 * real server process:
 * - a cookie copied before sign-out ("stolen") is refused afterwards, as are look-alike tokens;
 * - every state-changing route without the CSRF header, or with another session's token, is 403
 *   and changes nothing;
 * - another user's ids on every route are 404, the same answer as for ids that do not exist.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiClient, newCredentials, signedInClient } from '../support/api-client';
import { gridDocument } from '../support/documents';
import { buildWorld, expectCleanAnswer, TINY_PNG, uploadForm, type World } from '../support/fixtures';
import { startServerProcess, type ServerProcess } from '../support/server-process';

let server: ServerProcess;
let world: World;

beforeAll(async () => {
  server = await startServerProcess();
  world = await buildWorld(server, 'sessions');
});

afterAll(async () => {
  await server?.stop();
});

/** A client that carries a copy of another client's cookies and CSRF token. */
function copyOf(client: ApiClient): ApiClient {
  const thief = new ApiClient(client.baseUrl);
  for (const [k, v] of client.cookies) thief.cookies.set(k, v);
  thief.csrfToken = client.csrfToken;
  return thief;
}

describe('stolen and forged session cookies', () => {
  it('the session cookie is httpOnly and SameSite=Lax', async () => {
    const c = new ApiClient(server.baseUrl);
    const creds = newCredentials('designer', 'cookie');
    const res = await c.post('/api/auth/sign-up', creds);
    expect(res.status).toBe(201);
    const line = res.headers.getSetCookie().find((l) => l.startsWith('seamwright.sid='));
    expect(line).toBeDefined();
    expect(line).toMatch(/;\s*HttpOnly/i);
    expect(line).toMatch(/;\s*SameSite=Lax/i);
  });

  it('a cookie copied before sign-out is refused after it, everywhere', async () => {
    const { client: victim, credentials: victimCredentials } = await signedInClient(server.baseUrl, 'designer', 'victim');
    const made = await victim.post('/api/patterns', { document: gridDocument('Victim block', 2, 2, 2) });
    expect(made.status).toBe(201);
    const id = made.json.pattern.id;
    const thief = copyOf(victim);
    // Before sign-out the copy works (it is the same cookie) — so the refusal below is the sign-out's doing.
    expect((await thief.get('/api/auth/me')).status).toBe(200);

    const out = await victim.signOut();
    expect(out.status).toBe(200);
    const me = await thief.get('/api/auth/me');
    expect(me.status).toBe(401);
    expectCleanAnswer(me, 'me after sign-out');
    expect((await thief.get('/api/patterns')).status).toBe(401);
    const session = await thief.get('/api/auth/session');
    expect(session.status).toBe(200);
    expect(session.json.user).toBeNull();
    const read = await thief.get(`/api/patterns/${id}`);
    expect(read.status).toBe(404);
    expect(read.json.error).toBe('Pattern not found');
    // Writes with the stolen cookie and its old CSRF token: refused (403 for the token, or 404).
    const write = await thief.put(`/api/patterns/${id}`, { baseRevision: 1, document: gridDocument('Stolen edit', 2, 2, 2) });
    expect([403, 404]).toContain(write.status);
    expectCleanAnswer(write, 'write after sign-out');
    // Even with a fresh anonymous CSRF token the old cookie is no session.
    thief.csrfToken = undefined;
    const write2 = await thief.put(`/api/patterns/${id}`, { baseRevision: 1, document: gridDocument('Stolen edit', 2, 2, 2) });
    expect(write2.status).toBe(404);
    // Nothing changed: the pattern is still at revision 1 with its own title.
    expect((await victim.signIn(victimCredentials.email, victimCredentials.password)).status).toBe(200);
    const after = await victim.get(`/api/patterns/${id}`);
    expect(after.json.pattern.headRevision).toBe(1);
    expect(after.json.revision.document.title).toBe('Victim block');
  });

  it('sessions ended by a password change and a reset do not come back', async () => {
    const creds = newCredentials('designer', 'changer');
    const laptop = new ApiClient(server.baseUrl);
    await laptop.signUp(creds);
    const phone = new ApiClient(server.baseUrl);
    expect((await phone.signIn(creds.email, creds.password)).status).toBe(200);
    const stolen = copyOf(phone);
    const changed = await laptop.post('/api/auth/change-password', { currentPassword: creds.password, newPassword: 'a-brand-new-password-1' });
    expect(changed.status, changed.text).toBe(200);
    expect((await laptop.get('/api/auth/me')).status).toBe(200); // the session that changed it stays
    expect((await phone.get('/api/auth/me')).status).toBe(401);
    expect((await stolen.get('/api/auth/me')).status).toBe(401);
    expect((await new ApiClient(server.baseUrl).signIn(creds.email, creds.password)).status).toBe(401);
  });

  it('look-alike and malformed session cookies are nobody', async () => {
    const real = world.owner.cookies.get('seamwright.sid')!;
    const flip = (s: string) => s.slice(0, -1) + (s.endsWith('A') ? 'B' : 'A');
    const forged = [flip(real), real.toUpperCase(), real + 'x', real.slice(1), 'x'.repeat(real.length), '', 'x'.repeat(5000), '%00', 'null', 'undefined', `${real}; seamwright.sid=${real}`];
    for (const value of forged) {
      const c = new ApiClient(server.baseUrl);
      c.cookies.set('seamwright.sid', encodeURIComponent(value));
      const me = await c.get('/api/auth/me');
      expect(me.status, `cookie ${value.slice(0, 40)}`).toBe(401);
      expectCleanAnswer(me, 'forged cookie');
      const read = await c.get(`/api/patterns/${world.patternId}`);
      expect(read.status).toBe(404);
    }
  });
});

describe('guessing passwords', () => {
  it('after 10 failed sign-ins an account answers 429 with Retry-After, even to the right password, in any letter case', async () => {
    const { credentials } = await signedInClient(server.baseUrl, 'designer', 'guessed');
    const guesser = new ApiClient(server.baseUrl);
    for (let i = 0; i < 10; i++) {
      const res = await guesser.signIn(credentials.email, `wrong-password-${i}`);
      expect(res.status, `guess ${i + 1}`).toBe(401);
      expect(res.json.error).toBe('Wrong e-mail or password');
    }
    for (const email of [credentials.email, credentials.email.toUpperCase(), ` ${credentials.email} `]) {
      const limited = await guesser.signIn(email, credentials.password);
      expect(limited.status, email).toBe(429);
      expectCleanAnswer(limited, 'rate-limited sign-in');
      expect(Number(limited.headers.get('retry-after'))).toBeGreaterThan(0);
      expect(limited.json.details.retryAfterSeconds).toBe(Number(limited.headers.get('retry-after')));
    }
    expect(guesser.user).toBeUndefined();
    // Another account from the same address is not locked out by it.
    const other = await signedInClient(server.baseUrl, 'designer', 'bystander');
    const fresh = new ApiClient(server.baseUrl);
    expect((await fresh.signIn(other.credentials.email, other.credentials.password)).status).toBe(200);
  });
});

describe('CSRF', () => {
  /** Every state-changing route, with real ids of the world so only the token stands in the way. */
  const routes = (w: World): [string, string, unknown?][] => [
    ['POST', '/api/auth/sign-out'],
    ['POST', '/api/auth/change-password', { currentPassword: w.ownerCredentials.password, newPassword: 'another-password-99' }],
    ['POST', '/api/auth/sign-in', { email: w.ownerCredentials.email, password: w.ownerCredentials.password }],
    ['POST', '/api/auth/sign-up', newCredentials('designer', 'csrf')],
    ['POST', '/api/auth/password-reset', { email: w.ownerCredentials.email }],
    ['POST', '/api/auth/password-reset/confirm', { token: 'x'.repeat(43), newPassword: 'another-password-99' }],
    ['POST', '/api/patterns', { document: gridDocument('CSRF block', 2, 2, 2) }],
    ['PUT', `/api/patterns/${w.patternId}`, { baseRevision: 2, document: gridDocument('CSRF edit', 2, 2, 2) }],
    ['POST', `/api/patterns/${w.patternId}/duplicate`, {}],
    ['POST', `/api/patterns/${w.patternId}/trash`],
    ['POST', `/api/patterns/${w.patternId}/restore`],
    ['DELETE', `/api/patterns/${w.patternId}`],
    ['POST', `/api/patterns/${w.patternId}/revisions/1/restore`, { baseRevision: 2 }],
    ['POST', `/api/patterns/${w.patternId}/invitations`, { email: 'csrf-invite@faults.example', access: 'quilter' }],
    ['DELETE', `/api/patterns/${w.patternId}/invitations/${w.invitationId}`],
    ['PATCH', `/api/patterns/${w.patternId}/members/${w.partner.user!.id}`, { access: 'quilter' }],
    ['DELETE', `/api/patterns/${w.patternId}/members/${w.partner.user!.id}`],
    ['PUT', `/api/patterns/${w.patternId}/sewing-log/${w.sectionIds[0]}`, { stage: 'joined' }],
    ['POST', `/api/patterns/${w.patternId}/uploads`],
    ['DELETE', `/api/patterns/${w.patternId}/uploads/${w.uploadId}`],
    ['POST', `/api/patterns/${w.patternId}/print-sets`, { options: {} }],
    ['DELETE', `/api/patterns/${w.patternId}/print-sets/${w.printSetId}`],
    ['POST', '/api/invitations/accept', { token: w.invitationToken }],
    ['PATCH', `/api/admin/users/${w.partner.user!.id}`, { role: 'quilter' }],
  ];

  async function snapshot(w: World) {
    const p = await w.owner.get(`/api/patterns/${w.patternId}`);
    const m = await w.owner.get(`/api/patterns/${w.patternId}/members`);
    const u = await w.owner.get(`/api/patterns/${w.patternId}/uploads`);
    const l = await w.owner.get(`/api/patterns/${w.patternId}/sewing-log`);
    const list = await w.owner.get('/api/patterns?scope=all');
    const sets = await w.owner.get(`/api/patterns/${w.patternId}/print-sets`);
    return {
      printSets: sets.json.items.map((x: { id: string; status: string }) => [x.id, x.status]), pattern: p.json.pattern, members: m.json, uploads: u.json, log: l.json, total: list.json.total, me: (await w.owner.get('/api/auth/me')).status };
  }

  it('every state-changing route without the X-CSRF-Token header answers 403 and changes nothing', async () => {
    const before = await snapshot(world);
    for (const [method, path, json] of routes(world)) {
      const body = path.endsWith('/uploads') ? { body: uploadForm(TINY_PNG) } : { json: json ?? {} };
      const res = await world.owner.request(method, path, { ...body, csrf: false });
      expect(res.status, `${method} ${path}: ${res.text.slice(0, 200)}`).toBe(403);
      expect(res.json?.error).toBe('Missing or invalid CSRF token');
    }
    expect(await snapshot(world)).toEqual(before);
  });

  it('a token from another session, a forged token and an empty one are refused too', async () => {
    const before = await snapshot(world);
    const other = new ApiClient(server.baseUrl);
    const otherToken = await other.fetchCsrf();
    const ownToken = world.owner.csrfToken!;
    const forged = [otherToken, world.partner.csrfToken!, '', 'x', ownToken.toUpperCase(), ownToken.slice(0, -2), `${ownToken}${ownToken}`];
    for (const token of forged) {
      for (const [method, path, json] of routes(world).filter((_, i) => i % 3 === 0)) {
        const res = await world.owner.request(method, path, { json: json ?? {}, csrf: false, headers: { 'x-csrf-token': token } });
        expect(res.status, `${method} ${path} with token ${token.slice(0, 12)}…`).toBe(403);
      }
    }
    // The header without the cookie that comes with it is not enough either.
    const noCookie = await world.owner.request('PUT', `/api/patterns/${world.patternId}`, {
      json: { baseRevision: 2, document: gridDocument('No cookie', 2, 2, 2) },
      csrf: false,
      cookies: false,
      headers: { 'x-csrf-token': ownToken, cookie: `seamwright.sid=${world.owner.cookies.get('seamwright.sid')}` },
    });
    expect(noCookie.status).toBe(403);
    expect(await snapshot(world)).toEqual(before);
  });

  it('with the token the same request goes through (the 403s above are the token’s doing)', async () => {
    const res = await world.owner.put(`/api/patterns/${world.patternId}/sewing-log/${world.sectionIds[0]}`, { stage: 'joined' });
    expect(res.status, res.text).toBe(200);
    expect(res.json.entry.stage).toBe('joined');
  });
});

describe("another user's ids", () => {
  it('are 404 on every route, the same answer as for an id that does not exist', async () => {
    const { client: stranger } = await signedInClient(server.baseUrl, 'designer', 'stranger');
    const anonymous = new ApiClient(server.baseUrl);
    // The stranger's own pattern and upload, to mix with the owner's ids.
    const own = await stranger.post('/api/patterns', { document: gridDocument('Stranger block', 2, 2, 2) });
    expect(own.status).toBe(201);
    const ownId = own.json.pattern.id;
    const ownUpload = await stranger.request('POST', `/api/patterns/${ownId}/uploads`, { body: uploadForm(TINY_PNG) });
    expect(ownUpload.status).toBe(201);

    const w = world;
    const p = `/api/patterns/${w.patternId}`;
    const cases: [string, string, unknown?][] = [
      ['GET', p],
      ['PUT', p, { baseRevision: 2, document: gridDocument('Not yours', 2, 2, 2) }],
      ['POST', `${p}/duplicate`, {}],
      ['POST', `${p}/trash`],
      ['POST', `${p}/restore`],
      ['DELETE', p],
      ['GET', `${p}/revisions`],
      ['GET', `${p}/revisions/1`],
      ['GET', `${p}/revisions/2`],
      ['POST', `${p}/revisions/1/restore`, { baseRevision: 2 }],
      ['GET', `${p}/members`],
      ['POST', `${p}/invitations`, { email: 'sneaky@faults.example', access: 'co-designer' }],
      ['DELETE', `${p}/invitations/${w.invitationId}`],
      ['PATCH', `${p}/members/${w.partner.user!.id}`, { access: 'quilter' }],
      ['DELETE', `${p}/members/${w.partner.user!.id}`],
      ['GET', `${p}/sewing-log`],
      ['PUT', `${p}/sewing-log/${w.sectionIds[0]}`, { stage: 'pieced' }],
      ['GET', `${p}/uploads`],
      ['GET', `${p}/uploads/${w.uploadId}/file`],
      ['DELETE', `${p}/uploads/${w.uploadId}`],
      ['GET', `${p}/print-sets`],
      ['POST', `${p}/print-sets`, { options: {} }],
      ['GET', `${p}/print-sets/${w.printSetId}`],
      ['GET', `${p}/print-sets/${w.printSetId}/events`],
      ['GET', `${p}/print-sets/${w.printSetId}/file`],
      ['DELETE', `${p}/print-sets/${w.printSetId}`],
      // The stranger's own pattern with the owner's print set.
      ['GET', `/api/patterns/${ownId}/print-sets/${w.printSetId}`],
      ['GET', `/api/patterns/${ownId}/print-sets/${w.printSetId}/file`],
      ['DELETE', `/api/patterns/${ownId}/print-sets/${w.printSetId}`],
      // The stranger's own pattern with the owner's upload: still not theirs.
      ['GET', `/api/patterns/${ownId}/uploads/${w.uploadId}/file`],
      ['DELETE', `/api/patterns/${ownId}/uploads/${w.uploadId}`],
      // The owner's pattern with the stranger's upload.
      ['GET', `${p}/uploads/${ownUpload.json.upload.id}/file`],
    ];
    const missing = 'zzzzzzzzzzzzzzzzzzzz';
    for (const [method, path, json] of cases) {
      const upload = method === 'POST' && path.endsWith('/uploads');
      for (const [who, client] of [['stranger', stranger], ['anonymous', anonymous]] as const) {
        const res = await client.request(method, path, upload ? { body: uploadForm(TINY_PNG) } : { json });
        expect(res.status, `${who} ${method} ${path}: ${res.text.slice(0, 200)}`).toBe(404);
        expectCleanAnswer(res, `${who} ${method} ${path}`);
        // Same answer as for a pattern that does not exist: nothing to tell the two apart.
        const ghost = await client.request(method, path.replace(w.patternId, missing), upload ? { body: uploadForm(TINY_PNG) } : { json });
        if (path.includes(w.patternId)) expect(ghost.json?.error, `${method} ${path}`).toBe(res.json?.error);
      }
    }
    // An upload through the stranger's own pattern cannot reach the owner's file either.
    expect((await stranger.request('POST', `${p}/uploads`, { body: uploadForm(TINY_PNG) })).status).toBe(404);
    // Not listed, not searchable.
    const listed = await stranger.get(`/api/patterns?scope=all&q=${encodeURIComponent('sessions pattern')}`);
    expect(listed.json.total).toBe(0);
    // And nothing of the owner's changed.
    const after = await w.owner.get(p);
    expect(after.json.pattern.headRevision).toBe(2);
    expect(after.json.pattern.trashedAt).toBeNull();
    const members = await w.owner.get(`${p}/members`);
    expect(members.json.members.map((m: { userId: string; access: string }) => [m.userId, m.access])).toEqual([[w.partner.user!.id, 'co-designer']]);
    expect((await w.owner.get(`${p}/uploads/${w.uploadId}/file`)).status).toBe(200);
    const pdf = await w.owner.get(`${p}/print-sets/${w.printSetId}/file`);
    expect(pdf.status).toBe(200);
    expect(pdf.contentType).toContain('application/pdf');
  });

  it('a stranger cannot accept an invitation meant for someone else', async () => {
    const { client: stranger } = await signedInClient(server.baseUrl, 'designer', 'gatecrasher');
    const res = await stranger.post('/api/invitations/accept', { token: world.invitationToken });
    expect(res.status).toBe(403);
    expectCleanAnswer(res, 'accept other address');
    expect((await stranger.get(`/api/patterns/${world.patternId}`)).status).toBe(404);
  });
});
