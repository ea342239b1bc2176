/**
 * A data folder that cannot be written (issue 15): an upload answers a clear 503 and nothing is
 * stored. About the disk file store, so SQLite only (with PostgreSQL, files live in the database).
 */
import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { TINY_PNG, sharedPattern, startTestServer, userClient, type Client, type TestServer } from './test/harness';

let t: TestServer;
let owner: Client;
let id: string;
beforeAll(async () => {
  t = await startTestServer();
  owner = await userClient(t.app, 'owner@unwritable.test', 'designer');
  id = await sharedPattern(t, owner, [], 'Unwritable block');
});
afterAll(async () => {
  await t.close();
});

describe('unwritable data folder', () => {
  it('answers an upload with a clear 503 and stores nothing when the data folder cannot be written', async () => {
    // The uploads folder replaced by a plain file: every write below it fails (ENOTDIR), as on a
    // broken mount. (Folder permissions would not do: tests may run as root, who ignores them.)
    const uploadsDir = path.join(t.dataDir, 'uploads');
    fs.rmSync(uploadsDir, { recursive: true, force: true });
    fs.writeFileSync(uploadsDir, 'not a folder');
    try {
      const res = await owner.req('post', `/api/patterns/${id}/uploads`).attach('file', TINY_PNG, 'ref.png');
      expect(res.status).toBe(503);
      expect(res.body).toEqual({ error: 'The server cannot write its data folder; nothing was stored', details: null });
    } finally {
      fs.rmSync(uploadsDir, { force: true });
    }
    const list = await owner.get(`/api/patterns/${id}/uploads`).expect(200);
    expect(list.body.items).toEqual([]);
    await owner.get('/api/health').expect(200);
  });
});
