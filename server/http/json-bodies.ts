import express, { type Request, type RequestHandler } from 'express';
import { HttpError } from './errors';

/** Largest JSON body of a route that takes no pattern document (sign-in, sharing, sewing log, shop…). */
export const SMALL_JSON_LIMIT = '64kb';

/**
 * Document bodies up to this many bytes are parsed and checked on the request thread; larger ones (and
 * bodies of unknown length) of the routes that can, in the validation pool (server/validation). The
 * ordinary save of a block is 1–20 kB, checked inline in about a millisecond; a worker hop would cost
 * it more than that (bench/save-validation.bench.ts).
 */
export const INLINE_DOCUMENT_BYTES = 64 * 1024;

/**
 * Deepest nesting of arrays and objects a JSON body may have. A pattern document nests about eight
 * levels (body → document → sections → geometry → vertices → point); 64 leaves room for growth.
 */
export const MAX_JSON_DEPTH = 64;

const OPEN_ARRAY = 0x5b;
const CLOSE_ARRAY = 0x5d;
const OPEN_OBJECT = 0x7b;
const CLOSE_OBJECT = 0x7d;
const QUOTE = 0x22;
const BACKSLASH = 0x5c;

/**
 * The deepest nesting of `[`/`{` in a JSON text, by one pass over its bytes (brackets inside strings
 * do not count), stopping as soon as `limit` is passed. Structural characters are ASCII and every byte
 * of a multi-byte UTF-8 sequence is ≥ 0x80, so the bytes need no decoding (RFC 8259 §2, §8.1).
 */
export function jsonDepthExceeds(bytes: Uint8Array, limit: number): boolean {
  let depth = 0;
  let inString = false;
  for (let i = 0; i < bytes.length; i++) {
    const b = bytes[i];
    if (inString) {
      if (b === BACKSLASH) i++;
      else if (b === QUOTE) inString = false;
    } else if (b === QUOTE) inString = true;
    else if (b === OPEN_ARRAY || b === OPEN_OBJECT) {
      if (++depth > limit) return true;
    } else if (b === CLOSE_ARRAY || b === CLOSE_OBJECT) depth--;
  }
  return false;
}

/** body-parser's `verify` hook: runs on the raw bytes before `JSON.parse` ever sees them. */
const refuseDeepNesting = (_req: unknown, _res: unknown, buf: Buffer) => {
  if (jsonDepthExceeds(buf, MAX_JSON_DEPTH)) {
    throw new HttpError(400, `The JSON body is nested too deeply (more than ${MAX_JSON_DEPTH} levels)`);
  }
};

/** Routes (below /api) whose body carries a whole pattern document. */
function takesDocument(req: Request): boolean {
  if (req.method === 'POST') return req.path === '/patterns' || req.path === '/patterns/' || /^\/patterns\/[^/]+\/revisions\/?$/.test(req.path);
  if (req.method === 'PUT') return /^\/patterns\/[^/]+\/?$/.test(req.path);
  return false;
}

/**
 * Document routes whose large bodies are checked off the request thread: their bytes are handed over
 * unparsed (a Buffer in `req.body`) and the route sends them to the validation pool
 * (server/validation/document-checks.ts). A body of unknown length counts as large.
 */
function checkedOffThread(req: Request): boolean {
  if (!takesDocument(req) || Number(req.headers['content-length']) <= INLINE_DOCUMENT_BYTES) return false;
  // Another charset than UTF-8 goes to the JSON parser, which answers 415 as before.
  const charset = /;\s*charset="?([^";\s]+)/i.exec(req.headers['content-type'] ?? '')?.[1];
  return charset === undefined || charset.toLowerCase() === 'utf-8';
}

/**
 * A large document body as it arrived: its chunks, not joined. The validation pool joins them (off the
 * request thread); joining 5 MB here cost the request thread a fresh copy per save
 * (bench/save-validation.bench.ts).
 */
export class DocumentBytes {
  constructor(readonly chunks: readonly Uint8Array[]) {}
}

/** The bytes of a body the validation pool checks (chunks, or one Buffer from express.raw); undefined for a parsed body. */
export function largeDocumentBody(body: unknown): readonly Uint8Array[] | undefined {
  if (body instanceof DocumentBytes) return body.chunks;
  if (Buffer.isBuffer(body)) return [body];
  return undefined;
}

