import fs from 'node:fs';
import { EventEmitter } from 'node:events';
import { Worker } from 'node:worker_threads';
import { eq, inArray } from 'drizzle-orm';
import type { Config } from '../config';
import type { Db } from '../db/database';
import { printSets, revisions, type PrintSet } from '../db/schema';
import type { RenderJob, WorkerMessage } from '../print/print-messages';
import { removeStoredFiles, resolveInData, sha256Hex, writeFileAtomic } from './files';

/** The fonts embedded in every print set (shipped in the repository's fonts/ folder). */
export const FONTS_DIR = new URL('../../fonts/', import.meta.url);

const BOOTSTRAP = new URL('../print/worker-bootstrap.mjs', import.meta.url);
const WORKER_ENTRY = new URL('../print/print-worker.ts', import.meta.url).href;

interface Slot {
  worker: Worker;
  ready: Promise<void>;
  busy: string | null;
  timer?: NodeJS.Timeout;
}

/** Renders print sets in worker threads, one job per worker at a time, and stores the PDFs. */
export class PrintSetService {
  /** Emits `update` with the print-set row whenever its status or progress changes. */
  readonly events = new EventEmitter();
  private readonly queue: string[] = [];
  private readonly slots: Slot[] = [];
  private fonts: { regular: Uint8Array; bold: Uint8Array } | undefined;
  private closed = false;
  private readonly idle = new Set<() => void>();

  constructor(
    private readonly db: Db,
    private readonly config: Config,
    private readonly log: (message: string, err?: unknown) => void,
  ) {
    this.events.setMaxListeners(1000);
  }

  /** Picks up jobs left queued or half-rendered by a previous process. */
  resumeUnfinished(): void {
    const rows = this.db
      .select({ id: printSets.id })
      .from(printSets)
      .where(inArray(printSets.status, ['queued', 'rendering']))
      .all();
    for (const r of rows) this.enqueue(r.id);
  }

  /** Queues a print set (its row must exist with status `queued`). */
  enqueue(setId: string): void {
    if (this.closed) return;
    this.queue.push(setId);
    this.pump();
  }

  /** Resolves when nothing is queued or rendering (for tests and shutdown). */
  whenIdle(): Promise<void> {
    if (this.queue.length === 0 && this.slots.every((s) => !s.busy)) return Promise.resolve();
    return new Promise((resolve) => this.idle.add(resolve));
  }

  async close(): Promise<void> {
    this.closed = true;
    this.queue.length = 0;
    for (const s of this.slots) clearTimeout(s.timer);
    await Promise.all(this.slots.map((s) => s.worker.terminate()));
    this.slots.length = 0;
  }

  private loadFonts() {
    this.fonts ??= {
      regular: new Uint8Array(fs.readFileSync(new URL('Roboto-Regular.ttf', FONTS_DIR))),
      bold: new Uint8Array(fs.readFileSync(new URL('Roboto-Bold.ttf', FONTS_DIR))),
    };
    return this.fonts;
  }

  private spawn(): Slot {
    const worker = new Worker(BOOTSTRAP, { workerData: { entry: WORKER_ENTRY } });
    worker.unref();
    const slot: Slot = { worker, busy: null, ready: Promise.resolve() };
    slot.ready = new Promise<void>((resolve) => {
      const onReady = (m: WorkerMessage) => {
        if (m.type === 'ready') {
          worker.off('message', onReady);
          resolve();
        }
      };
      worker.on('message', onReady);
    });
    worker.on('message', (m: WorkerMessage) => this.onMessage(slot, m));
    const lost = (why: unknown) => {
      clearTimeout(slot.timer);
      const job = slot.busy;
      this.slots.splice(this.slots.indexOf(slot), 1);
      if (job) this.fail(job, 'The print worker stopped unexpectedly');
      slot.busy = null;
      if (!this.closed) this.log('print worker stopped', why);
      this.pump();
    };
    worker.on('error', lost);
    worker.on('exit', (code) => {
      if (this.slots.includes(slot)) lost(new Error(`exit code ${code}`));
    });
    this.slots.push(slot);
    return slot;
  }

