/**
 * One payment event, delivered at the same moment to two app servers that share one PostgreSQL (the
 * provider retries, and behind a load balancer a retry may reach the other instance while the first
 * is still at work): it is acted on exactly once (issue 18, docs/postgresql.md). The two servers run
 * in this process, each with its own connection pool and its own mail outbox sender, on one database
 * in a throwaway cluster. (One server receiving an event several times at once: server/shop/shop.spec.ts.)
 */
import { eq, sql, type SQL } from 'drizzle-orm';
import request from 'supertest';
import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startFakeStripeServer, type FakeStripeServer } from '../../server/dev/fake-stripe-server';
import { Client, sampleDocument, startTestServer, userClient, type TestServer } from '../../server/test/harness';
import { startPgCluster, type PgCluster } from '../support/pg-cluster';

const SK = 'sk_test_two_instances';
const WHSEC = 'whsec_two_instances';

let fake: FakeStripeServer;
let cluster: PgCluster | undefined;
let a: TestServer;
let b: TestServer;
let designer: Client;
let patternId: string;

beforeAll(async () => {
  fake = await startFakeStripeServer({ port: 0, webhookSecret: WHSEC, apiKey: SK, retries: 0 });
  cluster = await startPgCluster({ database: 'shop_two_instances' });
  const env = { STRIPE_SECRET_KEY: SK, STRIPE_WEBHOOK_SECRET: WHSEC, STRIPE_API_BASE: fake.url, DATABASE_URL: cluster.url };
  // One after the other: the first migrates the empty database, the second finds it migrated.
  a = await startTestServer(env);
  b = await startTestServer(env);
  designer = await userClient(a.app, 'dina@two.test', 'designer');
  patternId = (await designer.post('/api/patterns', { document: sampleDocument('Twin Stars') }).expect(201)).body.pattern.id;
  await designer.put('/api/shop/mine', { currency: 'usd' }).expect(200);
  await designer.put(`/api/shop/listings/${patternId}`, { priceMinor: 1100, description: 'Two instances.', published: true }).expect(200);
});

afterAll(async () => {
  await a?.close();
  await b?.close();
  await fake?.close();
  await cluster?.stop();
});

/** `SELECT count(*) AS n …` on the shared database (PostgreSQL answers a bigint as text). */
const count = async (query: SQL) => Number((await a.ctx.data.rows<{ n: unknown }>(query))[0]!.n);

async function until<T>(probe: () => T | undefined, what: string, ms = 10_000): Promise<T> {
  const end = Date.now() + ms;
  for (;;) {
    const v = probe();
    if (v !== undefined) return v;
    if (Date.now() > end) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

const mailsTo = (email: string) => [...a.mail.messages, ...b.mail.messages].filter((m) => m.to.includes(email));

describe('one payment event at two instances sharing one database', () => {
  it('grants access once, pays the order once and sends one receipt, whichever instance wins', async () => {
    // Several buyers, one event each, so the two deliveries overlap more than once.
    for (let i = 1; i <= 4; i++) {
      const email = `buyer${i}@two.test`;
      const buyer = await userClient(i % 2 ? a.app : b.app, email, 'quilter');
      const checkout = await buyer.post(`/api/shop/listings/${patternId}/checkout`).expect(201);
      const orderId = checkout.body.order.id as string;
      const session = fake.sessions.get(checkout.body.checkoutUrl.split('/').pop())!;
      const payload = JSON.stringify({
        id: `evt_two_${i}`,
        object: 'event',
        type: 'checkout.session.completed',
        data: { object: { ...session, status: 'complete', payment_status: 'paid', payment_intent: `pi_two_${i}` } },
      });
      const signature = new Stripe(SK).webhooks.generateTestHeaderString({ payload, secret: WHSEC });
      const deliver = (to: TestServer) =>
        request(to.app).post('/api/shop/webhook').set('Content-Type', 'application/json; charset=utf-8').set('Stripe-Signature', signature).send(payload);

      const answers = await Promise.all([deliver(a), deliver(b)]);

      expect(answers.map((r) => r.status)).toEqual([200, 200]);
      expect(answers.map((r) => r.body.duplicate).sort()).toEqual([false, true]);
      const userId = buyer.user!.id;
      expect(await count(sql`SELECT count(*) AS n FROM payment_events WHERE event_id = ${`evt_two_${i}`}`)).toBe(1);
      expect(await count(sql`SELECT count(*) AS n FROM members WHERE user_id = ${userId} AND pattern_id = ${patternId}`)).toBe(1);
      const { orders } = a.ctx.data.t;
      const [order] = await a.ctx.data.db.select().from(orders).where(eq(orders.id, orderId));
      expect(order).toMatchObject({ status: 'paid', grantedAccess: true, paymentIntentId: `pi_two_${i}` });
      expect(order!.receiptSentAt).not.toBeNull();
      // Both instances give the buyer the access the purchase granted.
      for (const who of [a, b]) {
        const there = await Client.create(who.app);
        expect((await there.signIn(email)).status).toBe(200);
        expect((await there.get(`/api/patterns/${patternId}`).expect(200)).body.pattern.access).toBe('quilter');
      }
      // One receipt in the shared outbox, delivered once by whichever sender took it.
      expect(await count(sql`SELECT count(*) AS n FROM mail_outbox WHERE to_address = ${email}`)).toBe(1);
      await until(() => mailsTo(email)[0], `the receipt to ${email}`);
      await Promise.all([a.ctx.mailOutbox.drain(), b.ctx.mailOutbox.drain()]);
      expect(mailsTo(email).map((m) => m.subject)).toEqual(['Your receipt for "Twin Stars"']);
    }
    // Every paid order counted once in the designer's sales.
    const sales = (await designer.get('/api/shop/sales').expect(200)).body;
    expect(sales.totals).toEqual([{ currency: 'usd', orders: 4, amountMinor: 4400 }]);
  });
});

describe('one buyer checking out on two instances at the same moment', () => {
  it('makes one order and one provider session, offered by both', async () => {
    const email = 'twice@two.test';
    const onA = await userClient(a.app, email, 'quilter');
    const onB = await Client.create(b.app);
    expect((await onB.signIn(email)).status).toBe(200);
    const sessionsBefore = fake.sessions.size;
    const answers = await Promise.all([onA, onB, onA, onB].map((c) => c.post(`/api/shop/listings/${patternId}/checkout`)));
    expect(answers.map((r) => r.status).sort()).toEqual([200, 200, 200, 201]);
    expect(new Set(answers.map((r) => r.body.order.id)).size).toBe(1);
    expect(new Set(answers.map((r) => r.body.checkoutUrl)).size).toBe(1);
    expect(fake.sessions.size).toBe(sessionsBefore + 1);
    expect(await count(sql`SELECT count(*) AS n FROM orders WHERE buyer_id = ${onA.user!.id}`)).toBe(1);
  });
});
