import crypto from 'node:crypto';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { asc, count as countRows, eq, sql, type SQL } from 'drizzle-orm';
import fc from 'fast-check';
import request from 'supertest';
import Stripe from 'stripe';
import { formatMoney, listingAnswerSchema } from '@seamwright/api';
import { buildOrchardWheel, quiltSizes } from '@seamwright/piecing';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startFakeStripeServer, type FakeStripeServer } from '../dev/fake-stripe-server';
import { sampleDocument, startTestServer, userClient, type Client, type TestServer } from '../test/harness';
import { seedDemoShop } from './demo-shop';

const SK = 'sk_test_shop_spec_key';
const WHSEC = 'whsec_shop_spec_secret';

let fake: FakeStripeServer;
let t: TestServer;
let listening: Server;
let designer: Client;
let buyer: Client;
let stranger: Client;
let listedId: string;
let draftId: string;

/** A `SELECT count(*) AS n …` on the test server's database (PostgreSQL answers a bigint as text). */
const count = async (query: SQL) => Number((await t.ctx.data.rows<{ n: unknown }>(query))[0]!.n);
/** Everything the webhook may change, to show a refused or replayed event changed nothing. */
const snapshot = async () => {
  const { orders } = t.ctx.data.t;
  return {
    events: await count(sql`SELECT count(*) AS n FROM payment_events`),
    members: await count(sql`SELECT count(*) AS n FROM members`),
    orders: await t.ctx.data.db
      .select({ id: orders.id, status: orders.status, paidAt: orders.paidAt, refundedAt: orders.refundedAt, grantedAccess: orders.grantedAccess })
      .from(orders)
      .orderBy(asc(orders.id)),
    // Mail queued for sending as well as mail delivered.
    queued: await count(sql`SELECT count(*) AS n FROM mail_outbox`),
    mails: t.mail.messages.length,
  };
};

const postWebhook = (payload: string, signature?: string) => {
  const r = request(t.app).post('/api/shop/webhook').set('Content-Type', 'application/json; charset=utf-8');
  return (signature ? r.set('Stripe-Signature', signature) : r).send(payload);
};

