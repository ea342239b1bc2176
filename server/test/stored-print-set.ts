/**
 * A finished print set stored as the renderer stores it (its file in the file store, its row in the
 * database), for tests about who may reach print sets; rendering itself has its own tests. Works on
 * SQLite and PostgreSQL (server/db/data.ts).
 */
import { and, eq } from 'drizzle-orm';
import type { TestServer } from './harness';

/** The bytes stored as the print set's PDF (a minimal file; 15 bytes). */
export const STORED_PDF = Buffer.from('%PDF-1.4\n%%EOF\n');

/** Stores a finished print set of revision 1 of `patternId`, made by `userId`; answers its id. */
export async function storeFinishedPrintSet(t: TestServer, patternId: string, userId: string): Promise<string> {
  const id = `ps${Math.random().toString(36).slice(2, 12)}`;
  const storagePath = `print-sets/${userId}/${id}.pdf`;
  await t.ctx.files.put(storagePath, STORED_PDF);
  const { printSets, revisions } = t.ctx.data.t;
  const [rev] = await t.ctx.data.db
    .select({ id: revisions.id })
    .from(revisions)
    .where(and(eq(revisions.patternId, patternId), eq(revisions.number, 1)));
  if (!rev) throw new Error(`pattern ${patternId} has no revision 1`);
  const now = new Date();
  await t.ctx.data.db.insert(printSets).values({
    id,
    patternId,
    revisionId: rev.id,
    revisionNumber: 1,
    createdBy: userId,
    options: '{}',
    status: 'done',
    progress: 1,
    sheets: 1,
    bytes: STORED_PDF.length,
    sha256: 'x',
    storagePath,
    createdAt: now,
    finishedAt: now,
  });
  return id;
}
