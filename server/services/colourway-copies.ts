import { and, eq } from 'drizzle-orm';
import type { ColourwayCopy as ColourwayCopyJson } from '@seamwright/api';
import type { Data } from '../db/data';
import type { ColourwayCopy } from '../db/schema';
import { HttpError } from '../http/errors';
import { idSchema } from '../http/validate';

/** The one answer for a copy the caller may not see: the same whether it exists, is someone else's or is of another pattern. */
export const copyNotFound = () => new HttpError(404, 'Colourway copy not found');

/**
 * The caller's own copy of this pattern (docs/api.md "Colourway copies"), or 404: a copy is its
 * owner's alone, so another user's copy, a copy of another pattern and a malformed id all answer alike.
 */
export async function findOwnCopy(d: Data, userId: string, patternId: string, copyId: unknown): Promise<ColourwayCopy> {
  if (!idSchema.safeParse(copyId).success) throw copyNotFound();
  const { colourwayCopies } = d.t;
  const [row] = await d.db
    .select()
    .from(colourwayCopies)
    .where(and(eq(colourwayCopies.id, copyId as string), eq(colourwayCopies.userId, userId), eq(colourwayCopies.patternId, patternId)));
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
