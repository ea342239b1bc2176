import fs from 'node:fs';
import { createHash } from 'node:crypto';
import { EventEmitter } from 'node:events';
import { MessageChannel } from 'node:worker_threads';
import { and, count, eq, inArray, ne, notInArray } from 'drizzle-orm';
import type pg from 'pg';
import PgBoss from 'pg-boss';
import { Piscina } from 'piscina';
import type { Config } from '../config';
import type { Data } from '../db/data';
import type { PrintSet } from '../db/schema';
import { RENDER_CANCELLED, type RenderProgress, type RenderResult, type RenderTask } from '../print/print-messages';
import { MAX_PRINT_SHEETS } from '../print/print-budget';
import type { FileStore, StoredFile } from '../storage/file-store';
import { fileStoreOf } from '../storage/file-store-of';

/** The fonts embedded in every print set (shipped in the repository's fonts/ folder). */
export const FONTS_DIR = new URL('../../fonts/', import.meta.url);

const WORKER_FILE = new URL('../print/worker-bootstrap.mjs', import.meta.url).href;

/** How long a deleted set's render may take to reach its next sheet before its worker is stopped. */
const CANCEL_GRACE_MS = 2000;

/** First and longest wait before writing a set's end ("done" or "failed") again after the write failed. */
const END_RETRY_FIRST_MS = 250;
const END_RETRY_MAX_MS = 5000;

/** The pg-boss queue of print jobs (PostgreSQL). */
export const PRINT_QUEUE = 'print-set';
/**
 * Where pg-boss moves a print job whose tries are used up (its instances died or stopped more times
 * than the retry limit): any instance takes it from there and marks the set failed, so no set stays
 * "rendering" with nobody left to render it.
 */
export const PRINT_GIVEN_UP_QUEUE = 'print-set-given-up';

/** A given-up set's error, as its maker reads it. */
export const GIVEN_UP_MESSAGE = 'Every try at rendering this set was stopped before the end (the server rendering it stopped); ask for the set again';

/** The advisory lock instances take in turn to set up the print queue (ASCII "SeamwQue"). */
const QUEUE_SETUP_LOCK = 0x5365616d77517565n.toString();

/** A print job in the pg-boss queue: the set to render. */
interface PrintJob {
  setId: string;
  /** Who made the set (fairness: the last free thread is for someone not rendering here). */
  userId?: string;
}

/** Jobs looked at when the last free thread must go to a user not rendering here. */
const LAST_THREAD_BATCH = 20;

/**
 * How print jobs are shared between instances on PostgreSQL (docs/postgresql.md "Print jobs").
 * Unused with SQLite, whose sets go through this process's own queue.
 */
export interface PrintJobOptions {
  /** PostgreSQL: the pool the job queue (pg-boss, in its own `pgboss` schema) runs on. */
  pgPool?: pg.Pool;
  /**
   * A job whose instance has not shown it alive for this long is given to another (its instance is
   * taken for dead). A live instance shows its jobs alive every quarter of this. Default 60 s.
   */
  expireSeconds?: number;
  /** How often an instance looks for expired jobs (pg-boss maintenance). Default 15 s. */
  expiryCheckSeconds?: number;
  /** Wait before an expired or handed-over job may be taken again. Default 1 s. */
  retryDelaySeconds?: number;
  /** Times a job is given to another instance before it is left failed. Default 5. */
  retryLimit?: number;
  /** How often an instance looks for new jobs and for deleted sets it renders. Default 500 ms. */
  pollMs?: number;
}

/**
 * The job settings from the environment (tests and the two-instance test shorten them):
 * PRINT_JOB_EXPIRE_SECONDS, PRINT_JOB_EXPIRY_CHECK_SECONDS, PRINT_JOB_RETRY_DELAY_SECONDS,
 * PRINT_JOB_RETRY_LIMIT, PRINT_JOB_POLL_MS.
 */
export function printJobOptionsFromEnv(env: Record<string, string | undefined>): PrintJobOptions {
  const num = (name: string, min: number): number | undefined => {
    const raw = env[name];
    if (raw === undefined || raw === '') return undefined;
    const n = Number(raw);
    if (!Number.isInteger(n) || n < min) throw new Error(`${name} must be a whole number of at least ${min}, not ${JSON.stringify(raw)}`);
    return n;
  };
  const options: PrintJobOptions = {
    expireSeconds: num('PRINT_JOB_EXPIRE_SECONDS', 1),
    expiryCheckSeconds: num('PRINT_JOB_EXPIRY_CHECK_SECONDS', 1),
    retryDelaySeconds: num('PRINT_JOB_RETRY_DELAY_SECONDS', 0),
    retryLimit: num('PRINT_JOB_RETRY_LIMIT', 0),
    pollMs: num('PRINT_JOB_POLL_MS', 50),
  };
  return Object.fromEntries(Object.entries(options).filter(([, v]) => v !== undefined)) as PrintJobOptions;
}

