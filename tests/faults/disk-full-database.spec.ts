/**
 * The disk that holds the DATABASE is full (issue 15, item 1): every write route must answer an
 * error that says nothing was stored, and store nothing — no "200 but lost" answers.
 *
 * How the disk is filled: the server's whole data folder (database, write-ahead log, uploads, print
 * sets) sits on a small tmpfs (`mount -t tmpfs -o size=…`, needs root with CAP_SYS_ADMIN, which the
 * test machine and CI have; the test fails loudly, not silently, where mounting is refused). After the
 * world is built, the test checkpoints the write-ahead log to zero bytes through its own connection
 * (`PRAGMA wal_checkpoint(TRUNCATE)`, SQLite documentation "Write-Ahead Logging" §5) so that the
 * next commit must grow a file, then fills the file system with a filler file until the kernel answers
 * ENOSPC. Every database commit from then on fails inside SQLite exactly as on a full production disk.
 */
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import Database from 'better-sqlite3';
import { afterAll, describe, expect, it } from 'vitest';
import { ApiClient, newCredentials, signedInClient, type ApiResponse } from '../support/api-client';
import { withReadOnlyDatabase } from '../support/database-check';
import { gridDocument } from '../support/documents';
import { buildWorld, TINY_PNG, uploadForm } from '../support/fixtures';
import { fillDisk } from '../support/fill-disk';
import { startServerProcess, type ServerProcess } from '../support/server-process';

let server: ServerProcess | undefined;
let mountPoint: string | undefined;
afterAll(async () => {
  await server?.stop();
  if (mountPoint) {
    try {
      execFileSync('umount', [mountPoint], { stdio: 'pipe' });
    } catch {
      // already unmounted
    }
    fs.rmSync(mountPoint, { recursive: true, force: true });
  }
});

/** Every row of every table, as JSON lines, from a read-only connection: what "stored" means. */
function snapshot(dataDir: string): Record<string, string[]> {
  return withReadOnlyDatabase(dataDir, (db) => {
    const tables = (db.prepare("SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%' ORDER BY name").all() as { name: string }[]).map((t) => t.name);
    return Object.fromEntries(tables.map((t) => [t, (db.prepare(`SELECT * FROM "${t}"`).raw().all() as unknown[][]).map((r) => JSON.stringify(r)).sort()]));
  });
}

/** Files under the data folder other than the database's own and the filler. */
function storedFiles(dataDir: string): string[] {
  const out: string[] = [];
  const walk = (dir: string) => {
    for (const e of fs.readdirSync(dir, { withFileTypes: true })) {
      const full = path.join(dir, e.name);
      if (e.isDirectory()) walk(full);
      else out.push(path.relative(dataDir, full));
    }
  };
  walk(dataDir);
  return out.filter((f) => !f.startsWith('seamwright.db') && f !== 'filler').sort();
}


