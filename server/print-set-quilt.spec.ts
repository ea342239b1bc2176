import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildOrchardWheel } from '@seamwright/piecing';
import { startTestServer, userClient, type Client, type TestServer } from './test/harness';

let t: TestServer;
let owner: Client;
let patternId: string;

beforeAll(async () => {
  t = await startTestServer();
  owner = await userClient(t.app, 'owner@quilt-print.test', 'designer');
  // The demo medallion carries a quilt layout with named sizes and two colourways (docs/quilt-layout.md).
  const res = await owner.post('/api/patterns', { document: buildOrchardWheel() });
  expect(res.status).toBe(201);
  patternId = res.body.pattern.id;
});
afterAll(async () => {
  await t.close();
});

describe('print sets of a quilt', () => {
  it('answers 400 naming options.quiltSize and options.colourwayId when they are not the pattern’s', async () => {
    const res = await owner.post(`/api/patterns/${patternId}/print-sets`, { options: { quiltSize: 'King', colourwayId: 'noon' } }).expect(400);
    const paths = res.body.details.map((d: { path: string }) => d.path);
    expect(paths).toEqual(['options.colourwayId', 'options.quiltSize']);
    expect(JSON.stringify(res.body.details)).toContain('unknown size \\"King\\"');
  });

  it('queues a print set for a named size in a colourway', async () => {
    const res = await owner.post(`/api/patterns/${patternId}/print-sets`, { options: { quiltSize: 'Wall 1 × 1', colourwayId: 'frost' } }).expect(202);
    expect(res.body.printSet.options).toMatchObject({ quiltSize: 'Wall 1 × 1', colourwayId: 'frost' });
  });
});
