import { and, eq } from 'drizzle-orm';
import express, { type Router } from 'express';
import { sectionIdParamSchema, sewingStageBodySchema } from '@seamwright/api';
import type { AppContext } from '../app-context';
import { currentUser } from '../auth/sessions';
import type { Tables } from '../db/data';
import { HttpError } from '../http/errors';
import { parseOr400 } from '../http/validate';
import { patternOf } from '../http/pattern-access';
import { findRevision } from '../services/revisions';


const entryJson = (e: Tables['sewingLog']['$inferSelect']) => ({ sectionId: e.sectionId, copy: e.copy, stage: e.stage, updatedAt: e.updatedAt.toISOString() });

/** What the route reads of the latest revision: each section's ring repeat, and the block count. */
interface LoggedDocument {
  blockCount?: number;
  sections: { id: string; ringRepeat?: { count: number } }[];
}

/**
 * `/api/patterns/:id/sewing-log`: the signed-in user's progress on a pattern, one stage per copy of each
 * section (ring repeats × blocks: 8 ring copies of B are 8 things to sew), see docs/api.md.
 */
export function sewingLogRouter(ctx: AppContext): Router {
  const d = ctx.data;
  const { sewingLog } = d.t;
  const router = express.Router({ mergeParams: true });

  router.get('/', async (req, res) => {
    const { pattern } = patternOf(res);
    const user = currentUser(req);
    const rows = await d.db
      .select()
      .from(sewingLog)
      .where(and(eq(sewingLog.patternId, pattern.id), eq(sewingLog.userId, user.id)))
      .orderBy(sewingLog.sectionId, sewingLog.copy);
    res.json({ entries: rows.map(entryJson) });
  });

  router.put('/:sectionId', async (req, res) => {
    const { pattern } = patternOf(res);
    const user = currentUser(req);
    const sectionId = parseOr400(sectionIdParamSchema, req.params.sectionId, 'Invalid section id');
    const body = parseOr400(sewingStageBodySchema, req.body);
    const latest = await findRevision(d, pattern.id);
    const doc: LoggedDocument = latest ? (JSON.parse(latest.revision.document) as LoggedDocument) : { sections: [] };
    const section = doc.sections.find((s) => s.id === sectionId);
    if (!section) {
      throw new HttpError(400, 'No such section in the latest revision', [{ path: 'sectionId', message: `unknown section "${sectionId}"` }]);
    }
    const copies = (section.ringRepeat?.count ?? 1) * (doc.blockCount ?? 1);
    if (body.copy > copies) {
      throw new HttpError(400, 'No such copy of the section', [{ path: 'copy', message: `section has ${copies} ${copies === 1 ? 'copy' : 'copies'}` }]);
    }
    const key = and(eq(sewingLog.patternId, pattern.id), eq(sewingLog.userId, user.id), eq(sewingLog.sectionId, sectionId), eq(sewingLog.copy, body.copy));
    if (body.stage === null) {
      await d.db.delete(sewingLog).where(key);
      res.json({ entry: null });
      return;
    }
    const [entry] = await d.db
      .insert(sewingLog)
      .values({ patternId: pattern.id, userId: user.id, sectionId, copy: body.copy, stage: body.stage, updatedAt: new Date() })
      .onConflictDoUpdate({
        target: [sewingLog.patternId, sewingLog.userId, sewingLog.sectionId, sewingLog.copy],
        set: { stage: body.stage, updatedAt: new Date() },
      })
      .returning();
    res.json({ entry: entryJson(entry) });
  });

  return router;
}
