/**
 * Where a pattern document sent to the server is checked and stored (docs/design-notes.md#where-documents-are-checked).
 * A small body (the ordinary save, a few kB) is parsed and checked on the request thread: a hop to a
 * worker would cost it more than the check. A large one (over INLINE_DOCUMENT_BYTES of
 * server/http/json-bodies.ts, up to the 100 sections × 2,000 vertices the schema allows, about 5 MB)
 * arrives as raw bytes and goes to a small pool of worker threads (piscina), which parses and checks
 * it, stores the revision through its own database connection and writes the answer; the request
 * thread only moves bytes in and out.
 */
import os from 'node:os';
import type { Response } from 'express';
import { Piscina } from 'piscina';
import type { DocumentTask, DocumentTaskResult } from './document-worker';

const WORKER_FILE = new URL('./worker-bootstrap.mjs', import.meta.url).href;

/** Threads of the validation pool: one fewer than the machine's cores (the request thread keeps one), at least one. */
export function validationThreads(): number {
  return Math.max(1, os.availableParallelism() - 1);
}

/** A large save or new pattern, as the route hands it over (the pool adds where the database is). */
export type LargeDocumentTask = DistributiveOmit<DocumentTask, 'body' | 'dataDir' | 'databaseUrl'>;
type DistributiveOmit<T, K extends PropertyKey> = T extends unknown ? Omit<T, K> : never;

/** The validation pool: started on the first large body; its idle threads stop after a while. */
export class DocumentChecks {
  private pool: Piscina | undefined;
  private closed = false;

  constructor(
    readonly dataDir: string,
    readonly threads = validationThreads(),
    /** The PostgreSQL database the server uses (the workers open their own connections to it); SQLite in `dataDir` without. */
    readonly databaseUrl?: string,
  ) {}

  /** Milliseconds the worker spent on the last large body (parse, check, store, answer); for the benchmark. */
  lastWorkerMs = 0;

  /** Whether the pool has been started (by a large body). */
  get started(): boolean {
    return this.pool !== undefined;
  }

  /**
   * Checks and stores a large body (its chunks as received, joined by the worker) in the pool and
   * sends its answer (the same status and JSON the request thread would have sent). Each chunk is
   * moved to the worker, not copied, when it owns its memory (the HTTP parser's chunks do).
   */
  async answer(res: Response, task: LargeDocumentTask, chunks: readonly Uint8Array[]): Promise<DocumentTaskResult> {
    if (this.closed) throw new Error('The validation pool is closed');
    const owned = (c: Uint8Array) => c.byteOffset === 0 && c.byteLength === c.buffer.byteLength && c.buffer instanceof ArrayBuffer;
    const body = chunks.map((c) => (owned(c) ? new Uint8Array(c.buffer) : new Uint8Array(c)));
    const transferList = [...new Set(body.map((c) => c.buffer as ArrayBuffer))];
    const full: DocumentTask = { ...task, body, dataDir: this.dataDir, databaseUrl: this.databaseUrl } as DocumentTask;
    const result = (await this.getPool().run(full, { transferList })) as DocumentTaskResult;
    this.lastWorkerMs = result.workerMs;
    if ('storageError' in result) {
      // A full or unwritable disk: the error middleware answers 507/503 from the code.
      throw Object.assign(new Error(result.storageError.message), { code: result.storageError.code });
    }
    const answer = Buffer.from(result.answer.buffer, result.answer.byteOffset, result.answer.byteLength);
    res.status(result.status).type('application/json').set('ETag', result.etag).send(answer);
    return result;
  }

  private getPool(): Piscina {
    this.pool ??= new Piscina({
      filename: WORKER_FILE,
      minThreads: 0,
      maxThreads: this.threads,
      // A thread costs a tsx start-up (about a second); keep it a while between large saves.
      idleTimeout: 5 * 60_000,
    });
    return this.pool;
  }

  async close(): Promise<void> {
    this.closed = true;
    await this.pool?.destroy();
    this.pool = undefined;
  }
}
