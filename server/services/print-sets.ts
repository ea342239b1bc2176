import fs from 'node:fs';
import { EventEmitter } from 'node:events';
import { MessageChannel } from 'node:worker_threads';
import { eq, inArray } from 'drizzle-orm';
import { Piscina } from 'piscina';
import type { Config } from '../config';
import type { Db } from '../db/database';
import { printSets, revisions, type PrintSet } from '../db/schema';
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
 * Fair between users: each user's sets wait in their own queue, and free threads go to the users in
 * turn (round robin), so one user's sets queue behind each other, never in front of others'. A user who
 * already has a set rendering does not take the last free thread, which stays for whoever comes next
 * (with a pool of one thread, sets simply take turns by user). A deleted set stops: a queued one leaves
 * its queue, a rendering one stops at its next sheet, or within {@link CANCEL_GRACE_MS} its worker is
 * stopped outright.
 */
export class PrintSetService {
  /** Emits `update` with the print-set row whenever its status or progress changes. */
  readonly events = new EventEmitter();
  /** Queued set ids per user, oldest first. */
  private readonly waiting = new Map<string, string[]>();
  /** Users with queued sets, in the order their turn comes. */
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

  constructor(
    private readonly db: Db,
    private readonly config: Config,
    private readonly log: (message: string, err?: unknown) => void,
    files?: FileStore,
  ) {
    this.events.setMaxListeners(1000);
    this.files = fileStoreOf({ config, files });
  }

  /** Threads the pool renders on at once. */
  get threads(): number {
    return this.config.printWorkers;
  }

  /** Sets rendering now (for tests and the health figures). */
  get activeCount(): number {
    return this.running.size;
  }

  /** Picks up jobs left queued or half-rendered by a previous process, oldest first. */
  resumeUnfinished(): void {
    const rows = this.db
      .select({ id: printSets.id })
      .from(printSets)
      .where(inArray(printSets.status, ['queued', 'rendering']))
      .orderBy(printSets.createdAt)
      .all();
    for (const r of rows) this.enqueue(r.id);
  }

