import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';
import { colourwayCopyAnswerSchema, colourwayCopyListAnswerSchema, MAX_COLOURWAY_COPIES, staleCopyDetailsSchema } from '@seamwright/api';
import { buildOrchardWheel } from '@seamwright/piecing';
import { Client, startTestServer, userClient, type TestServer } from './test/harness';

let t: TestServer;
let owner: Client;
let quilter: Client;
let second: Client;
let stranger: Client;
let patternId: string;
let otherPatternId: string;

/** The Orchard Wheel demo (two colourways, docs/quilt-layout.md) owned by `owner`, with two quilters. */
beforeAll(async () => {
  t = await startTestServer();
  owner = await userClient(t.app, 'owner@copies.test', 'designer');
  quilter = await userClient(t.app, 'quilter@copies.test', 'quilter');
  second = await userClient(t.app, 'second@copies.test', 'quilter');
  stranger = await userClient(t.app, 'stranger@copies.test', 'designer');
  const made = await owner.post('/api/patterns', { document: buildOrchardWheel() }).expect(201);
  patternId = made.body.pattern.id;
  otherPatternId = (await owner.post('/api/patterns', { document: buildOrchardWheel() }).expect(201)).body.pattern.id;
  const { members } = t.ctx.data.t;
  for (const c of [quilter, second]) {
    for (const id of [patternId, otherPatternId]) await t.ctx.data.db.insert(members).values({ patternId: id, userId: c.user!.id, access: 'quilter', createdAt: new Date() });
  }
});
afterAll(async () => {
  await t.close();
});

const base = () => `/api/patterns/${patternId}/colourway-copies`;