describe('the disk holding the database is full', () => {
  it('every write route answers 507 "nothing was stored" and the database is unchanged', async () => {
    mountPoint = fs.mkdtempSync(path.join(os.tmpdir(), 'seamwright-db-disk-'));
    execFileSync('mount', ['-t', 'tmpfs', '-o', 'size=48m,mode=0700', 'tmpfs', mountPoint], { stdio: 'pipe' });
    server = await startServerProcess({ dataDir: mountPoint, env: { RESET_LIMIT_PER_ADDRESS: '1000', SIGNIN_LIMIT_PER_ADDRESS: '1000' } });
    const s = server;
    const world = await buildWorld(s, 'fulldb');
    const { owner, partner, patternId } = world;

    // More to change: a quilter member, a trashed pattern, a shop, a live reset link, an admin, the
    // person the pending invitation was sent to.
    const { client: quilter } = await signedInClient(s.baseUrl, 'quilter', 'fulldb-quilter');
    const invitedMail = s.mail.waitFor(quilter.user!.email, 15_000);
    expect((await owner.post(`/api/patterns/${patternId}/invitations`, { email: quilter.user!.email, access: 'quilter' })).status).toBe(201);
    const quilterToken = decodeURIComponent(/[?&]token=([^&\s"'<>]+)/.exec((await invitedMail).text)?.[1] ?? '');
    expect((await quilter.post('/api/invitations/accept', { token: quilterToken })).status).toBe(200);
    const trashed = await owner.post('/api/patterns', { document: gridDocument('Trashed block', 1, 1, 0) });
    expect((await owner.post(`/api/patterns/${trashed.json.pattern.id}/trash`)).status).toBe(200);
    const shopSet = await owner.request('PUT', '/api/shop/mine', { json: { currency: 'usd' } });
    const resetMail = s.mail.waitFor(world.partnerCredentials.email, 15_000);
    expect((await new ApiClient(s.baseUrl).post('/api/auth/password-reset', { email: world.partnerCredentials.email })).status).toBe(202);
    const resetToken = decodeURIComponent(/[?&]token=([^&\s"'<>]+)/.exec((await resetMail).text)?.[1] ?? '');
    const { client: admin } = await signedInClient(s.baseUrl, 'designer', 'fulldb-admin');
    const invitee = new ApiClient(s.baseUrl);
    await invitee.signUp({ ...newCredentials('quilter', 'fulldb-invitee'), email: `pending-fulldb@faults.example` });
    // Mail still going out would write to the outbox: wait until it is all sent.
    await new Promise((r) => setTimeout(r, 500));

    // Admin rights are given in the database (sign-up cannot make admins), before the disk fills.
    const file = path.join(s.dataDir, 'seamwright.db');
    const direct = new Database(file);
    direct.prepare("UPDATE users SET role = 'admin' WHERE id = ?").run(admin.user!.id);
    const checkpoint = direct.pragma('wal_checkpoint(TRUNCATE)') as { busy: number }[];
    direct.close();
    expect(checkpoint[0].busy, 'the write-ahead log could not be emptied').toBe(0);
    expect(fs.statSync(`${file}-wal`).size).toBe(0);

    const before = snapshot(s.dataDir);
    const filesBefore = storedFiles(s.dataDir);
    const filled = fillDisk(path.join(s.dataDir, 'filler'));
    console.log(`filled the database's disk with ${(filled / 1024 / 1024).toFixed(1)} MB`);

    const writes: [string, () => Promise<ApiResponse>][] = [
      ['sign up', () => new ApiClient(s.baseUrl).post('/api/auth/sign-up', newCredentials('designer', 'fulldb-new'))],
      ['sign in', () => new ApiClient(s.baseUrl).signIn(world.ownerCredentials.email, world.ownerCredentials.password)],
      ['change password', () => partner.post('/api/auth/change-password', { currentPassword: world.partnerCredentials.password, newPassword: 'a password for the full disk' })],
      ['ask for a reset link (known address)', () => new ApiClient(s.baseUrl).post('/api/auth/password-reset', { email: world.ownerCredentials.email })],
      ['confirm a reset', () => new ApiClient(s.baseUrl).post('/api/auth/password-reset/confirm', { token: resetToken, newPassword: 'reset on a full disk' })],
      ['create pattern', () => owner.post('/api/patterns', { document: gridDocument('Never stored', 2, 2, 2) })],
      ['save pattern', () => owner.put(`/api/patterns/${patternId}`, { baseRevision: 2, document: gridDocument('Never stored save', 2, 2, 2) })],
      ['duplicate pattern', () => owner.post(`/api/patterns/${patternId}/duplicate`, {})],
      ['save a named version', () => owner.post(`/api/patterns/${patternId}/revisions`, { baseRevision: 2, name: 'Never stored' })],
      ['restore a revision', () => owner.post(`/api/patterns/${patternId}/revisions/1/restore`, { baseRevision: 2 })],
      ['write sewing log', () => owner.request('PUT', `/api/patterns/${patternId}/sewing-log/${world.sectionIds[1]}`, { json: { stage: 'trimmed' } })],
      ['clear sewing log', () => owner.request('PUT', `/api/patterns/${patternId}/sewing-log/${world.sectionIds[0]}`, { json: { stage: null } })],
      ['invite', () => owner.post(`/api/patterns/${patternId}/invitations`, { email: 'never@faults.example', access: 'quilter' })],
      ['revoke invitation', () => owner.request('DELETE', `/api/patterns/${patternId}/invitations/${world.invitationId}`)],
      ['accept invitation', () => invitee.post('/api/invitations/accept', { token: world.invitationToken })],
      ['change member access', () => owner.request('PATCH', `/api/patterns/${patternId}/members/${quilter.user!.id}`, { json: { access: 'co-designer' } })],
      ['remove member', () => owner.request('DELETE', `/api/patterns/${patternId}/members/${partner.user!.id}`)],
      ['upload image', () => owner.request('POST', `/api/patterns/${patternId}/uploads`, { body: uploadForm(TINY_PNG) })],
      ['delete upload', () => owner.request('DELETE', `/api/patterns/${patternId}/uploads/${world.uploadId}`)],
      ['queue print set', () => owner.post(`/api/patterns/${patternId}/print-sets`, { options: { copies: 'single' } })],
      ['delete print set', () => owner.request('DELETE', `/api/patterns/${patternId}/print-sets/${world.printSetId}`)],
      ['trash pattern', () => owner.post(`/api/patterns/${patternId}/trash`)],
      ['restore from trash', () => owner.post(`/api/patterns/${trashed.json.pattern.id}/restore`)],
      ['delete for good', () => owner.request('DELETE', `/api/patterns/${trashed.json.pattern.id}`)],
      ['admin: disable a user', () => admin.request('PATCH', `/api/admin/users/${quilter.user!.id}`, { json: { disabled: true } })],
      ...(shopSet.status === 200
        ? ([
            ['shop currency', () => owner.request('PUT', '/api/shop/mine', { json: { currency: 'eur' } })],
            ['shop listing', () => owner.request('PUT', `/api/shop/listings/${patternId}`, { json: { priceMinor: 900, description: 'Never stored', published: true } })],
          ] as [string, () => Promise<ApiResponse>][])
        : []),
      // Last: a sign-out that went through would end the owner's session for the checks above.
      ['sign out', () => owner.post('/api/auth/sign-out')],
    ];
    const answers: Record<string, string> = {};
    for (const [what, send] of writes) {
      const res = await send();
      answers[what] = `${res.status} ${res.json?.error ?? res.text.slice(0, 80)}`;
    }
    console.log(Object.entries(answers).map(([k, v]) => `${k}: ${v}`).join('\n'));
    const expected = Object.fromEntries(writes.map(([what]) => [what, '507 The server has no space left; nothing was stored']));
    expect(answers).toEqual(expected);
    expect(s.alive(), s.output()).toBe(true);

    // Nothing stored: every table row for row as before, no new or removed file.
    await s.kill('SIGKILL');
    fs.rmSync(path.join(s.dataDir, 'filler'));
    expect(snapshot(s.dataDir)).toEqual(before);
    expect(storedFiles(s.dataDir)).toEqual(filesBefore);

    // Space again: the same server folder takes writes.
    await s.restart();
    const again = new ApiClient(s.baseUrl);
    await again.signIn(world.ownerCredentials.email, world.ownerCredentials.password);
    expect((await again.put(`/api/patterns/${patternId}`, { baseRevision: 2, document: gridDocument('Stored after all', 2, 2, 2) })).status).toBe(200);
  });
});
