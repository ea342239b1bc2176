/**
 * `POST /api/patterns/:id/revisions` (save a named version) as one step shared by the request thread
 * (a small body) and the validation pool's worker (a large one), so both store and answer alike
 * (docs/design-notes.md#where-documents-are-checked).
 */
import type { Data } from '../db/data';
import { HttpError } from '../http/errors';
import { findRevision, saveRevision } from '../services/revisions';
import type { CheckedVersionBody } from './document-body';
import { DocumentText } from './valid-document';

/**
 * Stores a named version of `document`, or of the latest revision when the body has none. Run inside a
 * transaction (a stale base gets saveRevision's 409). The latest revision's text is copied as
 * stored, not parsed and written out again (`DocumentText.stored`).
 */
export async function saveVersion(tx: Data, patternId: string, body: CheckedVersionBody, authorId: string) {
  const { fields } = body;
  let document = body.document;
  if (!document) {
    const head = await findRevision(tx, patternId);
    if (!head) throw new HttpError(500, 'Pattern has no revision');
    document = DocumentText.stored(head.revision.document);
  }
  const version = { name: fields.name, note: fields.note ? fields.note : null };
  return saveRevision(tx, patternId, fields.baseRevision, document, authorId, { version, editSession: fields.editSession });
}
