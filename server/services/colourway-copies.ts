import { and, eq } from 'drizzle-orm';
import type { ColourwayCopy as ColourwayCopyJson } from '@seamwright/api';
import type { DbLike } from '../db/database';
import { colourwayCopies, type ColourwayCopy } from '../db/schema';
import { HttpError } from '../http/errors';
import { idSchema } from '../http/validate';

/** The one answer for a copy the caller may not see: the same whether it exists, is someone else's or is of another pattern. */
export const copyNotFound = () => new HttpError(404, 'Colourway copy not found');

/**
 * The caller's own copy of this pattern (docs/api.md "Colourway copies"), or 404: a copy is its
 * owner's alone, so another user's copy, a copy of another pattern and a malformed id all answer alike.
 */
export function findOwnCopy(db: DbLike, userId: string, patternId: string, copyId: unknown): ColourwayCopy {
  if (!idSchema.safeParse(copyId).success) throw copyNotFound();
  const row = db
    .select()
    .from(colourwayCopies)
    .where(and(eq(colourwayCopies.id, copyId as string), eq(colourwayCopies.userId, userId), eq(colourwayCopies.patternId, patternId)))
    .get();
  if (!row) throw copyNotFound();
  return row;
}

/** A copy as the API answers it. */
export function copyJson(c: ColourwayCopy): ColourwayCopyJson {
  return {
    id: c.id,
    patternId: c.patternId,
    sourceColourwayId: c.sourceColourwayId,
    name: c.name,
    fabrics: c.fabrics,
    version: c.version,
    createdAt: c.createdAt.toISOString(),
    updatedAt: c.updatedAt.toISOString(),
  };
}
