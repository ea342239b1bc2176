import { count, desc, eq } from 'drizzle-orm';
import express, { type Router } from 'express';
import { z } from 'zod';
import type { AppContext } from '../app-context';
import { currentUser } from '../auth/sessions';
import { revisions, users } from '../db/schema';
import { HttpError } from '../http/errors';
import { pagingQuery } from '../http/paging';
import { parseOr400 } from '../http/validate';
import { resolvePatternAccess } from '../services/access';
import { findRevision, ownerName, patternJson, revisionJsonText, revisionSummary, saveRevision, sendPatternWithRevision } from '../services/revisions';

const listQuery = z.strictObject(pagingQuery);
const numberParam = z.coerce.number().int().min(1).max(1_000_000_000);
const restoreBody = z.strictObject({ baseRevision: z.number().int().min(1) });

/** `/api/patterns/:id/revisions…`: list, read, restore. */
export function revisionsRouter(ctx: AppContext): Router {
  const { db } = ctx;
  const router = express.Router({ mergeParams: true });

  router.get('/', (req, res) => {
    const { pattern } = resolvePatternAccess(db, req.user, (req.params as { id?: string }).id);
    const q = parseOr400(listQuery, req.query, 'Invalid query');
    const total = db.select({ n: count() }).from(revisions).where(eq(revisions.patternId, pattern.id)).get()?.n ?? 0;
    const rows = db
      .select({ revision: revisions, authorName: users.displayName })
      .from(revisions)
      .innerJoin(users, eq(users.id, revisions.authorId))
      .where(eq(revisions.patternId, pattern.id))
      .orderBy(desc(revisions.number))
      .limit(q.pageSize)
      .offset((q.page - 1) * q.pageSize)
      .all();
    res.json({ items: rows.map((r) => revisionSummary(r.revision, r.authorName)), total, page: q.page, pageSize: q.pageSize });
  });

  router.get('/:number', (req, res) => {
    const { pattern } = resolvePatternAccess(db, req.user, (req.params as { id?: string }).id);
    const number = parseOr400(numberParam, req.params.number, 'Invalid revision number');
    const found = findRevision(db, pattern.id, number);
    if (!found) throw new HttpError(404, 'Revision not found');
    res.type('application/json').send(`{"revision":${revisionJsonText(found.revision, found.authorName)}}`);
  });

  router.post('/:number/restore', (req, res) => {
    const { pattern, access } = resolvePatternAccess(db, req.user, (req.params as { id?: string }).id, 'edit');
    const user = currentUser(req);
    const number = parseOr400(numberParam, req.params.number, 'Invalid revision number');
    const body = parseOr400(restoreBody, req.body);
    const saved = db.transaction(
      (tx) => {
        const found = findRevision(tx, pattern.id, number);
        if (!found) throw new HttpError(404, 'Revision not found');
        return saveRevision(tx, pattern.id, body.baseRevision, JSON.parse(found.revision.document), user.id, number);
      },
      { behavior: 'immediate' },
    );
    sendPatternWithRevision(res, 201, patternJson(saved.pattern, ownerName(db, saved.pattern.ownerId), access), saved.revision, user.displayName);
  });

  return router;
}