  private pump(): void {
    if (this.closed) return;
    while (this.queue.length > 0) {
      let slot = this.slots.find((s) => !s.busy);
      if (!slot && this.slots.length < this.config.printWorkers) slot = this.spawn();
      if (!slot) return;
      const setId = this.queue.shift()!;
      this.start(slot, setId);
    }
    if (this.slots.every((s) => !s.busy)) {
      for (const resolve of this.idle) resolve();
      this.idle.clear();
    }
  }

  private start(slot: Slot, setId: string): void {
    const row = this.db.select().from(printSets).where(eq(printSets.id, setId)).get();
    if (!row || (row.status !== 'queued' && row.status !== 'rendering')) return;
    const revision = this.db.select().from(revisions).where(eq(revisions.id, row.revisionId)).get();
    if (!revision) return this.fail(setId, 'The revision is gone');
    slot.busy = setId;
    this.update(setId, { status: 'rendering', progress: 0 });
    // A render that never ends (a bug, a hostile document) must not hold the queue: stop the worker.
    slot.timer = setTimeout(() => {
      if (slot.busy !== setId) return;
      this.fail(setId, `Rendering took longer than ${this.config.printTimeoutSeconds} s and was stopped`);
      slot.busy = null;
      this.slots.splice(this.slots.indexOf(slot), 1);
      void slot.worker.terminate();
      this.pump();
    }, this.config.printTimeoutSeconds * 1000);
    slot.timer.unref();
    const job: RenderJob = {
      type: 'render',
      jobId: setId,
      document: JSON.parse(revision.document),
      options: JSON.parse(row.options),
      fonts: this.loadFonts(),
    };
    void slot.ready.then(() => slot.worker.postMessage(job));
  }

  private onMessage(slot: Slot, m: WorkerMessage): void {
    if (m.type === 'ready' || m.jobId !== slot.busy) return;
    if (m.type !== 'progress') clearTimeout(slot.timer);
    if (m.type === 'progress') {
      // Cover and appendix are steps too; keep 1.0 for "stored".
      this.update(m.jobId, { progress: Math.min(0.99, m.done / Math.max(1, m.total)) });
      return;
    }
    const setId = m.jobId;
    if (m.type === 'failed') {
      slot.busy = null;
      this.fail(setId, m.message);
      this.pump();
      return;
    }
    void this.store(setId, m).finally(() => {
      slot.busy = null;
      this.pump();
    });
  }

  private async store(setId: string, m: Extract<WorkerMessage, { type: 'done' }>): Promise<void> {
    const row = this.db.select().from(printSets).where(eq(printSets.id, setId)).get();
    if (!row) return; // deleted while rendering
    const storagePath = `print-sets/${row.createdBy}/${setId}.pdf`;
    const pdf = new Uint8Array(m.pdf);
    try {
      await writeFileAtomic(resolveInData(this.config.dataDir, storagePath), pdf);
    } catch (err) {
      const code = (err as NodeJS.ErrnoException).code;
      this.log('print set could not be stored', err);
      this.fail(setId, code === 'ENOSPC' || code === 'EDQUOT' || code === 'EFBIG' ? 'The server has no space left to store the PDF' : `The PDF could not be stored (${code ?? 'error'})`);
      return;
    }
    const updated = this.update(setId, {
      status: 'done',
      progress: 1,
      sheets: m.sheetCount,
      templateSheets: m.templateSheetCount,
      lowerBoundSheets: m.lowerBoundSheets,
      bytes: pdf.byteLength,
      sha256: sha256Hex(pdf),
      storagePath,
      finishedAt: new Date(),
    });
    if (!updated) await removeStoredFiles(this.config.dataDir, [storagePath]);
  }

  private fail(setId: string, message: string): void {
    this.update(setId, { status: 'failed', error: message.slice(0, 500), finishedAt: new Date() });
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