/** The pg-boss job id of a set (a UUID made from the set id), so any instance can cancel it. */
export function printJobId(setId: string): string {
  const h = createHash('sha256').update(`print-set:${setId}`).digest('hex');
  return `${h.slice(0, 8)}-${h.slice(8, 12)}-4${h.slice(13, 16)}-8${h.slice(17, 20)}-${h.slice(20, 32)}`;
}

/** A set rendering in the pool. */
interface Running {
  userId: string;
  /** Set to 1 to ask the render to stop at its next sheet. */
  cancel: Int32Array;
  /** Aborting stops the worker thread at once (piscina terminates it). */
  abort: AbortController;
  timer?: NodeJS.Timeout;
  /** Why the render was aborted, when it was. */
  abortReason?: string;
  /** PostgreSQL: the job taken for this set. */
  jobId?: string;
  /** PostgreSQL: the instance is stopping; the job is left to another instance, the row untouched. */
  handover?: boolean;
  /** Progress not yet written, and the write in flight (progress is written in order, one at a time). */
  nextProgress?: number;
  writing?: Promise<void>;
}

/** An end state ("done" or "failed") whose write failed (a full disk): written again until it is stored. */
interface UnstoredEnd {
  values: Partial<PrintSet>;
  waitMs: number;
  timer?: NodeJS.Timeout;
  /** Files to remove when the set turns out to be gone. */
  orphanPaths?: string[];
}

/**
 * Renders print sets in a pool of worker threads (piscina) and stores the PDFs.
 *
 * SQLite: fair between users: each user's sets wait in their own queue, and free threads go to the
 * users in turn (round robin), so one user's sets queue behind each other, never in front of others'.
 * A user who already has a set rendering does not take the last free thread, which stays for whoever
 * comes next (with a pool of one thread, sets simply take turns by user). A deleted set stops: a
 * queued one leaves its queue, a rendering one stops at its next sheet, or within
 * {@link CANCEL_GRACE_MS} its worker is stopped outright.
 *
 * PostgreSQL (docs/postgresql.md "Print jobs"): the sets wait in a pg-boss queue in the same database
 * and any instance with a free thread takes the next one. A user's set is queued at a lower priority
 * the more of their sets already wait, so one user's sets queue behind others'; the last free thread
 * is taken only for a user not rendering here. Progress and the end are written to the set's row,
 * where every instance reads them. A job whose instance dies stays active until it expires, and is
 * then taken by another instance, which renders the set again from the start. A deleted set's job is
 * cancelled, and the instance rendering it sees its row gone and stops the render.
 */
export class PrintSetService {
  /** Emits `update` with the print-set row whenever its status or progress changes (this instance's renders). */
  readonly events = new EventEmitter();
  /** Queued set ids per user, oldest first (SQLite). */
  private readonly waiting = new Map<string, string[]>();
  /** Users with queued sets, in the order their turn comes (SQLite). */
  private readonly turns: string[] = [];
  private readonly running = new Map<string, Running>();
  private pool: Piscina | undefined;
  private fonts: RenderTask['fonts'] | undefined;
  private closed = false;
  private readonly idle = new Set<() => void>();
  private readonly pending = new Set<Promise<void>>();
  /** End states not yet stored, by set id (docs/api.md: a set never stays "rendering"). */
  private readonly unstoredEnds = new Map<string, UnstoredEnd>();

  /** Where the PDFs are stored. */
  private readonly files: FileStore;
  /** PostgreSQL: the job queue, started on first use. */
  private boss: Promise<PgBoss> | undefined;
  private pollTimer: NodeJS.Timeout | undefined;
  private heartbeatTimer: NodeJS.Timeout | undefined;
  private bossStopped = false;
  private fetching = false;
  private fetchAgain = false;
  /** Whether a look at the given-up queue is under way (one at a time). */
  private collectingGivenUp = false;
  private readonly jobs: Required<Omit<PrintJobOptions, 'pgPool'>>;

