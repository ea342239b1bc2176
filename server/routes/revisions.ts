import { and, count, desc, eq, gte, lte } from 'drizzle-orm';
import type { PatternDocument } from '@seamwright/piecing';
import express, { type Router } from 'express';
import { pageQuerySchema, restoreBodySchema, revisionListQuerySchema, revisionNumberParamSchema, saveVersionBodySchema } from '@seamwright/api';
import type { AppContext } from '../app-context';
import { currentUser } from '../auth/sessions';
import { revisions, users } from '../db/schema';
import { HttpError } from '../http/errors';
import { parseOr400 } from '../http/validate';
import { patternOf } from '../http/pattern-access';
import { listRevisionGroups } from '../services/revision-groups';
import {
  findRevision,
  ownerName,
  patternJson,
  revisionJsonText,
  revisionSummary,
  saveRevision,
  sendPatternWithRevision,
  validDocument,
} from '../services/revisions';


/** `/api/patterns/:id/revisions…`: list, runs of saves, read, save a named version, restore. */
export function revisionsRouter(ctx: AppContext): Router {
  const { db } = ctx;
  const router = express.Router({ mergeParams: true });

  router.get('/', (req, res) => {
    const { pattern } = patternOf(res);
    const q = parseOr400(revisionListQuerySchema, req.query, 'Invalid query');
    const where = and(
      eq(revisions.patternId, pattern.id),
      q.from === undefined ? undefined : gte(revisions.number, q.from),
      q.to === undefined ? undefined : lte(revisions.number, q.to),
    );
    const total = db.select({ n: count() }).from(revisions).where(where).get()?.n ?? 0;
    const rows = db
      .select({ revision: revisions, authorName: users.displayName })
      .from(revisions)
      .innerJoin(users, eq(users.id, revisions.authorId))
      .where(where)
      .orderBy(desc(revisions.number))
      .limit(q.pageSize)
      .offset((q.page - 1) * q.pageSize)
      .all();
    res.json({ items: rows.map((r) => revisionSummary(r.revision, r.authorName)), total, page: q.page, pageSize: q.pageSize });
  });

  router.get('/groups', (req, res) => {
    const { pattern } = patternOf(res);
    const q = parseOr400(pageQuerySchema, req.query, 'Invalid query');
    res.json(listRevisionGroups(db, pattern.id, q.page, q.pageSize));
  });

  router.post('/', (req, res) => {
    const { pattern, access } = patternOf(res, 'edit');
    const user = currentUser(req);
    const body = parseOr400(saveVersionBodySchema, req.body);
    const document = body.document === undefined ? undefined : validDocument(body.document);
    const version = { name: body.name, note: body.note ? body.note : null };
    const saved = db.transaction(
      (tx) => {
        let doc = document;
        if (!doc) {
          const head = findRevision(tx, pattern.id);
          if (!head) throw new HttpError(500, 'Pattern has no revision');
          doc = JSON.parse(head.revision.document) as PatternDocument;
        }
        return saveRevision(tx, pattern.id, body.baseRevision, doc, user.id, { version, editSession: body.editSession });
      },
      { behavior: 'immediate' },
    );
    sendPatternWithRevision(res, 201, patternJson(saved.pattern, ownerName(db, saved.pattern.ownerId), access), saved.revision, user.displayName);
  });

  router.get('/:number', (req, res) => {
    const { pattern } = patternOf(res);
    const number = parseOr400(revisionNumberParamSchema, req.params.number, 'Invalid revision number');
    const found = findRevision(db, pattern.id, number);
    if (!found) throw new HttpError(404, 'Revision not found');
    res.type('application/json').send(`{"revision":${revisionJsonText(found.revision, found.authorName)}}`);
  });

  router.post('/:number/restore', (req, res) => {
    const { pattern, access } = patternOf(res, 'edit');
    const user = currentUser(req);
    const number = parseOr400(revisionNumberParamSchema, req.params.number, 'Invalid revision number');
    const body = parseOr400(restoreBodySchema, req.body);
    const saved = db.transaction(
      (tx) => {
        const found = findRevision(tx, pattern.id, number);
        if (!found) throw new HttpError(404, 'Revision not found');
        return saveRevision(tx, pattern.id, body.baseRevision, JSON.parse(found.revision.document), user.id, { restoredFrom: number });
      },
      { behavior: 'immediate' },
    );
    sendPatternWithRevision(res, 201, patternJson(saved.pattern, ownerName(db, saved.pattern.ownerId), access), saved.revision, user.displayName);
  });

  return router;
}
