import { and, eq, ne } from 'drizzle-orm';
import type Stripe from 'stripe';
import type { Db, Tx } from '../db/database';
import { members, orders, paymentEvents, patterns, type Order } from '../db/schema';

/** What handling one verified event did. */
export type EventOutcome =
  | { kind: 'duplicate' }
  | { kind: 'ignored'; reason: string }
  | { kind: 'paid'; order: Order }
  | { kind: 'refunded'; order: Order }
  | { kind: 'expired'; order: Order };

const idOf = (v: string | { id: string } | null | undefined): string | null => (typeof v === 'string' ? v : (v?.id ?? null));

/**
 * Acts on one verified provider event, exactly once: the event id is recorded in the same
 * transaction as its effects, so a replay (or the provider's own retry) changes nothing.
 */
export function handlePaymentEvent(db: Db, event: Stripe.Event): EventOutcome {
  return db.transaction(
    (tx) => {
      const fresh = tx
        .insert(paymentEvents)
        .values({ eventId: event.id, type: event.type, receivedAt: new Date() })
        .onConflictDoNothing()
        .returning()
        .get();
      if (!fresh) return { kind: 'duplicate' } as const;
      switch (event.type) {
        case 'checkout.session.completed':
        case 'checkout.session.async_payment_succeeded':
          return completeOrder(tx, event.data.object);
        case 'checkout.session.expired':
          return expireOrder(tx, event.data.object);
        case 'charge.refunded':
          return refundOrder(tx, event.data.object);
        default:
          return { kind: 'ignored', reason: `event type ${event.type} is not used` } as const;
      }
    },
    { behavior: 'immediate' },
  );
}

/** The order a session pays for: by session id, else by the order id it carries (if no other session took it). */
function orderOfSession(tx: Tx, session: Stripe.Checkout.Session): Order | undefined {
  const bySession = tx.select().from(orders).where(eq(orders.checkoutSessionId, session.id)).get();
  if (bySession || !session.client_reference_id) return bySession;
  const byRef = tx.select().from(orders).where(eq(orders.id, session.client_reference_id)).get();
  return byRef && byRef.checkoutSessionId === null ? byRef : undefined;
}

function completeOrder(tx: Tx, session: Stripe.Checkout.Session): EventOutcome {
  const order = orderOfSession(tx, session);
  if (!order) return { kind: 'ignored', reason: 'no order for this checkout session' };
  if (session.payment_status !== 'paid') return { kind: 'ignored', reason: `payment status is ${session.payment_status}` };
  if (order.status !== 'pending') return { kind: 'ignored', reason: `order is already ${order.status}` };
  if (session.amount_total !== order.amountMinor || session.currency !== order.currency) {
    return { kind: 'ignored', reason: `paid ${session.amount_total} ${session.currency}, order is ${order.amountMinor} ${order.currency}` };
  }
  let granted = false;
  const pattern = order.patternId ? tx.select().from(patterns).where(eq(patterns.id, order.patternId)).get() : undefined;
  if (pattern && pattern.ownerId !== order.buyerId) {
    // A buyer who is a member already keeps their access as it is.
    granted = !!tx
      .insert(members)
      .values({ patternId: pattern.id, userId: order.buyerId, access: 'quilter', createdAt: new Date() })
      .onConflictDoNothing()
      .returning()
      .get();
  }
  const paid = tx
    .update(orders)
    .set({ status: 'paid', paidAt: new Date(), checkoutSessionId: session.id, paymentIntentId: idOf(session.payment_intent), grantedAccess: granted })
    .where(eq(orders.id, order.id))
    .returning()
    .get();
  return { kind: 'paid', order: paid };
}

function expireOrder(tx: Tx, session: Stripe.Checkout.Session): EventOutcome {
  const expired = tx
    .update(orders)
    .set({ status: 'expired' })
    .where(and(eq(orders.checkoutSessionId, session.id), eq(orders.status, 'pending')))
    .returning()
    .get();
  return expired ? { kind: 'expired', order: expired } : { kind: 'ignored', reason: 'no pending order for this session' };
}

function refundOrder(tx: Tx, charge: Stripe.Charge): EventOutcome {
  const intent = idOf(charge.payment_intent);
  if (!intent) return { kind: 'ignored', reason: 'charge without a payment intent' };
  if (!charge.refunded) return { kind: 'ignored', reason: 'partial refund' };
  const order = tx.select().from(orders).where(and(eq(orders.paymentIntentId, intent), eq(orders.status, 'paid'))).get();
  if (!order) return { kind: 'ignored', reason: 'no paid order for this payment' };
  const refundId = charge.refunds?.data?.[0]?.id ?? order.refundId;
  const refunded = tx
    .update(orders)
    .set({ status: 'refunded', refundedAt: new Date(), refundId })
    .where(eq(orders.id, order.id))
    .returning()
    .get();
  if (order.grantedAccess && order.patternId) {
    const otherPaid = tx
      .select({ id: orders.id })
      .from(orders)
      .where(and(eq(orders.buyerId, order.buyerId), eq(orders.patternId, order.patternId), eq(orders.status, 'paid'), ne(orders.id, order.id)))
      .get();
    // Only the quilter access this purchase gave is taken back; an owner's later promotion stays.
    if (!otherPaid) {
      tx.delete(members)
        .where(and(eq(members.patternId, order.patternId), eq(members.userId, order.buyerId), eq(members.access, 'quilter')))
        .run();
    }
  }
  return { kind: 'refunded', order: refunded };
}
