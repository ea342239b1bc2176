import fs from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from '../test/harness';

let t: TestServer;
beforeAll(async () => {
  t = await startTestServer();
  const dir = t.ctx.config.staticDir;
  fs.mkdirSync(dir, { recursive: true });
  fs.writeFileSync(path.join(dir, 'index.html'), '<!doctype html><title>Seamwright</title><sw-root></sw-root>');
  fs.writeFileSync(path.join(dir, 'main-ABCDEFGH.js'), 'console.log(1)');
});
afterAll(async () => {
  await t.close();
});

describe('serving the built app', () => {
  it('serves index.html for the app root and for client-side routes, never cached', async () => {
    for (const url of ['/', '/patterns', '/invitations/accept?token=abc', '/reset-password?token=x']) {
      const res = await request(t.app).get(url).set('Accept', 'text/html');
      expect(res.status, url).toBe(200);
      expect(res.headers['content-type']).toContain('text/html');
      expect(res.text).toContain('<sw-root>');
      expect(res.headers['cache-control']).toBe('no-cache');
      expect(res.headers['content-security-policy']).toContain("script-src 'self'");
    }
  });

  it('serves hashed bundles as immutable and answers a missing file with 404, not the page', async () => {
    const js = await request(t.app).get('/main-ABCDEFGH.js');
    expect(js.status).toBe(200);
    expect(js.headers['cache-control']).toContain('immutable');
    const missing = await request(t.app).get('/chunk-MISSING1.js').set('Accept', '*/*');
    expect(missing.status).toBe(404);
    expect(missing.body).toEqual({ error: 'Not found', details: null });
  });

  it('keeps /api answers JSON, also for unknown API routes asked for as HTML', async () => {
    const res = await request(t.app).get('/api/nothing-here').set('Accept', 'text/html');
    expect(res.status).toBe(404);
    expect(res.headers['content-type']).toContain('application/json');
  });
});
