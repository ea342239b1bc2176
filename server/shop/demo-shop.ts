import type { DbLike } from '../db/database';
import { eq } from 'drizzle-orm';
import { patterns, shopListings, shops, type ShopCurrency } from '../db/schema';
import { listingFacts } from './listings';

/** A listing to seed for the demo studio (invented data). */
export interface DemoListing {
  patternId: string;
  priceMinor: number;
  description: string;
}

/**
 * Opens the demo designer's shop in `currency` and publishes `listings`, for `npm start`'s demo data.
 * Existing rows are left as they are, so seeding twice changes nothing.
 */
export function seedDemoShop(db: DbLike, ownerId: string, currency: ShopCurrency, listings: DemoListing[]): void {
  const now = new Date();
  db.insert(shops).values({ ownerId, currency, createdAt: now, updatedAt: now }).onConflictDoNothing().run();
  for (const l of listings) {
    const pattern = db.select({ id: patterns.id, headRevision: patterns.headRevision }).from(patterns).where(eq(patterns.id, l.patternId)).get();
    const facts = pattern ? listingFacts(db, pattern) : {};
    db.insert(shopListings)
      .values({ patternId: l.patternId, priceMinor: l.priceMinor, description: l.description, publishedAt: now, createdAt: now, updatedAt: now, ...facts })
      .onConflictDoNothing()
      .run();
  }
}
