import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Express } from 'express';
import { createApp } from '../app';
import { sqliteData } from '../db/data';
import { type DatabaseHandle, openDatabase } from '../db/database';
import { sqliteRateLimitSql } from './rate-limit-store';
import { removeExpired } from '../services/housekeeping';
import { Client, startTestServer, type TestServer, userClient } from '../test/harness';

/**
 * Two server instances on one database (issue 18): each app has its own connection to the same SQLite
 * file, as two processes would, and their sign-in and reset limits count together
 * (server/auth/rate-limit-store.ts checks the same on PostgreSQL, store by store).
 */
describe('rate limits across two instances on one database', () => {
  let first: TestServer;
  let secondDb: DatabaseHandle;
  let second: Express;

  beforeAll(async () => {
    first = await startTestServer({ SIGNIN_LIMIT_PER_ACCOUNT: '3', SIGNIN_LIMIT_PER_ADDRESS: '50', RESET_LIMIT_PER_ACCOUNT: '2' });
    secondDb = openDatabase(first.dataDir);
    // The second instance reads and counts through its own connection to the file.
    second = createApp({ ...first.ctx, data: sqliteData(secondDb), rateLimitSql: sqliteRateLimitSql(secondDb.sqlite) });
  });
  afterAll(async () => {
    secondDb.close();
    await first.close();
  });

  it('failed sign-ins on either instance count toward one per-account limit', async () => {
    await userClient(first.app, 'shared@example.test');
    const [a, b] = await Promise.all([Client.create(first.app), Client.create(second)]);
    const statuses: number[] = [];
    for (const c of [a, b, a, b]) statuses.push((await c.signIn('shared@example.test', 'not the password')).status);
    // SIGNIN_LIMIT_PER_ACCOUNT=3: two failures on the first instance and one on the second, then refused on both.
    expect(statuses).toEqual([401, 401, 401, 429]);
    expect((await a.signIn('shared@example.test')).status).toBe(429);
  });

  it('reset requests on either instance count toward one per-account limit', async () => {
    await userClient(first.app, 'reset-shared@example.test');
    const [a, b] = await Promise.all([Client.create(first.app), Client.create(second)]);
    const statuses: number[] = [];
    for (const c of [a, b, a]) statuses.push((await c.post('/api/auth/password-reset', { email: 'reset-shared@example.test' })).status);
    // RESET_LIMIT_PER_ACCOUNT=2.
    expect(statuses).toEqual([202, 202, 429]);
  });

  it('housekeeping removes counts whose window has ended, and only those', async () => {
    const { db, t: tables } = first.ctx.data;
    const rows = await db.select().from(tables.rateLimitHits);
    expect(rows.length).toBeGreaterThan(0);
    const ends = rows.map((r) => r.resetAt).sort((x, y) => x - y);
    // RATE_LIMIT_WINDOW_MINUTES defaults to 15: every window ends 15 minutes after its first hit.
    for (const end of ends) expect(end - Date.now()).toBeLessThanOrEqual(15 * 60_000);
    expect(await removeExpired(first.ctx.data, ends[0]! - 1)).toBe(0);
    expect(await db.select().from(tables.rateLimitHits)).toHaveLength(rows.length);
    await removeExpired(first.ctx.data, ends[ends.length - 1]!);
    expect(await db.select().from(tables.rateLimitHits)).toHaveLength(0);
  });
});
