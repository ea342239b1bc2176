import { and, count, desc, eq, inArray } from 'drizzle-orm';
import express, { type Request, type Response, type Router } from 'express';
import { printSetBodySchema } from '@seamwright/api';
import { applyFabricChoice, findUnsewableSections, printOptionsSchema, quiltPrintDocument, quiltPrintIssues, unsewableStatement, type PatternDocument, type UnsewableSection } from '@seamwright/piecing';
import type { AppContext } from '../app-context';
import { currentUser } from '../auth/sessions';
import { newId } from '../auth/tokens';
import type { PrintSet } from '../db/schema';
import { HttpError, zodDetails } from '../http/errors';
import { idSchema, parseOr400 } from '../http/validate';
import { patternOf } from '../http/pattern-access';
import { estimateTemplateSheets, MAX_PRINT_SHEETS } from '../print/print-budget';
import { fileStoreOf } from '../storage/file-store-of';
import { sendStoredFile } from '../storage/send-stored';
import { isShopBuyer } from '../services/access';
import { findOwnCopy } from '../services/colourway-copies';
import { findRevision } from '../services/revisions';


/** A quilter's colourway copy as stored with a print set's options: a snapshot of its fabrics when requested. */
interface StoredCopy {
  id: string;
  name: string;
  fabrics: Record<string, { name: string; colour: string }>;
}

/** The stored options as answered: a colourway copy shows its id and name only (its fabrics are in the PDF). */
function optionsJson(text: string): Record<string, unknown> {
  const { colourwayCopy, ...options } = JSON.parse(text) as Record<string, unknown> & { colourwayCopy?: StoredCopy };
  return colourwayCopy ? { ...options, colourwayCopy: { id: colourwayCopy.id, name: colourwayCopy.name } } : options;
}

function printSetJson(s: PrintSet, creatorName: string) {
  return {
    id: s.id,
    patternId: s.patternId,
    revision: s.revisionNumber,
    options: optionsJson(s.options),
    status: s.status,
    progress: s.progress,
    error: s.error,
    sheets: s.sheets,
    templateSheets: s.templateSheets,
    lowerBoundSheets: s.lowerBoundSheets,
    bytes: s.bytes,
    sha256: s.sha256,
    createdBy: { id: s.createdBy, displayName: creatorName },
    createdAt: s.createdAt.toISOString(),
    finishedAt: s.finishedAt ? s.finishedAt.toISOString() : null,
    url: `/api/patterns/${s.patternId}/print-sets/${s.id}/file`,
  };
}

