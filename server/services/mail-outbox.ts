import { and, asc, eq, inArray, isNull, lte } from 'drizzle-orm';
import type { Data } from '../db/data';
import { newId } from '../auth/tokens';
import type { Mailer, OutgoingMail } from './mailer';

/** How the sender retries: delays grow 2× from `firstRetryMs` up to `maxRetryMs`; it gives up after `maxAttempts`. */
export interface OutboxOptions {
  /** How often due mail is looked for when nobody wakes the sender. */
  pollMs: number;
  firstRetryMs: number;
  maxRetryMs: number;
  maxAttempts: number;
  /** Mails sent per pass. */
  batch: number;
  /** Whether an enqueued mail wakes the sender at once (tests that drive `drain` themselves turn it off). */
  wakeOnEnqueue: boolean;
  /**
   * How long a sender holds the mails it took: their next attempt moves this far ahead while it sends,
   * so another instance does not take them too; a sender that died mid-pass leaves them due again then.
   */
  leaseMs: number;
}

const DEFAULTS: OutboxOptions = { pollMs: 5_000, firstRetryMs: 5_000, maxRetryMs: 3_600_000, maxAttempts: 10, batch: 20, wakeOnEnqueue: true, leaseMs: 120_000 };

/** Delay before attempt `attempts + 1`, after `attempts` failed ones (exponential backoff with a ceiling). */
export function retryDelayMs(attempts: number, o: Pick<OutboxOptions, 'firstRetryMs' | 'maxRetryMs'> = DEFAULTS): number {
  return Math.min(o.maxRetryMs, o.firstRetryMs * 2 ** Math.max(0, attempts - 1));
}

/**
 * Durable outgoing mail. A request that decides to send an e-mail only writes a row (inside its own
 * transaction, so the mail exists exactly when the change that caused it does); the background sender
 * delivers due rows through the mailer, retrying with backoff, and clears each body once it is sent.
 * No request ever waits for the mail server, so an answer says nothing about whether mail went out.
 */
export class MailOutbox {
  private readonly options: OutboxOptions;
  private timer: NodeJS.Timeout | undefined;
  private draining: Promise<number> | undefined;
  private again = false;
  private closed = false;

  constructor(
    private readonly data: Data,
    private readonly mailer: Mailer,
    private readonly log: (message: string, err?: unknown) => void,
    options: Partial<OutboxOptions> = {},
  ) {
    this.options = { ...DEFAULTS, ...options };
  }

  /** Stores a mail to send; `d` may be the caller's transaction. The sender is woken after the caller returns. */
  async enqueue(d: Data, kind: string, mail: OutgoingMail): Promise<string> {
    const id = newId();
    await d.db
      .insert(d.t.mailOutbox)
      .values({ id, kind, to: mail.to, subject: mail.subject, text: mail.text, html: mail.html ?? null, nextAttemptAt: new Date() });
    // A timer, not a call: the caller's transaction commits before the sender looks.
    if (!this.closed && this.options.wakeOnEnqueue) setTimeout(() => this.wake(), 0).unref();
    return id;
  }

  /** Starts polling for due mail (retries come due while nobody enqueues anything). */
  start(): void {
    if (this.timer || this.closed) return;
    this.timer = setInterval(() => this.wake(), this.options.pollMs);
    this.timer.unref();
    this.wake();
  }

  /** Sends due mail now (one pass at a time; a wake during a pass runs another after it). */
  wake(): void {
    if (this.closed) return;
    if (this.draining) {
      this.again = true;
      return;
    }
    this.draining = this.drain()
      .catch((err: unknown) => {
        this.log('mail outbox: sending failed', err);
        return 0;
      })
      .finally(() => {
        this.draining = undefined;
        if (this.again) {
          this.again = false;
          this.wake();
        }
      });
  }

  /**
   * Takes due mail for this sender: every due mail, oldest first, at most `batch`, its next attempt
   * moved `leaseMs` ahead in the same transaction. With several instances on one PostgreSQL the rows
   * are locked with SKIP LOCKED, so each mail is taken by one sender only.
   */
  private async take(now: number) {
    const { mailOutbox } = this.data.t;
    const isDue = and(isNull(mailOutbox.sentAt), isNull(mailOutbox.failedAt), lte(mailOutbox.nextAttemptAt, new Date(now)));
    // A plain read first: most passes find nothing due and then take no write lock. On SQLite a
    // transaction's BEGIN IMMEDIATE waits (on a timer, server/db/data.ts) while the validation pool
    // stores a large save through its own connection, and holds up the transactions queued after it.
    if ((await this.data.db.select({ id: mailOutbox.id }).from(mailOutbox).where(isDue).limit(1)).length === 0) return [];
    return this.data.transaction(async (tx) => {
      const due = await tx.lockSkipLocked(
        tx.db.select().from(mailOutbox).where(isDue).orderBy(asc(mailOutbox.nextAttemptAt)).limit(this.options.batch),
      );
      if (due.length > 0) {
        await tx.db
          .update(mailOutbox)
          .set({ nextAttemptAt: new Date(now + this.options.leaseMs) })
          .where(inArray(mailOutbox.id, due.map((r) => r.id)));
      }
      return due;
    });
  }

  /** One pass: every due mail, oldest first, at most `batch`. Returns how many were sent. */
  async drain(now = () => Date.now()): Promise<number> {
    const { mailOutbox } = this.data.t;
    const due = await this.take(now());
    let sent = 0;
    for (const row of due) {
      if (this.closed) {
        // Not sent: due again at once for the next sender.
        await this.data.db.update(mailOutbox).set({ nextAttemptAt: row.nextAttemptAt }).where(eq(mailOutbox.id, row.id));
        continue;
      }
      try {
        await this.mailer.send({ to: row.to, subject: row.subject, text: row.text, ...(row.html ? { html: row.html } : {}) });
        // The body goes once delivered: no reset or invitation link stays in the table.
        await this.data.db
          .update(mailOutbox)
          .set({ sentAt: new Date(now()), attempts: row.attempts + 1, text: '', html: null, lastError: null })
          .where(eq(mailOutbox.id, row.id));
        sent++;
      } catch (err) {
        const attempts = row.attempts + 1;
        const giveUp = attempts >= this.options.maxAttempts;
        const message = err instanceof Error ? err.message : String(err);
        this.log(`mail outbox: ${row.kind} mail ${row.id} failed (attempt ${attempts}${giveUp ? ', giving up' : ''})`, err);
        await this.data.db
          .update(mailOutbox)
          .set({
            attempts,
            lastError: message.slice(0, 500),
            nextAttemptAt: new Date(now() + retryDelayMs(attempts, this.options)),
            failedAt: giveUp ? new Date(now()) : null,
          })
          .where(eq(mailOutbox.id, row.id));
      }
    }
    return sent;
  }

  /** Stops the sender and waits for a pass under way. */
  async close(): Promise<void> {
    this.closed = true;
    if (this.timer) clearInterval(this.timer);
    this.timer = undefined;
    await this.draining;
  }
}
