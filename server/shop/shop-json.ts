import type { Order, ShopCurrency, ShopListing } from '../db/schema';
import type { Access } from '../services/access';

/** A listing as buyers see it. */
export interface ListingJson {
  patternId: string;
  title: string;
  description: string;
  priceMinor: number;
  currency: ShopCurrency;
  designer: { id: string; displayName: string };
  published: boolean;
  publishedAt: string | null;
  sectionCount: number;
  finishedSize: { widthIn: number; heightIn: number } | null;
  /** The viewer's access to the pattern (owner, member, or null: not theirs yet). */
  access: Access | null;
}

export function listingJson(
  l: ShopListing,
  extra: { title: string; currency: ShopCurrency; designer: { id: string; displayName: string }; document: string | null; access: Access | null },
): ListingJson {
  const facts = documentFacts(extra.document);
  return {
    patternId: l.patternId,
    title: extra.title,
    description: l.description,
    priceMinor: l.priceMinor,
    currency: extra.currency,
    designer: extra.designer,
    published: l.publishedAt !== null,
    publishedAt: l.publishedAt ? l.publishedAt.toISOString() : null,
    ...facts,
    access: extra.access,
  };
}

/** What a buyer may know of a design before paying: how many sections and how big it finishes. */
function documentFacts(document: string | null): Pick<ListingJson, 'sectionCount' | 'finishedSize'> {
  if (!document) return { sectionCount: 0, finishedSize: null };
  try {
    const d = JSON.parse(document) as { sections?: unknown[]; canvas?: { widthIn?: unknown; heightIn?: unknown } };
    const w = d.canvas?.widthIn;
    const h = d.canvas?.heightIn;
    return {
      sectionCount: Array.isArray(d.sections) ? d.sections.length : 0,
      finishedSize: typeof w === 'number' && typeof h === 'number' ? { widthIn: w, heightIn: h } : null,
    };
  } catch {
    return { sectionCount: 0, finishedSize: null };
  }
}

/** An order as its buyer or seller sees it. */
export function orderJson(o: Order, people: { buyer?: { id: string; displayName: string; email: string }; seller?: { id: string; displayName: string } } = {}) {
  return {
    id: o.id,
    patternId: o.patternId,
    patternTitle: o.patternTitle,
    amountMinor: o.amountMinor,
    currency: o.currency,
    status: o.status,
    refundRequested: o.refundRequestedAt !== null,
    createdAt: o.createdAt.toISOString(),
    paidAt: o.paidAt ? o.paidAt.toISOString() : null,
    refundedAt: o.refundedAt ? o.refundedAt.toISOString() : null,
    receiptSent: o.receiptSentAt !== null,
    ...(people.buyer ? { buyer: people.buyer } : {}),
    ...(people.seller ? { seller: people.seller } : {}),
  };
}