describe('colourway copies', () => {
  it('copies a colourway with every fabric slot, names it after the colourway, and answers the contract', async () => {
    const res = await quilter.post(base(), { colourwayId: 'dusk' }).expect(201);
    const { copy } = colourwayCopyAnswerSchema.parse(res.body);
    expect(copy).toMatchObject({ patternId, sourceColourwayId: 'dusk', name: 'My Dusk', version: 1 });
    // Dusk's names and colours (projects/piecing/src/lib/demo/orchard-wheel-quilt.ts), one per document fabric.
    expect(copy.fabrics).toEqual({
      plum: { name: 'Midnight', colour: '#2b2d4f' },
      oat: { name: 'Fog', colour: '#cfd3d6' },
      sage: { name: 'Slate', colour: '#6f8291' },
      marigold: { name: 'Ember', colour: '#c8553d' },
      ink: { name: 'Coal', colour: '#1c1c22' },
    });
    const own = await quilter.post(base(), { colourwayId: null, name: '  Scrappy  ' }).expect(201);
    expect(own.body.copy).toMatchObject({ name: 'Scrappy', sourceColourwayId: null });
    expect(own.body.copy.fabrics.plum).toEqual({ name: 'Plum', colour: '#6d3b5e' });
  });

  it('shows each user only their own copies; anyone else gets 404 for a copy', async () => {
    const mine = colourwayCopyListAnswerSchema.parse((await quilter.get(base()).expect(200)).body);
    expect(mine.items.map((c) => c.name)).toEqual(['My Dusk', 'Scrappy']);
    const copyId = mine.items[0].id;
    // The pattern's owner and another quilter of the same pattern see none of them.
    expect((await owner.get(base()).expect(200)).body.items).toEqual([]);
    expect((await second.get(base()).expect(200)).body.items).toEqual([]);
    for (const c of [owner, second]) {
      await c.get(`${base()}/${copyId}`).expect(404);
      await c.patch(`${base()}/${copyId}`, { version: 1, name: 'Taken' }).expect(404);
      await c.del(`${base()}/${copyId}`).expect(404);
    }
    // A stranger cannot even see the pattern; the copy under another pattern's path is not found either.
    await stranger.get(base()).expect(404);
    await stranger.post(base(), { colourwayId: 'dusk' }).expect(404);
    await quilter.get(`/api/patterns/${otherPatternId}/colourway-copies/${copyId}`).expect(404);
    await quilter.get(`${base()}/not..an-id`).expect(404);
    expect((await quilter.get(`${base()}/${copyId}`).expect(200)).body.copy.name).toBe('My Dusk');
  });

  it('saves on top of its version and answers 409 with the copy as it is when the version is stale', async () => {
    const { body } = await quilter.post(base(), { colourwayId: 'frost' }).expect(201);
    const url = `${base()}/${body.copy.id}`;
    const fabrics = { ...body.copy.fabrics, plum: { name: 'Aubergine linen', colour: '#40203a', note: 'shop: corner store' } };
    const saved = await quilter.patch(url, { version: 1, fabrics }).expect(200);
    expect(saved.body.copy).toMatchObject({ version: 2, name: 'My Frost' });
    expect(saved.body.copy.fabrics.plum).toEqual({ name: 'Aubergine linen', colour: '#40203a', note: 'shop: corner store' });
    const stale = await quilter.patch(url, { version: 1, name: 'Lost edit' }).expect(409);
    expect(stale.body.error).toContain('changed elsewhere');
    expect(staleCopyDetailsSchema.parse(stale.body.details).latest).toMatchObject({ version: 2, name: 'My Frost' });
    const renamed = await quilter.patch(url, { version: 2, name: 'Winter' }).expect(200);
    expect(renamed.body.copy).toMatchObject({ version: 3, name: 'Winter' });
    expect(renamed.body.copy.fabrics.plum.name).toBe('Aubergine linen');
  });

  it('refuses bad bodies with 400 naming the field', async () => {
    const { body } = await quilter.post(base(), { colourwayId: 'dusk', name: 'Checks' }).expect(201);
    const url = `${base()}/${body.copy.id}`;
    const unknownColourway = await quilter.post(base(), { colourwayId: 'noon' }).expect(400);
    expect(unknownColourway.body.details).toEqual([{ path: 'colourwayId', message: 'unknown colourway "noon" (the pattern has: "dusk", "frost")' }]);
    const unknownSlot = await quilter.patch(url, { version: 1, fabrics: { nope: { name: 'Ghost', colour: '#000000' } } }).expect(400);
    expect(unknownSlot.body.details).toEqual([{ path: 'fabrics.nope', message: 'unknown fabric "nope"' }]);
    const badColour = await quilter.patch(url, { version: 1, fabrics: { plum: { name: 'Red', colour: 'red' } } }).expect(400);
    expect(badColour.body.details).toEqual([{ path: 'fabrics.plum.colour', message: 'must be a colour like #7a3b69' }]);
    const emptyName = await quilter.patch(url, { version: 1, name: '   ' }).expect(400);
    expect(emptyName.body.details).toEqual([{ path: 'name', message: 'must not be empty' }]);
    const nothing = await quilter.patch(url, { version: 1 }).expect(400);
    expect(nothing.body.details[0].message).toBe('give name or fabrics');
    await quilter.patch(url, { version: 1, name: 'x', extra: true }).expect(400);
    await quilter.post(base(), { name: 'No source' }).expect(400);
    // Nothing was saved by the refused requests.
    expect((await quilter.get(url).expect(200)).body.copy).toMatchObject({ version: 1, name: 'Checks' });
  });

  it('needs the CSRF token on writes', async () => {
    const bare = await quilter.agent.post(base()).send({ colourwayId: 'dusk' });
    expect(bare.status).toBe(403);
  });

  it('deletes a copy for its owner only, then answers 404', async () => {
    const { body } = await second.post(base(), { colourwayId: 'frost' }).expect(201);
    const url = `${base()}/${body.copy.id}`;
    await quilter.del(url).expect(404);
    await second.del(url).expect(204);
    await second.get(url).expect(404);
    await second.del(url).expect(404);
  });

  it(`keeps at most ${MAX_COLOURWAY_COPIES} copies per user and pattern`, async () => {
    const url = `/api/patterns/${otherPatternId}/colourway-copies`;
    for (let i = 0; i < MAX_COLOURWAY_COPIES; i++) await second.post(url, { colourwayId: 'dusk' }).expect(201);
    const over = await second.post(url, { colourwayId: 'dusk' }).expect(409);
    expect(over.body.details).toEqual({ max: MAX_COLOURWAY_COPIES });
    // Another user's count is their own.
    await quilter.post(url, { colourwayId: 'dusk' }).expect(201);
  });
});

