import { and, eq, sql, type SQL } from 'drizzle-orm';
import type BetterSqlite3 from 'better-sqlite3';
import { SQLiteSyncDialect } from 'drizzle-orm/sqlite-core';
import type { Data } from '../db/data';
import { preparedOn } from '../db/prepared';
import type { Pattern, User } from '../db/schema';
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

/** Every route's access check runs these (prepared once per connection; on PostgreSQL per transaction). */
const accessQueries = preparedOn((db, t) => ({
  pattern: db.select().from(t.patterns).where(eq(t.patterns.id, sql.placeholder('id'))).prepare(),
  membership: db
    .select({ access: t.members.access })
    .from(t.members)
    .where(and(eq(t.members.patternId, sql.placeholder('patternId')), eq(t.members.userId, sql.placeholder('userId'))))
    .prepare(),
}));

/**
 * The access a user holds on a pattern by ownership or membership, or null for a stranger. Says
 * nothing about the trash: callers that hide trashed patterns check it themselves.
 */
export async function accessOf(d: Data, user: User, pattern: { id: string; ownerId: string }): Promise<Access | null> {
  if (pattern.ownerId === user.id) return 'owner';
  const rows = await accessQueries(d).membership.execute({ patternId: pattern.id, userId: user.id });
  return rows[0]?.access ?? null;
}

/**
 * Finds the pattern and the user's access to it. Anonymous users, strangers, malformed ids and
 * (for everyone but the owner) trashed patterns all get the same 404.
 */
export async function loadPatternAccess(d: Data, user: User | undefined, patternId: unknown): Promise<PatternAccess> {
  if (!user || !idSchema.safeParse(patternId).success) throw patternNotFound();
  const pattern = (await accessQueries(d).pattern.execute({ id: patternId as string }))[0];
  if (!pattern) throw patternNotFound();
  const access = await accessOf(d, user, pattern);
  if (!access || (access !== 'owner' && pattern.trashedAt)) throw patternNotFound();
  return { pattern, access };
}

/** A member whose access is too low for `need` gets 403: they can see the pattern, so hiding it would be a lie. */
export function checkNeed(access: Access, need: Need): void {
  if (need === 'edit' && access === 'quilter') throw new HttpError(403, 'Quilter access cannot change this pattern');
  if (need === 'owner' && access !== 'owner') throw new HttpError(403, 'Only the owner can do this');
}

/** `loadPatternAccess` and `checkNeed` together, for routes not under `/patterns/:id`. */
export async function resolvePatternAccess(d: Data, user: User | undefined, patternId: unknown, need: Need = 'read'): Promise<PatternAccess> {
  const found = await loadPatternAccess(d, user, patternId);
  checkNeed(found.access, need);
  return found;
}

/**
 * Whether a quilter's access came from buying the pattern in the shop: such buyers see only the
 * owner and their own membership and print sets, never other buyers (docs/api.md, sharing).
 */
export async function isShopBuyer(d: Data, found: PatternAccess, userId: string): Promise<boolean> {
  if (found.access !== 'quilter') return false;
  const { orders } = d.t;
  const rows = await d.db
    .select({ id: orders.id })
    .from(orders)
    .where(and(eq(orders.buyerId, userId), eq(orders.patternId, found.pattern.id), eq(orders.grantedAccess, true)))
    .limit(1);
  return rows.length > 0;
}

/** Whether the caller may see the e-mail addresses of a pattern's owner and members. */
export const seesAddresses = (access: Access) => access === 'owner' || access === 'co-designer';

/** Whether the user's account role may create patterns. */
export const canDesign = (user: User) => user.role === 'designer' || user.role === 'admin';

/**
 * The row of the one-statement read: the pattern, its owner's name, the caller's membership, the
 * latest revision. Times are epoch ms on SQLite and Dates on PostgreSQL: read them with `new Date(…)`.
 */
