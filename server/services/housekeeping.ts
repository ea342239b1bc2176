import { and, isNotNull, isNull, lt, lte, or } from 'drizzle-orm';
import type { Data } from '../db/data';
import type { FileStore, SweepOptions } from '../storage/file-store';
import { fillListingQuilts } from '../shop/listings';

/** Keeps answered invitations and used reset tokens this long, for the record. */
const KEEP_MS = 30 * 86_400_000;

/**
 * How old a stored file must be before a start-up sweep on a shared database may remove it: another
 * instance may have written it a moment ago and not inserted its row yet (docs/postgresql.md).
 */
export const SHARED_SWEEP_AGE_MS = 15 * 60_000;

/** Removes expired sessions, old reset tokens, long-dead invitations, old sent mail and ended rate-limit windows. Returns rows removed. */
export async function removeExpired(d: Data, now = Date.now()): Promise<number> {
  const cutoff = new Date(now - KEEP_MS);
  return d.transaction(async (tx) => {
    const { invitations, mailOutbox, passwordResets, rateLimitHits, sessions } = tx.t;
    let n = (await tx.db.delete(sessions).where(lt(sessions.expiresAt, new Date(now))).returning({ id: sessions.tokenHash })).length;
    n += (await tx.db.delete(passwordResets).where(lt(passwordResets.expiresAt, cutoff)).returning({ id: passwordResets.tokenHash })).length;
    n += (
      await tx.db
        .delete(invitations)
        .where(
          or(
            lt(invitations.expiresAt, cutoff),
            and(isNotNull(invitations.revokedAt), lt(invitations.revokedAt, cutoff)),
            and(isNotNull(invitations.acceptedAt), lt(invitations.acceptedAt, cutoff), isNull(invitations.revokedAt)),
          ),
        )
        .returning({ id: invitations.id })
    ).length;
    // Sent or given-up mail (its body is already gone once sent) is kept for the record, then dropped.
    n += (await tx.db.delete(mailOutbox).where(or(lt(mailOutbox.sentAt, cutoff), lt(mailOutbox.failedAt, cutoff))).returning({ id: mailOutbox.id })).length;
    n += (await tx.db.delete(rateLimitHits).where(lte(rateLimitHits.resetAt, now)).returning({ key: rateLimitHits.key })).length;
    return n;
  });
}

/** Runs {@link removeExpired} now and every hour; the timer never keeps the process alive. */
export function startHousekeeping(d: Data, log: (message: string, err?: unknown) => void): () => void {
  const run = () => {
    removeExpired(d).catch((err: unknown) => log('housekeeping failed', err));
  };
  run();
  const timer = setInterval(run, 3_600_000);
  timer.unref();
  // Listings saved before migration 0008 get their quilt size chart and pictures, in batches after start-up.
  let stopped = false;
  const fill = setImmediate(() => {
    fillListingQuilts(d, 20, () => stopped).then(
      (n) => {
        if (n > 0) log(`Filled the quilt pictures and size chart of ${n} shop listing${n === 1 ? '' : 's'}`);
      },
      (err: unknown) => log('filling shop listings\' quilts failed', err),
    );
  });
  return () => {
    stopped = true;
    clearInterval(timer);
    clearImmediate(fill);
  };
}

/** Key prefixes (folders of the data folder) of stored files; every file in them belongs to a database row. */
const STORED_FOLDERS = ['uploads', 'print-sets'];

/** The stored-file keys some upload or print-set row names. */
async function knownKeys(d: Data): Promise<Set<string>> {
  const { printSets, uploads } = d.t;
  const [ups, sets] = await Promise.all([
    d.db.select({ p: uploads.storagePath }).from(uploads),
    d.db.select({ p: printSets.storagePath }).from(printSets).where(isNotNull(printSets.storagePath)),
  ]);
  return new Set<string>([...ups.map((r) => r.p), ...sets.map((r) => r.p).filter((p): p is string => typeof p === 'string')]);
}

/**
 * Removes what a killed process left among the stored files (the data folder or the database):
 * unfinished writes and files no upload or print-set row names (written just before a kill, or whose
 * row was deleted just before one). With several instances on one store, pass `writtenBefore` some
 * minutes ago: another instance may have just written a file whose row it has not inserted yet.
 * Returns the removed keys.
 */
export async function sweepStoredFilesIn(d: Data, files: FileStore, options: SweepOptions = {}): Promise<string[]> {
  const known = await knownKeys(d);
  return files.sweep(STORED_FOLDERS, (key) => known.has(key), options);
}

/**
 * The start-up sweep: on SQLite (one process owns the data folder) everything left over goes; on
 * PostgreSQL, shared with other instances, only files older than {@link SHARED_SWEEP_AGE_MS}.
 */
export function sweepStoredFilesAtStart(d: Data, files: FileStore, now = Date.now()): Promise<string[]> {
  return sweepStoredFilesIn(d, files, d.dialect === 'postgres' ? { writtenBefore: new Date(now - SHARED_SWEEP_AGE_MS) } : {});
}
