import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { count } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Data } from './db/data';
import { openData } from './db/open-data';
import { DEMO_ACCOUNTS, isEmpty, seedDemo, seedDemoIfEmpty } from './db/seed';
import { Client, startTestServer, testDatabase, testDatabaseUrl, type TestServer } from './test/harness';

let t: TestServer;
beforeAll(async () => {
  t = await startTestServer();
});
afterAll(async () => {
  await t.close();
});

const signedIn = async (role: string) => {
  const a = DEMO_ACCOUNTS.find((x) => x.role === role)!;
  const c = await Client.create(t.app);
  const res = await c.signIn(a.email, a.password);
  expect(res.status).toBe(200);
  expect(res.body.user).toMatchObject({ email: a.email, role });
  return c;
};

describe(`demo data (docs/design-notes.md#demo-data) on ${testDatabase}`, () => {
  it('creates the Fernbrook accounts and demo patterns once', async () => {
    expect(await isEmpty(t.ctx.data)).toBe(true);
    const first = await seedDemo(t.ctx.data, 4);
    expect(first.accountsCreated).toEqual(DEMO_ACCOUNTS.map((a) => a.email));
    expect(first.patternsCreated).toEqual(['Orchard Wheel', 'Garden Gate']);
    expect(await isEmpty(t.ctx.data)).toBe(false);
    const second = await seedDemo(t.ctx.data, 4);
    expect(second).toEqual({ accountsCreated: [], patternsCreated: [] });
    expect(await seedDemoIfEmpty(t.ctx.data, 4)).toBeUndefined();
    await signedIn('admin');
  });

  it("publishes Garden Gate in the studio's shop, once", async () => {
    const quilter = await signedIn('quilter');
    const listed = await quilter.get('/api/shop/listings').expect(200);
    expect(listed.body.items.map((l: { title: string; priceMinor: number; currency: string }) => [l.title, l.priceMinor, l.currency])).toEqual([
      ['Garden Gate', 900, 'usd'],
    ]);
  });

  it('gives the designer both patterns and shares them with the demo quilter as quilter', async () => {
    const designer = await signedIn('designer');
    const own = await designer.get('/api/patterns?scope=owned&sort=title&order=asc').expect(200);
    expect(own.body.items.map((p: { title: string }) => p.title)).toEqual(['Garden Gate', 'Orchard Wheel']);
    const quilter = await signedIn('quilter');
    const shared = await quilter.get('/api/patterns?scope=shared&sort=title&order=asc').expect(200);
    expect(shared.body.items.map((p: { title: string; access: string }) => [p.title, p.access])).toEqual([
      ['Garden Gate', 'quilter'],
      ['Orchard Wheel', 'quilter'],
    ]);
    const wheelId = shared.body.items[1].id;
    const wheel = await quilter.get(`/api/patterns/${wheelId}`).expect(200);
    // The medallion's fabrics (docs/design-notes.md#demo-data).
    expect(wheel.body.revision.document.fabrics.map((f: { name: string }) => f.name)).toEqual(['Plum', 'Oat', 'Sage', 'Marigold', 'Ink']);
    await quilter.put(`/api/patterns/${wheelId}`, { baseRevision: 1, document: wheel.body.revision.document }).expect(403);
  });

  it('renders the demo medallion as a print set for the quilter', async () => {
    const quilter = await signedIn('quilter');
    const shared = await quilter.get('/api/patterns?scope=shared&q=Orchard').expect(200);
    const id = shared.body.items[0].id;
    const made = await quilter.post(`/api/patterns/${id}/print-sets`, { options: { paper: 'letter' } }).expect(202);
    let set = made.body.printSet;
    for (let i = 0; i < 1200 && set.status !== 'done' && set.status !== 'failed'; i++) {
      await new Promise((r) => setTimeout(r, 100));
      set = (await quilter.get(`/api/patterns/${id}/print-sets/${set.id}`).expect(200)).body.printSet;
    }
    expect(set.error).toBeNull();
    expect(set.status).toBe('done');
    // M is a lower bound on the template sheets N (area argument, issue 4); the PDF has N plus the
    // cover and the closing sheets. (Packing quality against N ≤ 1.3 M is the print library's test.)
    expect(set.templateSheets).toBeGreaterThanOrEqual(set.lowerBoundSheets);
    expect(set.lowerBoundSheets).toBeGreaterThanOrEqual(1);
    expect(set.sheets).toBeGreaterThan(set.templateSheets);
    const file = await quilter.get(set.url).buffer(true).parse((res, cb) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => cb(null, Buffer.concat(chunks)));
    }).expect(200);
    // Read back with Mozilla's reader (pdfjs-dist): the page count is what the row says.
    const { getDocument } = await import('pdfjs-dist/legacy/build/pdf.mjs');
    const pdf = await getDocument({ data: new Uint8Array(file.body as Buffer) }).promise;
    expect(pdf.numPages).toBe(set.sheets);
    await pdf.destroy();
  }, 180_000);
});

describe(`two instances starting together on one empty ${testDatabase} database`, () => {
  it('seed the demo once: one reports it, the other finds it seeded', async () => {
    // Two connections (pools) to one fresh database, as two server processes have.
    const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'seamwright-seed-'));
    const databaseUrl = await testDatabaseUrl();
    const a = await openData({ dataDir, databaseUrl }, { poolSize: 2 });
    const b = await openData({ dataDir, databaseUrl }, { poolSize: 2 });
    try {
      const reports = await Promise.all([seedDemoIfEmpty(a.data, 4), seedDemoIfEmpty(b.data, 4)]);
      const seeded = reports.filter((r) => r !== undefined);
      expect(seeded).toEqual([{ accountsCreated: DEMO_ACCOUNTS.map((x) => x.email), patternsCreated: ['Orchard Wheel', 'Garden Gate'] }]);
      const rows = async (d: Data) => {
        const { members, patterns, revisions, shopListings, users } = d.t;
        const n = async (table: typeof users | typeof patterns | typeof revisions | typeof members | typeof shopListings) =>
          (await d.db.select({ n: count() }).from(table))[0]!.n;
        return { users: await n(users), patterns: await n(patterns), revisions: await n(revisions), members: await n(members), listings: await n(shopListings) };
      };
      expect(await rows(b.data)).toEqual({ users: 3, patterns: 2, revisions: 2, members: 2, listings: 1 });
    } finally {
      await a.close();
      await b.close();
      fs.rmSync(dataDir, { recursive: true, force: true });
    }
  });
});
