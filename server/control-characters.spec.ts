/** Control characters in titles and names are removed at the API's edge (issue 15, minor). */
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client, sampleDocument, startTestServer, userClient, type TestServer } from './test/harness';

let t: TestServer;
beforeAll(async () => {
  t = await startTestServer();
});
afterAll(async () => {
  await t.close();
});

describe('control characters', () => {
  it('a pattern title with NUL and ESC is stored and answered without them', async () => {
    const owner = await userClient(t.app, 'ctl@example.test');
    const made = await owner.post('/api/patterns', { document: sampleDocument('Star\u0000 of\u001b[31m the\u0085 North') }).expect(201);
    expect(made.body.pattern.title).toBe('Star of[31m the North');
    const { patterns } = t.ctx.data.t;
    const [stored] = await t.ctx.data.db.select({ title: patterns.title }).from(patterns).where(eq(patterns.id, made.body.pattern.id));
    expect(stored?.title).toBe('Star of[31m the North');
    const onlyControls = await owner.put(`/api/patterns/${made.body.pattern.id}`, { baseRevision: 1, document: sampleDocument('\u0000\u0007') });
    expect(onlyControls.status).toBe(400);
    const copy = await owner.post(`/api/patterns/${made.body.pattern.id}/duplicate`, { title: 'Copy\u0000\u009b' }).expect(201);
    expect(copy.body.pattern.title).toBe('Copy');
  });

  it('a display name with a NUL is stored without it', async () => {
    const c = await Client.create(t.app);
    const res = await c.post('/api/auth/sign-up', { email: 'nul@example.test', password: 'long enough password', displayName: 'Nul\u0000l', role: 'quilter' });
    expect(res.status).toBe(201);
    expect(res.body.user.displayName).toBe('Null');
  });
});
