import { and, asc, count, desc, eq, inArray, isNotNull, isNull, or, sql, type SQL } from 'drizzle-orm';
import { formatLength, parsePatternDocument } from '@seamwright/piecing';
import type { Data, Tables } from '../db/data';
import { preparedOn, rawRowsOf } from '../db/prepared';
import type { Pattern } from '../db/schema';
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
/** The search pattern, bound when the statement runs (`Data.likeIgnoringCase` writes it into the SQL as given). */
const like = sql.placeholder('like') as unknown as string;

/**
 * A query's rows as arrays in its select order, run by a statement prepared once: on SQLite a plain
 * better-sqlite3 statement that gives arrays (no per-row mapping into objects: the list is the busiest
 * read after opening a pattern), on PostgreSQL Drizzle's prepared query with its rows laid out the same.
 * Times come as epoch ms on SQLite and Dates on PostgreSQL: read them with `new Date(…)`.
 */
function arrayRows<Q extends { toSQL(): { sql: string; params: unknown[] }; prepare(): { execute(v: Record<string, unknown>): Promise<Record<string, unknown>[]> } }>(
  d: Data,
  db: Data['db'],
  query: Q,
  columns: readonly string[],
): (values: Record<string, unknown>) => Promise<unknown[][]> {
  if (d.sqlite) {
    const run = rawRowsOf(db, query);
    return async (values) => run(values);
  }
  const prepared = query.prepare();
  return async (values) => (await prepared.execute(values)).map((r) => columns.map((c) => r[c]));
}

/**
 * The patterns list: its two statements (the page, which carries the total, and the count alone for a
 * page past the end) are built and prepared once per connection for each scope, sort, order and
 * whether there is a search, then run with the user, search words, limit and offset bound. A search
 * and the title sort ignore case alike on both databases (`Data.likeIgnoringCase`, `Data.textIgnoringCase`).
 */
const listStatements = preparedOn((db, t) => {
  const { members, patterns, users } = t;
  const cache = new Map<string, ReturnType<typeof build>>();
  function build(d: Data, scope: ListScope, sort: ListSort, order: 'asc' | 'desc', search: boolean) {
    const membership = and(eq(members.patternId, patterns.id), eq(members.userId, userId));
    const scopeWhere = {
      all: and(or(eq(patterns.ownerId, userId), isNotNull(members.userId)), isNull(patterns.trashedAt)),
      owned: and(eq(patterns.ownerId, userId), isNull(patterns.trashedAt)),
      shared: and(isNotNull(members.userId), isNull(patterns.trashedAt)),
      trash: and(eq(patterns.ownerId, userId), isNotNull(patterns.trashedAt)),
    }[scope];
    const where: SQL | undefined = search ? and(scopeWhere, d.likeIgnoringCase(patterns.title, like)) : scopeWhere;
    const direction = order === 'asc' ? asc : desc;
    const sortColumn = {
      updated: patterns.updatedAt,
      created: patterns.createdAt,
      title: d.textIgnoringCase(patterns.title),
    }[sort];
    const page = {
      id: patterns.id,
      ownerId: patterns.ownerId,
      title: patterns.title,
      headRevision: patterns.headRevision,
      createdAt: patterns.createdAt,
      updatedAt: patterns.updatedAt,
      trashedAt: patterns.trashedAt,
      ownerName: users.displayName,
      memberAccess: members.access,
      // Every row in scope, counted before LIMIT (a bigint on PostgreSQL: read with Number).
      total: sql<number>`count(*) OVER ()`,
    };
    return {
      total: db.select({ n: count() }).from(patterns).leftJoin(members, membership).where(where).prepare(),
      // Rows as arrays in this order (see PageRow).
      page: arrayRows(
        d,
        db,
        db
          .select(page)
          .from(patterns)
          .leftJoin(members, membership)
          .innerJoin(users, eq(users.id, patterns.ownerId))
          .where(where)
          .orderBy(direction(sortColumn), direction(patterns.id))
          .limit(sql.placeholder('limit'))
          .offset(sql.placeholder('offset')),
        Object.keys(page),
      ),
    };
  }
  /** The statements for one kind of list; `d` is the database they are prepared on (it only says which SQL to write). */
  return (d: Data, scope: ListScope, sort: ListSort, order: 'asc' | 'desc', search: boolean) => {
    const key = `${scope}|${sort}|${order}|${search}`;
    let statements = cache.get(key);
    if (!statements) cache.set(key, (statements = build(d, scope, sort, order, search)));
    return statements;
  };
});

type StoredPreview = Tables['patternPreviews']['$inferSelect'];
type PreviewRow = Pick<StoredPreview, 'sectionCount' | 'widthIn' | 'heightIn' | 'displayUnit' | 'svg'>;

