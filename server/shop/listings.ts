import { and, eq } from 'drizzle-orm';
import type { DbLike } from '../db/database';
import { patterns, revisions, shopListings, shops, users } from '../db/schema';

/** Listings joined with their pattern, shop currency, designer name and latest document. */
export function listingRows(db: DbLike) {
  return db
    .select({ listing: shopListings, pattern: patterns, currency: shops.currency, designerName: users.displayName, document: revisions.document })
    .from(shopListings)
    .innerJoin(patterns, eq(patterns.id, shopListings.patternId))
    .innerJoin(shops, eq(shops.ownerId, patterns.ownerId))
    .innerJoin(users, eq(users.id, patterns.ownerId))
    .leftJoin(revisions, and(eq(revisions.patternId, patterns.id), eq(revisions.number, patterns.headRevision)));
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