  constructor(
    private readonly data: Data,
    private readonly config: Config,
    private readonly log: (message: string, err?: unknown) => void,
    files?: FileStore,
    /** How jobs are shared on PostgreSQL (a second service in tests takes the same). */
    readonly jobOptions: PrintJobOptions = {},
  ) {
    this.events.setMaxListeners(1000);
    this.files = fileStoreOf({ config, files });
    this.jobs = {
      expireSeconds: jobOptions.expireSeconds ?? 60,
      expiryCheckSeconds: jobOptions.expiryCheckSeconds ?? 15,
      retryDelaySeconds: jobOptions.retryDelaySeconds ?? 1,
      retryLimit: jobOptions.retryLimit ?? 5,
      pollMs: jobOptions.pollMs ?? 500,
    };
    if (data.dialect === 'postgres') {
      if (!jobOptions.pgPool) throw new Error('PrintSetService on PostgreSQL needs the pool (jobOptions.pgPool) for its job queue');
      this.boss = this.startBoss(jobOptions.pgPool);
      this.boss.catch((err: unknown) => this.log('the print job queue could not be started', err));
      this.pollTimer = setInterval(() => this.poll(), this.jobs.pollMs);
      this.pollTimer.unref();
      this.heartbeatTimer = setInterval(() => this.heartbeat(jobOptions.pgPool!), (this.jobs.expireSeconds * 1000) / 4);
      this.heartbeatTimer.unref();
    }
  }

  private get onPostgres(): boolean {
    return this.data.dialect === 'postgres';
  }

  /** Threads the pool renders on at once. */
  get threads(): number {
    return this.config.printWorkers;
  }

  /** Renders this instance started and finished with a stored PDF (for tests: which instance rendered what). */
  readonly renders = { started: 0, stored: 0 };

  /** Sets rendering now in this instance (for tests and the health figures). */
  get activeCount(): number {
    return this.running.size;
  }

  /** How often the events stream reads a set's row on PostgreSQL (progress made by any instance). */
  get eventsPollMs(): number {
    return this.jobs.pollMs;
  }

  private async startBoss(pool: pg.Pool): Promise<PgBoss> {
    const boss = new PgBoss({
      db: { executeSql: (text: string, values: unknown[]) => pool.query(text, values) },
      schedule: false,
      supervise: true,
      maintenanceIntervalSeconds: this.jobs.expiryCheckSeconds,
    });
    boss.on('error', (err: unknown) => this.log('print job queue error', err));
    // Instances starting together would create the queue together, and pg-boss's queue creation
    // (a partition and its constraint) can deadlock with itself: one instance at a time, under a
    // session advisory lock held on a connection of its own (docs/postgresql.md "Print jobs").
    const lock = await pool.connect();
    try {
      await lock.query('SELECT pg_advisory_lock($1)', [QUEUE_SETUP_LOCK]);
      try {
        await boss.start();
        await boss.createQueue(PRINT_GIVEN_UP_QUEUE, { name: PRINT_GIVEN_UP_QUEUE });
        await boss.createQueue(PRINT_QUEUE, {
          name: PRINT_QUEUE,
          deadLetter: PRINT_GIVEN_UP_QUEUE,
          expireInSeconds: this.jobs.expireSeconds,
          retryLimit: this.jobs.retryLimit,
          retryDelay: this.jobs.retryDelaySeconds,
        });
      } finally {
        await lock.query('SELECT pg_advisory_unlock($1)', [QUEUE_SETUP_LOCK]);
      }
    } finally {
      lock.release();
    }
    return boss;
  }

  /** Picks up jobs left queued or half-rendered by a previous process, oldest first. */
  async resumeUnfinished(): Promise<void> {
    const { printSets } = this.data.t;
    const rows = await this.data.db
      .select({ id: printSets.id })
      .from(printSets)
      .where(inArray(printSets.status, ['queued', 'rendering']))
      .orderBy(printSets.createdAt);
    if (!this.onPostgres) {
      for (const r of rows) await this.enqueue(r.id);
      return;
    }
    // A set whose job is still waiting or active is in hand; one whose job ended (or never was sent:
    // its instance died between the row and the job) is queued again.
    const boss = await this.boss!;
    for (const r of rows) {
      const job = await boss.getJobById(PRINT_QUEUE, printJobId(r.id));
      if (job && (job.state === 'created' || job.state === 'retry' || job.state === 'active')) continue;
      if (job) await boss.deleteJob(PRINT_QUEUE, job.id);
      await this.enqueue(r.id);
    }
  }