  /** Queues a print set (its row must exist with status `queued` or `rendering`) in its maker's queue. */
  enqueue(setId: string): void {
    if (this.closed) return;
    const row = this.db.select({ createdBy: printSets.createdBy }).from(printSets).where(eq(printSets.id, setId)).get();
    if (!row) return;
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
   */
  cancel(setId: string): void {
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
    if (!run) return;
    Atomics.store(run.cancel, 0, 1);
    clearTimeout(run.timer);
    run.timer = setTimeout(() => this.abort(setId, RENDER_CANCELLED), CANCEL_GRACE_MS);
    run.timer.unref();
  }

  /** Resolves when nothing is queued or rendering (for tests and shutdown). */
  whenIdle(): Promise<void> {
    if (this.isIdle()) return Promise.resolve();
    return new Promise((resolve) => this.idle.add(resolve));
  }

  async close(): Promise<void> {
    this.closed = true;
    this.waiting.clear();
    this.turns.length = 0;
    for (const id of [...this.running.keys()]) this.abort(id, 'The server is shutting down');
    await Promise.allSettled([...this.pending]);
    await this.pool?.destroy();
    this.pool = undefined;
    // One last try at ends not yet stored; a set still left "rendering" is rendered again at start-up.
    for (const [setId, entry] of this.unstoredEnds) {
      clearTimeout(entry.timer);
      this.tryUpdate(setId, entry.values);
    }
    this.unstoredEnds.clear();
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

  /** Hands free threads to the users in turn. */
  private pump(): void {
    if (this.closed) return;
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
    if (this.isIdle()) {
      for (const resolve of this.idle) resolve();
      this.idle.clear();
    }
  }

  private start(setId: string, userId: string): void {
    const row = this.db.select().from(printSets).where(eq(printSets.id, setId)).get();
    if (!row || (row.status !== 'queued' && row.status !== 'rendering')) return;
    const revision = this.db.select().from(revisions).where(eq(revisions.id, row.revisionId)).get();
    if (!revision) return this.fail(setId, 'The revision is gone');
    const run: Running = { userId, cancel: new Int32Array(new SharedArrayBuffer(4)), abort: new AbortController() };
    this.running.set(setId, run);
    this.update(setId, { status: 'rendering', progress: 0 });
    // A render that never ends (a bug, a hostile document) must not hold a thread: stop its worker.
    run.timer = setTimeout(
      () => this.abort(setId, `Rendering took longer than ${this.config.printTimeoutSeconds} s and was stopped`),
      this.config.printTimeoutSeconds * 1000,
    );
    run.timer.unref();
    const channel = new MessageChannel();
    channel.port1.on('message', (p: RenderProgress) => {
      // Cover and appendix are steps too; keep 1.0 for "stored".
      if (this.running.get(setId) === run && Atomics.load(run.cancel, 0) === 0) this.update(setId, { progress: Math.min(0.99, p.done / Math.max(1, p.total)) });
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
    const done = this.getPool()
      .run(task, { transferList: [channel.port2], signal: run.abort.signal })
      .then(
        (result: RenderResult) => (Atomics.load(run.cancel, 0) !== 0 ? undefined : this.store(setId, result)),
        (err: unknown) => {
          if (Atomics.load(run.cancel, 0) !== 0) return; // deleted: nothing to report
          const reason = run.abortReason ?? (err instanceof Error ? err.message : String(err));
          this.fail(setId, reason);
        },
      )
      .catch((err: unknown) => this.log('print set could not be finished', err))
      .finally(() => {
        clearTimeout(run.timer);
        channel.port1.close();
        this.running.delete(setId);
        this.pending.delete(done);
        this.pump();
      });
    this.pending.add(done);
  }

  /** Stops a running set's worker at once (piscina terminates the thread). */
  private abort(setId: string, reason: string): void {
    const run = this.running.get(setId);
    if (!run || run.abort.signal.aborted) return;
    run.abortReason = reason;
    run.abort.abort(new Error(reason));
  }

  private async store(setId: string, m: RenderResult): Promise<void> {
    const row = this.db.select().from(printSets).where(eq(printSets.id, setId)).get();
    if (!row) return; // deleted while rendering
    const storagePath = `print-sets/${row.createdBy}/${setId}.pdf`;
    let stored: StoredFile;
    try {
      stored = await this.files.put(storagePath, new Uint8Array(m.pdf));
    } catch (err) {
      const code = (err as NodeJS.ErrnoException).code;
      this.log('print set could not be stored', err);
      this.fail(setId, code === 'ENOSPC' || code === 'EDQUOT' || code === 'EFBIG' ? 'The server has no space left to store the PDF' : `The PDF could not be stored (${code ?? 'error'})`);
      return;
    }
    this.end(
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
  }

  private fail(setId: string, message: string): void {
    this.end(setId, { status: 'failed', error: message.slice(0, 500), finishedAt: new Date() });
  }

  /**
   * Writes a set's end state. When the write fails (a full disk: the set's own progress writes may have
   * used the last room), the end is kept and written again with growing waits until it is stored, so a
   * set never stays "rendering" once there is room again. A set deleted meanwhile has its files removed.
   */
  private end(setId: string, values: Partial<PrintSet>, orphanPaths: string[] = []): void {
    const stored = this.tryUpdate(setId, values);
    if (stored === 'gone') {
      if (orphanPaths.length > 0) void this.files.remove(orphanPaths).catch((err: unknown) => this.log('files of a deleted print set could not be removed', err));
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
      const stored = this.tryUpdate(setId, entry.values);
      if (stored === 'failed') {
        entry.waitMs = Math.min(END_RETRY_MAX_MS, entry.waitMs * 2);
        this.scheduleEndRetry(setId, entry);
        return;
      }
      this.unstoredEnds.delete(setId);
      if (stored === 'gone' && entry.orphanPaths?.length) void this.files.remove(entry.orphanPaths).catch((err: unknown) => this.log('files of a deleted print set could not be removed', err));
    }, entry.waitMs);
    entry.timer.unref();
  }

  private tryUpdate(setId: string, values: Partial<PrintSet>): 'stored' | 'gone' | 'failed' {
    try {
      const row = this.db.update(printSets).set(values).where(eq(printSets.id, setId)).returning().get();
      if (!row) return 'gone';
      this.events.emit('update', row);
      return 'stored';
    } catch (err) {
      this.log('print set end could not be written yet (written again shortly)', err);
      return 'failed';
    }
  }

  private update(setId: string, values: Partial<PrintSet>): PrintSet | undefined {
    try {
      const row = this.db.update(printSets).set(values).where(eq(printSets.id, setId)).returning().get();
      if (row) this.events.emit('update', row);
      return row;
    } catch (err) {
      this.log('print set row update failed', err);
      return undefined;
    }
  }
}
