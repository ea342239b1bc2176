/**
 * Reads and checks the JSON body of a request that carries a whole pattern document (a save, a new
 * pattern): the same steps and the same answers as the request thread's JSON parser and route checks
 * (nesting depth, strict JSON, the route's body schema, the document schema and geometry), but from
 * the raw bytes, so it can run in the validation pool's worker thread (docs/design-notes.md#where-documents-are-checked).
 */
import { createPatternBodySchema, saveRevisionBodySchema } from '@seamwright/api';
import { HttpError } from '../http/errors';
import { MAX_JSON_DEPTH, jsonDepthExceeds } from '../http/json-bodies';
import { parseOr400 } from '../http/validate';
import { validDocument } from './valid-document';

/** The body schemas of the routes whose documents may be checked off the request thread. */
export const documentBodySchemas = {
  /** `PUT /api/patterns/:id`. */
  save: saveRevisionBodySchema,
  /** `POST /api/patterns`. */
  create: createPatternBodySchema,
} as const;

export type DocumentBodyKind = keyof typeof documentBodySchemas;

/** One body to check (a task of the validation pool). */
export interface DocumentBodyTask {
  kind: DocumentBodyKind;
  /** The body's bytes as received (UTF-8 JSON). */
  body: Uint8Array;
}

/** What a check gives back: the body's other fields and the document as stored, or the 4xx answer. */
export type DocumentBodyResult =
  | { ok: true; fields: Record<string, unknown>; title: string; json: string; workerMs: number }
  | { ok: false; status: number; error: string; details: unknown; workerMs: number };

const decoder = new TextDecoder('utf-8', { fatal: false });

/**
 * The body as JSON, as the request thread's parser would read it (express.json with `strict`, and the
 * nesting check on the bytes first): an empty body is `{}`, anything but an object or array at the top
 * is malformed.
 */
export function parseJsonBody(bytes: Uint8Array): unknown {
  if (jsonDepthExceeds(bytes, MAX_JSON_DEPTH)) {
    throw new HttpError(400, `The JSON body is nested too deeply (more than ${MAX_JSON_DEPTH} levels)`);
  }
  if (bytes.length === 0) return {};
  const text = decoder.decode(bytes);
  // The first character after JSON's whitespace (RFC 8259 §2: space, tab, line feed, carriage return).
  let at = 0;
  while (at < text.length && ' \t\n\r'.includes(text[at])) at++;
  const first = text[at];
  if (first !== '{' && first !== '[') throw new HttpError(400, 'Malformed JSON body');
  try {
    return JSON.parse(text) as unknown;
  } catch {
    throw new HttpError(400, 'Malformed JSON body');
  }
}

/** Checks one document body from its bytes; never throws an HttpError (it comes back as the answer). */
export function checkDocumentBody(task: DocumentBodyTask): DocumentBodyResult {
  const t0 = performance.now();
  try {
    const body = parseOr400(documentBodySchemas[task.kind], parseJsonBody(task.body)) as { document: unknown } & Record<string, unknown>;
    const { document, ...fields } = body;
    const checked = validDocument(document);
    return { ok: true, fields, title: checked.title, json: JSON.stringify(checked), workerMs: performance.now() - t0 };
  } catch (err) {
    if (!(err instanceof HttpError)) throw err;
    return { ok: false, status: err.status, error: err.message, details: err.details ?? null, workerMs: performance.now() - t0 };
  }
}
