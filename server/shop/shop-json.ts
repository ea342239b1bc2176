import type { Order, ShopCurrency, ShopListing } from '../db/schema';
import type { Access } from '../services/access';
import type { ListingQuiltPicture, ListingQuiltSize } from './listing-quilt';

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
  /** A small SVG picture of the design, drawn by the server when the listing was saved. */
  preview: string | null;
  /** The viewer's access to the pattern (owner, member, or null: not theirs yet). */
  access: Access | null;
  /** The quilt's size chart and pictures (one listing's page only; null: no quilt layout). */
  quilt?: { sizes: ListingQuiltSize[]; pictures: ListingQuiltPicture[] } | null;
}

/** The quilt part of one listing's page, from the listing's own columns (no document is read). */
export function listingQuiltJson(l: ShopListing): ListingJson['quilt'] {
  return l.quiltSizes && l.quiltPictures ? { sizes: l.quiltSizes, pictures: l.quiltPictures } : null;
}

export function listingJson(
  l: ShopListing,
  extra: { title: string; currency: ShopCurrency; designer: { id: string; displayName: string }; access: Access | null },
): ListingJson {
  return {
    patternId: l.patternId,
    title: extra.title,
    description: l.description,
    priceMinor: l.priceMinor,
    currency: extra.currency,
    designer: extra.designer,
    published: l.publishedAt !== null,
    publishedAt: l.publishedAt ? l.publishedAt.toISOString() : null,
    sectionCount: l.sectionCount,
    finishedSize: l.finishedWidthIn !== null && l.finishedHeightIn !== null ? { widthIn: l.finishedWidthIn, heightIn: l.finishedHeightIn } : null,
    preview: l.previewSvg,
    access: extra.access,
  };
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
