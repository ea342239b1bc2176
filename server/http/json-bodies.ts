import express, { type Request, type RequestHandler } from 'express';
import { HttpError } from './errors';

/** Largest JSON body of a route that takes no pattern document (sign-in, sharing, sewing log, shop…). */
export const SMALL_JSON_LIMIT = '64kb';

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
 * JSON bodies for the API, mounted after the session, CSRF and pattern-access checks so a signed-out
 * or forged request is refused before its body is read. Each route gets its own size limit (a pattern
 * document up to `documentLimit`, everything else {@link SMALL_JSON_LIMIT}); a document body is read
 * only for a signed-in caller, and every body's nesting is checked by a byte scan before parsing.
 */
export function jsonBodies(documentLimit: string): RequestHandler {
  const small = express.json({ limit: SMALL_JSON_LIMIT, strict: true, verify: refuseDeepNesting });
  const large = express.json({ limit: documentLimit, strict: true, verify: refuseDeepNesting });
  return (req, res, next) => {
    if (!takesDocument(req)) return small(req, res, next);
    if (!req.user) return next(new HttpError(401, 'Sign in first'));
    return large(req, res, next);
  };
}
