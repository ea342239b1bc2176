import { and, isNotNull, isNull, lt, or } from 'drizzle-orm';
import type { Db } from '../db/database';
import { invitations, passwordResets, sessions } from '../db/schema';

/** Keeps answered invitations and used reset tokens this long, for the record. */
const KEEP_MS = 30 * 86_400_000;

/** Removes expired sessions, old reset tokens and long-dead invitations. Returns rows removed. */
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
  return () => clearInterval(timer);
}
