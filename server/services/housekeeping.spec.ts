import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { removeExpired } from './housekeeping';
import { startTestServer, userClient, type TestServer } from '../test/harness';

let t: TestServer;
beforeAll(async () => {
  t = await startTestServer();
});
afterAll(async () => {
  await t.close();
});

describe('housekeeping', () => {
  it('removes expired sessions and keeps live ones', async () => {
    const a = await userClient(t.app, 'live@house.test');
    const b = await userClient(t.app, 'stale@house.test');
    const sql = t.ctx.database.sqlite;
    sql.prepare('UPDATE sessions SET expires_at = ? WHERE user_id = ?').run(Date.now() - 1000, b.user!.id);
    const count = () => (sql.prepare('SELECT count(*) AS n FROM sessions').get() as { n: number }).n;
    expect(count()).toBe(2);
    expect(removeExpired(t.ctx.db)).toBe(1);
    expect(count()).toBe(1);
    await a.get('/api/auth/me').expect(200);
    await b.get('/api/auth/me').expect(401);
  });
});