const previewStatements = preparedOn((db, t) => {
  const { patternPreviews, revisions } = t;
  /**
   * The stored previews of one page's patterns, read after the page rather than joined to it: a join
   * would run for every pattern in scope before the sort and limit. One statement per page length
   * (ids bound as `id0`, `id1`, …).
   */
  const forPage = new Map<number, ReturnType<typeof pageOf>>();
  const columns = {
    patternId: patternPreviews.patternId,
    revisionNumber: patternPreviews.revisionNumber,
    sectionCount: patternPreviews.sectionCount,
    widthIn: patternPreviews.widthIn,
    heightIn: patternPreviews.heightIn,
    displayUnit: patternPreviews.displayUnit,
    svg: patternPreviews.svg,
  };
  function pageOf(d: Data, n: number) {
    const query = db
      .select(columns)
      .from(patternPreviews)
      .where(
        and(
          inArray(
            patternPreviews.patternId,
            Array.from({ length: n }, (_, i) => sql.placeholder(`id${i}`)),
          ),
          eq(patternPreviews.rendererVersion, PREVIEW_RENDERER_VERSION),
        ),
      );
    // Rows as arrays in this order (see PreviewRowArray).
    return arrayRows(d, db, query, Object.keys(columns));
  }
  return {
    forPage(d: Data, n: number) {
      let q = forPage.get(n);
      if (!q) forPage.set(n, (q = pageOf(d, n)));
      return q;
    },
    document: db
      .select({ document: revisions.document })
      .from(revisions)
      .where(and(eq(revisions.patternId, sql.placeholder('patternId')), eq(revisions.number, sql.placeholder('number'))))
      .prepare(),
  };
});

/**
 * What the list shows of a pattern's head revision, worked out from its document and stored, so the
 * next list reads it with the page. Patterns are few per page and the work is done once per revision
 * that is listed (not per save: autosave makes many revisions nobody lists).
 */
async function fillPreview(d: Data, pattern: Pattern): Promise<PreviewRow | null> {
  const [stored] = await previewStatements(d).document.execute({ patternId: pattern.id, number: pattern.headRevision });
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
    const { patternPreviews } = d.t;
    const { patternId: _id, ...changes } = row;
    // A preview of an older revision never replaces a newer one (two lists may race).
    await d.db
      .insert(patternPreviews)
      .values(row)
      .onConflictDoUpdate({ target: patternPreviews.patternId, set: changes, setWhere: sql`excluded.revision_number >= ${patternPreviews.revisionNumber}` });
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

/** A page row as the page statement gives it (columns in its select order; times as ms or Dates). */
type PageRow = [id: string, ownerId: string, title: string, headRevision: number, createdAt: number | Date, updatedAt: number | Date, trashedAt: number | Date | null, ownerName: string, memberAccess: Access | null, total: number | string];
/** A preview row as the preview statement gives it. */
type PreviewRowArray = [patternId: string, revisionNumber: number, sectionCount: number, widthIn: number, heightIn: number, displayUnit: PreviewRow['displayUnit'], svg: string | null];

/** One page of the patterns a user owns or is a member of, with the total across pages. */
export async function listPatterns(d: Data, user: { id: string }, q: ListRequest) {
  const statements = listStatements(d)(d, q.scope, q.sort, q.order, Boolean(q.q));
  const params = { userId: user.id, like: q.q ? likeContains(q.q) : '' };
  const rows = (await statements.page({ ...params, limit: q.pageSize, offset: (q.page - 1) * q.pageSize })) as PageRow[];
  // The page carries the count over every row in scope; only a page past the end needs it on its own.
  const total = rows.length > 0 ? Number(rows[0][9]) : q.page > 1 ? ((await statements.total.execute(params))[0]?.n ?? 0) : 0;
  const previews = new Map<string, PreviewRowArray>();
  if (rows.length > 0) {
    const ids: Record<string, string> = {};
    for (let i = 0; i < rows.length; i++) ids[`id${i}`] = rows[i][0];
    for (const p of (await previewStatements(d).forPage(d, rows.length)(ids)) as PreviewRowArray[]) previews.set(p[0], p);
  }
  const items = [];
  for (const r of rows) {
    const pattern: Pattern = {
      id: r[0],
      ownerId: r[1],
      title: r[2],
      headRevision: r[3],
      createdAt: new Date(r[4]),
      updatedAt: new Date(r[5]),
      trashedAt: r[6] === null ? null : new Date(r[6]),
    };
    const stored = previews.get(pattern.id);
    const preview: PreviewRow | null =
      stored && stored[1] === pattern.headRevision
        ? { sectionCount: stored[2], widthIn: stored[3], heightIn: stored[4], displayUnit: stored[5], svg: stored[6] }
        : await fillPreview(d, pattern);
    items.push(listItem(pattern, r[7], r[1] === user.id ? 'owner' : (r[8] as Access), preview));
  }
  return { items, total, page: q.page, pageSize: q.pageSize };
}