  /** Queues a print set (its row must exist with status `queued` or `rendering`) in its maker's queue. */
  async enqueue(setId: string): Promise<void> {
    if (this.closed) return;
    const { printSets } = this.data.t;
    const [row] = await this.data.db.select({ createdBy: printSets.createdBy }).from(printSets).where(eq(printSets.id, setId));
    if (!row) return;
    if (this.onPostgres) {
      // Fairness across instances: the more of their sets already wait, the later a user's next one comes.
      const [ahead] = await this.data.db
        .select({ n: count() })
        .from(printSets)
        .where(and(eq(printSets.createdBy, row.createdBy), inArray(printSets.status, ['queued', 'rendering']), ne(printSets.id, setId)));
      const boss = await this.boss!;
      await boss.send(PRINT_QUEUE, { setId, userId: row.createdBy } satisfies PrintJob, {
        id: printJobId(setId),
        priority: -Number(ahead?.n ?? 0),
        // Each job carries this instance's settings (the queue's own are whoever created it first).
        expireInSeconds: this.jobs.expireSeconds,
        retryLimit: this.jobs.retryLimit,
        retryDelay: this.jobs.retryDelaySeconds,
        // Also on each job: a queue made by an older version has no dead letter of its own.
        deadLetter: PRINT_GIVEN_UP_QUEUE,
      });
      void this.pumpPg();
      return;
    }
    const queue = this.waiting.get(row.createdBy) ?? [];
    if (queue.length === 0) {
      this.waiting.set(row.createdBy, queue);
      this.turns.push(row.createdBy);
    }
    queue.push(setId);
    this.pump();
  }

  /**
   * Stops a set that is being deleted: out of its queue if it waits; if it renders, the render stops at
   * its next sheet and, failing that, its worker is stopped after a short grace. Nothing is stored.
   * On PostgreSQL its job is cancelled too; an instance rendering it sees its row gone and stops.
   */
  cancel(setId: string): void {
    if (this.onPostgres && this.boss) {
      this.boss.then((boss) => boss.cancel(PRINT_QUEUE, printJobId(setId))).catch((err: unknown) => this.log('print job could not be cancelled', err));
    }
    for (const [userId, queue] of this.waiting) {
      const at = queue.indexOf(setId);
      if (at >= 0) {
        queue.splice(at, 1);
        if (queue.length === 0) this.dropUser(userId);
        this.pump();
        return;
      }
    }
    const run = this.running.get(setId);
    if (!run || Atomics.load(run.cancel, 0) !== 0) return;
    Atomics.store(run.cancel, 0, 1);
    clearTimeout(run.timer);
    run.timer = setTimeout(() => this.abort(setId, RENDER_CANCELLED), CANCEL_GRACE_MS);
    run.timer.unref();
  }

  /**
   * Resolves when nothing is queued or rendering (for tests and shutdown); on PostgreSQL, when this
   * instance renders nothing and no job waits or runs in the queue.
   */
  async whenIdle(): Promise<void> {
    if (!this.onPostgres) {
      if (this.isIdle()) return;
      return new Promise((resolve) => this.idle.add(resolve));
    }
    const boss = await this.boss!;
    for (;;) {
      if (this.isIdle() && !this.fetching && (await boss.getQueueSize(PRINT_QUEUE, { before: 'completed' })) === 0) return;
      await new Promise((r) => setTimeout(r, 50));
    }
  }

  /**
   * Stops rendering. With SQLite, sets still rendering are stopped and marked failed. On PostgreSQL
   * they are handed over: their jobs go back to the queue (taken again after the retry delay by any
   * instance) and their rows are left as they are; the job queue is stopped.
   */
  async close(): Promise<void> {
    this.closed = true;
    clearInterval(this.pollTimer);
    clearInterval(this.heartbeatTimer);
    this.waiting.clear();
    this.turns.length = 0;
    const handedOver: string[] = [];
    for (const [id, run] of this.running) {
      if (this.onPostgres) {
        run.handover = true;
        if (run.jobId) handedOver.push(run.jobId);
      }
      this.abort(id, 'The server is shutting down');
    }
    await Promise.allSettled([...this.pending]);
    await this.pool?.destroy();
    this.pool = undefined;
    // One last try at ends not yet stored; a set still left "rendering" is rendered again at start-up.
    for (const [setId, entry] of this.unstoredEnds) {
      clearTimeout(entry.timer);
      await this.tryUpdate(setId, entry.values);
    }
    this.unstoredEnds.clear();
    if (this.boss) {
      const boss = await this.boss.catch(() => undefined);
      if (boss && !this.bossStopped) {
        this.bossStopped = true;
        for (const jobId of handedOver) {
          await boss.fail(PRINT_QUEUE, jobId, { message: 'The server rendering it stopped' }).catch((err: unknown) => this.log('print job could not be handed over', err));
        }
        await boss.stop({ graceful: false, wait: true, close: false });
      }
    }
  }

