import { eq } from 'drizzle-orm';
import type { Data } from '../db/data';
import type { ShopCurrency } from '../db/schema';
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
export async function seedDemoShop(d: Data, ownerId: string, currency: ShopCurrency, listings: DemoListing[]): Promise<void> {
  const { patterns, shopListings, shops } = d.t;
  const now = new Date();
  await d.db.insert(shops).values({ ownerId, currency, createdAt: now, updatedAt: now }).onConflictDoNothing();
  for (const l of listings) {
    const [pattern] = await d.db.select({ id: patterns.id, headRevision: patterns.headRevision }).from(patterns).where(eq(patterns.id, l.patternId));
    const facts = pattern ? await listingFacts(d, pattern) : {};
    await d.db
      .insert(shopListings)
      .values({ patternId: l.patternId, priceMinor: l.priceMinor, description: l.description, publishedAt: now, createdAt: now, updatedAt: now, ...facts })
      .onConflictDoNothing();
  }
}