async function until<T>(probe: () => Promise<T | undefined> | T | undefined, what: string, ms = 10_000): Promise<T> {
  const end = Date.now() + ms;
  for (;;) {
    const v = await probe();
    if (v !== undefined) return v;
    if (Date.now() > end) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

beforeAll(async () => {
  fake = await startFakeStripeServer({ port: 0, webhookSecret: WHSEC, apiKey: SK, retries: 0 });
  t = await startTestServer({ STRIPE_SECRET_KEY: SK, STRIPE_WEBHOOK_SECRET: WHSEC, STRIPE_API_BASE: fake.url });
  listening = await new Promise<Server>((resolve) => {
    const s = t.app.listen(0, '127.0.0.1', () => resolve(s));
  });
  fake.setWebhookUrl(`http://127.0.0.1:${(listening.address() as AddressInfo).port}/api/shop/webhook`);
  designer = await userClient(t.app, 'dora@shop.test', 'designer');
  buyer = await userClient(t.app, 'bea@shop.test', 'quilter');
  stranger = await userClient(t.app, 'stan@shop.test', 'designer');
  listedId = (await designer.post('/api/patterns', { document: sampleDocument('Plum Lattice') }).expect(201)).body.pattern.id;
  draftId = (await designer.post('/api/patterns', { document: sampleDocument('Unfinished Star') }).expect(201)).body.pattern.id;
});

afterAll(async () => {
  await new Promise<void>((r) => listening.close(() => r()));
  await t.close();
  await fake.close();
});

describe('money in minor units', () => {
  it('formats with the currency’s own decimals', () => {
    // ISO 4217 minor units: USD and EUR have 2 decimals, JPY has none.
    expect(formatMoney(1250, 'usd')).toBe('$12.50');
    expect(formatMoney(1500, 'jpy')).toBe('¥1,500');
    expect(formatMoney(999, 'eur')).toBe('€9.99');
  });
});

describe('publishing', () => {
  it('asks for the shop currency before a listing, and validates price and description', async () => {
    const early = await designer.put(`/api/shop/listings/${listedId}`, { priceMinor: 1250, description: 'A lattice', published: true });
    expect(early.status).toBe(409);
    expect(early.body.error).toMatch(/currency/);
    expect((await designer.put('/api/shop/mine', { currency: 'xyz' })).status).toBe(400);
    expect((await designer.put('/api/shop/mine', { currency: 'usd' }).expect(200)).body.shop).toEqual({ currency: 'usd' });

    const fractional = await designer.put(`/api/shop/listings/${listedId}`, { priceMinor: 12.5, description: 'x', published: true });
    expect(fractional.status).toBe(400);
    expect(fractional.body.details[0].path).toBe('priceMinor');
    const tiny = await designer.put(`/api/shop/listings/${listedId}`, { priceMinor: 10, description: 'x', published: true });
    expect(tiny.status).toBe(400);
    const blank = await designer.put(`/api/shop/listings/${listedId}`, { priceMinor: 1250, description: '   ', published: true });
    expect(blank.body.details[0].path).toBe('description');
  });

  it('lets only the owning designer list a pattern', async () => {
    expect((await buyer.put('/api/shop/mine', { currency: 'eur' })).status).toBe(403);
    expect((await buyer.get('/api/shop/mine')).status).toBe(403);
    // Someone else's pattern is not there for them (404, as everywhere else).
    expect((await stranger.put(`/api/shop/listings/${listedId}`, { priceMinor: 100, description: 'mine now', published: true })).status).toBe(404);
    expect((await request(t.app).get('/api/shop/listings')).status).toBe(401);
  });

  it('publishes one pattern and keeps the other as an unpublished draft', async () => {
    const put = await designer
      .put(`/api/shop/listings/${listedId}`, { priceMinor: 1250, description: 'A four-inch lattice block in two patches.', published: true })
      .expect(200);
    expect(put.body.listing).toMatchObject({ priceMinor: 1250, currency: 'usd', published: true, sectionCount: 1, finishedSize: { widthIn: 4, heightIn: 4 } });
    await designer.put(`/api/shop/listings/${draftId}`, { priceMinor: 900, description: 'Not ready', published: false }).expect(200);

    const browse = (await buyer.get('/api/shop/listings').expect(200)).body;
    expect(browse.total).toBe(1);
    expect(browse.items[0]).toMatchObject({ patternId: listedId, title: 'Plum Lattice', priceMinor: 1250, currency: 'usd', access: null });
    expect(browse.items[0].designer.displayName).toBe('dora');
    expect((await buyer.get('/api/shop/listings?q=lattice')).body.total).toBe(1);
    expect((await buyer.get('/api/shop/listings?q=star')).body.total).toBe(0);

    const mine = (await designer.get('/api/shop/mine').expect(200)).body;
    expect(mine.shop.currency).toBe('usd');
    expect(mine.patterns.map((p: { title: string; listing: { published: boolean } }) => [p.title, p.listing.published])).toEqual([
      ['Plum Lattice', true],
      ['Unfinished Star', false],
    ]);
  });

  it('keeps what a listing shows (sections, finished block size, picture) from its last save; browsing reads no document', async () => {
    // The sample block's 4 in. section on a 10 in. drawing area: the block finishes at 4 in., not 10.
    const doc = { ...sampleDocument('Small on a big sheet'), canvas: { widthIn: 10, heightIn: 10 } };
    const id = (await designer.post('/api/patterns', { document: doc }).expect(201)).body.pattern.id as string;
    const put = await designer.put(`/api/shop/listings/${id}`, { priceMinor: 700, description: 'Four inches.', published: true }).expect(200);
    expect(put.body.listing).toMatchObject({ sectionCount: 1, finishedSize: { widthIn: 4, heightIn: 4 } });
    // The picture: drawn by the server, 320 px wide, the drawing area's proportions, the fabrics' colours.
    expect(put.body.listing.preview).toMatch(/^<svg[^>]* width="320" height="320"/);
    expect(put.body.listing.preview).toContain('#6b2d5c');
    // Damage the stored document: a view that parsed it would lose the facts; the stored columns keep them.
    const { revisions } = t.ctx.data.t;
    const [{ document: before }] = await t.ctx.data.db.select({ document: revisions.document }).from(revisions).where(eq(revisions.patternId, id));
    await t.ctx.data.db.update(revisions).set({ document: 'not json' }).where(eq(revisions.patternId, id));
    try {
      const seen = (await buyer.get(`/api/shop/listings/${id}`).expect(200)).body.listing;
      expect(seen).toMatchObject({ sectionCount: 1, finishedSize: { widthIn: 4, heightIn: 4 }, preview: put.body.listing.preview });
      const browse = (await buyer.get('/api/shop/listings?q=big%20sheet').expect(200)).body;
      expect(browse.items[0]).toMatchObject({ patternId: id, sectionCount: 1, finishedSize: { widthIn: 4, heightIn: 4 } });
    } finally {
      await t.ctx.data.db.update(revisions).set({ document: before }).where(eq(revisions.patternId, id));
    }
    // A new revision shows once the listing is saved again.
    const bigger = { ...doc, sections: [{ ...doc.sections[0] }, { ...doc.sections[0], id: 'sec-b', label: 'B', geometry: { kind: 'straight', vertices: [{ x: 4, y: 0 }, { x: 9, y: 0 }, { x: 9, y: 4 }, { x: 4, y: 4 }] }, seams: [], patches: [] }] };
    await designer.put(`/api/patterns/${id}`, { baseRevision: 1, document: bigger }).expect(200);
    expect((await buyer.get(`/api/shop/listings/${id}`).expect(200)).body.listing.sectionCount).toBe(1);
    const again = await designer.put(`/api/shop/listings/${id}`, { priceMinor: 700, description: 'Nine inches.', published: true }).expect(200);
    expect(again.body.listing).toMatchObject({ sectionCount: 2, finishedSize: { widthIn: 9, heightIn: 4 } });
    await designer.put(`/api/shop/listings/${id}`, { priceMinor: 700, description: 'Nine inches.', published: false }).expect(200);
  });

  it('hides an unpublished pattern from buyers: listing, checkout and the pattern itself are 404', async () => {
    expect((await buyer.get(`/api/shop/listings/${draftId}`)).status).toBe(404);
    expect((await buyer.post(`/api/shop/listings/${draftId}/checkout`)).status).toBe(404);
    expect((await buyer.get(`/api/patterns/${draftId}`)).status).toBe(404);
    expect((await buyer.get('/api/shop/listings/..%2F..%2Fetc')).status).toBe(404);
    // The owner may look at their own draft listing.
    expect((await designer.get(`/api/shop/listings/${draftId}`)).body.listing.published).toBe(false);
    expect(fake.sessions.size).toBe(0);
  });
});

describe('buying', () => {
  let orderId: string;
  let sessionId: string;

  it('refuses a checkout of your own pattern', async () => {
    expect((await designer.post(`/api/shop/listings/${listedId}/checkout`)).status).toBe(409);
  });

  it('creates a checkout session at the provider; an unpaid order gives no access', async () => {
    const res = await buyer.post(`/api/shop/listings/${listedId}/checkout`).expect(201);
    expect(res.body.order).toMatchObject({ status: 'pending', amountMinor: 1250, currency: 'usd', patternTitle: 'Plum Lattice' });
    orderId = res.body.order.id;
    expect(res.body.checkoutUrl).toMatch(new RegExp(`^${fake.url}/checkout/cs_test_`));
    sessionId = res.body.checkoutUrl.split('/').pop();
    const session = fake.sessions.get(sessionId)!;
    expect(session).toMatchObject({ amount_total: 1250, currency: 'usd', client_reference_id: orderId, customer_email: 'bea@shop.test' });
    expect(session.metadata).toEqual({ orderId, patternId: listedId, buyerId: buyer.user!.id });

    expect((await buyer.get(`/api/patterns/${listedId}`)).status).toBe(404);
    expect((await buyer.get(`/api/patterns/${listedId}/sewing-log`)).status).toBe(404);
    expect((await buyer.get(`/api/shop/orders/${orderId}`)).body.order.status).toBe('pending');
    expect((await stranger.get(`/api/shop/orders/${orderId}`)).status).toBe(404);
  });

  it('pays on the hosted page; the signed webhook grants quilter access once and mails a receipt', async () => {
    const page = await fetch(`${fake.url}/checkout/${sessionId}`);
    const html = await page.text();
    expect(html).toContain('Plum Lattice');
    expect(html).toContain('$12.50');

    const paid = await fetch(`${fake.url}/checkout/${sessionId}/pay`, { method: 'POST', redirect: 'manual' });
    expect(paid.status).toBe(303);
    expect(paid.headers.get('location')).toBe(`http://localhost:4200/shop/purchases?order=${orderId}&session_id=${sessionId}`);
    expect(fake.events.map((e) => [e.type, e.attempts])).toEqual([['checkout.session.completed', [200]]]);

    const order = (await buyer.get(`/api/shop/orders/${orderId}`).expect(200)).body.order;
    expect(order).toMatchObject({ status: 'paid', receiptSent: true });
    const pattern = await buyer.get(`/api/patterns/${listedId}`).expect(200);
    expect(pattern.body.pattern.access).toBe('quilter');
    await buyer.get(`/api/patterns/${listedId}/sewing-log`).expect(200);
    // Quilter access reads and logs but cannot change the design.
    expect((await buyer.put(`/api/patterns/${listedId}`, { baseRevision: 1, document: sampleDocument('Taken') })).status).toBe(403);

    // The receipt went to the mail outbox with the payment; the outbox delivers it.
    await until(() => t.mail.messages.find((m) => m.to.includes('bea@shop.test')), 'the receipt');
    await t.ctx.mailOutbox.drain();
    const mails = t.mail.messages.filter((m) => m.to.includes('bea@shop.test'));
    expect(mails).toHaveLength(1);
    expect(mails[0].subject).toBe('Your receipt for "Plum Lattice"');
    expect(mails[0].text).toContain('Amount paid: $12.50 (USD)');
    expect(mails[0].text).toContain(`Order: ${orderId}`);
    expect(mails[0].text).toContain(`http://localhost:4200/patterns/${listedId}`);
    expect(mails[0].text).toContain('does not calculate or collect taxes');

    expect((await buyer.get('/api/shop/listings')).body.items[0].access).toBe('quilter');
    expect((await buyer.post(`/api/shop/listings/${listedId}/checkout`)).status).toBe(409);
    const purchases = (await buyer.get('/api/shop/purchases').expect(200)).body;
    expect(purchases.items.map((o: { id: string; status: string }) => [o.id, o.status])).toEqual([[orderId, 'paid']]);
    const sales = (await designer.get('/api/shop/sales').expect(200)).body;
    expect(sales.items).toHaveLength(1);
    expect(sales.items[0]).toMatchObject({ id: orderId, status: 'paid', buyer: { email: 'bea@shop.test' } });
    expect(sales.totals).toEqual([{ currency: 'usd', orders: 1, amountMinor: 1250 }]);
    expect((await buyer.get('/api/shop/sales')).status).toBe(403);
    expect((await stranger.get('/api/shop/sales')).body.items).toEqual([]);
  });

  it('acknowledges a replayed event without acting on it again', async () => {
    const before = await snapshot();
    const delivered = fake.events[0];
    const replay = await postWebhook(delivered.payload, delivered.signature).expect(200);
    expect(replay.body).toEqual({ received: true, duplicate: true });
    expect(await snapshot()).toEqual(before);
  });

  it('refuses forged events and changes nothing', async () => {
    const before = await snapshot();
    const delivered = fake.events[0];
    const event = JSON.parse(delivered.payload);
    const forged = JSON.stringify({ ...event, id: 'evt_forged_1' });
    const stripe = new Stripe(SK);
    const wrongSecret = stripe.webhooks.generateTestHeaderString({ payload: forged, secret: 'whsec_not_ours' });
    const stale = stripe.webhooks.generateTestHeaderString({ payload: forged, secret: WHSEC, timestamp: Math.floor(Date.now() / 1000) - 3600 });

    // A changed body under the original signature, a signature with another secret, an hour-old
    // timestamp (the SDK's tolerance is 300 s), garbage, and no signature at all.
    for (const [payload, signature] of [
      [forged, delivered.signature],
      [forged, wrongSecret],
      [forged, stale],
      [forged, 't=1,v1=deadbeef'],
      [forged, undefined],
    ] as const) {
      const res = await postWebhook(payload, signature);
      expect(res.status).toBe(400);
      expect(res.body.error).toMatch(/signature/i);
    }
    expect(await snapshot()).toEqual(before);
  });

  it('accepts a signature made by hand as the provider documents it, and nothing else', async () => {
    // The provider's documented scheme: v1 = hex HMAC-SHA256 of "<timestamp>.<raw body>" with the
    // endpoint secret (Stripe docs, "Verify webhook signatures manually"). Computed here with
    // node:crypto, independently of the SDK that signs the fake's events.
    const payload = JSON.stringify({ id: 'evt_by_hand', object: 'event', type: 'customer.created', data: { object: { id: 'cus_1', object: 'customer' } } });
    const ts = Math.floor(Date.now() / 1000);
    const v1 = crypto.createHmac('sha256', WHSEC).update(`${ts}.${payload}`).digest('hex');
    const res = await postWebhook(payload, `t=${ts},v1=${v1}`).expect(200);
    expect(res.body).toEqual({ received: true, duplicate: false });
    const flipped = v1.slice(0, -1) + (v1.endsWith('0') ? '1' : '0');
    expect((await postWebhook(payload.replace('evt_by_hand', 'evt_by_hand2'), `t=${ts},v1=${flipped}`)).status).toBe(400);
  });

  it('ignores a signed completion whose amount does not match the order', async () => {
    const res = await stranger.post(`/api/shop/listings/${listedId}/checkout`).expect(201);
    const session = fake.sessions.get(res.body.checkoutUrl.split('/').pop())!;
    const before = await snapshot();
    const event = {
      id: 'evt_wrong_amount',
      object: 'event',
      type: 'checkout.session.completed',
      data: { object: { ...session, payment_status: 'paid', status: 'complete', amount_total: 1, payment_intent: 'pi_x' } },
    };
    const payload = JSON.stringify(event);
    const signature = new Stripe(SK).webhooks.generateTestHeaderString({ payload, secret: WHSEC });
    await postWebhook(payload, signature).expect(200);
    const after = await snapshot();
    expect(after.events).toBe(before.events + 1);
    expect(after.members).toBe(before.members);
    expect(after.orders).toEqual(before.orders);
    expect((await stranger.get(`/api/patterns/${listedId}`)).status).toBe(404);
  });

  it('refunds through the provider; the refund event takes the access away', async () => {
    expect((await stranger.post(`/api/shop/sales/${orderId}/refund`)).status).toBe(404);
    expect((await buyer.post(`/api/shop/sales/${orderId}/refund`)).status).toBe(404);
    const res = await designer.post(`/api/shop/sales/${orderId}/refund`).expect(202);
    expect(res.body.order).toMatchObject({ status: 'paid', refundRequested: true });
    expect((await designer.post(`/api/shop/sales/${orderId}/refund`)).status).toBe(409);

    const order = await until(async () => {
      const o = (await buyer.get(`/api/shop/orders/${orderId}`)).body.order;
      return o.status === 'refunded' ? o : undefined;
    }, 'the refund event');
    expect(order.refundedAt).not.toBeNull();
    expect(fake.events.map((e) => e.type)).toEqual(['checkout.session.completed', 'charge.refunded']);
    expect((await buyer.get(`/api/patterns/${listedId}`)).status).toBe(404);
    expect((await designer.get('/api/shop/sales')).body.totals).toEqual([]);
    expect((await buyer.get('/api/shop/purchases')).body.items[0].status).toBe('refunded');
    const notice = await until(() => t.mail.messages.find((m) => m.subject === 'Refund for "Plum Lattice"'), 'the refund mail');
    expect(notice.to).toEqual(['bea@shop.test']);
    expect(notice.text).toContain('$12.50 goes back to you');

    // The refund event replayed does nothing either.
    const before = await snapshot();
    const refundEvent = fake.events[1];
    expect((await postWebhook(refundEvent.payload, refundEvent.signature).expect(200)).body.duplicate).toBe(true);
    expect(await snapshot()).toEqual(before);
  });

  it('can buy again after a refund', async () => {
    const res = await buyer.post(`/api/shop/listings/${listedId}/checkout`).expect(201);
    await fake.pay(res.body.checkoutUrl.split('/').pop());
    expect((await buyer.get(`/api/patterns/${listedId}`).expect(200)).body.pattern.access).toBe('quilter');
  });
});

describe('abandoned and repeated checkouts', () => {
  it('makes one order and one session of four checkouts asked at the same moment (a double click)', async () => {
    const dan = await userClient(t.app, 'dan@shop.test', 'quilter');
    const sessionsBefore = fake.sessions.size;
    const answers = await Promise.all(Array.from({ length: 4 }, () => dan.post(`/api/shop/listings/${listedId}/checkout`)));
    expect(answers.map((r) => r.status).sort()).toEqual([200, 200, 200, 201]);
    expect(new Set(answers.map((r) => r.body.order.id)).size).toBe(1);
    expect(new Set(answers.map((r) => r.body.checkoutUrl)).size).toBe(1);
    expect(fake.sessions.size).toBe(sessionsBefore + 1);
    expect(await count(sql`SELECT count(*) AS n FROM orders WHERE buyer_id = ${dan.user!.id}`)).toBe(1);
  });

  it('offers a checkout still open again instead of a second one, so nobody pays twice', async () => {
    const ruth = await userClient(t.app, 'ruth@shop.test', 'quilter');
    const sessionsBefore = fake.sessions.size;
    const first = await ruth.post(`/api/shop/listings/${listedId}/checkout`).expect(201);
    const again = await ruth.post(`/api/shop/listings/${listedId}/checkout`).expect(200);
    expect(again.body.checkoutUrl).toBe(first.body.checkoutUrl);
    expect(again.body.order.id).toBe(first.body.order.id);
    expect(fake.sessions.size).toBe(sessionsBefore + 1);

    // Cancel on the hosted page goes back to the listing, marked as cancelled; nothing is paid.
    const sessionId = first.body.checkoutUrl.split('/').pop();
    const cancel = await fetch(`${fake.url}/checkout/${sessionId}/cancel`, { method: 'POST', redirect: 'manual' });
    expect(cancel.status).toBe(303);
    expect(cancel.headers.get('location')).toBe(`http://localhost:4200/shop/patterns/${listedId}?cancelled=1`);
    expect((await ruth.get(`/api/patterns/${listedId}`)).status).toBe(404);

    // The provider expires the session (after 24 h at the real service; here through the SDK): the order ends.
    const sdk = new Stripe(SK, { host: '127.0.0.1', port: fake.port, protocol: 'http' });
    await sdk.checkout.sessions.expire(sessionId);
    const expired = await until(async () => {
      const o = (await ruth.get(`/api/shop/orders/${first.body.order.id}`)).body.order;
      return o.status === 'expired' ? o : undefined;
    }, 'the expiry event');
    expect(expired.paidAt).toBeNull();
    expect((await ruth.get('/api/shop/purchases')).body.items).toEqual([]);
    const fresh = await ruth.post(`/api/shop/listings/${listedId}/checkout`).expect(201);
    expect(fresh.body.checkoutUrl).not.toBe(first.body.checkoutUrl);
    // The old hosted page is closed.
    expect((await fetch(first.body.checkoutUrl)).status).toBe(410);
  });
});

describe('exactly once', () => {
  it('acts on one event delivered five times at once exactly once', async () => {
    const kim = await userClient(t.app, 'kim@shop.test', 'quilter');
    const res = await kim.post(`/api/shop/listings/${listedId}/checkout`).expect(201);
    const session = fake.sessions.get(res.body.checkoutUrl.split('/').pop())!;
    const payload = JSON.stringify({
      id: 'evt_burst_1',
      object: 'event',
      type: 'checkout.session.completed',
      data: { object: { ...session, status: 'complete', payment_status: 'paid', payment_intent: 'pi_burst_1' } },
    });
    const signature = new Stripe(SK).webhooks.generateTestHeaderString({ payload, secret: WHSEC });
    const members = await count(sql`SELECT count(*) AS n FROM members WHERE user_id = ${kim.user!.id}`);
    const answers = await Promise.all(Array.from({ length: 5 }, () => postWebhook(payload, signature)));
    expect(answers.map((a) => a.status)).toEqual([200, 200, 200, 200, 200]);
    expect(answers.filter((a) => a.body.duplicate === false)).toHaveLength(1);
    expect(await count(sql`SELECT count(*) AS n FROM members WHERE user_id = ${kim.user!.id}`)).toBe(members + 1);
    expect(await count(sql`SELECT count(*) AS n FROM mail_outbox WHERE to_address = 'kim@shop.test'`)).toBe(1);
    await until(() => t.mail.messages.find((m) => m.to.includes('kim@shop.test')), 'the receipt');
    await t.ctx.mailOutbox.drain();
    expect(t.mail.messages.filter((m) => m.to.includes('kim@shop.test'))).toHaveLength(1);
    expect((await kim.get(`/api/shop/orders/${res.body.order.id}`)).body.order.status).toBe('paid');
  });
});

describe('hostile input', () => {
  it('never answers 5xx to random bodies on the shop routes or random bytes on the webhook', async () => {
    const before = await snapshot();
    await fc.assert(
      fc.asyncProperty(fc.jsonValue(), fc.string({ maxLength: 40 }), async (body, id) => {
        const target = id.length > 0 ? encodeURIComponent(id) : listedId;
        const answers: [string, { status: number }][] = [
          ['PUT listing', await designer.put(`/api/shop/listings/${target}`, { value: body } as object)],
          ['PUT mine', await designer.put('/api/shop/mine', (typeof body === 'object' && body !== null ? body : { currency: body }) as object)],
          ['POST checkout', await stranger.post(`/api/shop/listings/${target}/checkout`, {})],
          ['GET order', await stranger.get(`/api/shop/orders/${target}`)],
          ['POST refund', await stranger.post(`/api/shop/sales/${target}/refund`, {})],
          ['POST webhook', await postWebhook(JSON.stringify(body), `t=${Math.floor(Date.now() / 1000)},v1=${Buffer.from(id).toString('hex')}`)],
        ];
        for (const [what, res] of answers) {
          expect(res.status, what).toBeLessThan(500);
        }
      }),
      { numRuns: 40, seed: 9 },
    );
    const big = await postWebhook('x'.repeat(300 * 1024), 't=1,v1=00');
    expect(big.status).toBe(413);
    // Nothing random reached the orders, members or handled events.
    const after = await snapshot();
    expect(after.events).toBe(before.events);
    expect(after.members).toBe(before.members);
  });
});

describe('quilt listings', () => {
  it('stores the size chart and a quilt picture per colourway when the listing is saved, and shows them on its page', async () => {
    const quiltDesigner = await userClient(t.app, 'quinn@shop.test', 'designer');
    await quiltDesigner.put('/api/shop/mine', { currency: 'usd' }).expect(200);
    const document = buildOrchardWheel();
    const id = (await quiltDesigner.post('/api/patterns', { document }).expect(201)).body.pattern.id;
    const put = await quiltDesigner.put(`/api/shop/listings/${id}`, { priceMinor: 2400, description: 'A wheel quilt.', published: true }).expect(200);
    expect(listingAnswerSchema.safeParse(put.body).success).toBe(true);

    const { listing } = listingAnswerSchema.parse((await buyer.get(`/api/shop/listings/${id}`).expect(200)).body);
    const expected = quiltSizes(document);
    expect(listing.quilt?.sizes.map((s) => s.name)).toEqual(['Wall 1 × 1', 'Throw 2 × 2', 'Bed 3 × 3']);
    expect(listing.quilt?.sizes).toEqual(
      expected.map((s) => ({
        name: s.name,
        widthIn: expect.closeTo(s.finishedSizeIn.width, 3),
        heightIn: expect.closeTo(s.finishedSizeIn.height, 3),
        blockCount: s.blockCount,
        totalYards: expect.closeTo(s.totalYards, 3),
      })),
    );
    expect(listing.quilt?.sizes.map((s) => s.blockCount)).toEqual([1, 4, 9]);
    expect(listing.quilt?.pictures.map((p) => [p.colourwayId, p.name])).toEqual([
      [null, 'Pattern fabrics'],
      ...document.colourways!.map((c) => [c.id, c.name]),
    ]);
    expect(document.colourways!.map((c) => c.name)).toEqual(['Dusk', 'Frost']);
    const pictures = listing.quilt!.pictures;
    for (const [i, p] of pictures.entries()) {
      expect(p.svg).toMatch(/^<svg xmlns="http:\/\/www\.w3\.org\/2000\/svg" width="320" /);
      expect(p.svg).not.toMatch(/<script|on\w+=/i);
      // Each picture is drawn in its own fabrics: the colourway's first fabric colour appears in it.
      const way = i === 0 ? null : document.colourways![i - 1];
      const colour = way ? Object.values(way.fabrics)[0].colour : document.fabrics[0].colour;
      expect(p.svg.toLowerCase()).toContain(colour.toLowerCase());
      // The layout's own (laid-out) size places one block per cell.
      expect(p.svg.match(/<use href="#qb"/g)?.length).toBe(document.quilt!.columns * document.quilt!.rows);
    }
    expect(new Set(pictures.map((p) => p.svg)).size).toBe(3);

    // Browse pages stay small: the quilt is on the listing's own page only.
    const page = (await buyer.get('/api/shop/listings').query({ q: document.title }).expect(200)).body;
    expect(page.items[0].patternId).toBe(id);
    expect(page.items[0]).not.toHaveProperty('quilt');
  });

  it('shows no quilt for a pattern without a quilt layout', async () => {
    const { listing } = listingAnswerSchema.parse((await buyer.get(`/api/shop/listings/${listedId}`).expect(200)).body);
    expect(listing.quilt).toBeNull();
  });
});

describe('demo shop', () => {
  it('opens a shop and publishes listings once, for the demo seed', async () => {
    const demo = await userClient(t.app, 'fern@shop.test', 'designer');
    const id = (await demo.post('/api/patterns', { document: sampleDocument('Garden Gate') }).expect(201)).body.pattern.id;
    const listing = { patternId: id, priceMinor: 1800, description: 'An 8 in. block in three sections.' };
    await seedDemoShop(t.ctx.data, demo.user!.id, 'usd', [listing]);
    await seedDemoShop(t.ctx.data, demo.user!.id, 'eur', [{ ...listing, priceMinor: 1 }]);
    const seen = (await buyer.get(`/api/shop/listings/${id}`).expect(200)).body.listing;
    expect(seen).toMatchObject({ priceMinor: 1800, currency: 'usd', published: true });
  });
});

describe('without payment keys', () => {
  it('answers 503 for checkout and webhook, and browsing still works', async () => {
    const bare = await startTestServer();
    try {
      const d = await userClient(bare.app, 'd@bare.test', 'designer');
      const q = await userClient(bare.app, 'q@bare.test', 'quilter');
      const id = (await d.post('/api/patterns', { document: sampleDocument('Bare') }).expect(201)).body.pattern.id;
      await d.put('/api/shop/mine', { currency: 'jpy' }).expect(200);
      await d.put(`/api/shop/listings/${id}`, { priceMinor: 1500, description: 'Yen', published: true }).expect(200);
      expect((await q.get('/api/shop/listings')).body.items[0]).toMatchObject({ priceMinor: 1500, currency: 'jpy' });
      expect((await q.post(`/api/shop/listings/${id}/checkout`)).status).toBe(503);
      const hook = await request(bare.app).post('/api/shop/webhook').set('Stripe-Signature', 't=1,v1=00').send('{}');
      expect(hook.status).toBe(503);
      expect(await bare.ctx.data.db.select({ n: countRows() }).from(bare.ctx.data.t.orders)).toEqual([{ n: 0 }]);
    } finally {
      await bare.close();
    }
  });

  it('answers 502 and keeps no order when the provider cannot be reached', async () => {
    const gone = await startFakeStripeServer({ port: 0, webhookSecret: WHSEC, apiKey: SK });
    const deadBase = gone.url;
    await gone.close();
    const cut = await startTestServer({ STRIPE_SECRET_KEY: SK, STRIPE_WEBHOOK_SECRET: WHSEC, STRIPE_API_BASE: deadBase });
    try {
      const d = await userClient(cut.app, 'd@cut.test', 'designer');
      const q = await userClient(cut.app, 'q@cut.test', 'quilter');
      const id = (await d.post('/api/patterns', { document: sampleDocument('Cut off') }).expect(201)).body.pattern.id;
      await d.put('/api/shop/mine', { currency: 'gbp' }).expect(200);
      await d.put(`/api/shop/listings/${id}`, { priceMinor: 800, description: 'Pence', published: true }).expect(200);
      const res = await q.post(`/api/shop/listings/${id}/checkout`);
      expect(res.status).toBe(502);
      expect(res.body.error).toMatch(/nothing was charged/);
      expect(await cut.ctx.data.db.select({ n: countRows() }).from(cut.ctx.data.t.orders)).toEqual([{ n: 0 }]);
    } finally {
      await cut.close();
    }
  });
});
