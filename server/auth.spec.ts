import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { Client, startTestServer, tokenFromMail, userClient, type TestServer } from './test/harness';

let t: TestServer;
beforeAll(async () => {
  t = await startTestServer();
});
afterAll(async () => {
  await t.close();
});

describe('accounts and sessions', () => {
  it('signs up, answers /me, signs out, and refuses the old cookie afterwards', async () => {
    const c = await userClient(t.app, 'ada@example.test', 'designer');
    expect(c.user).toMatchObject({ email: 'ada@example.test', role: 'designer', disabled: false });
    const me = await c.get('/api/auth/me').expect(200);
    expect(me.body.user.email).toBe('ada@example.test');
    expect(me.body.user.passwordHash).toBeUndefined();

    const cookie = (await c.agent.get('/api/auth/me')).request.cookies as unknown as string;
    expect(cookie).toContain('seamwright.sid=');
    const out = await c.post('/api/auth/sign-out').expect(200);
    expect(typeof out.body.csrfToken).toBe('string');
    await c.get('/api/auth/me').expect(401);
    // The same cookie replayed by someone else after sign-out is refused.
    const replay = await request(t.app).get('/api/auth/me').set('Cookie', cookie);
    expect(replay.status).toBe(401);
    expect(replay.body).toEqual({ error: 'Sign in first', details: null });
  });

  it('answers /session with the user or null and a working CSRF token', async () => {
    const c = await Client.create(t.app);
    const anon = await c.get('/api/auth/session').expect(200);
    expect(anon.body.user).toBeNull();
    await c.signUp('sess@example.test', 'quilter');
    const signed = await c.get('/api/auth/session').expect(200);
    expect(signed.body.user).toMatchObject({ email: 'sess@example.test', role: 'quilter' });
    await c.agent.post('/api/auth/sign-out').set('X-CSRF-Token', signed.body.csrfToken).expect(200);
  });

  it('sets an httpOnly SameSite session cookie', async () => {
    const c = await Client.create(t.app);
    const res = await c.post('/api/auth/sign-up', {
      email: 'cookie@example.test',
      password: 'long enough password',
      displayName: 'Cookie',
      role: 'quilter',
    });
    expect(res.status).toBe(201);
    const setCookie = ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((h) => h.startsWith('seamwright.sid='));
    expect(setCookie).toMatch(/HttpOnly/i);
    expect(setCookie).toMatch(/SameSite=Lax/i);
    expect(setCookie).toMatch(/seamwright\.sid=[A-Za-z0-9_-]{43};/); // 32 random bytes, base64url
  });

  it('rejects a duplicate e-mail, a short password and an admin role at sign-up', async () => {
    await userClient(t.app, 'dup@example.test');
    const c = await Client.create(t.app);
    const dup = await c.post('/api/auth/sign-up', { email: 'DUP@example.test', password: 'another long one', displayName: 'D', role: 'designer' });
    expect(dup.status).toBe(409);
    const short = await c.post('/api/auth/sign-up', { email: 'x@example.test', password: 'short', displayName: 'X', role: 'designer' });
    expect(short.status).toBe(400);
    expect(short.body.details).toContainEqual({ path: 'password', message: 'must be at least 10 characters' });
    const admin = await c.post('/api/auth/sign-up', { email: 'y@example.test', password: 'long enough password', displayName: 'Y', role: 'admin' });
    expect(admin.status).toBe(400);
    expect(admin.body.details[0].path).toBe('role');
  });

  it('refuses state-changing requests without a CSRF token (403)', async () => {
    const c = await userClient(t.app, 'csrf@example.test');
    const noToken = await c.agent.post('/api/patterns').send({ document: {} });
    expect(noToken.status).toBe(403);
    expect(noToken.body.error).toBe('Missing or invalid CSRF token');
    const wrong = await c.agent.post('/api/auth/sign-out').set('X-CSRF-Token', 'x'.repeat(40));
    expect(wrong.status).toBe(403);
    // A token issued to another session does not work either.
    const other = await userClient(t.app, 'csrf2@example.test');
    const crossed = await c.agent.post('/api/auth/sign-out').set('X-CSRF-Token', other.csrfToken);
    expect(crossed.status).toBe(403);
    await c.get('/api/auth/me').expect(200);
  });

  it('signs in with the right password only; wrong ones answer 401 without telling which part was wrong', async () => {
    await userClient(t.app, 'bea@example.test', 'quilter');
    const c = await Client.create(t.app);
    const bad = await c.signIn('bea@example.test', 'not the password');
    expect(bad.status).toBe(401);
    const none = await c.signIn('nobody@example.test', 'not the password');
    expect(none.status).toBe(401);
    expect(none.body.error).toBe(bad.body.error);
    const good = await c.signIn('BEA@example.test');
    expect(good.status).toBe(200);
    expect(good.body.user.role).toBe('quilter');
  });

  it('changes the password and signs out the other sessions', async () => {
    const a = await userClient(t.app, 'carol@example.test');
    const b = await Client.create(t.app);
    expect((await b.signIn('carol@example.test')).status).toBe(200);
    const wrong = await a.post('/api/auth/change-password', { currentPassword: 'nope nope nope', newPassword: 'a new long password' });
    expect(wrong.status).toBe(401);
    await a.post('/api/auth/change-password', { currentPassword: 'correct horse battery', newPassword: 'a new long password' }).expect(200);
    await a.get('/api/auth/me').expect(200);
    await b.get('/api/auth/me').expect(401);
    const c = await Client.create(t.app);
    expect((await c.signIn('carol@example.test')).status).toBe(401);
    expect((await c.signIn('carol@example.test', 'a new long password')).status).toBe(200);
  });
});

