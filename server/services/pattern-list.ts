import { and, asc, count, desc, eq, isNotNull, isNull, or, sql, type SQL } from 'drizzle-orm';
import type { DbLike } from '../db/database';
import { preparedPerDb } from '../db/prepared';
import { members, patterns, users } from '../db/schema';
import { likeContains } from '../http/paging';
import type { Access } from './access';
import { patternJson } from './revisions';

export type ListScope = 'all' | 'owned' | 'shared' | 'trash';
export type ListSort = 'updated' | 'created' | 'title';

export interface ListRequest {
  scope: ListScope;
  sort: ListSort;
  order: 'asc' | 'desc';
  /** Words to find in the title, when searching. */
  q?: string;
  page: number;
  pageSize: number;
}

const userId = sql.placeholder('userId');
const like = sql.placeholder('like');

/**
 * The patterns list is the busiest read after opening a pattern: its two statements (the page and the
 * count) are built and prepared once per database handle for each scope, sort, order and whether
 * there is a search, then run with the user, search words, limit and offset bound.
 */
const listStatements = preparedPerDb((db) => {
  const cache = new Map<string, ReturnType<typeof build>>();
  function build(scope: ListScope, sort: ListSort, order: 'asc' | 'desc', search: boolean) {
    const membership = and(eq(members.patternId, patterns.id), eq(members.userId, userId));
    const scopeWhere = {
      all: and(or(eq(patterns.ownerId, userId), isNotNull(members.userId)), isNull(patterns.trashedAt)),
      owned: and(eq(patterns.ownerId, userId), isNull(patterns.trashedAt)),
      shared: and(isNotNull(members.userId), isNull(patterns.trashedAt)),
      trash: and(eq(patterns.ownerId, userId), isNotNull(patterns.trashedAt)),
    }[scope];
    const where: SQL | undefined = search ? and(scopeWhere, sql`${patterns.title} LIKE ${like} ESCAPE '\\'`) : scopeWhere;
    const direction = order === 'asc' ? asc : desc;
    const sortColumn = {
      updated: patterns.updatedAt,
      created: patterns.createdAt,
      title: sql`${patterns.title} COLLATE NOCASE`,
    }[sort];
    return {
      total: db.select({ n: count() }).from(patterns).leftJoin(members, membership).where(where).prepare(),
      page: db
        .select({ pattern: patterns, ownerName: users.displayName, memberAccess: members.access })
        .from(patterns)
        .leftJoin(members, membership)
        .innerJoin(users, eq(users.id, patterns.ownerId))
        .where(where)
        .orderBy(direction(sortColumn), direction(patterns.id))
        .limit(sql.placeholder('limit'))
        .offset(sql.placeholder('offset'))
        .prepare(),
    };
  }
  return (scope: ListScope, sort: ListSort, order: 'asc' | 'desc', search: boolean) => {
    const key = `${scope}|${sort}|${order}|${search}`;
    let statements = cache.get(key);
    if (!statements) cache.set(key, (statements = build(scope, sort, order, search)));
    return statements;
  };
});

/** One page of the patterns a user owns or is a member of, with the total across pages. */
export function listPatterns(db: DbLike, user: { id: string }, q: ListRequest) {
  const statements = listStatements(db)(q.scope, q.sort, q.order, Boolean(q.q));
  const params = { userId: user.id, like: q.q ? likeContains(q.q) : '' };
  const total = statements.total.get(params)?.n ?? 0;
  const rows = statements.page.all({ ...params, limit: q.pageSize, offset: (q.page - 1) * q.pageSize });
  return {
    items: rows.map((r) => patternJson(r.pattern, r.ownerName, (r.pattern.ownerId === user.id ? 'owner' : r.memberAccess) as Access)),
    total,
    page: q.page,
    pageSize: q.pageSize,
  };
}
