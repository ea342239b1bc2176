import fs from 'node:fs';
import path from 'node:path';
import { count, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { newId } from '../auth/tokens';
import { removeExpired, SHARED_SWEEP_AGE_MS, sweepStoredFilesAtStart } from './housekeeping';
import { startTestServer, testDatabase, TINY_PNG, userClient, type TestServer } from '../test/harness';

let t: TestServer;
beforeAll(async () => {
  t = await startTestServer();
});
afterAll(async () => {
  await t.close();
});

describe(`housekeeping (${testDatabase})`, () => {
  it('removes expired sessions and keeps live ones', async () => {
    const a = await userClient(t.app, 'live@house.test');
    const b = await userClient(t.app, 'stale@house.test');
    const { db, t: tables } = t.ctx.data;
    const { sessions } = tables;
    await db.update(sessions).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(sessions.userId, b.user!.id));
    const sessionCount = async () => (await db.select({ n: count() }).from(sessions))[0]!.n;
    expect(await sessionCount()).toBe(2);
    expect(await removeExpired(t.ctx.data)).toBe(1);
    expect(await sessionCount()).toBe(1);
    await a.get('/api/auth/me').expect(200);
    await b.get('/api/auth/me').expect(401);
  });

  it('removes reset tokens and answered invitations kept past 30 days, and ended rate-limit windows', async () => {
    const owner = await userClient(t.app, 'keeper@house.test');
    const { db, t: tables } = t.ctx.data;
    const { invitations, passwordResets, patterns, rateLimitHits } = tables;
    const now = Date.now();
    const day = 86_400_000;
    const patternId = newId();
    await db.insert(patterns).values({ id: patternId, ownerId: owner.user!.id, title: 'Kept', headRevision: 1, updatedAt: new Date() });
    await db.insert(passwordResets).values([
      { tokenHash: 'old-reset', userId: owner.user!.id, expiresAt: new Date(now - 31 * day) },
      { tokenHash: 'recent-reset', userId: owner.user!.id, expiresAt: new Date(now - 29 * day) },
    ]);
    const invitation = (id: string, extra: object) => ({
      id,
      patternId,
      email: `${id}@house.test`,
      access: 'quilter' as const,
      tokenHash: `token-${id}`,
      invitedBy: owner.user!.id,
      expiresAt: new Date(now + day),
      ...extra,
    });
    await db.insert(invitations).values([
      invitation('accepted-long-ago', { acceptedAt: new Date(now - 40 * day) }),
      invitation('revoked-long-ago', { revokedAt: new Date(now - 31 * day) }),
      invitation('accepted-lately', { acceptedAt: new Date(now - 2 * day) }),
      invitation('open', {}),
    ]);
    await db.insert(rateLimitHits).values([
      { key: 'test/ended', hits: 3, resetAt: now - 1 },
      { key: 'test/running', hits: 1, resetAt: now + 60_000 },
    ]);
    expect(await removeExpired(t.ctx.data, now)).toBe(4);
    expect((await db.select({ h: passwordResets.tokenHash }).from(passwordResets)).map((r) => r.h)).toEqual(['recent-reset']);
    expect((await db.select({ id: invitations.id }).from(invitations).where(eq(invitations.patternId, patternId))).map((r) => r.id).sort()).toEqual([
      'accepted-lately',
      'open',
    ]);
    expect((await db.select({ k: rateLimitHits.key }).from(rateLimitHits)).map((r) => r.k).filter((k) => k.startsWith('test/'))).toEqual(['test/running']);
    expect(await removeExpired(t.ctx.data, now)).toBe(0);
  });
});

describe(`sweeping stored files at start-up (${testDatabase})`, () => {
  it('removes files no row names and unfinished writes, keeps every stored upload; on PostgreSQL only files older than the shared age', async () => {
    const owner = await userClient(t.app, 'sweep@house.test');
    const { db, t: tables } = t.ctx.data;
    const { patterns, uploads } = tables;
    const patternId = newId();
    const uploadId = newId();
    const kept = `uploads/${owner.user!.id}/${uploadId}.png`;
    await db.insert(patterns).values({ id: patternId, ownerId: owner.user!.id, title: 'Sweep block', headRevision: 1, updatedAt: new Date() });
    const stored = await t.ctx.files.put(kept, TINY_PNG);
    await db.insert(uploads).values({
      id: uploadId,
      patternId,
      uploaderId: owner.user!.id,
      fileName: 'kept.png',
      mimeType: 'image/png',
      bytes: stored.size,
      sha256: stored.sha256,
      storagePath: kept,
    });
    // What a kill leaves: an upload written before its row, a PDF whose row was deleted.
    const orphans = [`uploads/${owner.user!.id}/orphanId.png`, 'print-sets/someone/gone.pdf'];
    for (const key of orphans) await t.ctx.files.put(key, Buffer.from('left over'));
    // On the data folder also half-written temporary files (writeFileAtomic's `.<name>.<random>.tmp`).
    const temporary =
      testDatabase === 'sqlite' ? [`uploads/${owner.user!.id}/.abc.png.0a1b2c3d4e5f.tmp`, 'print-sets/someone/.set.pdf.112233445566.tmp'] : [];
    for (const f of temporary) fs.writeFileSync(path.join(t.dataDir, f), 'left over');
    const leftovers = [...orphans, ...temporary].sort();

    if (testDatabase === 'postgres') {
      // Other instances share the store: a file written a moment ago may not have its row yet.
      expect(await sweepStoredFilesAtStart(t.ctx.data, t.ctx.files)).toEqual([]);
      for (const key of orphans) expect(await t.ctx.files.stat(key), key).toBeDefined();
    }
    const later = Date.now() + SHARED_SWEEP_AGE_MS + 60_000;
    expect((await sweepStoredFilesAtStart(t.ctx.data, t.ctx.files, later)).sort()).toEqual(leftovers);
    for (const key of orphans) expect(await t.ctx.files.stat(key), key).toBeUndefined();
    for (const f of temporary) expect(fs.existsSync(path.join(t.dataDir, f)), f).toBe(false);
    const back = await t.ctx.files.openRead(kept);
    const chunks: Buffer[] = [];
    for await (const c of back!) chunks.push(c as Buffer);
    expect(Buffer.concat(chunks).equals(TINY_PNG)).toBe(true);
    // A second sweep finds nothing.
    expect(await sweepStoredFilesAtStart(t.ctx.data, t.ctx.files, later)).toEqual([]);
  });
});
