import { and, eq, sql } from 'drizzle-orm';
import type { DbLike } from '../db/database';
import { preparedPerDb } from '../db/prepared';
import { members, patterns, type Pattern, type User } from '../db/schema';
import { HttpError } from '../http/errors';
import { idSchema } from '../http/validate';

/** A user's access to one pattern. */
export type Access = 'owner' | 'co-designer' | 'quilter';

/** What a user may do with a pattern: read (any access), edit (owner, co-designer), own. */
export type Need = 'read' | 'edit' | 'owner';

export interface PatternAccess {
  pattern: Pattern;
  access: Access;
}

/** The one answer for a pattern someone may not see: the same whether it exists or not. */
export const patternNotFound = () => new HttpError(404, 'Pattern not found');

/** Every route's access check runs these. */
const accessQueries = preparedPerDb((db) => ({
  pattern: db.select().from(patterns).where(eq(patterns.id, sql.placeholder('id'))).prepare(),
  membership: db
    .select({ access: members.access })
    .from(members)
    .where(and(eq(members.patternId, sql.placeholder('patternId')), eq(members.userId, sql.placeholder('userId'))))
    .prepare(),
}));

/**
 * Finds the pattern and the user's access to it. Anonymous users, strangers, malformed ids and
 * (for everyone but the owner) trashed patterns all get the same 404. A member whose access is too
 * low for `need` gets 403: they can see the pattern, so hiding it would be a lie.
 */
export function resolvePatternAccess(db: DbLike, user: User | undefined, patternId: unknown, need: Need = 'read'): PatternAccess {
  if (!user || !idSchema.safeParse(patternId).success) throw patternNotFound();
  const id = patternId as string;
  const q = accessQueries(db);
  const pattern = q.pattern.get({ id });
  if (!pattern) throw patternNotFound();
  let access: Access;
  if (pattern.ownerId === user.id) access = 'owner';
  else {
    const m = q.membership.get({ patternId: id, userId: user.id });
    if (!m || pattern.trashedAt) throw patternNotFound();
    access = m.access;
  }
  if (need === 'edit' && access === 'quilter') throw new HttpError(403, 'Quilter access cannot change this pattern');
  if (need === 'owner' && access !== 'owner') throw new HttpError(403, 'Only the owner can do this');
  return { pattern, access };
}

/** Whether the user's account role may create patterns. */
export const canDesign = (user: User) => user.role === 'designer' || user.role === 'admin';
