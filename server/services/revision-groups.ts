import { count, countDistinct, desc, eq, max, min, sql } from 'drizzle-orm';
import type { Data } from '../db/data';
import type { Revision } from '../db/schema';

/** A named version's name and note, or null for an ordinary save. */
export function versionJson(r: Pick<Revision, 'versionName' | 'versionNote'>): { name: string; note: string | null } | null {
  return r.versionName === null ? null : { name: r.versionName, note: r.versionNote };
}

/** The head revision as the grouping rule needs it. */
export interface GroupedHead {
  number: number;
  authorId: string;
  editSession: string | null;
  versionName: string | null;
  groupStart: number | null;
}

/**
 * Where a new revision's run of saves starts (docs/api.md, "Revisions"). A save joins the head's run
 * when both come from the same editing session and author and neither is a named version; anything
 * else (a restore, an API save without a session, another person, a named version) starts a run.
 */
export function groupStartOf(
  head: GroupedHead | undefined,
  next: { number: number; authorId: string; editSession: string | null; named: boolean },
): number {
  if (!head || next.named || next.editSession === null || head.versionName !== null) return next.number;
  if (head.editSession !== next.editSession || head.authorId !== next.authorId) return next.number;
  return head.groupStart ?? head.number;
}

/** One row of History: a run of saves, or a single revision (a named version is always alone). */
export interface RevisionGroupJson {
  first: number;
  last: number;
  count: number;
  author: { id: string; displayName: string };
  startedAt: string;
  endedAt: string;
  version: { name: string; note: string | null } | null;
  restoredFrom: number | null;
}

/** A pattern's runs of saves, newest first, paged like the revision list. */
export async function listRevisionGroups(d: Data, patternId: string, page: number, pageSize: number) {
  const { revisions, users } = d.t;
  // Revisions from before grouping have no group_start: each is a run of its own.
  const key = sql<number>`coalesce(${revisions.groupStart}, ${revisions.number})`;
  const total = (await d.db.select({ n: countDistinct(key) }).from(revisions).where(eq(revisions.patternId, patternId)))[0]?.n ?? 0;
  const rows = await d.db
    .select({
      first: min(revisions.number),
      last: max(revisions.number),
      count: count(),
      startedAt: min(revisions.createdAt),
      endedAt: max(revisions.createdAt),
      // One author per run by construction (groupStartOf), so min() is the run's author.
      authorId: min(revisions.authorId),
      authorName: min(users.displayName),
      // A named version or a restore is always a run of one, so max() is that revision's value.
      versionName: max(revisions.versionName),
      versionNote: max(revisions.versionNote),
      restoredFrom: max(revisions.restoredFrom),
    })
    .from(revisions)
    .innerJoin(users, eq(users.id, revisions.authorId))
    .where(eq(revisions.patternId, patternId))
    .groupBy(key)
    .orderBy(desc(key))
    .limit(pageSize)
    .offset((page - 1) * pageSize);
  const items: RevisionGroupJson[] = rows.map((r) => ({
    first: r.first ?? 0,
    last: r.last ?? 0,
    count: r.count,
    author: { id: r.authorId ?? '', displayName: r.authorName ?? '' },
    startedAt: (r.startedAt ?? new Date(0)).toISOString(),
    endedAt: (r.endedAt ?? new Date(0)).toISOString(),
    version: versionJson({ versionName: r.versionName, versionNote: r.versionNote }),
    restoredFrom: r.restoredFrom,
  }));
  return { items, total, page, pageSize };
}