  /**
   * For tests: stops as a killed process would (SIGKILL), on PostgreSQL. Renders end without writing
   * anything, jobs stay active in the queue until they expire and another instance takes them.
   */
  async stopAsIfKilled(): Promise<void> {
    this.closed = true;
    clearInterval(this.pollTimer);
    clearInterval(this.heartbeatTimer);
    for (const [id, run] of this.running) {
      run.handover = true;
      this.abort(id, 'killed');
    }
    const boss = await this.boss?.catch(() => undefined);
    if (boss && !this.bossStopped) {
      this.bossStopped = true;
      await boss.stop({ graceful: false, wait: true, close: false });
    }
    await Promise.allSettled([...this.pending]);
    await this.pool?.destroy();
    this.pool = undefined;
  }

  private isIdle(): boolean {
    return this.turns.length === 0 && this.running.size === 0 && this.pending.size === 0;
  }

  private dropUser(userId: string): void {
    this.waiting.delete(userId);
    const at = this.turns.indexOf(userId);
    if (at >= 0) this.turns.splice(at, 1);
  }

  private loadFonts(): RenderTask['fonts'] {
    this.fonts ??= {
      regular: new Uint8Array(fs.readFileSync(new URL('Roboto-Regular.ttf', FONTS_DIR))),
      bold: new Uint8Array(fs.readFileSync(new URL('Roboto-Bold.ttf', FONTS_DIR))),
      // For characters Roboto lacks, in this order (fonts/README.md).
      fallbacks: ['DroidSansFallback-Japanese.ttf', 'NotoSansArabic-Regular.ttf'].map((f) => new Uint8Array(fs.readFileSync(new URL(f, FONTS_DIR)))),
    };
    return this.fonts;
  }

  private getPool(): Piscina {
    this.pool ??= new Piscina({
      filename: WORKER_FILE,
      minThreads: 0,
      maxThreads: this.threads,
      // Threads cost a tsx start-up each; keep them a while between sets.
      idleTimeout: 60_000,
    });
    return this.pool;
  }

  private resolveIdle(): void {
    if (this.isIdle()) {
      for (const resolve of this.idle) resolve();
      this.idle.clear();
    }
  }

  /** Hands free threads to the users in turn (SQLite). */
  private pump(): void {
    if (this.closed) return;
    if (this.onPostgres) {
      void this.pumpPg();
      return;
    }
    while (this.running.size < this.threads) {
      const free = this.threads - this.running.size;
      const at = this.turns.findIndex((u) => free > 1 || ![...this.running.values()].some((r) => r.userId === u));
      if (at < 0) break;
      const userId = this.turns[at];
      const queue = this.waiting.get(userId)!;
      const setId = queue.shift()!;
      this.turns.splice(at, 1);
      if (queue.length > 0) this.turns.push(userId);
      else this.waiting.delete(userId);
      this.start(setId, userId);
    }
    this.resolveIdle();
  }

  /** PostgreSQL: takes jobs from the queue while threads are free (one fetch loop at a time). */
  private async pumpPg(): Promise<void> {
    if (this.fetching) {
      this.fetchAgain = true;
      return;
    }
    this.fetching = true;
    try {
      const boss = await this.boss!;
      do {
        this.fetchAgain = false;
        while (!this.closed && this.running.size < this.threads) {
          const busy = [...new Set([...this.running.values()].map((r) => r.userId))];
          const lastThread = this.threads - this.running.size === 1 && busy.length > 0;
          // The last free thread stays for a user not rendering here.
          if (lastThread && !(await this.othersWaiting(busy))) break;
          const fetched = await boss.fetch<PrintJob>(PRINT_QUEUE, { batchSize: lastThread ? LAST_THREAD_BATCH : 1 });
          const chosen = lastThread ? fetched.find((j) => !j.data.userId || !busy.includes(j.data.userId)) : fetched[0];
          const job = this.closed ? undefined : chosen;
          const putBack = fetched.filter((j) => j !== job).map((j) => j.id);
          if (putBack.length > 0) {
            // Back to the queue as they were (same priority and age) for another thread or instance.
            await boss.cancel(PRINT_QUEUE, putBack);
            await boss.resume(PRINT_QUEUE, putBack);
          }
          if (!job) break;
          await this.take(boss, job);
        }
      } while (this.fetchAgain && !this.closed);
    } catch (err) {
      this.log('print jobs could not be taken from the queue', err);
    } finally {
      this.fetching = false;
      this.resolveIdle();
    }
  }

