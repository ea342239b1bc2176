import { and, eq } from 'drizzle-orm';
import { finishedBlockSize, parsePatternDocument } from '@seamwright/piecing';
import type { DbLike } from '../db/database';
import { patterns, revisions, shopListings, shops, users, type ShopListing } from '../db/schema';
import { patternPreviewSvg } from '../services/pattern-preview';
import { listingQuiltFacts } from './listing-quilt';

/** Width of a shop listing's picture in pixels (a 160 px card picture at twice the density). */
export const LISTING_PREVIEW_WIDTH_PX = 320;

/**
 * Listings joined with their pattern, shop currency and designer name. What the page shows of the
 * design is in the listing's own columns ({@link listingFacts}): no document is read on a view.
 */
export function listingRows(db: DbLike) {
  return db
    .select({ listing: shopListings, pattern: patterns, currency: shops.currency, designerName: users.displayName })
    .from(shopListings)
    .innerJoin(patterns, eq(patterns.id, shopListings.patternId))
    .innerJoin(shops, eq(shops.ownerId, patterns.ownerId))
    .innerJoin(users, eq(users.id, patterns.ownerId));
}

/** The listing of a pattern with what a page about it needs; undefined when there is none. */
export function findListing(db: DbLike, patternId: string) {
  return listingRows(db).where(eq(shopListings.patternId, patternId)).get();
}

/** A listing any signed-in user may see: published, of a pattern not in the trash. */
export function findPublishedListing(db: DbLike, patternId: string) {
  const found = findListing(db, patternId);
  return found && found.listing.publishedAt && !found.pattern.trashedAt ? found : undefined;
}

/** The listing columns that describe the design. */
export type ListingFacts = Pick<
  ShopListing,
  'sectionCount' | 'finishedWidthIn' | 'finishedHeightIn' | 'previewSvg' | 'quiltSizes' | 'quiltPictures'
>;

/**
 * What a buyer may know of a design before paying, from the pattern's head revision: how many
 * sections, how big the block finishes (the sections' extent, not the drawing area), a picture and,
 * for a pattern with a quilt layout, its size chart and a quilt picture per colourway.
 * Worked out when the listing is saved and stored with it, so browsing never parses documents.
 */
export function listingFacts(db: DbLike, pattern: { id: string; headRevision: number }): ListingFacts {
  const stored = db
    .select({ document: revisions.document })
    .from(revisions)
    .where(and(eq(revisions.patternId, pattern.id), eq(revisions.number, pattern.headRevision)))
    .get();
  const parsed = stored ? parsePatternDocument(JSON.parse(stored.document) as unknown) : null;
  if (!parsed?.ok) {
    return { sectionCount: 0, finishedWidthIn: null, finishedHeightIn: null, previewSvg: null, quiltSizes: null, quiltPictures: null };
  }
  const document = parsed.document;
  const size = finishedBlockSize(document);
  let previewSvg: string | null = null;
  try {
    previewSvg = patternPreviewSvg(document, LISTING_PREVIEW_WIDTH_PX);
  } catch {
    // A picture is never worth refusing a listing for; the card shows without one.
  }
  const round = (v: number) => Math.round(v * 1000) / 1000;
  return {
    sectionCount: document.sections.length,
    finishedWidthIn: size ? round(size.widthIn) : null,
    finishedHeightIn: size ? round(size.heightIn) : null,
    previewSvg,
    ...listingQuiltFacts(document),
  };
}
