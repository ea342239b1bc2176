import { count, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildGardenGate } from '@seamwright/piecing';
import { DEMO_ACCOUNTS, seedDemo } from '../db/seed';
import { Client, sampleDocument, startTestServer, type TestServer } from '../test/harness';
import { readSvg as parse } from '../test/read-svg';
import { PREVIEW_RENDERER_VERSION } from './pattern-preview';

let t: TestServer;
let designer: Client;
let quilter: Client;

const signedIn = async (role: 'designer' | 'quilter') => {
  const account = DEMO_ACCOUNTS.find((a) => a.role === role)!;
  const c = await Client.create(t.app);
  expect((await c.signIn(account.email, account.password)).status).toBe(200);
  return c;
};

beforeAll(async () => {
  t = await startTestServer();
  await seedDemo(t.ctx.data, 4);
  designer = await signedIn('designer');
  quilter = await signedIn('quilter');
});
afterAll(async () => {
  await t.close();
});

interface Row {
  id: string;
  title: string;
  headRevision: number;
  sectionCount: number | null;
  finishedSize: { widthIn: number; heightIn: number; displayUnit: 'in' | 'cm'; text: string } | null;
  preview: string | null;
}

const list = async (c: Client, query = '') => (await c.get(`/api/patterns${query}`).expect(200)).body.items as Row[];
const byTitle = (rows: Row[], title: string) => rows.find((r) => r.title === title)!;

/** The preview stored for a pattern. */
const stored = async (patternId: string) => {
  const { patternPreviews: p } = t.ctx.data.t;
  const [row] = await t.ctx.data.db.select({ rev: p.revisionNumber, version: p.rendererVersion, svg: p.svg }).from(p).where(eq(p.patternId, patternId));
  return row;
};

describe('pattern list rows', () => {
  it('carry the section count and finished size of the demo patterns (docs/design-notes.md#demo-data)', async () => {
    const rows = await list(designer);
    // Orchard Wheel: star, band, points and corners on a 26 in. square; Garden Gate: roof, door and path on 8 in.
    expect(byTitle(rows, 'Orchard Wheel')).toMatchObject({ sectionCount: 4, finishedSize: { widthIn: 26, heightIn: 26, displayUnit: 'in', text: '26 × 26 in.' } });
    expect(byTitle(rows, 'Garden Gate')).toMatchObject({ sectionCount: 3, finishedSize: { widthIn: 8, heightIn: 8, displayUnit: 'in', text: '8 × 8 in.' } });
    // The quilter the patterns are shared with sees the same.
    expect(byTitle(await list(quilter, '?scope=shared'), 'Orchard Wheel')).toMatchObject({ sectionCount: 4, finishedSize: { text: '26 × 26 in.' } });
  });

  it('carry a small SVG picture: Garden Gate with every patch in its fabric', async () => {
    const svg = parse(byTitle(await list(designer), 'Garden Gate').preview!);
    expect([svg.getAttribute('width'), svg.getAttribute('height'), svg.getAttribute('viewBox')]).toEqual(['96', '96', '0 0 8 8']);
    const fills = [...svg.querySelectorAll('polygon')].map((p) => p.getAttribute('fill')).sort();
    // Roof (brick between two cream corners), door (moss between two cream sides), path (cream between
    // two moss lawns): 9 patches, and the 3 section outlines unfilled.
    expect(fills).toEqual(['#5f7f4a', '#5f7f4a', '#5f7f4a', '#a4493d', '#f1e8d2', '#f1e8d2', '#f1e8d2', '#f1e8d2', '#f1e8d2', 'none', 'none', 'none']);
    const door = [...svg.querySelectorAll('polygon')].find((p) => p.getAttribute('fill') === '#5f7f4a' && p.getAttribute('points')!.includes('2.75,3'));
    expect(door?.getAttribute('points')!.split(' ').sort()).toEqual(['2.75,3', '2.75,5.5', '5.25,3', '5.25,5.5']);
  });

  it('draw each ring-repeat copy as a turned copy of its section: the Orchard Wheel', async () => {
    const svg = parse(byTitle(await list(designer), 'Orchard Wheel').preview!);
    const uses = [...svg.querySelectorAll('use')];
    const turns = (id: string) => uses.filter((u) => u.getAttribute('href') === `#${id}`).map((u) => u.getAttribute('transform') ?? 'none');
    // 8 star wedges, 8 stripe arcs, 16 point arcs, 4 corners, all turned about the block's centre (13, 13).
    expect(turns('s0')).toEqual(['none', ...[45, 90, 135, 180, 225, 270, 315].map((a) => `rotate(${a} 13 13)`)]);
    expect(turns('s2')).toHaveLength(16);
    expect(turns('s2')[1]).toBe('rotate(22.5 13 13)');
    expect(turns('s3')).toEqual(['none', 'rotate(90 13 13)', 'rotate(180 13 13)', 'rotate(270 13 13)']);
    // The stripe arcs are strip sets: each patch's strips are clipped to it.
    expect(svg.querySelectorAll('clipPath').length).toBeGreaterThan(0);
  });

  it('follow the latest revision and store what they show once per revision', async () => {
    const gate = byTitle(await list(designer), 'Garden Gate');
    expect(await stored(gate.id)).toMatchObject({ rev: gate.headRevision, version: PREVIEW_RENDERER_VERSION });
    const doc = buildGardenGate();
    const saved = await designer
      .put(`/api/patterns/${gate.id}`, { baseRevision: gate.headRevision, document: { ...doc, displayUnit: 'cm', canvas: { widthIn: 10, heightIn: 8 }, sections: doc.sections.slice(0, 2) } })
      .expect(200);
    const after = byTitle(await list(designer), 'Garden Gate');
    // 10 in. = 25.4 cm and 8 in. = 20.32 cm (the inch is 2.54 cm by definition).
    expect(after).toMatchObject({ headRevision: saved.body.revision.number, sectionCount: 2, finishedSize: { widthIn: 10, heightIn: 8, displayUnit: 'cm', text: '25.4 × 20.32 cm' } });
    expect(parse(after.preview!).getAttribute('viewBox')).toBe('0 0 10 8');
    expect(await stored(gate.id)).toMatchObject({ rev: saved.body.revision.number });
    const [rows] = await t.ctx.data.db.select({ n: count() }).from(t.ctx.data.t.patternPreviews);
    expect(rows.n).toBe(2);
  });

  it('are drawn again when the stored picture comes from an older renderer', async () => {
    const wheel = byTitle(await list(designer), 'Orchard Wheel');
    const { patternPreviews } = t.ctx.data.t;
    await t.ctx.data.db.update(patternPreviews).set({ rendererVersion: 0, svg: '<svg>old</svg>' }).where(eq(patternPreviews.patternId, wheel.id));
    const again = byTitle(await list(designer), 'Orchard Wheel');
    expect(again.preview).toBe(wheel.preview);
    expect(await stored(wheel.id)).toMatchObject({ version: PREVIEW_RENDERER_VERSION, svg: wheel.preview });
  });

  it('write no text of the document into the picture, and show in the trash too', async () => {
    const own = await Client.create(t.app);
    await own.signUp('lister@pattern-list.test');
    const title = '<script>alert(1)</script> & "quotes"';
    const created = await own.post('/api/patterns', { document: sampleDocument(title) }).expect(201);
    const [row] = await list(own);
    expect(row).toMatchObject({ title, sectionCount: 1, finishedSize: { widthIn: 4, heightIn: 4 } });
    expect(row.preview).not.toMatch(/script|alert|quotes|sec-a/);
    expect(row.preview).toMatch(/^<svg xmlns="http:\/\/www\.w3\.org\/2000\/svg" width="96" height="96" viewBox="0 0 4 4">/);
    await own.post(`/api/patterns/${created.body.pattern.id}/trash`).expect(200);
    const [trashed] = await list(own, '?scope=trash');
    expect(trashed).toMatchObject({ id: created.body.pattern.id, sectionCount: 1, preview: row.preview });
  });
});