/** A file name for the download: ASCII letters, digits and dashes. */
const fileSlug = (title: string) =>
  title
    .normalize('NFKD')
    .replace(/[^\x20-\x7e]/g, '')
    .replace(/[^A-Za-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 60) || 'print-set';

/**
 * The printed sections not sewable as numbered (all sections, or those asked for). A stored document
 * that cannot be read is left to the render, which fails the set with the reason.
 */
function unsewableSections(document: PatternDocument, sectionIds: readonly string[] | undefined): UnsewableSection[] {
  const wanted = sectionIds ? new Set(sectionIds) : null;
  try {
    return findUnsewableSections({ sections: document.sections.filter((s) => !wanted || wanted.has(s.id)) });
  } catch {
    return [];
  }
}

/** `/api/patterns/:id/print-sets…`: render, list, follow, download and delete print sets. */
export function printSetsRouter(ctx: AppContext): Router {
  const { config } = ctx;
  const d = ctx.data;
  const { printSets, users } = d.t;
  const router = express.Router({ mergeParams: true });
  const files = fileStoreOf(ctx);

  // A shop buyer reaches only their own print sets (issue 15: buyers never see each other).
  const onlyBy = async (req: Request, res: Response): Promise<string | undefined> => {
    const user = currentUser(req);
    return (await isShopBuyer(ctx.data, patternOf(res), user.id)) ? user.id : undefined;
  };

  const readSet = async (setId: string, patternId: string, createdBy?: string) =>
    (
      await d.db
        .select({ set: printSets, creatorName: users.displayName })
        .from(printSets)
        .innerJoin(users, eq(users.id, printSets.createdBy))
        .where(and(eq(printSets.id, setId), eq(printSets.patternId, patternId), createdBy ? eq(printSets.createdBy, createdBy) : undefined))
    )[0];

  const findSet = async (patternId: string, raw: unknown, createdBy?: string) => {
    const setId = parseOr400(idSchema, raw, 'Invalid print-set id');
    const row = await readSet(setId, patternId, createdBy);
    if (!row) throw new HttpError(404, 'Print set not found');
    return row;
  };

  router.post('/', async (req, res) => {
    const { pattern } = patternOf(res);
    const user = currentUser(req);
    const body = parseOr400(printSetBodySchema, req.body ?? {});
    // A colourway copy must be the caller's own copy of this pattern (anyone else's is not found).
    const copy = body.colourwayCopyId === undefined ? null : await findOwnCopy(ctx.data, user.id, pattern.id, body.colourwayCopyId);
    if (copy && body.options['colourwayId'] !== undefined) {
      throw new HttpError(400, 'Invalid print options', [{ path: 'options.colourwayId', message: 'choose a colourway or a colourway copy, not both' }]);
    }
    const [counted] = await d.db
      .select({ n: count() })
      .from(printSets)
      .where(and(eq(printSets.createdBy, user.id), inArray(printSets.status, ['queued', 'rendering'])));
    const waiting = Number(counted?.n ?? 0);
    if (waiting >= config.printQueuePerUser) {
      throw new HttpError(429, 'Too many print sets are still rendering; wait for them to finish', { waiting });
    }
    const revision = await findRevision(d, pattern.id, body.revision);
    if (!revision) throw new HttpError(404, 'Revision not found');
    // The PDF's date comes from the revision, so the same revision and options give the same bytes.
    const parsed = printOptionsSchema.safeParse({
      ...body.options,
      ...(body.printUnsewable !== undefined ? { printUnsewable: body.printUnsewable } : {}),
      createdAt: revision.revision.createdAt.toISOString(),
    });
    if (!parsed.success) {
      throw new HttpError(
        400,
        'Invalid print options',
        zodDetails(parsed.error).map((d) => ({ ...d, path: d.path ? `options.${d.path}` : 'options' })),
      );
    }
    // The size budget, before anything is queued (the stored document was validated when saved).
    const stored = JSON.parse(revision.revision.document) as PatternDocument;
    // A quilt size and colourway must be the pattern's own; the set is then for the whole quilt in that size.
    const quiltIssues = quiltPrintIssues(stored, parsed.data);
    if (quiltIssues.length > 0) {
      throw new HttpError(400, 'Invalid print options', quiltIssues.map((i) => ({ path: `options.${i.path}`, message: i.message })));
    }
    const quiltDocument = quiltPrintDocument(stored, parsed.data);
    const document = copy ? applyFabricChoice(quiltDocument, copy.fabrics) : quiltDocument;
    // A section not sewable as numbered is refused with the reason unless the request prints anyway.
    const unsewable = parsed.data.printUnsewable ? [] : unsewableSections(document, parsed.data.sectionIds);
    if (unsewable.length > 0) {
      throw new HttpError(422, `${unsewableStatement(unsewable)} Send printUnsewable to print anyway.`, { sections: unsewable });
    }
    const sheets = estimateTemplateSheets(document, parsed.data);
    if (sheets !== null && sheets > MAX_PRINT_SHEETS) {
      throw new HttpError(422, `This print set needs at least ${sheets} template sheets; a print set may have at most ${MAX_PRINT_SHEETS}`, {
        sheets,
        maxSheets: MAX_PRINT_SHEETS,
      });
    }
    const [row] = await d.db
      .insert(printSets)
      .values({
        id: newId(),
        patternId: pattern.id,
        revisionId: revision.revision.id,
        revisionNumber: revision.revision.number,
        createdBy: user.id,
        // The copy's fabrics as they are now: a later edit of the copy does not change this set.
        options: JSON.stringify(copy ? { ...parsed.data, colourwayCopy: { id: copy.id, name: copy.name, fabrics: copy.fabrics } satisfies StoredCopy } : parsed.data),
        status: 'queued',
        createdAt: new Date(),
      })
      .returning();
    await ctx.printSets.enqueue(row.id);
    res.status(202).json({ printSet: printSetJson(row, user.displayName) });
  });

  router.get('/', async (req, res) => {
    const { pattern } = patternOf(res);
    const by = await onlyBy(req, res);
    const rows = await d.db
      .select({ set: printSets, creatorName: users.displayName })
      .from(printSets)
      .innerJoin(users, eq(users.id, printSets.createdBy))
      .where(and(eq(printSets.patternId, pattern.id), by ? eq(printSets.createdBy, by) : undefined))
      .orderBy(desc(printSets.createdAt), desc(printSets.id));
    res.json({ items: rows.map((r) => printSetJson(r.set, r.creatorName)) });
  });

  router.get('/:setId', async (req, res) => {
    const { pattern } = patternOf(res);
    const row = await findSet(pattern.id, req.params.setId, await onlyBy(req, res));
    res.json({ printSet: printSetJson(row.set, row.creatorName) });
  });

  router.get('/:setId/events', async (req, res) => {
    const { pattern } = patternOf(res);
    const row = await findSet(pattern.id, req.params.setId, await onlyBy(req, res));
    res.writeHead(200, { 'Content-Type': 'text/event-stream', 'Cache-Control': 'no-store', Connection: 'keep-alive' });
    const send = (s: PrintSet) => res.write(`event: progress\ndata: ${JSON.stringify(printSetJson(s, row.creatorName))}\n\n`);
    const terminal = (s: PrintSet) => s.status === 'done' || s.status === 'failed';
    send(row.set);
    if (terminal(row.set)) return void res.end();
    if (d.dialect === 'postgres') {
      // Any instance may render the set: read its row from the database until it ends.
      let last = `${row.set.status} ${row.set.progress}`;
      let reading = false;
      const timer = setInterval(() => {
        if (reading) return;
        reading = true;
        readSet(row.set.id, pattern.id)
          .then((now) => {
            if (!now) return stop();
            const seen = `${now.set.status} ${now.set.progress}`;
            if (seen !== last) {
              last = seen;
              send(now.set);
            }
            if (terminal(now.set)) stop();
          })
          .catch(() => undefined)
          .finally(() => (reading = false));
      }, ctx.printSets.eventsPollMs);
      const stop = () => {
        clearInterval(timer);
        res.end();
      };
      req.on('close', () => clearInterval(timer));
      return;
    }
    const onUpdate = (s: PrintSet) => {
      if (s.id !== row.set.id) return;
      send(s);
      if (terminal(s)) stop();
    };
    const stop = () => {
      ctx.printSets.events.off('update', onUpdate);
      res.end();
    };
    ctx.printSets.events.on('update', onUpdate);
    req.on('close', () => ctx.printSets.events.off('update', onUpdate));
  });

  router.get('/:setId/file', async (req, res) => {
    const { pattern } = patternOf(res);
    const { set } = await findSet(pattern.id, req.params.setId, await onlyBy(req, res));
    if (set.status !== 'done' || !set.storagePath) {
      throw new HttpError(409, set.status === 'failed' ? 'This print set failed to render' : 'This print set is not ready yet', {
        status: set.status,
        progress: set.progress,
      });
    }
    const name = `${fileSlug(pattern.title)}-r${set.revisionNumber}.pdf`;
    res.setHeader('Content-Disposition', `attachment; filename="${name}"`);
    res.setHeader('Cache-Control', 'private, no-store');
    const sent = await sendStoredFile(req, res, files, set.storagePath, { contentType: 'application/pdf', sha256: set.sha256 });
    if (!sent) {
      res.removeHeader('Content-Disposition');
      throw new HttpError(404, 'Print set file not found');
    }
  });

  router.delete('/:setId', async (req, res) => {
    const { pattern, access } = patternOf(res);
    const user = currentUser(req);
    const { set } = await findSet(pattern.id, req.params.setId, await onlyBy(req, res));
    if (set.createdBy !== user.id && access !== 'owner') throw new HttpError(403, 'Only its maker or the pattern owner can delete a print set');
    await d.db.delete(printSets).where(eq(printSets.id, set.id));
    ctx.printSets.cancel(set.id);
    if (set.storagePath) await files.remove([set.storagePath]);
    res.status(204).end();
  });

  return router;
}
