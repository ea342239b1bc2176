import { and, asc, count, desc, eq, isNotNull, isNull, or, sql, type SQL } from 'drizzle-orm';
import type { DbLike } from '../db/database';
import { preparedPerDb, rawRowsOf } from '../db/prepared';
import { formatLength, parsePatternDocument } from '@seamwright/piecing';
import { members, patternPreviews, patterns, revisions, users, type Pattern } from '../db/schema';
import { likeContains } from '../http/paging';
import type { Access } from './access';
import { PREVIEW_RENDERER_VERSION, patternPreviewSvg } from './pattern-preview';
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
 * The patterns list is the busiest read after opening a pattern: its two statements (the page, which
 * carries the total, and the count alone for a page past the end) are built and prepared once per database handle for each scope, sort, order and whether
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
      // Rows as arrays in this order (see PAGE_COLUMNS), read and written out by hand.
      page: rawRowsOf(
        db,
        db
          .select({
            id: patterns.id,
            ownerId: patterns.ownerId,
            title: patterns.title,
            headRevision: patterns.headRevision,
            createdAt: patterns.createdAt,
            updatedAt: patterns.updatedAt,
            trashedAt: patterns.trashedAt,
            ownerName: users.displayName,
            memberAccess: members.access,
            total: sql<number>`count(*) OVER ()`,
          })
          .from(patterns)
          .leftJoin(members, membership)
          .innerJoin(users, eq(users.id, patterns.ownerId))
          .where(where)
          .orderBy(direction(sortColumn), direction(patterns.id))
          .limit(sql.placeholder('limit'))
          .offset(sql.placeholder('offset')),
      ),
    };
  }
  return (scope: ListScope, sort: ListSort, order: 'asc' | 'desc', search: boolean) => {
    const key = `${scope}|${sort}|${order}|${search}`;
    let statements = cache.get(key);
    if (!statements) cache.set(key, (statements = build(scope, sort, order, search)));
    return statements;
  };
});

type StoredPreview = typeof patternPreviews.$inferSelect;
type PreviewRow = Pick<StoredPreview, 'sectionCount' | 'widthIn' | 'heightIn' | 'displayUnit' | 'svg'>;

const previewStatements = preparedPerDb((db) => ({
  /**
   * The stored previews of one page's patterns (ids as a JSON array), read after the page rather than
   * joined to it: a join would run for every pattern in scope before the sort and limit.
   */
  forPage: rawRowsOf(
    db,
    db
      .select({
        patternId: patternPreviews.patternId,
        revisionNumber: patternPreviews.revisionNumber,
        sectionCount: patternPreviews.sectionCount,
        widthIn: patternPreviews.widthIn,
        heightIn: patternPreviews.heightIn,
        displayUnit: patternPreviews.displayUnit,
        svg: patternPreviews.svg,
      })
      .from(patternPreviews)
      .where(
        and(
          sql`${patternPreviews.patternId} IN (SELECT value FROM json_each(${sql.placeholder('ids')}))`,
          eq(patternPreviews.rendererVersion, PREVIEW_RENDERER_VERSION),
        ),
      ),
  ),
  document: db
    .select({ document: revisions.document })
    .from(revisions)
    .where(and(eq(revisions.patternId, sql.placeholder('patternId')), eq(revisions.number, sql.placeholder('number'))))
    .prepare(),
}));

/**
 * What the list shows of a pattern's head revision, worked out from its document and stored, so the
 * next list reads it with the page. Patterns are few per page and the work is done once per revision
 * that is listed (not per save: autosave makes many revisions nobody lists).
 */
function fillPreview(db: DbLike, pattern: Pattern): PreviewRow | null {
  const stored = previewStatements(db).document.get({ patternId: pattern.id, number: pattern.headRevision });
  if (!stored) return null;
  const parsed = parsePatternDocument(JSON.parse(stored.document) as unknown);
  if (!parsed.ok) return null;
  const document = parsed.document;
  let svg: string | null = null;
  try {
    svg = patternPreviewSvg(document);
  } catch {
    // A picture is never worth failing the list for; the row shows without one.
  }
  const row: StoredPreview = {
    patternId: pattern.id,
    revisionNumber: pattern.headRevision,
    rendererVersion: PREVIEW_RENDERER_VERSION,
    sectionCount: document.sections.length,
    widthIn: document.canvas.widthIn,
    heightIn: document.canvas.heightIn,
    displayUnit: document.displayUnit,
    svg,
  };
  try {
    const { patternId: _id, ...changes } = row;
    db.insert(patternPreviews)
      .values(row)
      .onConflictDoUpdate({ target: patternPreviews.patternId, set: changes, setWhere: sql`excluded.revision_number >= ${patternPreviews.revisionNumber}` })
      .run();
  } catch {
    // Not stored (the database is busy or read-only): this answer still carries it; a later list stores it.
  }
  return row;
}