describe('pattern list search and sort', () => {
  // Both databases ignore case the same way (ASCII): SQLite's LIKE and NOCASE, PostgreSQL's ILIKE and lower().
  it('finds a title whatever the case of the words searched for', async () => {
    const titles = async (c: Client, query: string) => (await list(c, query)).map((r) => r.title);
    expect(await titles(designer, '?q=ORCHARD')).toEqual(['Orchard Wheel']);
    expect(await titles(designer, '?q=garden%20GATE')).toEqual(['Garden Gate']);
    expect(await titles(quilter, '?q=orchard&scope=shared')).toEqual(['Orchard Wheel']);
    expect(await titles(designer, '?q=ORCHARDS')).toEqual([]);
    // LIKE's own wildcards are searched for as text.
    expect(await titles(designer, '?q=%25')).toEqual([]);
  });

  it('sorts by title ignoring case, both ways, with the total across pages', async () => {
    const sorter = await Client.create(t.app);
    await sorter.signUp('sorter@pattern-list.test');
    for (const title of ['cherry pie', 'Banana split', 'apple tart', 'Damson jam']) await sorter.post('/api/patterns', { document: sampleDocument(title) }).expect(201);
    const titles = async (query: string) => (await list(sorter, query)).map((r) => r.title);
    expect(await titles('?sort=title&order=asc')).toEqual(['apple tart', 'Banana split', 'cherry pie', 'Damson jam']);
    expect(await titles('?sort=title&order=desc')).toEqual(['Damson jam', 'cherry pie', 'Banana split', 'apple tart']);
    const second = (await sorter.get('/api/patterns?sort=title&order=asc&pageSize=3&page=2').expect(200)).body;
    expect(second).toMatchObject({ total: 4, page: 2, pageSize: 3, items: [{ title: 'Damson jam' }] });
    // A page past the end still carries the total.
    expect((await sorter.get('/api/patterns?pageSize=3&page=5').expect(200)).body).toMatchObject({ total: 4, items: [] });
  });
});
