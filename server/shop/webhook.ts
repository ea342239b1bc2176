import { eq } from 'drizzle-orm';
import express, { type RequestHandler } from 'express';
import type Stripe from 'stripe';
import type { AppContext } from '../app-context';
import { orders, users, type Order } from '../db/schema';
import { HttpError } from '../http/errors';
import { handlePaymentEvent } from './payment-events';
import { requirePayments, type Payments } from './payments';
import { receiptMail, refundMail } from './receipt-mail';

/** Largest webhook body taken (events are a few kB). */
const WEBHOOK_BODY_LIMIT = '256kb';

/**
 * `POST /api/shop/webhook`: the provider's signed events. Mounted ahead of the JSON parser and the
 * CSRF check: the signature is over the raw bytes (verified by the SDK's `webhooks.constructEvent`,
 * which also refuses timestamps older than its tolerance), and the signature is the proof of origin.
 */
export function webhookHandlers(ctx: AppContext, payments: Payments | null): RequestHandler[] {
  const raw = express.raw({ type: () => true, limit: WEBHOOK_BODY_LIMIT });
  const handle: RequestHandler = async (req, res) => {
    const { stripe, webhookSecret } = requirePayments(payments);
    const signature = req.headers['stripe-signature'];
    if (typeof signature !== 'string' || signature.length === 0) throw new HttpError(400, 'Missing Stripe-Signature header');
    if (!Buffer.isBuffer(req.body) || req.body.length === 0) throw new HttpError(400, 'Empty webhook body');
    let event: Stripe.Event;
    try {
      event = stripe.webhooks.constructEvent(req.body, signature, webhookSecret);
    } catch (err) {
      ctx.log('webhook refused: signature verification failed', (err as Error).message);
      throw new HttpError(400, 'Webhook signature verification failed');
    }
    const outcome = handlePaymentEvent(ctx.db, event);
    if (outcome.kind === 'ignored') ctx.log(`webhook ${event.id} (${event.type}) ignored: ${outcome.reason}`);
    if (outcome.kind === 'paid') await sendReceipt(ctx, outcome.order);
    if (outcome.kind === 'refunded') await sendRefundNotice(ctx, outcome.order);
    // Duplicates are acknowledged (2xx) so the provider stops retrying, but change nothing.
    res.json({ received: true, duplicate: outcome.kind === 'duplicate' });
  };
  return [raw, handle];
}

/** E-mails the buyer's receipt; a mail failure is logged and never undoes the payment. */
async function sendReceipt(ctx: AppContext, order: Order): Promise<void> {
  const buyer = ctx.db.select().from(users).where(eq(users.id, order.buyerId)).get();
  const seller = ctx.db.select().from(users).where(eq(users.id, order.sellerId)).get();
  if (!buyer) return;
  const link = `${ctx.config.publicUrl}/patterns/${encodeURIComponent(order.patternId ?? '')}`;
  try {
    await ctx.mailer.send({ to: buyer.email, ...receiptMail(order, buyer.displayName, seller?.displayName ?? 'the designer', link) });
    ctx.db.update(orders).set({ receiptSentAt: new Date() }).where(eq(orders.id, order.id)).run();
  } catch (err) {
    ctx.log(`receipt mail for order ${order.id} failed`, err);
  }
}

/** E-mails the buyer that the refund went through; failures are logged. */
async function sendRefundNotice(ctx: AppContext, order: Order): Promise<void> {
  const buyer = ctx.db.select().from(users).where(eq(users.id, order.buyerId)).get();
  if (!buyer) return;
  try {
    await ctx.mailer.send({ to: buyer.email, ...refundMail(order, buyer.displayName) });
  } catch (err) {
    ctx.log(`refund mail for order ${order.id} failed`, err);
  }
}
