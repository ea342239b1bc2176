import { and, eq, ne } from 'drizzle-orm';
import type Stripe from 'stripe';
import type { Data } from '../db/data';
import type { Order } from '../db/schema';

/** What handling one verified event did. */
export type EventOutcome =
  | { kind: 'duplicate' }
  | { kind: 'ignored'; reason: string }
  | { kind: 'paid'; order: Order }
  | { kind: 'refunded'; order: Order }
  | { kind: 'expired'; order: Order };

/**
 * What else happens with an event's effects, in the same transaction (the receipt or refund mail
 * put in the outbox): it is committed exactly when they are. Awaits only the database.
 */
export type AlongWithEvent = (tx: Data, outcome: EventOutcome) => Promise<EventOutcome>;

const idOf = (v: string | { id: string } | null | undefined): string | null => (typeof v === 'string' ? v : (v?.id ?? null));

/**
 * Acts on one verified provider event, exactly once, also with several instances on one database
 * (the provider retries, and a retry may reach another instance while the first is still at work):
 * the event id is claimed (`INSERT … ON CONFLICT DO NOTHING … RETURNING`) in the same transaction
 * that applies its effects. A second delivery's claim waits on the first's uncommitted row and then
 * finds it taken (PostgreSQL), or runs after it (SQLite's one writer): a duplicate that changes
 * nothing. Should the first roll back, its claim goes with it and the retry acts instead.
 * Each change is also conditional on the order's status, so two different events for one session
 * (completed, then async payment succeeded) still pay it once.
 */
export async function handlePaymentEvent(d: Data, event: Stripe.Event, along?: AlongWithEvent): Promise<EventOutcome> {
  return d.transaction(async (tx) => {
    const { paymentEvents } = tx.t;
    const [fresh] = await tx.db
      .insert(paymentEvents)
      .values({ eventId: event.id, type: event.type, receivedAt: new Date() })
      .onConflictDoNothing()
      .returning({ eventId: paymentEvents.eventId });
    if (!fresh) return { kind: 'duplicate' } as const;
    const outcome = await applyEvent(tx, event);
    return along ? along(tx, outcome) : outcome;
  });
}

function applyEvent(tx: Data, event: Stripe.Event): Promise<EventOutcome> {
  switch (event.type) {
    case 'checkout.session.completed':
    case 'checkout.session.async_payment_succeeded':
      return completeOrder(tx, event.data.object);
    case 'checkout.session.expired':
      return expireOrder(tx, event.data.object);
    case 'charge.refunded':
      return refundOrder(tx, event.data.object);
    default:
      return Promise.resolve({ kind: 'ignored', reason: `event type ${event.type} is not used` });
  }
}

/** The order a session pays for: by session id, else by the order id it carries (if no other session took it). */
async function orderOfSession(tx: Data, session: Stripe.Checkout.Session): Promise<Order | undefined> {
  const { orders } = tx.t;
  const [bySession] = await tx.db.select().from(orders).where(eq(orders.checkoutSessionId, session.id));
  if (bySession || !session.client_reference_id) return bySession;
  const [byRef] = await tx.db.select().from(orders).where(eq(orders.id, session.client_reference_id));
  return byRef && byRef.checkoutSessionId === null ? byRef : undefined;
}

async function completeOrder(tx: Data, session: Stripe.Checkout.Session): Promise<EventOutcome> {
  const { members, orders, patterns } = tx.t;
  const order = await orderOfSession(tx, session);
  if (!order) return { kind: 'ignored', reason: 'no order for this checkout session' };
  if (session.payment_status !== 'paid') return { kind: 'ignored', reason: `payment status is ${session.payment_status}` };
  if (order.status !== 'pending') return { kind: 'ignored', reason: `order is already ${order.status}` };
  if (session.amount_total !== order.amountMinor || session.currency !== order.currency) {
    return { kind: 'ignored', reason: `paid ${session.amount_total} ${session.currency}, order is ${order.amountMinor} ${order.currency}` };
  }
  // Paid only while still pending: another event for this session, applied meanwhile, already paid it.
  const [paid] = await tx.db
    .update(orders)
    .set({ status: 'paid', paidAt: new Date(), checkoutSessionId: session.id, paymentIntentId: idOf(session.payment_intent), grantedAccess: false })
    .where(and(eq(orders.id, order.id), eq(orders.status, 'pending')))
    .returning();
  if (!paid) return { kind: 'ignored', reason: 'order is no longer pending' };
  const [pattern] = paid.patternId ? await tx.db.select().from(patterns).where(eq(patterns.id, paid.patternId)) : [];
  if (!pattern || pattern.ownerId === paid.buyerId) return { kind: 'paid', order: paid };
  // A buyer who is a member already keeps their access as it is.
  const granted = await tx.db
    .insert(members)
    .values({ patternId: pattern.id, userId: paid.buyerId, access: 'quilter', createdAt: new Date() })
    .onConflictDoNothing()
    .returning({ userId: members.userId });
  if (granted.length === 0) return { kind: 'paid', order: paid };
  const [withAccess] = await tx.db.update(orders).set({ grantedAccess: true }).where(eq(orders.id, paid.id)).returning();
  return { kind: 'paid', order: withAccess ?? paid };
}

async function expireOrder(tx: Data, session: Stripe.Checkout.Session): Promise<EventOutcome> {
  const { orders } = tx.t;
  const [expired] = await tx.db
    .update(orders)
    .set({ status: 'expired' })
    .where(and(eq(orders.checkoutSessionId, session.id), eq(orders.status, 'pending')))
    .returning();
  return expired ? { kind: 'expired', order: expired } : { kind: 'ignored', reason: 'no pending order for this session' };
}

async function refundOrder(tx: Data, charge: Stripe.Charge): Promise<EventOutcome> {
  const { members, orders } = tx.t;
  const intent = idOf(charge.payment_intent);
  if (!intent) return { kind: 'ignored', reason: 'charge without a payment intent' };
  if (!charge.refunded) return { kind: 'ignored', reason: 'partial refund' };
  const [order] = await tx.db.select().from(orders).where(and(eq(orders.paymentIntentId, intent), eq(orders.status, 'paid')));
  if (!order) return { kind: 'ignored', reason: 'no paid order for this payment' };
  const refundId = charge.refunds?.data?.[0]?.id ?? order.refundId;
  // Refunded only while still paid: another event for this charge, applied meanwhile, already did it.
  const [refunded] = await tx.db
    .update(orders)
    .set({ status: 'refunded', refundedAt: new Date(), refundId })
    .where(and(eq(orders.id, order.id), eq(orders.status, 'paid')))
    .returning();
  if (!refunded) return { kind: 'ignored', reason: 'order is no longer paid' };
  if (refunded.grantedAccess && refunded.patternId) {
    const [otherPaid] = await tx.db
      .select({ id: orders.id })
      .from(orders)
      .where(and(eq(orders.buyerId, refunded.buyerId), eq(orders.patternId, refunded.patternId), eq(orders.status, 'paid'), ne(orders.id, refunded.id)))
      .limit(1);
    // Only the quilter access this purchase gave is taken back; an owner's later promotion stays.
    if (!otherPaid) {
      await tx.db
        .delete(members)
        .where(and(eq(members.patternId, refunded.patternId), eq(members.userId, refunded.buyerId), eq(members.access, 'quilter')));
    }
  }
  return { kind: 'refunded', order: refunded };
}
