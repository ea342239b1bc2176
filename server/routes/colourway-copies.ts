import { and, asc, count, eq } from 'drizzle-orm';
import express, { type Router } from 'express';
import { createColourwayCopyBodySchema, MAX_COLOURWAY_COPIES, updateColourwayCopyBodySchema, type ColourwayCopyFabric } from '@seamwright/api';
import type { PatternDocument } from '@seamwright/piecing';
import type { AppContext } from '../app-context';
import { currentUser } from '../auth/sessions';
import { newId } from '../auth/tokens';
import { HttpError } from '../http/errors';
import { parseOr400 } from '../http/validate';
import { patternOf } from '../http/pattern-access';
import { copyJson, findOwnCopy } from '../services/colourway-copies';
import { findRevision } from '../services/revisions';

/** What the routes read of the latest revision: its fabric slots and colourways. */
type CopiedDocument = Pick<PatternDocument, 'fabrics' | 'colourways'>;

async function latestDocument(ctx: AppContext, patternId: string): Promise<CopiedDocument> {
  const latest = await findRevision(ctx.data, patternId);
  return latest ? (JSON.parse(latest.revision.document) as CopiedDocument) : { fabrics: [], colourways: [] };
}

/**
 * `/api/patterns/:id/colourway-copies`: a quilter's own copies of the pattern's colourways (design §11,
 * docs/api.md). Anyone who can read the pattern may copy; each user sees, changes and deletes only their
 * own copies (anyone else's answer 404). A save carries the copy's version; a stale one gets 409.
 */
export function colourwayCopiesRouter(ctx: AppContext): Router {
  const d = ctx.data;
  const { colourwayCopies } = d.t;
  const router = express.Router({ mergeParams: true });

  router.get('/', async (req, res) => {
    const { pattern } = patternOf(res);
    const user = currentUser(req);
    const rows = await d.db
      .select()
      .from(colourwayCopies)
      .where(and(eq(colourwayCopies.userId, user.id), eq(colourwayCopies.patternId, pattern.id)))
      .orderBy(asc(colourwayCopies.createdAt), asc(colourwayCopies.id));
    res.json({ items: rows.map(copyJson) });
  });

  router.get('/:copyId', async (req, res) => {
    const { pattern } = patternOf(res);
    res.json({ copy: copyJson(await findOwnCopy(d, currentUser(req).id, pattern.id, req.params.copyId)) });
  });

  router.post('/', async (req, res) => {
    const { pattern } = patternOf(res);
    const user = currentUser(req);
    const body = parseOr400(createColourwayCopyBodySchema, req.body ?? {});
    const doc = await latestDocument(ctx, pattern.id);
    const source = body.colourwayId === null ? null : (doc.colourways ?? []).find((c) => c.id === body.colourwayId);
    if (source === undefined) {
      const known = (doc.colourways ?? []).map((c) => `"${c.id}"`).join(', ') || 'none';
      throw new HttpError(400, 'No such colourway in the latest revision', [{ path: 'colourwayId', message: `unknown colourway "${body.colourwayId}" (the pattern has: ${known})` }]);
    }
    const [{ n: held }] = await d.db
      .select({ n: count() })
      .from(colourwayCopies)
      .where(and(eq(colourwayCopies.userId, user.id), eq(colourwayCopies.patternId, pattern.id)));
    if (held >= MAX_COLOURWAY_COPIES) {
      throw new HttpError(409, `You already have ${MAX_COLOURWAY_COPIES} copies of this pattern's colourways; delete one first`, { max: MAX_COLOURWAY_COPIES });
    }
    // Every slot of the document, as the colourway shows it (or the document's own fabric).
    const fabrics: Record<string, ColourwayCopyFabric> = {};
    for (const f of doc.fabrics) {
      const slot = source ? source.fabrics[f.id] : undefined;
      fabrics[f.id] = slot ? { name: slot.name, colour: slot.colour } : { name: f.name, colour: f.colour };
    }
    const now = new Date();
    const [row] = await d.db
      .insert(colourwayCopies)
      .values({
        id: newId(),
        userId: user.id,
        patternId: pattern.id,
        sourceColourwayId: source ? source.id : null,
        name: body.name ?? `My ${source ? source.name : 'fabrics'}`.slice(0, 80),
        fabrics,
        version: 1,
        createdAt: now,
        updatedAt: now,
      })
      .returning();
    res.status(201).json({ copy: copyJson(row) });
  });

  router.patch('/:copyId', async (req, res) => {
    const { pattern } = patternOf(res);
    const user = currentUser(req);
    const copy = await findOwnCopy(d, user.id, pattern.id, req.params.copyId);
    const body = parseOr400(updateColourwayCopyBodySchema, req.body ?? {});
    if (body.fabrics) {
      const slots = new Set((await latestDocument(ctx, pattern.id)).fabrics.map((f) => f.id));
      const unknown = Object.keys(body.fabrics).filter((k) => !slots.has(k));
      if (unknown.length > 0) {
        throw new HttpError(
          400,
          'No such fabric in the latest revision',
          unknown.map((k) => ({ path: `fabrics.${k}`, message: `unknown fabric "${k}"` })),
        );
      }
    }
    // The version check and the write are one statement, so two saves of the same version cannot both land.
    const [updated] = await d.db
      .update(colourwayCopies)
      .set({
        ...(body.name !== undefined ? { name: body.name } : {}),
        ...(body.fabrics !== undefined ? { fabrics: body.fabrics } : {}),
        version: body.version + 1,
        updatedAt: new Date(),
      })
      .where(and(eq(colourwayCopies.id, copy.id), eq(colourwayCopies.version, body.version)))
      .returning();
    if (!updated) {
      const latest = await findOwnCopy(d, user.id, pattern.id, copy.id);
      throw new HttpError(409, `This copy was changed elsewhere (version ${latest.version}); reload it and make your change again`, { latest: copyJson(latest) });
    }
    res.json({ copy: copyJson(updated) });
  });

  router.delete('/:copyId', async (req, res) => {
    const { pattern } = patternOf(res);
    const copy = await findOwnCopy(d, currentUser(req).id, pattern.id, req.params.copyId);
    await d.db.delete(colourwayCopies).where(eq(colourwayCopies.id, copy.id));
    res.status(204).end();
  });

  return router;
}