/** Bytes of a body-parser limit (`<n>kb` or `<n>mb`, as body-parser's `bytes` reads them: 1 kb = 1024); 0 when written otherwise. */
export function limitBytes(limit: string): number {
  const m = /^(\d+)(kb|mb)$/i.exec(limit);
  if (!m) return 0;
  return Number(m[1]) * (m[2].toLowerCase() === 'kb' ? 1024 : 1024 * 1024);
}

/** A JSON body read as UTF-8 with no conversion. */
const PLAIN_JSON = /^application\/json\s*(;\s*charset="?utf-8"?\s*)?$/i;

/**
 * Whether express.raw would take this body as it is: UTF-8 JSON of a stated length within `limit`, not
 * encoded. Only such a body is read as chunks; anything else keeps express.raw's handling (its limits,
 * decompression and errors).
 */
function plainLargeBody(req: Request, limit: number): boolean {
  const length = req.headers['content-length'];
  if (length === undefined || !/^\d+$/.test(length) || Number(length) > limit) return false;
  const encoding = req.headers['content-encoding'];
  if (encoding !== undefined && encoding.toLowerCase() !== 'identity') return false;
  return req.headers['transfer-encoding'] === undefined && PLAIN_JSON.test(req.headers['content-type'] ?? '');
}

/** A body-parser-like error (the error middleware answers it by its status). */
function readError(status: number, message: string, type: string): Error {
  return Object.assign(new Error(message), { status, statusCode: status, expose: true, type });
}

/** Reads a plain large body (see {@link plainLargeBody}) into `req.body` as {@link DocumentBytes}. */
function readChunks(req: Request, next: (err?: unknown) => void): void {
  const expected = Number(req.headers['content-length']);
  const chunks: Uint8Array[] = [];
  let received = 0;
  const onData = (chunk: Buffer) => {
    chunks.push(chunk);
    received += chunk.length;
  };
  const settle = (err?: unknown) => {
    req.off('data', onData);
    req.off('end', onEnd);
    req.off('error', onError);
    req.off('aborted', onAborted);
    req.off('close', onClose);
    if (err) return next(err);
    req.body = new DocumentBytes(chunks);
    next();
  };
  // The errors raw-body gives (express.raw): 400 with its types.
  const onEnd = () =>
    settle(received === expected ? undefined : readError(400, 'request size did not match content length', 'request.size.invalid'));
  const onError = (err: Error) => settle(Object.assign(err, { status: 400, statusCode: 400 }));
  const onAborted = () => settle(readError(400, 'request aborted', 'request.aborted'));
  const onClose = () => {
    if (!req.complete) onAborted();
  };
  req.on('data', onData);
  req.once('end', onEnd);
  req.once('error', onError);
  req.once('aborted', onAborted);
  req.once('close', onClose);
}

/**
 * JSON bodies for the API, mounted after the session, CSRF and pattern-access checks so a signed-out
 * or forged request is refused before its body is read. Each route gets its own size limit (a pattern
 * document up to `documentLimit`, everything else {@link SMALL_JSON_LIMIT}); a document body is read
 * only for a signed-in caller, and every body's nesting is checked by a byte scan before parsing.
 */
export function jsonBodies(documentLimit: string): RequestHandler {
  const small = express.json({ limit: SMALL_JSON_LIMIT, strict: true, verify: refuseDeepNesting });
  const large = express.json({ limit: documentLimit, strict: true, verify: refuseDeepNesting });
  const raw = express.raw({ limit: documentLimit, type: 'application/json' });
  const rawLimit = limitBytes(documentLimit);
  return (req, res, next) => {
    // A GET, HEAD or OPTIONS request has no body the API reads.
    if (req.method === 'GET' || req.method === 'HEAD' || req.method === 'OPTIONS') return next();
    if (!takesDocument(req)) return small(req, res, next);
    if (!req.user) return next(new HttpError(401, 'Sign in first'));
    if (!checkedOffThread(req)) return large(req, res, next);
    return plainLargeBody(req, rawLimit) ? readChunks(req, next) : raw(req, res, next);
  };
}
