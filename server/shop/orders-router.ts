import { and, count, desc, eq, inArray, isNotNull, or, sql } from 'drizzle-orm';
import express, { type Router } from 'express';
import { pageQuerySchema } from '@seamwright/api';
import type { AppContext } from '../app-context';
import { currentUser, requireUser } from '../auth/sessions';
import type { Data } from '../db/data';
import { newId } from '../auth/tokens';
import { HttpError } from '../http/errors';
import { idSchema, parseOr400 } from '../http/validate';
import { accessOf, canDesign } from '../services/access';
import { CheckoutLock } from './checkout-lock';
import { findPublishedListing } from './listings';
import { requirePayments, type Payments } from './payments';
import { orderJson } from './shop-json';

const orderNotFound = () => new HttpError(404, 'Order not found');

/** `/api/shop` buying and selling: checkout, the buyer's purchases, the designer's sales and refunds. */
export function ordersRouter(ctx: AppContext, payments: Payments | null): Router {
  const { config } = ctx;
  const d = ctx.data;
  const { orders, users } = d.t;
  const checkoutLock = new CheckoutLock(d);
  const router = express.Router();
  router.use(requireUser);

  router.post('/listings/:patternId/checkout', async (req, res) => {
    const user = currentUser(req);
    const id = idSchema.safeParse(req.params.patternId);
    const found = id.success ? await findPublishedListing(d, id.data) : undefined;
    if (!found) throw new HttpError(404, 'Listing not found');
    const access = await accessOf(d, user, found.pattern);
    if (access === 'owner') throw new HttpError(409, 'This is your own pattern');
    if (access) throw new HttpError(409, 'You have this pattern already', { access });
    const { stripe } = requirePayments(payments);
    // One checkout at a time per buyer and pattern, across instances too (checkout-lock.ts).
    const answer = await checkoutLock.run(user.id, found.pattern.id, async (db) => {
      // A checkout still open for this buyer and pattern is offered again, so one purchase is never paid twice.
      const open = await openCheckout(db, stripe, user.id, found.pattern.id);
      if (open) return { status: 200, body: { order: orderJson(open.order), checkoutUrl: open.url } };
      const [order] = await db.db
        .insert(orders)
        .values({
          id: newId(),
          buyerId: user.id,
          sellerId: found.pattern.ownerId,
          patternId: found.pattern.id,
          patternTitle: found.pattern.title,
          amountMinor: found.listing.priceMinor,
          currency: found.currency,
          status: 'pending',
          createdAt: new Date(),
        })
        .returning();
      if (!order) throw new HttpError(500, 'Order was not stored');
      const pattern = encodeURIComponent(found.pattern.id);
      let session;
      try {
        session = await stripe.checkout.sessions.create(
          {
            mode: 'payment',
            line_items: [
              {
                quantity: 1,
                price_data: {
                  currency: found.currency,
                  unit_amount: found.listing.priceMinor,
                  product_data: { name: found.pattern.title, description: `FPP pattern by ${found.designerName}` },
                },
              },
            ],
            customer_email: user.email,
            client_reference_id: order.id,
            metadata: { orderId: order.id, patternId: found.pattern.id, buyerId: user.id },
            success_url: `${config.publicUrl}/shop/purchases?order=${encodeURIComponent(order.id)}&session_id={CHECKOUT_SESSION_ID}`,
            cancel_url: `${config.publicUrl}/shop/patterns/${pattern}?cancelled=1`,
          },
          { idempotencyKey: `checkout-${order.id}` },
        );
      } catch (err) {
        ctx.log(`checkout session for order ${order.id} failed`, err);
        await db.db.delete(orders).where(eq(orders.id, order.id));
        throw new HttpError(502, 'The payment provider could not be reached; nothing was charged, try again');
      }
      if (!session.url) throw new HttpError(502, 'The payment provider gave no checkout page');
      const [stored] = await db.db.update(orders).set({ checkoutSessionId: session.id }).where(eq(orders.id, order.id)).returning();
      if (!stored) throw orderNotFound();
      return { status: 201, body: { order: orderJson(stored), checkoutUrl: session.url } };
    });
    res.status(answer.status).json(answer.body);
  });

  /** The buyer's newest pending order for the pattern whose checkout session is still open at the provider. */
  async function openCheckout(db: Data, stripe: Payments['stripe'], buyerId: string, patternId: string) {
    const [pending] = await db.db
      .select()
      .from(orders)
      .where(and(eq(orders.buyerId, buyerId), eq(orders.patternId, patternId), eq(orders.status, 'pending'), isNotNull(orders.checkoutSessionId)))
      .orderBy(desc(orders.createdAt))
      .limit(1);
    if (!pending?.checkoutSessionId) return undefined;
    try {
      const session = await stripe.checkout.sessions.retrieve(pending.checkoutSessionId);
      return session.status === 'open' && session.url ? { order: pending, url: session.url } : undefined;
    } catch (err) {
      ctx.log(`checkout session ${pending.checkoutSessionId} could not be read`, err);
      return undefined;
    }
  }

  router.get('/purchases', async (req, res) => {
    const user = currentUser(req);
    const q = parseOr400(pageQuerySchema, req.query, 'Invalid query');
    const mine = and(eq(orders.buyerId, user.id), inArray(orders.status, ['pending', 'paid', 'refunded']));
    const total = (await d.db.select({ n: count() }).from(orders).where(mine))[0]?.n ?? 0;
    const rows = await d.db
      .select({ order: orders, sellerName: users.displayName })
      .from(orders)
      .innerJoin(users, eq(users.id, orders.sellerId))
      .where(mine)
      .orderBy(desc(orders.createdAt), desc(orders.id))
      .limit(q.pageSize)
      .offset((q.page - 1) * q.pageSize);
    res.json({
      items: rows.map((r) => orderJson(r.order, { seller: { id: r.order.sellerId, displayName: r.sellerName } })),
      total,
      page: q.page,
      pageSize: q.pageSize,
    });
  });

  router.get('/sales', async (req, res) => {
    const user = currentUser(req);
    if (!canDesign(user)) throw new HttpError(403, 'Only designers have sales');
    const q = parseOr400(pageQuerySchema, req.query, 'Invalid query');
    const mine = and(eq(orders.sellerId, user.id), inArray(orders.status, ['paid', 'refunded']));
    const total = (await d.db.select({ n: count() }).from(orders).where(mine))[0]?.n ?? 0;
    const rows = await d.db
      .select({ order: orders, buyerName: users.displayName, buyerEmail: users.email })
      .from(orders)
      .innerJoin(users, eq(users.id, orders.buyerId))
      .where(mine)
      .orderBy(desc(orders.paidAt), desc(orders.id))
      .limit(q.pageSize)
      .offset((q.page - 1) * q.pageSize);
    const totals = await d.db
      .select({ currency: orders.currency, orders: count(), amountMinor: sql<number>`sum(${orders.amountMinor})` })
      .from(orders)
      .where(and(eq(orders.sellerId, user.id), eq(orders.status, 'paid')))
      .groupBy(orders.currency);
    res.json({
      items: rows.map((r) => orderJson(r.order, { buyer: { id: r.order.buyerId, displayName: r.buyerName, email: r.buyerEmail } })),
      total,
      page: q.page,
      pageSize: q.pageSize,
      totals: totals.map((t) => ({ currency: t.currency, orders: t.orders, amountMinor: Number(t.amountMinor) })),
    });
  });

  router.get('/orders/:orderId', async (req, res) => {
    const user = currentUser(req);
    const id = idSchema.safeParse(req.params.orderId);
    const [order] = id.success
      ? await d.db
          .select()
          .from(orders)
          .where(and(eq(orders.id, id.data), or(eq(orders.buyerId, user.id), eq(orders.sellerId, user.id))))
      : [];
    if (!order) throw orderNotFound();
    res.json({ order: orderJson(order) });
  });

  router.post('/sales/:orderId/refund', async (req, res) => {
    const user = currentUser(req);
    const id = idSchema.safeParse(req.params.orderId);
    const [order] = id.success ? await d.db.select().from(orders).where(and(eq(orders.id, id.data), eq(orders.sellerId, user.id))) : [];
    if (!order) throw orderNotFound();
    if (order.status !== 'paid') throw new HttpError(409, `Only paid orders can be refunded; this one is ${order.status}`);
    if (order.refundRequestedAt) throw new HttpError(409, 'A refund was asked for already');
    if (!order.paymentIntentId) throw new HttpError(409, 'This order has no payment to refund');
    const { stripe } = requirePayments(payments);
    let refund;
    try {
      refund = await stripe.refunds.create(
        { payment_intent: order.paymentIntentId, metadata: { orderId: order.id } },
        { idempotencyKey: `refund-${order.id}` },
      );
    } catch (err) {
      ctx.log(`refund for order ${order.id} failed`, err);
      throw new HttpError(502, 'The payment provider did not take the refund; nothing changed, try again');
    }
    // Access is taken back when the provider confirms the refund (charge.refunded webhook).
    const [stored] = await d.db
      .update(orders)
      .set({ refundRequestedAt: new Date(), refundId: refund.id })
      .where(eq(orders.id, order.id))
      .returning();
    if (!stored) throw orderNotFound();
    res.status(202).json({ order: orderJson(stored) });
  });

  return router;
}
