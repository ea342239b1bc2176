import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_ACCOUNTS, isEmpty, seedDemo } from './db/seed';
import { Client, startTestServer, type TestServer } from './test/harness';

let t: TestServer;
beforeAll(async () => {
  t = await startTestServer();
});
afterAll(async () => {
  await t.close();
});

describe('demo data', () => {
  it('creates the Fernbrook accounts once, each able to sign in with its role', async () => {
    expect(isEmpty(t.ctx.db)).toBe(true);
    const first = await seedDemo(t.ctx.db, 4);
    expect(first.accountsCreated).toEqual(DEMO_ACCOUNTS.map((a) => a.email));
    expect(isEmpty(t.ctx.db)).toBe(false);
    const second = await seedDemo(t.ctx.db, 4);
    expect(second.accountsCreated).toEqual([]);
    expect(second.patternsCreated).toEqual([]);
    for (const a of DEMO_ACCOUNTS) {
      const c = await Client.create(t.app);
      const res = await c.signIn(a.email, a.password);
      expect(res.status).toBe(200);
      expect(res.body.user).toMatchObject({ email: a.email, role: a.role });
    }
  });
});
