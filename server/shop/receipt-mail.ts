import { formatMoney } from '@seamwright/api';
import type { Order } from '../db/schema';

const escapeHtml = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] ?? c);

/** The buyer's receipt for a paid order, as plain text with a simple HTML twin. */
export function receiptMail(order: Order, buyerName: string, designerName: string, link: string) {
  const amount = formatMoney(order.amountMinor, order.currency);
  const paid = (order.paidAt ?? new Date()).toISOString().slice(0, 10);
  const lines = [
    `Hello ${buyerName},`,
    `thank you for buying "${order.patternTitle}" by ${designerName} on Seamwright.`,
    `Amount paid: ${amount} (${order.currency.toUpperCase()})`,
    `Order: ${order.id}`,
    `Paid on: ${paid}`,
    'You now have quilter access to the pattern: print sets, the scale check and your sewing log. Print at 100 % (actual size) and measure the test square before cutting any fabric.',
    'Seamwright does not calculate or collect taxes on this sale.',
  ];
  return {
    subject: `Your receipt for "${order.patternTitle}"`,
    text: `${lines.join('\n\n')}\n\nOpen the pattern: ${link}\n`,
    html:
      '<!doctype html><html><body style="font-family:sans-serif">' +
      lines.map((l) => `<p>${escapeHtml(l)}</p>`).join('') +
      `<p><a href="${escapeHtml(link)}">Open the pattern</a></p></body></html>`,
  };
}

/** Tells the buyer a purchase was refunded and the access it gave has ended. */
export function refundMail(order: Order, buyerName: string) {
  const amount = formatMoney(order.amountMinor, order.currency);
  const lines = [
    `Hello ${buyerName},`,
    `your purchase of "${order.patternTitle}" (order ${order.id}) was refunded: ${amount} goes back to you through the payment provider.`,
    'The quilter access that came with the purchase has ended. Print sets you downloaded stay on your computer.',
  ];
  return {
    subject: `Refund for "${order.patternTitle}"`,
    text: `${lines.join('\n\n')}\n`,
    html: '<!doctype html><html><body style="font-family:sans-serif">' + lines.map((l) => `<p>${escapeHtml(l)}</p>`).join('') + '</body></html>',
  };
}
