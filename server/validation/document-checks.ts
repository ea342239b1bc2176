/**
 * Where a pattern document sent to the server is checked (docs/design-notes.md#where-documents-are-checked).
 * A small body (the ordinary save, a few kB) is parsed and checked on the request thread: a hop to a
 * worker would cost it more than the check. A large one (over INLINE_DOCUMENT_BYTES of server/http/json-bodies.ts, up to the 100 sections × 2,000 vertices the
 * schema allows, about 6 MB) arrives as raw bytes (server/http/json-bodies.ts) and is parsed, checked
 * and written out as the stored JSON text in a small pool of worker threads (piscina), so the request
 * thread only moves bytes and stores the text it gets back.
 */
import os from 'node:os';
import { Piscina } from 'piscina';
import { HttpError } from '../http/errors';
import { parseOr400 } from '../http/validate';
import { documentBodySchemas, type DocumentBodyKind, type DocumentBodyResult, type DocumentBodyTask } from './document-body';
import { DocumentText, validDocument } from './valid-document';

const WORKER_FILE = new URL('./worker-bootstrap.mjs', import.meta.url).href;

/** A checked document body: its other fields (base revision, edit session) and the document as stored. */
export interface CheckedDocumentBody<K extends DocumentBodyKind> {
  fields: Omit<ReturnType<(typeof documentBodySchemas)[K]['parse']>, 'document'>;
  document: DocumentText;
  /** Milliseconds the worker spent on the body (0 when checked on the request thread). */
  workerMs: number;
}

/** Threads of the validation pool: one fewer than the machine's cores (the request thread keeps one), at least one. */
export function validationThreads(): number {
  return Math.max(1, os.availableParallelism() - 1);
}

/** The validation pool: started on the first large body, its idle threads stop after a while. */
export class DocumentChecks {
  private pool: Piscina | undefined;
  private closed = false;

  constructor(readonly threads = validationThreads()) {}

  /**
   * Checks a document route's body: the raw bytes of a large body in the pool, a body the JSON parser
   * already read (small) on this thread. Throws the same HttpError (400 with zod's details) either way.
   */
  async check<K extends DocumentBodyKind>(kind: K, body: unknown): Promise<CheckedDocumentBody<K>> {
    if (!Buffer.isBuffer(body)) {
      const parsed = parseOr400(documentBodySchemas[kind], body) as { document: unknown } & Record<string, unknown>;
      const { document, ...fields } = parsed;
      return { fields: fields as CheckedDocumentBody<K>['fields'], document: DocumentText.of(validDocument(document)), workerMs: 0 };
    }
    const result = await this.inWorker(kind, body);
    if (!result.ok) throw new HttpError(result.status, result.error, result.details);
    return { fields: result.fields as CheckedDocumentBody<K>['fields'], document: new DocumentText(result.title, result.json), workerMs: result.workerMs };
  }

  /** Sends the bytes to a worker (moved, not copied, when the buffer owns its memory). */
  private inWorker(kind: DocumentBodyKind, body: Buffer): Promise<DocumentBodyResult> {
    if (this.closed) return Promise.reject(new HttpError(503, 'The server is shutting down'));
    const owns = body.byteOffset === 0 && body.byteLength === body.buffer.byteLength && body.buffer instanceof ArrayBuffer;
    const bytes = owns ? new Uint8Array(body.buffer) : new Uint8Array(body);
    const task: DocumentBodyTask = { kind, body: bytes };
    return this.getPool().run(task, { transferList: [bytes.buffer as ArrayBuffer] }) as Promise<DocumentBodyResult>;
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
