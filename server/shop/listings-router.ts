import { and, count, desc, eq, isNotNull, isNull } from 'drizzle-orm';
import express, { type Router } from 'express';
import { listingBodySchema, searchPageQuerySchema, shopBodySchema } from '@seamwright/api';
import type { AppContext } from '../app-context';
import { currentUser, requireUser } from '../auth/sessions';
import { HttpError } from '../http/errors';
import { likeContains } from '../http/paging';
import { idSchema, parseOr400 } from '../http/validate';
import { accessOf, canDesign, resolvePatternAccess } from '../services/access';
import { findListing, listingFacts, listingRows } from './listings';
import { listingJson, listingQuiltJson } from './shop-json';


const listingNotFound = () => new HttpError(404, 'Listing not found');

/** `/api/shop` browsing and publishing: published listings, one listing, a designer's shop settings. */
export function listingsRouter(ctx: AppContext): Router {
  const d = ctx.data;
  const { orders, patterns, shopListings, shops } = d.t;
  const router = express.Router();
  router.use(requireUser);

  router.get('/listings', async (req, res) => {
    const user = currentUser(req);
    const q = parseOr400(searchPageQuerySchema, req.query, 'Invalid query');
    const published = and(isNotNull(shopListings.publishedAt), isNull(patterns.trashedAt));
    const where = q.q ? and(published, d.likeIgnoringCase(patterns.title, likeContains(q.q))) : published;
    const [counted] = await d.db
      .select({ n: count() })
      .from(shopListings)
      .innerJoin(patterns, eq(patterns.id, shopListings.patternId))
      .innerJoin(shops, eq(shops.ownerId, patterns.ownerId))
      .where(where);
    const total = counted?.n ?? 0;
    const rows = await listingRows(d)
      .where(where)
      .orderBy(desc(shopListings.publishedAt), desc(shopListings.patternId))
      .limit(q.pageSize)
      .offset((q.page - 1) * q.pageSize);
    const accesses = await Promise.all(rows.map((r) => accessOf(d, user, r.pattern)));
    res.json({
      items: rows.map((r, i) =>
        listingJson(r.listing, {
          title: r.pattern.title,
          currency: r.currency,
          designer: { id: r.pattern.ownerId, displayName: r.designerName },
          access: accesses[i]!,
        }),
      ),
      total,
      page: q.page,
      pageSize: q.pageSize,
    });
  });

  router.get('/listings/:patternId', async (req, res) => {
    const user = currentUser(req);
    const id = idSchema.safeParse(req.params.patternId);
    if (!id.success) throw listingNotFound();
    const found = await findListing(d, id.data);
    // The owner may look at their own listing before publishing it; everybody else sees only published ones.
    const visible = found && (found.pattern.ownerId === user.id || (found.listing.publishedAt && !found.pattern.trashedAt));
    if (!found || !visible) throw listingNotFound();
    res.json({
      listing: {
        ...listingJson(found.listing, {
          title: found.pattern.title,
          currency: found.currency,
          designer: { id: found.pattern.ownerId, displayName: found.designerName },
          access: await accessOf(d, user, found.pattern),
        }),
        quilt: listingQuiltJson(found.listing),
      },
    });
  });

  /** The signed-in designer's shop: its currency and every pattern they own with its listing. */
  router.get('/mine', async (req, res) => {
    const user = currentUser(req);
    if (!canDesign(user)) throw new HttpError(403, 'Only designers have a shop');
    const [shop] = await d.db.select().from(shops).where(eq(shops.ownerId, user.id));
    const rows = await d.db
      .select({ pattern: patterns, listing: shopListings })
      .from(patterns)
      .leftJoin(shopListings, eq(shopListings.patternId, patterns.id))
      .where(and(eq(patterns.ownerId, user.id), isNull(patterns.trashedAt)))
      .orderBy(d.textIgnoringCase(patterns.title), patterns.id);
    const sold = await d.db
      .select({ patternId: orders.patternId, n: count() })
      .from(orders)
      .where(and(eq(orders.sellerId, user.id), eq(orders.status, 'paid')))
      .groupBy(orders.patternId);
    const soldBy = new Map(sold.map((s) => [s.patternId, s.n]));
    res.json({
      shop: shop ? { currency: shop.currency } : null,
      patterns: rows.map((r) => ({
        patternId: r.pattern.id,
        title: r.pattern.title,
        paidOrders: soldBy.get(r.pattern.id) ?? 0,
        listing: r.listing
          ? {
              priceMinor: r.listing.priceMinor,
              description: r.listing.description,
              published: r.listing.publishedAt !== null,
              publishedAt: r.listing.publishedAt ? r.listing.publishedAt.toISOString() : null,
              updatedAt: r.listing.updatedAt.toISOString(),
            }
          : null,
      })),
    });
  });

  router.put('/mine', async (req, res) => {
    const user = currentUser(req);
    if (!canDesign(user)) throw new HttpError(403, 'Only designers have a shop');
    const body = parseOr400(shopBodySchema, req.body);
    const now = new Date();
    const [shop] = await d.db
      .insert(shops)
      .values({ ownerId: user.id, currency: body.currency, createdAt: now, updatedAt: now })
      .onConflictDoUpdate({ target: shops.ownerId, set: { currency: body.currency, updatedAt: now } })
      .returning();
    if (!shop) throw new HttpError(500, 'Shop was not stored');
    res.json({ shop: { currency: shop.currency } });
  });

  router.put('/listings/:patternId', async (req, res) => {
    const user = currentUser(req);
    const { pattern } = await resolvePatternAccess(d, user, req.params.patternId, 'owner');
    if (!canDesign(user)) throw new HttpError(403, 'Only designers can sell patterns');
    const body = parseOr400(listingBodySchema, req.body);
    if (pattern.trashedAt) throw new HttpError(409, 'This pattern is in the trash; restore it before listing it');
    const [shop] = await d.db.select().from(shops).where(eq(shops.ownerId, user.id));
    if (!shop) throw new HttpError(409, "Choose your shop's currency first", [{ path: 'currency', message: 'is not set' }]);
    const now = new Date();
    const [existing] = await d.db.select().from(shopListings).where(eq(shopListings.patternId, pattern.id));
    const publishedAt = body.published ? (existing?.publishedAt ?? now) : null;
    // What the shop shows of the design is taken from the head revision now, once per save.
    const facts = await listingFacts(d, pattern);
    await d.db
      .insert(shopListings)
      .values({ patternId: pattern.id, priceMinor: body.priceMinor, description: body.description, publishedAt, createdAt: now, updatedAt: now, ...facts })
      .onConflictDoUpdate({
        target: shopListings.patternId,
        set: { priceMinor: body.priceMinor, description: body.description, publishedAt, updatedAt: now, ...facts },
      });
    const found = await findListing(d, pattern.id);
    if (!found) throw new HttpError(500, 'Listing was not stored');
    res.json({
      listing: {
        ...listingJson(found.listing, {
          title: pattern.title,
          currency: found.currency,
          designer: { id: user.id, displayName: user.displayName },
          access: 'owner',
        }),
        quilt: listingQuiltJson(found.listing),
      },
    });
  });

  return router;
}
