import { and, desc, eq, isNull, sql } from 'drizzle-orm';
import type { PatternDocument } from '@seamwright/piecing';
import type { Response } from 'express';
import type { Data } from '../db/data';
import { preparedOn } from '../db/prepared';
import type { Pattern, Revision } from '../db/schema';
import { HttpError } from '../http/errors';
import { sendJsonText } from '../http/send-json';
import { newId } from '../auth/tokens';
import type { Access } from './access';
import { groupStartOf, versionJson } from './revision-groups';
import { DocumentText } from '../validation/valid-document';

export { validDocument } from '../validation/valid-document';

/** A document as the database stores it: from the validation pool as text already, or an object to write out. */
function stored(document: PatternDocument | DocumentText): DocumentText {
  return document instanceof DocumentText ? document : DocumentText.of(document);
}

export function revisionSummary(r: Revision, authorName: string) {
  return {
    id: r.id,
    number: r.number,
    author: { id: r.authorId, displayName: authorName },
    restoredFrom: r.restoredFrom,
    version: versionJson(r),
    createdAt: r.createdAt.toISOString(),
  };
}

export function revisionJson(r: Revision, authorName: string) {
  return { ...revisionSummary(r, authorName), document: JSON.parse(r.document) as PatternDocument };
}

/**
 * A revision as JSON text with its stored document spliced in as is: the document was written by
 * JSON.stringify after validation, so parsing and re-serialising it on every read would only cost time.
 */
export function revisionJsonText(r: Revision, authorName: string): string {
  const meta = JSON.stringify(revisionSummary(r, authorName));
  return `${meta.slice(0, -1)},"document":${r.document}}`;
}

/** Sends `{ pattern, revision }` (the answer of reads and saves) without re-serialising the document. */
export function sendPatternWithRevision(res: Response, status: number, pattern: ReturnType<typeof patternJson>, revision: Revision, authorName: string): void {
  sendJsonText(res, status, patternWithRevisionText(pattern, revision, authorName));
}

/** The JSON text of `{ pattern, revision }` (the validation pool writes a save's answer with it too). */
export function patternWithRevisionText(pattern: ReturnType<typeof patternJson>, revision: Revision, authorName: string): string {
  return `{"pattern":${JSON.stringify(pattern)},"revision":${revisionJsonText(revision, authorName)}}`;
}

export function patternJson(p: Pattern, ownerName: string, access: Access) {
  return {
    id: p.id,
    title: p.title,
    owner: { id: p.ownerId, displayName: ownerName },
    access,
    headRevision: p.headRevision,
    createdAt: p.createdAt.toISOString(),
    updatedAt: p.updatedAt.toISOString(),
    trashedAt: p.trashedAt ? p.trashedAt.toISOString() : null,
  };
}

/** A revision with its author's name, by pattern and number (latest when number is omitted). */
export async function findRevision(d: Data, patternId: string, number?: number): Promise<{ revision: Revision; authorName: string } | undefined> {
  const q = revisionQueries(d);
  const rows = number === undefined ? await q.latest.execute({ patternId }) : await q.numbered.execute({ patternId, number });
  return rows[0];
}

export async function ownerName(d: Data, ownerId: string): Promise<string> {
  return (await revisionQueries(d).displayName.execute({ id: ownerId }))[0]?.n ?? '';
}

/** The read path runs these on every pattern load. */
const revisionQueries = preparedOn((db, { revisions, users }) => {
  const withAuthor = () =>
    db.select({ revision: revisions, authorName: users.displayName }).from(revisions).innerJoin(users, eq(users.id, revisions.authorId));
  const patternId = sql.placeholder('patternId');
  return {
    latest: withAuthor().where(eq(revisions.patternId, patternId)).orderBy(desc(revisions.number)).limit(1).prepare(),
    numbered: withAuthor()
      .where(and(eq(revisions.patternId, patternId), eq(revisions.number, sql.placeholder('number'))))
      .prepare(),
    displayName: db.select({ n: users.displayName }).from(users).where(eq(users.id, sql.placeholder('id'))).prepare(),
  };
});

/** Creates a pattern with revision 1 (run inside a transaction: both rows or neither). */
export async function createPattern(d: Data, ownerId: string, checked: PatternDocument | DocumentText) {
  const { patterns, revisions } = d.t;
  const document = stored(checked);
  const now = new Date();
  const id = newId();
  const [pattern] = await d.db
    .insert(patterns)
    .values({ id, ownerId, title: document.title, headRevision: 1, createdAt: now, updatedAt: now })
    .returning();
  const [revision] = await d.db
    .insert(revisions)
    .values({ id: newId(), patternId: id, number: 1, document: document.json, authorId: ownerId, groupStart: 1, createdAt: now })
    .returning();
  return { pattern, revision };
}