  private async othersWaiting(busyUsers: string[]): Promise<boolean> {
    const { printSets } = this.data.t;
    const rows = await this.data.db
      .select({ id: printSets.id })
      .from(printSets)
      .where(and(eq(printSets.status, 'queued'), notInArray(printSets.createdBy, busyUsers)))
      .limit(1);
    return rows.length > 0;
  }

  /** PostgreSQL: starts the render of a job's set, or completes the job when there is nothing to render. */
  private async take(boss: PgBoss, job: PgBoss.Job<PrintJob>): Promise<void> {
    const setId = job.data.setId;
    const { printSets } = this.data.t;
    const [row] = await this.data.db.select({ createdBy: printSets.createdBy, status: printSets.status }).from(printSets).where(eq(printSets.id, setId));
    // Gone (deleted), already finished, or already rendering here (a job taken over from this very instance).
    if (!row || (row.status !== 'queued' && row.status !== 'rendering') || this.running.has(setId)) {
      await boss.complete(PRINT_QUEUE, job.id);
      return;
    }
    // Names the instance that renders the set in its own log (several instances share one queue).
    this.log(`print set ${setId}: rendering here (job ${job.id})`);
    this.start(setId, row.createdBy, job.id);
  }

  /** PostgreSQL, every poll: takes new jobs, fails sets given up, and stops renders of sets deleted on another instance. */
  private poll(): void {
    if (this.closed) return;
    void this.pumpPg();
    void this.failGivenUp();
    const ids = [...this.running.entries()].filter(([, r]) => Atomics.load(r.cancel, 0) === 0).map(([id]) => id);
    if (ids.length === 0) return;
    const { printSets } = this.data.t;
    this.data.db
      .select({ id: printSets.id })
      .from(printSets)
      .where(inArray(printSets.id, ids))
      .then((rows) => {
        const present = new Set(rows.map((r) => r.id));
        for (const id of ids) if (!present.has(id)) this.cancel(id);
      })
      .catch((err: unknown) => this.log('print sets could not be checked', err));
  }

  /**
   * PostgreSQL: marks failed the sets whose jobs pg-boss gave up on (every try's instance died or
   * stopped before the end) and that are still waiting or "rendering". A set rendering here is left
   * to its render. Each given-up job is taken by one instance only.
   */
  private async failGivenUp(): Promise<void> {
    if (this.collectingGivenUp) return;
    this.collectingGivenUp = true;
    try {
      const boss = await this.boss!;
      const jobs = await boss.fetch<PrintJob>(PRINT_GIVEN_UP_QUEUE, { batchSize: LAST_THREAD_BATCH });
      for (const job of jobs) {
        const setId = job.data.setId;
        if (!this.running.has(setId)) {
          const failed = await this.update(
            setId,
            { status: 'failed', error: GIVEN_UP_MESSAGE, finishedAt: new Date() },
            ['queued', 'rendering'],
          );
          if (failed) this.log(`print set ${setId} failed: its job was given up after its last try`);
        }
        await boss.complete(PRINT_GIVEN_UP_QUEUE, job.id);
      }
    } catch (err) {
      if (!this.closed) this.log('given-up print jobs could not be checked', err);
    } finally {
      this.collectingGivenUp = false;
    }
  }

  /**
   * Shows this instance's active jobs alive: pg-boss 10 expires a job counted from when it was taken
   * (`started_on`) and has no call to extend it, so the time is moved on in its job table (pg-boss is
   * pinned to 10.4.2, whose `job` table this is). A killed instance stops doing this, and its jobs
   * expire within `expireSeconds`.
   */
  private heartbeat(pool: pg.Pool): void {
    const ids = [...this.running.values()].flatMap((r) => (r.jobId && !r.handover ? [r.jobId] : []));
    if (ids.length === 0 || this.closed) return;
    pool
      .query(`UPDATE pgboss.job SET started_on = now() WHERE name = $1 AND id = ANY($2::uuid[]) AND state = 'active'`, [PRINT_QUEUE, ids])
      .catch((err: unknown) => this.log('print jobs could not be shown alive', err));
  }

