import { and, asc, eq, gt, isNull, like } from 'drizzle-orm';
import { finishedBlockSize, parsePatternDocument } from '@seamwright/piecing';
import type { Data } from '../db/data';
import type { ShopListing } from '../db/schema';
import { patternPreviewSvg } from '../services/pattern-preview';
import { listingQuiltFacts } from './listing-quilt';

/** Width of a shop listing's picture in pixels (a 160 px card picture at twice the density). */
export const LISTING_PREVIEW_WIDTH_PX = 320;

/**
 * Listings joined with their pattern, shop currency and designer name. What the page shows of the
 * design is in the listing's own columns ({@link listingFacts}): no document is read on a view.
 */
export function listingRows(d: Data) {
  const { patterns, shopListings, shops, users } = d.t;
  return d.db
    .select({ listing: shopListings, pattern: patterns, currency: shops.currency, designerName: users.displayName })
    .from(shopListings)
    .innerJoin(patterns, eq(patterns.id, shopListings.patternId))
    .innerJoin(shops, eq(shops.ownerId, patterns.ownerId))
    .innerJoin(users, eq(users.id, patterns.ownerId));
}

/** The listing of a pattern with what a page about it needs; undefined when there is none. */
export async function findListing(d: Data, patternId: string) {
  return (await listingRows(d).where(eq(d.t.shopListings.patternId, patternId)))[0];
}

/** A listing any signed-in user may see: published, of a pattern not in the trash. */
export async function findPublishedListing(d: Data, patternId: string) {
  const found = await findListing(d, patternId);
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
export async function listingFacts(d: Data, pattern: { id: string; headRevision: number }): Promise<ListingFacts> {
  const { revisions } = d.t;
  const [stored] = await d.db
    .select({ document: revisions.document })
    .from(revisions)
    .where(and(eq(revisions.patternId, pattern.id), eq(revisions.number, pattern.headRevision)));
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

/**
 * Listings saved before their quilt columns existed (migration 0008) show no quilt until saved again. This
 * fills them: every listing whose quilt columns are both empty while its pattern's head revision (what a
 * listing shows, see {@link listingFacts}) has a quilt layout gets its size chart and pictures worked out and
 * stored. One batch of at most `limit` listings after `after` (by pattern id); answers how many were filled
 * and where the next batch starts (null: done). Listings without a quilt are passed over by a text match on the
 * stored document, so they cost no parse.
 */
export async function fillListingQuiltBatch(d: Data, after: string | null, limit = 20): Promise<{ filled: number; next: string | null }> {
  const { patterns, revisions, shopListings } = d.t;
  const rows = await d.db
    .select({ patternId: shopListings.patternId, document: revisions.document })
    .from(shopListings)
    .innerJoin(patterns, eq(patterns.id, shopListings.patternId))
    .innerJoin(revisions, and(eq(revisions.patternId, patterns.id), eq(revisions.number, patterns.headRevision)))
    .where(
      and(
        isNull(shopListings.quiltSizes),
        isNull(shopListings.quiltPictures),
        like(revisions.document, '%"quilt"%'),
        after === null ? undefined : gt(shopListings.patternId, after),
      ),
    )
    .orderBy(asc(shopListings.patternId))
    .limit(limit);
  let filled = 0;
  for (const row of rows) {
    let parsed: ReturnType<typeof parsePatternDocument> | null = null;
    try {
      parsed = parsePatternDocument(JSON.parse(row.document) as unknown);
    } catch {
      // A revision that does not read is left as it is; saving the listing reports it.
    }
    if (!parsed?.ok || !parsed.document.quilt) continue;
    const facts = listingQuiltFacts(parsed.document);
    if (!facts.quiltSizes && !facts.quiltPictures) continue;
    // Only while still empty: a listing saved meanwhile (or filled by another instance sharing the
    // database) already holds its own facts.
    filled += (
      await d.db
        .update(shopListings)
        .set(facts)
        .where(and(eq(shopListings.patternId, row.patternId), isNull(shopListings.quiltSizes), isNull(shopListings.quiltPictures)))
        .returning({ patternId: shopListings.patternId })
    ).length;
  }
  return { filled, next: rows.length < limit ? null : rows[rows.length - 1]!.patternId };
}

/**
 * {@link fillListingQuiltBatch} over every listing, a batch at a time, giving the event loop back between
 * batches so requests are answered meanwhile; `stopped` ends it between batches (the server closing). Resolves
 * to the number of listings filled.
 */
export async function fillListingQuilts(d: Data, batchSize = 20, stopped: () => boolean = () => false): Promise<number> {
  let after: string | null = null;
  let filled = 0;
  do {
    if (stopped()) break;
    const batch = await fillListingQuiltBatch(d, after, batchSize);
    filled += batch.filled;
    after = batch.next;
    if (after !== null) await new Promise<void>((resolve) => setImmediate(resolve));
  } while (after !== null);
  return filled;
}