describe('password reset by e-mail', () => {
  it('mails a single-use link that sets a new password and ends old sessions', async () => {
    const old = await userClient(t.app, 'dora@example.test');
    const c = await Client.create(t.app);
    const mailArrives = t.mail.waitFor('dora@example.test');
    const res = await c.post('/api/auth/password-reset', { email: 'dora@example.test' });
    expect(res.status).toBe(202);
    const mail = await mailArrives;
    expect(mail.subject).toBe('Reset your Seamwright password');
    const { link, token } = tokenFromMail(mail.text);
    expect(link.startsWith('http://localhost:4200/reset-password?token=')).toBe(true);

    await c.post('/api/auth/password-reset/confirm', { token, newPassword: 'fresh password here' }).expect(200);
    await old.get('/api/auth/me').expect(401);
    expect((await c.signIn('dora@example.test')).status).toBe(401);
    expect((await c.signIn('dora@example.test', 'fresh password here')).status).toBe(200);
    // Single use.
    const again = await c.post('/api/auth/password-reset/confirm', { token, newPassword: 'yet another password' });
    expect(again.status).toBe(400);
    expect(again.body.error).toBe('This reset link is invalid or has expired');
  });

  it('answers the same for an unknown address and sends nothing', async () => {
    const c = await Client.create(t.app);
    const before = t.mail.messages.length;
    const res = await c.post('/api/auth/password-reset', { email: 'ghost@example.test' });
    expect(res.status).toBe(202);
    expect(res.body).toEqual({ ok: true });
    await new Promise((r) => setTimeout(r, 200));
    expect(t.mail.messages.length).toBe(before);
  });

  it('refuses an expired token', async () => {
    await userClient(t.app, 'eve@example.test');
    const c = await Client.create(t.app);
    const arrives = t.mail.waitFor('eve@example.test');
    await c.post('/api/auth/password-reset', { email: 'eve@example.test' }).expect(202);
    const { token } = tokenFromMail((await arrives).text);
    // Age the token past its hour.
    await t.ctx.data.db.update(t.ctx.data.t.passwordResets).set({ expiresAt: new Date(Date.now() - 1000) });
    const res = await c.post('/api/auth/password-reset/confirm', { token, newPassword: 'fresh password here' });
    expect(res.status).toBe(400);
  });

});

describe('rate limits', () => {
  let r: TestServer;
  beforeAll(async () => {
    r = await startTestServer({ SIGNIN_LIMIT_PER_ACCOUNT: '3', SIGNIN_LIMIT_PER_ADDRESS: '8', RESET_LIMIT_PER_ACCOUNT: '2', RESET_LIMIT_PER_ADDRESS: '5' });
  });
  afterAll(async () => {
    await r.close();
  });

  it('rate-limits failed sign-ins per account and per address', async () => {
    await userClient(r.app, 'target@example.test');
    const c = await Client.create(r.app);
    const statuses: number[] = [];
    for (let i = 0; i < 4; i++) statuses.push((await c.signIn('target@example.test', `guess number ${i}`)).status);
    // SIGNIN_LIMIT_PER_ACCOUNT=3: three failures counted, the fourth is refused.
    expect(statuses).toEqual([401, 401, 401, 429]);
    const locked = await c.signIn('target@example.test');
    expect(locked.status).toBe(429);
    expect(locked.headers['retry-after']).toBe('900');
    // Per address: other accounts from the same address run out too.
    const more: number[] = [];
    for (let i = 0; i < 4; i++) more.push((await c.signIn(`other${i}@example.test`, 'wrong password')).status);
    // SIGNIN_LIMIT_PER_ADDRESS=8: the five attempts above (blocked ones count too) and three more.
    expect(more).toEqual([401, 401, 401, 429]);
  });

  it('rate-limits reset requests per account', async () => {
    await userClient(r.app, 'fay@example.test');
    const c = await Client.create(r.app);
    const s: number[] = [];
    for (let i = 0; i < 3; i++) s.push((await c.post('/api/auth/password-reset', { email: 'fay@example.test' })).status);
    expect(s).toEqual([202, 202, 429]);
    // Per address (RESET_LIMIT_PER_ADDRESS=5): the three above count, so two more accounts and then no more.
    const more: number[] = [];
    for (const email of ['g1@example.test', 'g2@example.test', 'g3@example.test']) more.push((await c.post('/api/auth/password-reset', { email })).status);
    expect(more).toEqual([202, 202, 429]);
  });
});

describe('sign-up rate limit', () => {
  let r: TestServer;
  beforeAll(async () => {
    r = await startTestServer({ SIGNUP_LIMIT_PER_ADDRESS: '3' });
  });
  afterAll(async () => {
    await r.close();
  });

  it('counts every sign-up attempt from an address, refused or not, and answers 429 with Retry-After', async () => {
    const c = await Client.create(r.app);
    const body = (email: string) => ({ email, password: 'a long enough password', displayName: 'New', role: 'quilter' });
    const attempt = async (email: string) => {
      const res = await c.post('/api/auth/sign-up', body(email));
      // A new account starts a new session with its own CSRF token.
      if (res.status === 201) c.csrfToken = res.body.csrfToken;
      return res;
    };
    const statuses: number[] = [];
    statuses.push((await attempt('first@example.test')).status);
    // A duplicate is refused (409) and still counts: it cost a password hash too.
    statuses.push((await attempt('first@example.test')).status);
    // The refused duplicate signed nobody out: the first account's session still answers.
    const me = await c.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body.user.email).toBe('first@example.test');
    statuses.push((await attempt('second@example.test')).status);
    const blocked = await attempt('third@example.test');
    statuses.push(blocked.status);
    expect(statuses).toEqual([201, 409, 201, 429]);
    expect(blocked.headers['retry-after']).toBe('900');
    expect(blocked.body.error).toMatch(/too many attempts/i);
  });
});