  private start(setId: string, userId: string, jobId?: string): void {
    const run: Running = { userId, cancel: new Int32Array(new SharedArrayBuffer(4)), abort: new AbortController(), jobId };
    this.running.set(setId, run);
    const channel = new MessageChannel();
    const done = this.render(setId, run, channel)
      .catch((err: unknown) => this.log('print set could not be finished', err))
      .finally(async () => {
        clearTimeout(run.timer);
        channel.port1.close();
        this.running.delete(setId);
        this.pending.delete(done);
        if (jobId && !run.handover && this.boss) {
          await this.boss.then((boss) => boss.complete(PRINT_QUEUE, jobId)).catch((err: unknown) => this.log('print job could not be completed', err));
        }
        this.pump();
        this.resolveIdle();
      });
    this.pending.add(done);
  }

  private async render(setId: string, run: Running, channel: MessageChannel): Promise<void> {
    const { printSets, revisions } = this.data.t;
    const [row] = await this.data.db.select().from(printSets).where(eq(printSets.id, setId));
    if (!row || (row.status !== 'queued' && row.status !== 'rendering')) return;
    const [revision] = await this.data.db.select().from(revisions).where(eq(revisions.id, row.revisionId));
    if (!revision) return this.fail(setId, 'The revision is gone');
    // A set taken over from a dead instance starts again from nothing.
    const started = await this.update(setId, { status: 'rendering', progress: 0, error: null }, ['queued', 'rendering']);
    if (!started) return;
    this.renders.started++;
    // A render that never ends (a bug, a hostile document) must not hold a thread: stop its worker.
    run.timer = setTimeout(
      () => this.abort(setId, `Rendering took longer than ${this.config.printTimeoutSeconds} s and was stopped`),
      this.config.printTimeoutSeconds * 1000,
    );
    run.timer.unref();
    channel.port1.on('message', (p: RenderProgress) => {
      // Cover and appendix are steps too; keep 1.0 for "stored".
      if (this.running.get(setId) === run && Atomics.load(run.cancel, 0) === 0) this.writeProgress(setId, run, Math.min(0.99, p.done / Math.max(1, p.total)));
    });
    channel.port1.unref();
    const task: RenderTask = {
      jobId: setId,
      document: JSON.parse(revision.document),
      options: JSON.parse(row.options),
      fonts: this.loadFonts(),
      progress: channel.port2,
      cancel: run.cancel.buffer as SharedArrayBuffer,
      maxSheets: MAX_PRINT_SHEETS,
    };
    let result: RenderResult;
    try {
      result = await this.getPool().run(task, { transferList: [channel.port2], signal: run.abort.signal });
    } catch (err) {
      await run.writing;
      if (Atomics.load(run.cancel, 0) !== 0 || run.handover) return; // deleted, or left to another instance
      const reason = run.abortReason ?? (err instanceof Error ? err.message : String(err));
      return this.fail(setId, reason);
    }
    await run.writing;
    if (Atomics.load(run.cancel, 0) !== 0 || run.handover) return;
    if (await this.store(setId, result)) this.renders.stored++;
  }

  /** Writes a render's progress in order, one write at a time, the latest value each time. */
  private writeProgress(setId: string, run: Running, progress: number): void {
    run.nextProgress = progress;
    if (run.writing) return;
    run.writing = (async () => {
      while (run.nextProgress !== undefined) {
        const value = run.nextProgress;
        run.nextProgress = undefined;
        const row = await this.update(setId, { progress: value }, ['rendering']);
        // The set was deleted (perhaps on another instance): stop its render.
        if (!row && !(await this.exists(setId))) this.cancel(setId);
      }
    })().finally(() => (run.writing = undefined));
  }

  private async exists(setId: string): Promise<boolean> {
    const { printSets } = this.data.t;
    try {
      return (await this.data.db.select({ id: printSets.id }).from(printSets).where(eq(printSets.id, setId))).length > 0;
    } catch {
      return true;
    }
  }

  /** Stops a running set's worker at once (piscina terminates the thread). */
  private abort(setId: string, reason: string): void {
    const run = this.running.get(setId);
    if (!run || run.abort.signal.aborted) return;
    run.abortReason = reason;
    run.abort.abort(new Error(reason));
  }

