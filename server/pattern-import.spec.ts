import { count } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { FORMAT_VERSION } from '@seamwright/piecing';
import { sampleDocument, startTestServer, userClient, type Client, type TestServer } from './test/harness';

/*
 * "Open a pattern file" sends the file's document to POST /api/patterns. The server checks it with the
 * same library parser as the app (parsePatternDocument) and stores nothing when it is invalid.
 */

let t: TestServer;
let designer: Client;
beforeAll(async () => {
  t = await startTestServer();
  designer = await userClient(t.app, 'designer@pattern-import.test', 'designer');
});
afterAll(async () => {
  await t.close();
});

const patternCount = async () => (await t.ctx.data.db.select({ n: count() }).from(t.ctx.data.t.patterns))[0]!.n;

describe('creating a pattern from a file', () => {
  it('answers 400 with every problem and its path, and stores nothing', async () => {
    const before = await patternCount();
    const file = sampleDocument('Broken file');
    const broken = {
      ...file,
      fabrics: [{ id: 'plum', name: 'Plum', colour: 'purple' }, file.fabrics[1]],
      sections: [
        file.sections[0],
        {
          id: 'sec-b',
          label: 'b',
          geometry: { kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 250, y: 0 }, { x: 3, y: 3 }] },
        },
      ],
    };
    const res = await designer.post('/api/patterns', { document: broken });
    expect(res.status).toBe(400);
    expect(res.body.error).toBe('The pattern document is not valid');
    expect(res.body.details).toEqual([
      { path: 'document.fabrics.0.colour', message: 'must be a colour like #7a3b69' },
      { path: 'document.sections.1.label', message: 'must be one to three capital letters' },
      { path: 'document.sections.1.geometry.vertices.1.x', message: 'must be within ±200 in.' },
    ]);
    expect(await patternCount()).toBe(before);
  });

  it('refuses a file of a newer format version by its path', async () => {
    const before = await patternCount();
    const res = await designer.post('/api/patterns', { document: { ...sampleDocument('From the future'), formatVersion: FORMAT_VERSION + 1 } });
    expect(res.status).toBe(400);
    expect(res.body.details).toEqual([
      { path: 'document.formatVersion', message: `version ${FORMAT_VERSION + 1} is newer than this program reads (${FORMAT_VERSION})` },
    ]);
    expect(await patternCount()).toBe(before);
  });

  it('takes a version 1 file and stores it in the current format', async () => {
    const res = await designer.post('/api/patterns', { document: { ...sampleDocument('Old file'), formatVersion: 1 } }).expect(201);
    expect(res.body.revision.document.formatVersion).toBe(FORMAT_VERSION);
    const read = await designer.get(`/api/patterns/${res.body.pattern.id}`).expect(200);
    expect(read.body.revision.document).toMatchObject({ title: 'Old file', formatVersion: FORMAT_VERSION });
    expect(read.body.revision.document.sections[0].patches.map((p: { fabricId: string }) => p.fabricId)).toEqual(['plum', 'oat']);
  });
});