interface PatternReadRow {
  id: string;
  ownerId: string;
  title: string;
  headRevision: number;
  createdAt: number | Date;
  updatedAt: number | Date;
  trashedAt: number | Date | null;
  ownerName: string;
  memberAccess: Access | null;
  revId: string | null;
  revNumber: number;
  revAuthorId: string;
  revAuthorName: string;
  revRestoredFrom: number | null;
  revEditSession: string | null;
  revGroupStart: number | null;
  revVersionName: string | null;
  revVersionNote: string | null;
  revCreatedAt: number | Date;
  revDocument: string;
}

/** What reading a pattern answers with, loaded by {@link loadPatternRead}. */
export interface PatternRead extends PatternAccess {
  ownerName: string;
  row: PatternReadRow;
}

/**
 * Reading a pattern (`GET /api/patterns/:id`, the busiest request) in one statement: the pattern, its
 * owner's name, the caller's membership and the latest revision with its author's name. SQL both
 * databases accept (aliases quoted, so PostgreSQL keeps their case).
 */
const readQuery = (userId: unknown, patternId: unknown): SQL => sql`SELECT p.id AS "id", p.owner_id AS "ownerId", p.title AS "title", p.head_revision AS "headRevision", p.created_at AS "createdAt",
            p.updated_at AS "updatedAt", p.trashed_at AS "trashedAt", o.display_name AS "ownerName", m.access AS "memberAccess",
            r.id AS "revId", r.number AS "revNumber", r.author_id AS "revAuthorId", a.display_name AS "revAuthorName",
            r.restored_from AS "revRestoredFrom", r.edit_session AS "revEditSession", r.group_start AS "revGroupStart", r.version_name AS "revVersionName", r.version_note AS "revVersionNote",
            r.created_at AS "revCreatedAt", r.document AS "revDocument"
       FROM patterns p
       JOIN users o ON o.id = p.owner_id
       LEFT JOIN members m ON m.pattern_id = p.id AND m.user_id = ${userId}
       LEFT JOIN revisions r ON r.pattern_id = p.id AND r.number = (SELECT max(number) FROM revisions WHERE pattern_id = p.id)
       LEFT JOIN users a ON a.id = r.author_id
      WHERE p.id = ${patternId}`;

/** The read's checks and answer from its row (the same for both ways of running the query). */
function patternReadOf(user: User, row: PatternReadRow | undefined): PatternRead {
  if (!row) throw patternNotFound();
  const access: Access | null = row.ownerId === user.id ? 'owner' : row.memberAccess;
  if (!access || (access !== 'owner' && row.trashedAt !== null)) throw patternNotFound();
  const pattern: Pattern = {
    id: row.id,
    ownerId: row.ownerId,
    title: row.title,
    headRevision: row.headRevision,
    createdAt: new Date(row.createdAt),
    updatedAt: new Date(row.updatedAt),
    trashedAt: row.trashedAt === null ? null : new Date(row.trashedAt),
  };
  return { pattern, access, ownerName: row.ownerName, row };
}

/**
 * `loadPatternAccess` and the latest revision in one query, with the same answers: anonymous users,
 * strangers, malformed ids and (for everyone but the owner) trashed patterns all get the one 404.
 */
export async function loadPatternRead(d: Data, user: User | undefined, patternId: unknown): Promise<PatternRead> {
  if (!user || !idSchema.safeParse(patternId).success) throw patternNotFound();
  const rows = await d.rows<PatternReadRow & Record<string, unknown>>(readQuery(user.id, patternId));
  return patternReadOf(user, rows[0]);
}

/**
 * {@link loadPatternRead} for the hot routes on SQLite (server/http/hot-routes.ts): the same SQL,
 * prepared once on the connection and run synchronously.
 */
export function sqlitePatternReader(sqlite: BetterSqlite3.Database): (user: User | undefined, patternId: unknown) => PatternRead {
  const text = new SQLiteSyncDialect().sqlToQuery(readQuery(sql.placeholder('userId'), sql.placeholder('patternId'))).sql;
  const statement = sqlite.prepare<[string, string], PatternReadRow>(text);
  return (user, patternId) => {
    if (!user || !idSchema.safeParse(patternId).success) throw patternNotFound();
    return patternReadOf(user, statement.get(user.id, patternId as string));
  };
}