  /** Stores a finished render's PDF and the set's end; false when the set is gone or the PDF could not be stored. */
  private async store(setId: string, m: RenderResult): Promise<boolean> {
    const { printSets } = this.data.t;
    const [row] = await this.data.db.select().from(printSets).where(eq(printSets.id, setId));
    if (!row) return false; // deleted while rendering
    const storagePath = `print-sets/${row.createdBy}/${setId}.pdf`;
    let stored: StoredFile;
    try {
      // All or nothing (FileStore): a render stopped half-way leaves no file to serve.
      stored = await this.files.put(storagePath, new Uint8Array(m.pdf));
    } catch (err) {
      const code = (err as NodeJS.ErrnoException).code;
      this.log('print set could not be stored', err);
      await this.fail(setId, code === 'ENOSPC' || code === 'EDQUOT' || code === 'EFBIG' ? 'The server has no space left to store the PDF' : `The PDF could not be stored (${code ?? 'error'})`);
      return false;
    }
    await this.end(
      setId,
      {
        status: 'done',
        progress: 1,
        sheets: m.sheetCount,
        templateSheets: m.templateSheetCount,
        lowerBoundSheets: m.lowerBoundSheets,
        bytes: stored.size,
        sha256: stored.sha256,
        storagePath,
        finishedAt: new Date(),
      },
      [storagePath],
    );
    return true;
  }

  private fail(setId: string, message: string): Promise<void> {
    return this.end(setId, { status: 'failed', error: message.slice(0, 500), finishedAt: new Date() });
  }

  /**
   * Writes a set's end state. When the write fails (a full disk: the set's own progress writes may have
   * used the last room), the end is kept and written again with growing waits until it is stored, so a
   * set never stays "rendering" once there is room again. A set deleted meanwhile has its files removed.
   */
  private async end(setId: string, values: Partial<PrintSet>, orphanPaths: string[] = []): Promise<void> {
    const stored = await this.tryUpdate(setId, values);
    if (stored === 'gone') {
      if (orphanPaths.length > 0) await this.files.remove(orphanPaths).catch((err: unknown) => this.log('files of a deleted print set could not be removed', err));
      return;
    }
    if (stored === 'stored') return;
    const previous = this.unstoredEnds.get(setId);
    if (previous) clearTimeout(previous.timer);
    const entry: UnstoredEnd = { values, waitMs: END_RETRY_FIRST_MS, orphanPaths };
    this.unstoredEnds.set(setId, entry);
    this.scheduleEndRetry(setId, entry);
  }

  private scheduleEndRetry(setId: string, entry: UnstoredEnd): void {
    entry.timer = setTimeout(() => {
      if (this.unstoredEnds.get(setId) !== entry) return;
      void this.tryUpdate(setId, entry.values).then((stored) => {
        if (this.unstoredEnds.get(setId) !== entry) return;
        if (stored === 'failed') {
          entry.waitMs = Math.min(END_RETRY_MAX_MS, entry.waitMs * 2);
          this.scheduleEndRetry(setId, entry);
          return;
        }
        this.unstoredEnds.delete(setId);
        if (stored === 'gone' && entry.orphanPaths?.length) void this.files.remove(entry.orphanPaths).catch((err: unknown) => this.log('files of a deleted print set could not be removed', err));
      });
    }, entry.waitMs);
    entry.timer.unref();
  }

  private async tryUpdate(setId: string, values: Partial<PrintSet>): Promise<'stored' | 'gone' | 'failed'> {
    const { printSets } = this.data.t;
    try {
      const [row] = await this.data.db.update(printSets).set(values).where(eq(printSets.id, setId)).returning();
      if (!row) return 'gone';
      this.events.emit('update', row);
      return 'stored';
    } catch (err) {
      this.log('print set end could not be written yet (written again shortly)', err);
      return 'failed';
    }
  }

  /** Updates a set's row while its status is one of `statuses`; the row written, if any. */
  private async update(setId: string, values: Partial<PrintSet>, statuses: PrintSet['status'][]): Promise<PrintSet | undefined> {
    const { printSets } = this.data.t;
    try {
      const [row] = await this.data.db
        .update(printSets)
        .set(values)
        .where(and(eq(printSets.id, setId), inArray(printSets.status, statuses)))
        .returning();
      if (row) this.events.emit('update', row);
      return row;
    } catch (err) {
      this.log('print set row update failed', err);
      return undefined;
    }
  }
}
