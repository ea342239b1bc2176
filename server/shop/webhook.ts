import { eq } from 'drizzle-orm';
import express, { type RequestHandler } from 'express';
import type Stripe from 'stripe';
import type { AppContext } from '../app-context';
import type { Data } from '../db/data';
import type { Order } from '../db/schema';
import { HttpError } from '../http/errors';
import { handlePaymentEvent, type EventOutcome } from './payment-events';
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
    // The buyer's mail goes in the outbox in the event's own transaction: one event, one mail.
    const outcome = await handlePaymentEvent(ctx.data, event, (tx, o) => queueMail(ctx, tx, o));
    if (outcome.kind === 'ignored') ctx.log(`webhook ${event.id} (${event.type}) ignored: ${outcome.reason}`);
    // Duplicates are acknowledged (2xx) so the provider stops retrying, but change nothing.
    res.json({ received: true, duplicate: outcome.kind === 'duplicate' });
  };
  return [raw, handle];
}

/**
 * Puts the buyer's receipt (paid) or refund notice (refunded) in the mail outbox, which delivers it
 * with retries after the transaction commits; a mail server that is down never undoes a payment.
 * A paid order's `receiptSentAt` is when its receipt was handed to the outbox.
 */
async function queueMail(ctx: AppContext, tx: Data, outcome: EventOutcome): Promise<EventOutcome> {
  if (outcome.kind !== 'paid' && outcome.kind !== 'refunded') return outcome;
  const { orders, users } = tx.t;
  const order: Order = outcome.order;
  const [buyer] = await tx.db.select().from(users).where(eq(users.id, order.buyerId));
  if (!buyer) return outcome;
  if (outcome.kind === 'refunded') {
    await ctx.mailOutbox.enqueue(tx, 'shop-refund', { to: buyer.email, ...refundMail(order, buyer.displayName) });
    return outcome;
  }
  const [seller] = await tx.db.select().from(users).where(eq(users.id, order.sellerId));
  const link = `${ctx.config.publicUrl}/patterns/${encodeURIComponent(order.patternId ?? '')}`;
  await ctx.mailOutbox.enqueue(tx, 'shop-receipt', {
    to: buyer.email,
    ...receiptMail(order, buyer.displayName, seller?.displayName ?? 'the designer', link),
  });
  const [queued] = await tx.db.update(orders).set({ receiptSentAt: new Date() }).where(eq(orders.id, order.id)).returning();
  return { kind: 'paid', order: queued ?? order };
}
