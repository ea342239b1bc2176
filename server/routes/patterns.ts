import { and, eq } from 'drizzle-orm';
import express, { type Router } from 'express';
import { duplicateBodySchema, patternListQuerySchema } from '@seamwright/api';
import type { AppContext } from '../app-context';
import { currentUser, requireUser } from '../auth/sessions';
import { newId } from '../auth/tokens';
import type { Upload } from '../db/schema';
import { HttpError } from '../http/errors';
import { largeDocumentBody } from '../http/json-bodies';
import { parseOr400 } from '../http/validate';
import { patternOf, patternReadOf } from '../http/pattern-access';
import { sendJsonText } from '../http/send-json';
import { canDesign } from '../services/access';
import { fileStoreOf } from '../storage/file-store-of';
import { checkDocumentBody } from '../validation/document-body';
import { listPatterns } from '../services/pattern-list';
import { readAnswerText, saveAnswerText } from '../services/pattern-answers';
import {
  createPattern,
  findRevision,
  patternJson,
  sendPatternWithRevision,
  validDocument,
} from '../services/revisions';

/** Patterns: list, create, read, save, duplicate, trash, restore, delete. */
export function patternsRouter(ctx: AppContext): Router {
  const d = ctx.data;
  const router = express.Router();

  router.get('/', requireUser, async (req, res) => {
    const user = currentUser(req);
    const q = parseOr400(patternListQuerySchema, req.query, 'Invalid query');
    res.json(await listPatterns(d, user, q));
  });

  router.post('/', requireUser, async (req, res) => {
    const user = currentUser(req);
    if (!canDesign(user)) throw new HttpError(403, 'Only designers can create patterns');
    // A large body (raw bytes) is parsed, checked and stored in the validation pool (server/validation).
    const large = largeDocumentBody(req.body);
    if (large) {
      await ctx.documentChecks.answer(res, { kind: 'create', userId: user.id, displayName: user.displayName }, large);
      return;
    }
    const { document } = checkDocumentBody('create', req.body);
    const { pattern, revision } = await d.transaction((tx) => createPattern(tx, user.id, document));
    sendPatternWithRevision(res, 201, patternJson(pattern, user.displayName, 'owner'), revision, user.displayName);
  });

  router.get('/:id', (_req, res) => {
    // Pattern, access and latest revision come from one query (the pattern-access middleware).
    sendJsonText(res, 200, readAnswerText(patternReadOf(res)));
  });

  router.put('/:id', async (req, res) => {
    const found = patternOf(res, 'edit');
    const user = currentUser(req);
    // A large body (raw bytes) is parsed, checked and stored in the validation pool (server/validation).
    const large = largeDocumentBody(req.body);
    if (large) {
      await ctx.documentChecks.answer(res, { kind: 'save', patternId: found.pattern.id, access: found.access, userId: user.id, displayName: user.displayName }, large);
      return;
    }
    sendJsonText(res, 200, await saveAnswerText(d, found, user, req.body));
  });

  router.post('/:id/duplicate', async (req, res) => {
    const { pattern } = patternOf(res, 'edit');
    const user = currentUser(req);
    if (!canDesign(user)) throw new HttpError(403, 'Only designers can duplicate patterns');
    const body = parseOr400(duplicateBodySchema, req.body ?? {});
    const latest = await findRevision(d, pattern.id);
    if (!latest) throw new HttpError(500, 'Pattern has no revision');
    const source = JSON.parse(latest.revision.document) as Record<string, unknown> & { title: string };
    const title = body.title ?? `${source.title} (copy)`.slice(0, 120);
    const document = validDocument({ ...source, title });
    // The reference image travels with the copy as the new owner's own file.
    const ref = document.referenceImage;
    const { uploads } = d.t;
    let copied: { row: Upload; from: string } | undefined;
    if (ref) {
      const [upload] = await d.db.select().from(uploads).where(and(eq(uploads.id, ref.uploadId), eq(uploads.patternId, pattern.id)));
      if (upload) {
        const id = newId();
        const storagePath = `uploads/${user.id}/${id}${upload.storagePath.slice(upload.storagePath.lastIndexOf('.'))}`;
        copied = { row: { ...upload, id, uploaderId: user.id, storagePath, createdAt: new Date() }, from: upload.storagePath };
        document.referenceImage = { ...ref, uploadId: id };
      } else delete document.referenceImage;
    }
    // The file is copied before the transaction (a SQLite transaction awaits only the database).
    if (copied) await fileStoreOf(ctx).copy(copied.from, copied.row.storagePath);
    const created = await d.transaction(async (tx) => {
      const made = await createPattern(tx, user.id, document);
      if (copied) await tx.db.insert(tx.t.uploads).values({ ...copied.row, patternId: made.pattern.id });
      return made;
    });
    sendPatternWithRevision(res, 201, patternJson(created.pattern, user.displayName, 'owner'), created.revision, user.displayName);
  });

  router.post('/:id/trash', async (req, res) => {
    const { pattern } = patternOf(res, 'owner');
    const { patterns } = d.t;
    const [updated] = await d.db
      .update(patterns)
      .set({ trashedAt: pattern.trashedAt ?? new Date() })
      .where(eq(patterns.id, pattern.id))
      .returning();
    if (!updated) throw new HttpError(404, 'Pattern not found');
    res.json({ pattern: patternJson(updated, currentUser(req).displayName, 'owner') });
  });

  router.post('/:id/restore', async (req, res) => {
    const { pattern } = patternOf(res, 'owner');
    const { patterns } = d.t;
    const [updated] = await d.db.update(patterns).set({ trashedAt: null }).where(eq(patterns.id, pattern.id)).returning();
    if (!updated) throw new HttpError(404, 'Pattern not found');
    res.json({ pattern: patternJson(updated, currentUser(req).displayName, 'owner') });
  });

  router.delete('/:id', async (req, res) => {
    const { pattern } = patternOf(res, 'owner');
    if (!pattern.trashedAt) throw new HttpError(409, 'Move the pattern to the trash before deleting it for good');
    const { files, setIds } = await d.transaction(async (tx) => {
      const { patterns, printSets, uploads } = tx.t;
      const sets = await tx.db.select({ id: printSets.id, p: printSets.storagePath }).from(printSets).where(eq(printSets.patternId, pattern.id));
      const paths = [...(await tx.db.select({ p: uploads.storagePath }).from(uploads).where(eq(uploads.patternId, pattern.id))), ...sets].map((r) => r.p);
      // Revisions, members, invitations, sewing log, uploads and print-set rows go by cascade.
      await tx.db.delete(patterns).where(eq(patterns.id, pattern.id));
      return { files: paths, setIds: sets.map((s) => s.id) };
    });
    // Their renders stop too (a queued set leaves its queue); nothing of theirs is stored.
    for (const id of setIds) ctx.printSets.cancel(id);
    // The rows are gone; files whose removal fails here are swept at the next start-up.
    await fileStoreOf(ctx)
      .remove(files.filter((f): f is string => typeof f === 'string' && f.length > 0))
      .catch((err: unknown) => ctx.log('Removing a deleted pattern\'s files failed; the start-up sweep will', err));
    res.status(204).end();
  });

  return router;
}
