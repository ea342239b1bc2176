/**
 * The answers of the busiest pattern routes — read, save — as JSON text, written once and used both
 * by the Express routes (server/routes/patterns.ts) and by the hot routes in front of Express
 * (server/http/hot-routes.ts), so the two answer the same bytes.
 */
import type { User, Revision } from '../db/schema';
import type { Data } from '../db/data';
import { HttpError } from '../http/errors';
import { checkDocumentBody } from '../validation/document-body';
import type { PatternAccess, PatternRead } from './access';
import { ownerName, patternJson, patternWithRevisionText, saveRevision } from './revisions';

/** `GET /api/patterns/:id`: the pattern and its latest revision, loaded in one query by `loadPatternRead`. */
export function readAnswerText(read: PatternRead): string {
  const { pattern, access, ownerName: owner, row } = read;
  if (row.revId === null) throw new HttpError(500, 'Pattern has no revision');
  const revision: Revision = {
    id: row.revId,
    patternId: pattern.id,
    number: row.revNumber,
    document: row.revDocument,
    authorId: row.revAuthorId,
    restoredFrom: row.revRestoredFrom,
    editSession: row.revEditSession,
    groupStart: row.revGroupStart,
    versionName: row.revVersionName,
    versionNote: row.revVersionNote,
    createdAt: new Date(row.revCreatedAt),
  };
  return patternWithRevisionText(patternJson(pattern, owner, access), revision, row.revAuthorName);
}

/**
 * `PUT /api/patterns/:id` with a body parsed on the request thread: checks it (400 with zod's details),
 * stores the new revision in one transaction (409 when stale or trashed) and answers the
 * saved pattern and revision. The caller has checked access (`edit`) already.
 */
export async function saveAnswerText(d: Data, found: PatternAccess, user: User, body: unknown): Promise<string> {
  const { fields, document } = checkDocumentBody('save', body);
  const saved = await d.transaction((tx) =>
    saveRevision(tx, found.pattern.id, fields.baseRevision, document, user.id, { editSession: fields.editSession }),
  );
  return patternWithRevisionText(patternJson(saved.pattern, await ownerName(d, saved.pattern.ownerId), found.access), saved.revision, user.displayName);
}
