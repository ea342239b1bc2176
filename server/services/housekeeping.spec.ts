import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { removeExpired, sweepStoredFiles } from './housekeeping';
import { sampleDocument, startTestServer, TINY_PNG, userClient, type TestServer } from '../test/harness';

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

describe('sweeping stored files at start-up', () => {
  it('removes temporary files and files no row names, keeps every stored upload', async () => {
    const owner = await userClient(t.app, 'sweep@house.test');
    const made = await owner.post('/api/patterns', { document: sampleDocument('Sweep block') }).expect(201);
    const up = await owner.req('post', `/api/patterns/${made.body.pattern.id}/uploads`).attach('file', TINY_PNG, 'kept.png').expect(201);
    const kept = `uploads/${owner.user!.id}/${up.body.upload.id}.png`;
    // What a kill leaves: a half-written temporary file, an upload written before its row, a PDF whose
    // row was deleted, and a temporary PDF of a render that never finished.
    const leftovers = [
      `uploads/${owner.user!.id}/.abc.png.0a1b2c3d4e5f.tmp`,
      `uploads/${owner.user!.id}/orphanId.png`,
      'print-sets/someone/gone.pdf',
      'print-sets/someone/.set.pdf.112233445566.tmp',
    ];
    for (const f of leftovers) {
      fs.mkdirSync(path.join(t.dataDir, path.dirname(f)), { recursive: true });
      fs.writeFileSync(path.join(t.dataDir, f), 'left over');
    }
    expect(sweepStoredFiles(t.ctx.db, t.dataDir).sort()).toEqual([...leftovers].sort());
    for (const f of leftovers) expect(fs.existsSync(path.join(t.dataDir, f)), f).toBe(false);
    expect(fs.readFileSync(path.join(t.dataDir, kept)).equals(TINY_PNG)).toBe(true);
    await owner.get(up.body.upload.url).expect(200);
    // A second sweep finds nothing.
    expect(sweepStoredFiles(t.ctx.db, t.dataDir)).toEqual([]);
  });
});
