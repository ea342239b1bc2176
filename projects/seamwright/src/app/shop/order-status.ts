import type { Order } from './shop-types';

/** Words for an order's state, as the buyer and the designer read them. */
export function orderStatusLabel(o: Pick<Order, 'status' | 'refundRequested'>): string {
  if (o.status === 'paid' && o.refundRequested) return 'Refund in progress';
  return { pending: 'Checkout not finished', paid: 'Paid', refunded: 'Refunded', expired: 'Checkout expired' }[o.status];
}
