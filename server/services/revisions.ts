import { and, desc, eq, sql } from 'drizzle-orm';
import type { PatternDocument } from '@seamwright/piecing';
import type { Response } from 'express';
import type { DbLike } from '../db/database';
import { connectionOf, preparedPerDb } from '../db/prepared';
import { patterns, revisions, users, type Pattern, type Revision } from '../db/schema';
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
export function findRevision(db: DbLike, patternId: string, number?: number) {
  const q = revisionQueries(db);
  return number === undefined ? q.latest.get({ patternId }) : q.numbered.get({ patternId, number });
}

export function ownerName(db: DbLike, ownerId: string): string {
  return revisionQueries(db).displayName.get({ id: ownerId })?.n ?? '';
}

/** The read path runs these on every pattern load. */
const revisionQueries = preparedPerDb((db) => {
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

/** Creates a pattern with revision 1 in one transaction. */
export function createPattern(db: DbLike, ownerId: string, checked: PatternDocument | DocumentText) {
  const document = stored(checked);
  const now = new Date();
  const id = newId();
  const pattern = db
    .insert(patterns)
    .values({ id, ownerId, title: document.title, headRevision: 1, createdAt: now, updatedAt: now })
    .returning()
    .get();
  const revision = db
    .insert(revisions)
    .values({ id: newId(), patternId: id, number: 1, document: document.json, authorId: ownerId, groupStart: 1, createdAt: now })
    .returning()
    .get();
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

/** A pattern row as SQLite gives it (times in ms). */
interface PatternRow {
  id: string;
  ownerId: string;
  headRevision: number;
  createdAt: number;
  trashedAt: number | null;
}

/**
 * A save's statements, prepared once on the connection (the save runs several per request inside its
 * transaction): plain SQL, no query building or row mapping per call.
 */
const saveStatements = preparedPerDb((db) => {
  const sqlite = connectionOf(db);
  return {
    pattern: sqlite.prepare<[string], PatternRow>(
      'SELECT id, owner_id AS ownerId, head_revision AS headRevision, created_at AS createdAt, trashed_at AS trashedAt FROM patterns WHERE id = ?',
    ),
    head: sqlite.prepare<[string, number], { number: number; authorId: string; editSession: string | null; versionName: string | null; groupStart: number | null }>(
      `SELECT number, author_id AS authorId, edit_session AS editSession, version_name AS versionName, group_start AS groupStart
         FROM revisions WHERE pattern_id = ? AND number = ?`,
    ),
    insert: sqlite.prepare(
      `INSERT INTO revisions (id, pattern_id, number, document, author_id, restored_from, edit_session, group_start, version_name, version_note, created_at)
       VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`,
    ),
    advance: sqlite.prepare('UPDATE patterns SET head_revision = ?, title = ?, updated_at = ? WHERE id = ?'),
  };
});

/**
 * Stores a new revision on top of `baseRevision`. Run inside an immediate transaction: the head is
 * read and advanced under the write lock, so of two saves on the same base exactly one wins and the
 * other gets 409 with the latest revision.
 */
export function saveRevision(
  tx: DbLike,
  patternId: string,
  baseRevision: number,
  checked: PatternDocument | DocumentText,
  authorId: string,
  extras: SaveExtras = {},
) {
  const document = stored(checked);
  const q = saveStatements(tx);
  const row = q.pattern.get(patternId);
  if (!row) throw new HttpError(404, 'Pattern not found');
  if (row.trashedAt !== null) throw new HttpError(409, 'This pattern is in the trash; restore it before saving');
  if (row.headRevision !== baseRevision) {
    const latest = findRevision(tx, patternId);
    throw new HttpError(409, `This pattern was saved by someone else since revision ${baseRevision}`, {
      latest: latest ? revisionJson(latest.revision, latest.authorName) : null,
    });
  }
  const now = new Date();
  const number = row.headRevision + 1;
  const head = q.head.get(patternId, row.headRevision);
  const editSession = extras.editSession ?? null;
  const version = extras.version ?? null;
  const groupStart = groupStartOf(head, { number, authorId, editSession, named: version !== null });
  // Written without RETURNING: every value is known here, and reading the row back would copy the
  // whole document out of SQLite again only to build the answer from it.
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
  const r = revision;
  q.insert.run(r.id, r.patternId, r.number, r.document, r.authorId, r.restoredFrom, r.editSession, r.groupStart, r.versionName, r.versionNote, now.getTime());
  q.advance.run(number, document.title, now.getTime(), patternId);
  const updated: Pattern = {
    id: row.id,
    ownerId: row.ownerId,
    title: document.title,
    headRevision: number,
    createdAt: new Date(row.createdAt),
    updatedAt: now,
    trashedAt: null,
  };
  return { pattern: updated, revision };
}
