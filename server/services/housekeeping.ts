import { and, isNotNull, isNull, lt, lte, or } from 'drizzle-orm';
import type { Db } from '../db/database';
import { invitations, mailOutbox, passwordResets, printSets, rateLimitHits, sessions, uploads } from '../db/schema';
import { DiskFileStore } from '../storage/disk-store';
import type { FileStore, SweepOptions } from '../storage/file-store';
import { fillListingQuilts } from '../shop/listings';

/** Keeps answered invitations and used reset tokens this long, for the record. */
const KEEP_MS = 30 * 86_400_000;

/** Removes expired sessions, old reset tokens, long-dead invitations, old sent mail and ended rate-limit windows. Returns rows removed. */
export function removeExpired(db: Db, now = Date.now()): number {
  const cutoff = new Date(now - KEEP_MS);
  return db.transaction((tx) => {
    let n = tx.delete(sessions).where(lt(sessions.expiresAt, new Date(now))).run().changes;
    n += tx.delete(passwordResets).where(lt(passwordResets.expiresAt, cutoff)).run().changes;
    n += tx
      .delete(invitations)
      .where(
        or(
          lt(invitations.expiresAt, cutoff),
          and(isNotNull(invitations.revokedAt), lt(invitations.revokedAt, cutoff)),
          and(isNotNull(invitations.acceptedAt), lt(invitations.acceptedAt, cutoff), isNull(invitations.revokedAt)),
        ),
      )
      .run().changes;
    // Sent or given-up mail (its body is already gone once sent) is kept for the record, then dropped.
    n += tx.delete(mailOutbox).where(or(lt(mailOutbox.sentAt, cutoff), lt(mailOutbox.failedAt, cutoff))).run().changes;
    n += tx.delete(rateLimitHits).where(lte(rateLimitHits.resetAt, now)).run().changes;
    return n;
  });
}

/** Runs {@link removeExpired} now and every hour; the timer never keeps the process alive. */
export function startHousekeeping(db: Db, log: (message: string, err?: unknown) => void): () => void {
  const run = () => {
    try {
      removeExpired(db);
    } catch (err) {
      log('housekeeping failed', err);
    }
  };
  run();
  const timer = setInterval(run, 3_600_000);
  timer.unref();
  // Listings saved before migration 0008 get their quilt size chart and pictures, in batches after start-up.
  let stopped = false;
  const fill = setImmediate(() => {
    fillListingQuilts(db, 20, () => stopped).then(
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
function knownKeys(db: Db): Set<string> {
  return new Set<string>([
    ...db.select({ p: uploads.storagePath }).from(uploads).all().map((r) => r.p),
    ...db
      .select({ p: printSets.storagePath })
      .from(printSets)
      .all()
      .map((r) => r.p)
      .filter((p): p is string => typeof p === 'string'),
  ]);
}

/**
 * Removes what a killed process left in the data folder's stored-file folders: temporary files of
 * writes that never finished (`writeFileAtomic` names them `.<name>.<random>.tmp`) and files no upload
 * or print set row names (written just before a kill, or whose row was deleted just before one). Run
 * it at start-up, before anything writes files. Returns the removed paths, relative to the data folder.
 */
export function sweepStoredFiles(db: Db, dataDir: string): string[] {
  const known = knownKeys(db);
  return new DiskFileStore(dataDir).sweepNow(STORED_FOLDERS, (key) => known.has(key));
}

/**
 * {@link sweepStoredFiles} for any file store (the data folder or the database). With several instances
 * on one store, pass `writtenBefore` some minutes ago: another instance may have just written a file
 * whose row it has not inserted yet. Returns the removed keys.
 */
export function sweepStoredFilesIn(db: Db, files: FileStore, options: SweepOptions = {}): Promise<string[]> {
  const known = knownKeys(db);
  return files.sweep(STORED_FOLDERS, (key) => known.has(key), options);
}
