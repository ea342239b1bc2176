import { listingAnswerSchema } from '@seamwright/api';
import { buildOrchardWheel } from '@seamwright/piecing';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sampleDocument, startTestServer, userClient, type Client, type TestServer } from '../test/harness';
import { listingQuiltFacts } from './listing-quilt';
import { fillListingQuiltBatch, fillListingQuilts } from './listings';

let t: TestServer;
let designer: Client;
let buyer: Client;

beforeAll(async () => {
  t = await startTestServer();
  designer = await userClient(t.app, 'fay@fill.test', 'designer');
  buyer = await userClient(t.app, 'bo@fill.test', 'quilter');
  await designer.put('/api/shop/mine', { currency: 'usd' }).expect(200);
});

afterAll(async () => {
  await t.close();
});

/** A published listing of `document`, then its quilt columns emptied as for a listing saved before migration 0008. */
async function oldListing(document: unknown, title: string): Promise<string> {
  const id = (await designer.post('/api/patterns', { document }).expect(201)).body.pattern.id as string;
  await designer.put(`/api/shop/listings/${id}`, { priceMinor: 1500, description: title, published: true }).expect(200);
  const { shopListings } = t.ctx.data.t;
  await t.ctx.data.db.update(shopListings).set({ quiltSizes: null, quiltPictures: null }).where(eq(shopListings.patternId, id));
  return id;
}

const quiltOf = async (id: string) => listingAnswerSchema.parse((await buyer.get(`/api/shop/listings/${id}`).expect(200)).body).listing.quilt;

describe('filling the quilt of listings saved before their quilt columns', () => {
  it('works out and stores the size chart and pictures of a listing with empty quilt columns; a block-only listing stays without', async () => {
    const wheel = buildOrchardWheel();
    const quiltId = await oldListing(wheel, 'A wheel quilt');
    const blockId = await oldListing(sampleDocument('Just a block'), 'A block');
    // As the buyer sees them before the fill: no quilt.
    expect(await quiltOf(quiltId)).toBeFalsy();

    expect(await fillListingQuilts(t.ctx.data)).toBe(1);

    const quilt = await quiltOf(quiltId);
    const expected = listingQuiltFacts(wheel);
    // The demo's three named sizes and a picture for its own fabrics and each of its two colourways.
    expect(quilt?.sizes.map((s) => s.name)).toEqual(['Wall 1 × 1', 'Throw 2 × 2', 'Bed 3 × 3']);
    expect(quilt?.sizes).toEqual(expected.quiltSizes);
    expect(quilt?.pictures.map((p) => p.colourwayId)).toEqual([null, 'dusk', 'frost']);
    expect(quilt?.pictures.map((p) => p.svg)).toEqual(expected.quiltPictures?.map((p) => p.svg));
    expect(await quiltOf(blockId)).toBeFalsy();
    // Nothing left to fill: a second run changes nothing.
    expect(await fillListingQuilts(t.ctx.data)).toBe(0);
  });

  it('goes in batches, each after the last pattern id of the one before', async () => {
    const ids = [await oldListing(buildOrchardWheel(), 'one'), await oldListing(buildOrchardWheel(), 'two'), await oldListing(buildOrchardWheel(), 'three')].sort();
    // Stopped (the server closing) before the first batch: nothing is filled.
    expect(await fillListingQuilts(t.ctx.data, 2, () => true)).toBe(0);
    const first = await fillListingQuiltBatch(t.ctx.data, null, 2);
    expect(first).toEqual({ filled: 2, next: ids[1] });
    expect(await quiltOf(ids[2]!)).toBeFalsy();
    expect(await fillListingQuiltBatch(t.ctx.data, first.next, 2)).toEqual({ filled: 1, next: null });
    expect((await quiltOf(ids[2]!))?.pictures).toHaveLength(3);
  });
});