/** What a save records beside its document. */
export interface SaveExtras {
  /** The revision a restore copies. */
  restoredFrom?: number | null;
  /** The editing session that sends the save (autosave from one opening of the board). */
  editSession?: string | null;
  /** Makes the revision a named version. */
  version?: { name: string; note: string | null } | null;
}

/** A save's statements, prepared once per connection (a save runs several inside its transaction). */
const saveStatements = preparedOn((db, { patterns, revisions }) => ({
  /**
   * Advances the head from the save's base, only if it is still the head and the pattern is not in
   * the trash: a compare-and-set. On PostgreSQL a second save on the same base waits here for the
   * first one's row lock and, once that commits, finds the head moved on and changes nothing.
   */
  advance: db
    .update(patterns)
    .set({ headRevision: sql`${patterns.headRevision} + 1`, title: sql`${sql.placeholder('title')}`, updatedAt: sql`${sql.placeholder('now')}` })
    .where(and(eq(patterns.id, sql.placeholder('id')), eq(patterns.headRevision, sql.placeholder('base')), isNull(patterns.trashedAt)))
    .returning({ ownerId: patterns.ownerId, createdAt: patterns.createdAt })
    .prepare(),
  pattern: db
    .select({ headRevision: patterns.headRevision, trashedAt: patterns.trashedAt })
    .from(patterns)
    .where(eq(patterns.id, sql.placeholder('id')))
    .prepare(),
  head: db
    .select({
      number: revisions.number,
      authorId: revisions.authorId,
      editSession: revisions.editSession,
      versionName: revisions.versionName,
      groupStart: revisions.groupStart,
    })
    .from(revisions)
    .where(and(eq(revisions.patternId, sql.placeholder('patternId')), eq(revisions.number, sql.placeholder('number'))))
    .prepare(),
}));

/**
 * Stores a new revision on top of `baseRevision`. Run inside a transaction: the head is advanced
 * from the base only if it is still the head (one conditional UPDATE, under SQLite's write lock or
 * PostgreSQL's row lock), so of two saves on the same base exactly one wins and the other gets 409
 * with the latest revision.
 */
export async function saveRevision(
  tx: Data,
  patternId: string,
  baseRevision: number,
  checked: PatternDocument | DocumentText,
  authorId: string,
  extras: SaveExtras = {},
) {
  const document = stored(checked);
  const q = saveStatements(tx);
  const now = new Date();
  // Dates go in as the column stores them (the placeholder skips the column's own mapping).
  const nowValue = tx.dialect === 'sqlite' ? now.getTime() : now.toISOString();
  const [row] = await q.advance.execute({ id: patternId, base: baseRevision, title: document.title, now: nowValue });
  if (!row) {
    const [current] = await q.pattern.execute({ id: patternId });
    if (!current) throw new HttpError(404, 'Pattern not found');
    if (current.trashedAt !== null) throw new HttpError(409, 'This pattern is in the trash; restore it before saving');
    const latest = await findRevision(tx, patternId);
    throw new HttpError(409, `This pattern was saved by someone else since revision ${baseRevision}`, {
      latest: latest ? revisionJson(latest.revision, latest.authorName) : null,
    });
  }
  const number = baseRevision + 1;
  const [head] = await q.head.execute({ patternId, number: baseRevision });
  const editSession = extras.editSession ?? null;
  const version = extras.version ?? null;
  const groupStart = groupStartOf(head, { number, authorId, editSession, named: version !== null });
  // Written without RETURNING: every value is known here, and reading the row back would copy the
  // whole document out of the database again only to build the answer from it.
  const revision: Revision = {
    id: newId(),
    patternId,
    number,
    document: document.json,
    authorId,
    restoredFrom: extras.restoredFrom ?? null,
    editSession,
    groupStart,
    versionName: version?.name ?? null,
    versionNote: version?.note ?? null,
    createdAt: now,
  };
  await tx.db.insert(tx.t.revisions).values(revision);
  const updated: Pattern = {
    id: patternId,
    ownerId: row.ownerId,
    title: document.title,
    headRevision: number,
    createdAt: new Date(row.createdAt),
    updatedAt: now,
    trashedAt: null,
  };
  return { pattern: updated, revision };
}
