/**
 * The validation pool's task (a piscina worker thread): one save, named version or new pattern with a large document,
 * from the body's bytes to the answer's bytes. It parses and checks the body, stores the revision
 * through its own connection to the database (SQLite in WAL mode: the request thread keeps reading
 * meanwhile and writes take turns under SQLite's lock; PostgreSQL: a small pool of its own) and
 * writes the answer, so the request thread only sends it.
 */
import { createHash } from 'node:crypto';
import { Piscina, transferableSymbol, valueSymbol } from 'piscina';
import type { Access } from '../services/access';
import { pgData, sqliteData, type Data } from '../db/data';
import { openDatabase } from '../db/database';
import { openPostgres } from '../db/postgres';
import { HttpError } from '../http/errors';
import { createPattern, ownerName, patternJson, patternWithRevisionText, saveRevision } from '../services/revisions';
import { checkDocumentBody, checkVersionBody } from './document-body';
import { saveVersion } from './version-save';

/** One large document body to check and store. */
export type DocumentTask = {
  /** The body's bytes as received (UTF-8 JSON), in the chunks they arrived in. */
  body: Uint8Array[];
  dataDir: string;
  /** The PostgreSQL database the server uses, when it uses one (else SQLite in `dataDir`). */
  databaseUrl?: string;
  userId: string;
  /** The caller's display name (the new revision's author). */
  displayName: string;
} & ({ kind: 'save' | 'version'; patternId: string; access: Access } | { kind: 'create' });

/** The answer to send: status, JSON bytes and their ETag; or a storage error's code for the error middleware. */
export type DocumentTaskResult =
  | { status: number; answer: Uint8Array; etag: string; workerMs: number }
  | { storageError: { code: string; message: string }; workerMs: number };

/** This thread's own connection, opened on its first task (a pool serves one server, so one database). */
let database: { where: string; data: Promise<Data>; close: () => Promise<void> } | undefined;

/** The database of `task`, opened once per thread: migrated already by the server, so not again here. */
async function dataOf(task: Pick<DocumentTask, 'dataDir' | 'databaseUrl'>): Promise<Data> {
  const where = task.databaseUrl ?? task.dataDir;
  if (database?.where !== where) {
    await database?.close().catch(() => undefined);
    if (task.databaseUrl) {
      const opening = openPostgres(task.databaseUrl, { max: 2, migrate: false });
      database = { where, data: opening.then(pgData), close: async () => (await opening).close() };
    } else {
      const handle = openDatabase(task.dataDir);
      database = { where, data: Promise.resolve(sqliteData(handle)), close: async () => handle.close() };
    }
  }
  return database.data;
}

/**
 * The task as piscina runs it: the result with its answer's bytes moved to the request thread, not
 * copied (a fresh 5 MB copy there cost it tens of milliseconds on a busy machine).
 */
export default async function documentTaskMoved(task: DocumentTask): Promise<DocumentTaskResult> {
  const result = await documentTask(task);
  if (!('answer' in result)) return result;
  const { answer } = result;
  // A small answer shares Node's buffer pool, which must not move: it is copied into bytes of its own.
  const own = answer.byteOffset === 0 && answer.byteLength === answer.buffer.byteLength ? answer : new Uint8Array(answer);
  const moved = { [transferableSymbol]: [own.buffer], [valueSymbol]: { ...result, answer: own } };
  return Piscina.move(moved) as unknown as DocumentTaskResult;
}

/** One task, from the body's bytes to the answer's bytes. */
export async function documentTask(task: DocumentTask): Promise<DocumentTaskResult> {
  const t0 = performance.now();
  const bytes = task.body.length === 1 ? task.body[0] : Buffer.concat(task.body);
  const done = (status: number, text: string) => {
    const answer = Buffer.from(text, 'utf8');
    return { status, answer, etag: weakEtag(answer), workerMs: performance.now() - t0 };
  };
  try {
    if (task.kind === 'save') {
      const { fields, document } = checkDocumentBody('save', bytes);
      const d = await dataOf(task);
      const saved = await d.transaction((tx) =>
        saveRevision(tx, task.patternId, fields.baseRevision, document, task.userId, { editSession: fields.editSession }),
      );
      const pattern = patternJson(saved.pattern, await ownerName(d, saved.pattern.ownerId), task.access);
      return done(200, patternWithRevisionText(pattern, saved.revision, task.displayName));
    }
    if (task.kind === 'version') {
      const body = checkVersionBody(bytes);
      const d = await dataOf(task);
      const saved = await d.transaction((tx) => saveVersion(tx, task.patternId, body, task.userId));
      const pattern = patternJson(saved.pattern, await ownerName(d, saved.pattern.ownerId), task.access);
      return done(201, patternWithRevisionText(pattern, saved.revision, task.displayName));
    }
    const { document } = checkDocumentBody('create', bytes);
    const d = await dataOf(task);
    const made = await d.transaction((tx) => createPattern(tx, task.userId, document));
    return done(201, patternWithRevisionText(patternJson(made.pattern, task.displayName, 'owner'), made.revision, task.displayName));
  } catch (err) {
    // The error middleware's answer, written here: `{ error, details }` (server/http/errors.ts).
    if (err instanceof HttpError) return done(err.status, JSON.stringify({ error: err.message, details: err.details ?? null }));
    const code = (err as { code?: unknown }).code;
    if (typeof code === 'string') return { storageError: { code, message: (err as Error).message }, workerMs: performance.now() - t0 };
    throw err;
  }
}

/** Express's default ETag of a body (the `etag` package, weak): W/"<length in hex>-<27 characters of its SHA-1 in base64>". */
function weakEtag(body: Buffer): string {
  return `W/"${body.length.toString(16)}-${createHash('sha1').update(body).digest('base64').substring(0, 27)}"`;
}
