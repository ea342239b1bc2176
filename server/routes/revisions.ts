import { and, count, desc, eq, gte, lte } from 'drizzle-orm';
import express, { type Router } from 'express';
import { pageQuerySchema, restoreBodySchema, revisionListQuerySchema, revisionNumberParamSchema } from '@seamwright/api';
import type { AppContext } from '../app-context';
import { currentUser } from '../auth/sessions';
import { HttpError } from '../http/errors';
import { largeDocumentBody } from '../http/json-bodies';
import { parseOr400 } from '../http/validate';
import { patternOf } from '../http/pattern-access';
import { listRevisionGroups } from '../services/revision-groups';
import { checkVersionBody } from '../validation/document-body';
import { DocumentText } from '../validation/valid-document';
import { saveVersion } from '../validation/version-save';
import {
  findRevision,
  ownerName,
  patternJson,
  revisionJsonText,
  revisionSummary,
  saveRevision,
  sendPatternWithRevision,
} from '../services/revisions';


/** `/api/patterns/:id/revisions…`: list, runs of saves, read, save a named version, restore. */
export function revisionsRouter(ctx: AppContext): Router {
  const d = ctx.data;
  const router = express.Router({ mergeParams: true });

  router.get('/', async (req, res) => {
    const { pattern } = patternOf(res);
    const q = parseOr400(revisionListQuerySchema, req.query, 'Invalid query');
    const { revisions, users } = d.t;
    const where = and(
      eq(revisions.patternId, pattern.id),
      q.from === undefined ? undefined : gte(revisions.number, q.from),
      q.to === undefined ? undefined : lte(revisions.number, q.to),
    );
    const total = (await d.db.select({ n: count() }).from(revisions).where(where))[0]?.n ?? 0;
    const rows = await d.db
      .select({ revision: revisions, authorName: users.displayName })
      .from(revisions)
      .innerJoin(users, eq(users.id, revisions.authorId))
      .where(where)
      .orderBy(desc(revisions.number))
      .limit(q.pageSize)
      .offset((q.page - 1) * q.pageSize);
    res.json({ items: rows.map((r) => revisionSummary(r.revision, r.authorName)), total, page: q.page, pageSize: q.pageSize });
  });

  router.get('/groups', async (req, res) => {
    const { pattern } = patternOf(res);
    const q = parseOr400(pageQuerySchema, req.query, 'Invalid query');
    res.json(await listRevisionGroups(d, pattern.id, q.page, q.pageSize));
  });

  router.post('/', async (req, res) => {
    const { pattern, access } = patternOf(res, 'edit');
    const user = currentUser(req);
    // A large body (raw bytes) is parsed, checked and stored in the validation pool (server/validation).
    const large = largeDocumentBody(req.body);
    if (large) {
      await ctx.documentChecks.answer(res, { kind: 'version', patternId: pattern.id, access, userId: user.id, displayName: user.displayName }, large);
      return;
    }
    const body = checkVersionBody(req.body);
    const saved = await d.transaction((tx) => saveVersion(tx, pattern.id, body, user.id));
    sendPatternWithRevision(res, 201, patternJson(saved.pattern, await ownerName(d, saved.pattern.ownerId), access), saved.revision, user.displayName);
  });

  router.get('/:number', async (req, res) => {
    const { pattern } = patternOf(res);
    const number = parseOr400(revisionNumberParamSchema, req.params.number, 'Invalid revision number');
    const found = await findRevision(d, pattern.id, number);
    if (!found) throw new HttpError(404, 'Revision not found');
    res.type('application/json').send(`{"revision":${revisionJsonText(found.revision, found.authorName)}}`);
  });

  router.post('/:number/restore', async (req, res) => {
    const { pattern, access } = patternOf(res, 'edit');
    const user = currentUser(req);
    const number = parseOr400(revisionNumberParamSchema, req.params.number, 'Invalid revision number');
    const body = parseOr400(restoreBodySchema, req.body);
    const saved = await d.transaction(async (tx) => {
      const found = await findRevision(tx, pattern.id, number);
      if (!found) throw new HttpError(404, 'Revision not found');
      // The stored text is copied as it is, not parsed and written out again (a large document took the request thread for tens of ms).
      return saveRevision(tx, pattern.id, body.baseRevision, DocumentText.stored(found.revision.document), user.id, { restoredFrom: number });
    });
    sendPatternWithRevision(res, 201, patternJson(saved.pattern, await ownerName(d, saved.pattern.ownerId), access), saved.revision, user.displayName);
  });

  return router;
}
