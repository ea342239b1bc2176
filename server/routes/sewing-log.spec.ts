import fs from 'node:fs';
import path from 'node:path';
import Database from 'better-sqlite3';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client, startTestServer, userClient, type TestServer } from '../test/harness';

/** One plain square A and a wedge B repeated 8 times round the centre: 9 things to sew per block. */
function ringDocument(blockCount: number) {
  return {
    formatVersion: 2,
    title: 'Ring log',
    blockCount,
    canvas: { widthIn: 12, heightIn: 12 },
    sections: [
      { id: 'sec-a', label: 'A', geometry: { kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 2, y: 0 }, { x: 2, y: 2 }, { x: 0, y: 2 }] } },
      {
        id: 'sec-b',
        label: 'B',
        geometry: { kind: 'wedge', centre: { x: 6, y: 6 }, radiusIn: 3, startAngleDeg: 0, sweepDeg: 45 },
        ringRepeat: { count: 8, centre: { x: 6, y: 6 } },
      },
    ],
  };
}

describe('sewing log per copy', () => {
  let t: TestServer;
  let quilter: Client;
  let other: Client;
  let id: string;

  beforeAll(async () => {
    t = await startTestServer();
    quilter = await userClient(t.app, 'copies@log.test', 'designer');
    other = await userClient(t.app, 'other@log.test', 'designer');
    const res = await quilter.post('/api/patterns', { document: ringDocument(2) }).expect(201);
    id = res.body.pattern.id;
  });
  afterAll(() => t.close());

  it('keeps one stage per copy: ring copies × blocks', async () => {
    // 8 ring copies × 2 blocks = 16 copies of B.
    await quilter.put(`/api/patterns/${id}/sewing-log/sec-b`, { copy: 3, stage: 'pieced' }).expect(200);
    const last = await quilter.put(`/api/patterns/${id}/sewing-log/sec-b`, { copy: 16, stage: 'joined' }).expect(200);
    expect(last.body.entry).toMatchObject({ sectionId: 'sec-b', copy: 16, stage: 'joined' });
    await quilter.put(`/api/patterns/${id}/sewing-log/sec-b`, { copy: 3, stage: 'trimmed' }).expect(200);
    await quilter.put(`/api/patterns/${id}/sewing-log/sec-a`, { stage: 'pieced' }).expect(200);
    const log = await quilter.get(`/api/patterns/${id}/sewing-log`).expect(200);
    expect(log.body.entries.map((e: { sectionId: string; copy: number; stage: string }) => [e.sectionId, e.copy, e.stage])).toEqual([
      ['sec-a', 1, 'pieced'],
      ['sec-b', 3, 'trimmed'],
      ['sec-b', 16, 'joined'],
    ]);
    const cleared = await quilter.put(`/api/patterns/${id}/sewing-log/sec-b`, { copy: 16, stage: null }).expect(200);
    expect(cleared.body.entry).toBeNull();
    expect((await quilter.get(`/api/patterns/${id}/sewing-log`)).body.entries).toHaveLength(2);
  });

  it('refuses a copy beyond the section\'s copies, a copy 0 and an unknown stage with 400', async () => {
    const beyond = await quilter.put(`/api/patterns/${id}/sewing-log/sec-b`, { copy: 17, stage: 'pieced' });
    expect([beyond.status, beyond.body.details[0]]).toEqual([400, { path: 'copy', message: 'section has 16 copies' }]);
    const plain = await quilter.put(`/api/patterns/${id}/sewing-log/sec-a`, { copy: 3, stage: 'pieced' });
    expect([plain.status, plain.body.details[0].message]).toEqual([400, 'section has 2 copies']);
    const zero = await quilter.put(`/api/patterns/${id}/sewing-log/sec-b`, { copy: 0, stage: 'pieced' });
    expect([zero.status, zero.body.details[0].path]).toEqual([400, 'copy']);
    const fraction = await quilter.put(`/api/patterns/${id}/sewing-log/sec-b`, { copy: 1.5, stage: 'pieced' });
    expect(fraction.status).toBe(400);
    const oldStage = await quilter.put(`/api/patterns/${id}/sewing-log/sec-b`, { copy: 1, stage: 'sewn' });
    expect([oldStage.status, oldStage.body.details[0].path]).toEqual([400, 'stage']);
    const extra = await quilter.put(`/api/patterns/${id}/sewing-log/sec-b`, { copy: 1, stage: 'pieced', block: 2 });
    expect(extra.status).toBe(400);
  });

  it('answers 404 to another user, and keeps each user\'s log apart', async () => {
    expect((await other.get(`/api/patterns/${id}/sewing-log`)).status).toBe(404);
    expect((await other.put(`/api/patterns/${id}/sewing-log/sec-b`, { copy: 1, stage: 'pieced' })).status).toBe(404);
    const mine = await quilter.get(`/api/patterns/${id}/sewing-log`);
    expect(mine.body.entries.some((e: { sectionId: string; copy: number }) => e.sectionId === 'sec-b' && e.copy === 1)).toBe(false);
  });

  it('refuses a write without the CSRF token', async () => {
    const res = await quilter.agent.put(`/api/patterns/${id}/sewing-log/sec-b`).send({ copy: 1, stage: 'pieced' });
    expect(res.status).toBe(403);
  });
});

describe('migration 0006_sewing_log_copies', () => {
  it('carries a section\'s old stage to its first copy: sewn → pieced, trimmed stays, cut is dropped', () => {
    const db = new Database(':memory:');
    // The table as migrations 0000…0005 left it.
    db.exec(`CREATE TABLE patterns (id text PRIMARY KEY); CREATE TABLE users (id text PRIMARY KEY);
      INSERT INTO patterns VALUES ('p'); INSERT INTO users VALUES ('u');
      CREATE TABLE sewing_log (pattern_id text NOT NULL REFERENCES patterns(id) ON DELETE cascade, user_id text NOT NULL REFERENCES users(id) ON DELETE cascade,
        section_id text NOT NULL, stage text NOT NULL, updated_at integer NOT NULL, PRIMARY KEY(pattern_id, user_id, section_id));
      INSERT INTO sewing_log VALUES ('p', 'u', 'a', 'cut', 1), ('p', 'u', 'b', 'sewn', 2), ('p', 'u', 'c', 'trimmed', 3);`);
    const sql = fs.readFileSync(path.join(__dirname, '../../drizzle/0006_sewing_log_copies.sql'), 'utf8');
    for (const statement of sql.split('--> statement-breakpoint')) db.exec(statement);
    expect(db.prepare('SELECT section_id, copy, stage, updated_at FROM sewing_log ORDER BY section_id').raw().all()).toEqual([
      ['b', 1, 'pieced', 2],
      ['c', 1, 'trimmed', 3],
    ]);
    // The new key takes a second copy of the same section.
    db.prepare("INSERT INTO sewing_log VALUES ('p', 'u', 'b', 2, 'joined', 4)").run();
    expect(db.prepare('SELECT count(*) FROM sewing_log').pluck().get()).toBe(3);
    db.close();
  });
});