/** Every text run of every page of a PDF, read back with Mozilla's reader (pdfjs-dist), not our writer. */
async function pdfText(bytes: Buffer): Promise<string> {
  const pdf = await getDocument({ data: new Uint8Array(bytes) }).promise;
  const pages: string[] = [];
  for (let n = 1; n <= pdf.numPages; n++) {
    const content = await (await pdf.getPage(n)).getTextContent();
    pages.push(content.items.map((i) => ('str' in i ? i.str : '')).join(' '));
  }
  await pdf.destroy();
  return pages.join('\n');
}

const binary = (res: import('superagent').Response, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
};

async function waitDone(c: Client, setId: string) {
  for (let i = 0; i < 1200; i++) {
    const res = await c.get(`/api/patterns/${patternId}/print-sets/${setId}`).expect(200);
    if (res.body.printSet.status === 'done' || res.body.printSet.status === 'failed') return res.body.printSet;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error('print set did not finish');
}

describe('print sets in a colourway copy', () => {
  it("prints in the copy's fabrics as they were when the set was asked for", async () => {
    const { body } = await quilter.post(base(), { colourwayId: 'dusk', name: 'Night orchard' }).expect(201);
    const fabrics = { ...body.copy.fabrics, plum: { name: 'Aubergine linen', colour: '#40203a' } };
    await quilter.patch(`${base()}/${body.copy.id}`, { version: 1, fabrics }).expect(200);
    const made = await quilter
      .post(`/api/patterns/${patternId}/print-sets`, { colourwayCopyId: body.copy.id, options: { quiltSize: 'Wall 1 × 1' } })
      .expect(202);
    // The answer names the copy; its fabrics are not repeated there.
    expect(made.body.printSet.options.colourwayCopy).toEqual({ id: body.copy.id, name: 'Night orchard' });
    // A later edit of the copy does not change the set already asked for.
    const later = { ...fabrics, plum: { name: 'Changed after', colour: '#000000' } };
    await quilter.patch(`${base()}/${body.copy.id}`, { version: 2, fabrics: later }).expect(200);
    const set = await waitDone(quilter, made.body.printSet.id);
    expect([set.status, set.error]).toEqual(['done', null]);
    const file = await quilter.get(set.url).buffer(true).parse(binary).expect(200);
    const text = await pdfText(file.body as Buffer);
    expect(text).toContain('Aubergine linen');
    // The other slots are Dusk's (the copy's source), not the pattern's own names.
    expect(text).toContain('Coal');
    expect(text).not.toContain('Changed after');
    expect(text).not.toMatch(/\bPlum\b/);
  });

  it("answers 404 for someone else's copy or a copy of another pattern, and 400 for a copy with a colourway", async () => {
    const mine = (await quilter.post(base(), { colourwayId: 'frost' }).expect(201)).body.copy.id as string;
    const url = `/api/patterns/${patternId}/print-sets`;
    const theirs = await second.post(url, { colourwayCopyId: mine, options: {} }).expect(404);
    expect(theirs.body.error).toBe('Colourway copy not found');
    await owner.post(url, { colourwayCopyId: mine, options: {} }).expect(404);
    const elsewhere = (await quilter.post(`/api/patterns/${otherPatternId}/colourway-copies`, { colourwayId: 'frost' }).expect(201)).body.copy.id as string;
    await quilter.post(url, { colourwayCopyId: elsewhere, options: {} }).expect(404);
    const both = await quilter.post(url, { colourwayCopyId: mine, options: { colourwayId: 'dusk' } }).expect(400);
    expect(both.body.details).toEqual([{ path: 'options.colourwayId', message: 'choose a colourway or a colourway copy, not both' }]);
    await quilter.post(url, { colourwayCopyId: '../x', options: {} }).expect(400);
  });
});