/** Size texts already written: a studio's patterns come in few sizes, and writing one is not free. */
const sizeTexts = new Map<string, string>();

/** Finished size as the row shows it, in the designer's unit: `8 × 8 in.`, `66.04 × 66.04 cm`. */
function sizeText(p: PreviewRow): string {
  const key = `${p.widthIn} ${p.heightIn} ${p.displayUnit}`;
  let text = sizeTexts.get(key);
  if (text === undefined) {
    text = `${formatLength(p.widthIn, p.displayUnit, { style: 'unicode', withUnit: false })} × ${formatLength(p.heightIn, p.displayUnit, { style: 'unicode' })}`;
    if (sizeTexts.size >= 1000) sizeTexts.clear();
    sizeTexts.set(key, text);
  }
  return text;
}

/** One row of the list: the pattern, and what the row shows of its latest revision. */
function listItem(pattern: Pattern, ownerName: string, access: Access, preview: PreviewRow | null) {
  return {
    ...patternJson(pattern, ownerName, access),
    sectionCount: preview?.sectionCount ?? null,
    finishedSize: preview ? { widthIn: preview.widthIn, heightIn: preview.heightIn, displayUnit: preview.displayUnit, text: sizeText(preview) } : null,
    preview: preview?.svg ?? null,
  };
}

/** A page row as the page statement gives it (columns in its select order; times in ms). */
type PageRow = [id: string, ownerId: string, title: string, headRevision: number, createdAt: number, updatedAt: number, trashedAt: number | null, ownerName: string, memberAccess: Access | null, total: number];
/** A preview row as the preview statement gives it. */
type PreviewRowArray = [patternId: string, revisionNumber: number, sectionCount: number, widthIn: number, heightIn: number, displayUnit: PreviewRow['displayUnit'], svg: string | null];

/** One page of the patterns a user owns or is a member of, with the total across pages. */
export function listPatterns(db: DbLike, user: { id: string }, q: ListRequest) {
  const statements = listStatements(db)(q.scope, q.sort, q.order, Boolean(q.q));
  const params = { userId: user.id, like: q.q ? likeContains(q.q) : '' };
  const rows = statements.page({ ...params, limit: q.pageSize, offset: (q.page - 1) * q.pageSize }) as PageRow[];
  // The page carries the count over every row in scope (a window over the whole result, taken
  // before LIMIT); only a page past the end needs the count on its own.
  const total = rows.length > 0 ? rows[0][9] : q.page > 1 ? (statements.total.get(params)?.n ?? 0) : 0;
  const previews = new Map<string, PreviewRowArray>();
  if (rows.length > 0) {
    for (const p of previewStatements(db).forPage({ ids: JSON.stringify(rows.map((r) => r[0])) }) as PreviewRowArray[]) previews.set(p[0], p);
  }
  const previewOf = (pattern: Pattern): PreviewRow | null => {
    const stored = previews.get(pattern.id);
    if (!stored || stored[1] !== pattern.headRevision) return fillPreview(db, pattern);
    return { sectionCount: stored[2], widthIn: stored[3], heightIn: stored[4], displayUnit: stored[5], svg: stored[6] };
  };
  return {
    items: rows.map((r) => {
      const pattern: Pattern = {
        id: r[0],
        ownerId: r[1],
        title: r[2],
        headRevision: r[3],
        createdAt: new Date(r[4]),
        updatedAt: new Date(r[5]),
        trashedAt: r[6] === null ? null : new Date(r[6]),
      };
      return listItem(pattern, r[7], r[1] === user.id ? 'owner' : (r[8] as Access), previewOf(pattern));
    }),
    total,
    page: q.page,
    pageSize: q.pageSize,
  };
}
