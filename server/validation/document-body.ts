/**
 * Reads and checks the JSON body of a request that carries a whole pattern document (a save, a new
 * pattern, a named version): the same steps and the same answers as the request thread's JSON parser and route checks
 * (nesting depth, strict JSON, the route's body schema, the document schema and geometry), but from
 * the raw bytes, so it can run in the validation pool's worker thread (docs/design-notes.md#where-documents-are-checked).
 */
import { createPatternBodySchema, saveRevisionBodySchema, saveVersionBodySchema } from '@seamwright/api';
import { HttpError } from '../http/errors';
import { MAX_JSON_DEPTH, jsonDepthExceeds } from '../http/json-bodies';
import { parseOr400 } from '../http/validate';
import { DocumentText, validDocument } from './valid-document';

/** The body schemas of the routes whose documents may be checked off the request thread. */
export const documentBodySchemas = {
  /** `PUT /api/patterns/:id`. */
  save: saveRevisionBodySchema,
  /** `POST /api/patterns`. */
  create: createPatternBodySchema,
} as const;

export type DocumentBodyKind = keyof typeof documentBodySchemas;

/** A checked body: its other fields and the document as the database stores it. */
export interface CheckedBody<K extends DocumentBodyKind> {
  fields: Omit<ReturnType<(typeof documentBodySchemas)[K]['parse']>, 'document'>;
  document: DocumentText;
}

const decoder = new TextDecoder('utf-8');

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

/**
 * Checks a document route's body, already parsed (a small body, on the request thread) or as bytes (in
 * the worker). Throws the routes' HttpError: 400 with zod's details, malformed JSON, deep nesting.
 */
export function checkDocumentBody<K extends DocumentBodyKind>(kind: K, body: unknown): CheckedBody<K> {
  const value = body instanceof Uint8Array ? parseJsonBody(body) : body;
  const parsed = parseOr400(documentBodySchemas[kind], value) as { document: unknown } & Record<string, unknown>;
  const { document, ...fields } = parsed;
  return { fields: fields as CheckedBody<K>['fields'], document: DocumentText.of(validDocument(document)) };
}

/** A checked named-version body: its fields, and its document if it carries one (else the latest revision's is kept). */
export interface CheckedVersionBody {
  fields: Omit<ReturnType<typeof saveVersionBodySchema.parse>, 'document'>;
  document: DocumentText | undefined;
}

/**
 * Checks the body of `POST /api/patterns/:id/revisions` (save a named version), parsed or as bytes: the
 * version fields with the route's schema, then the document, if any, as a save's.
 */
export function checkVersionBody(body: unknown): CheckedVersionBody {
  const value = body instanceof Uint8Array ? parseJsonBody(body) : body;
  const { document, ...fields } = parseOr400(saveVersionBodySchema, value);
  return { fields, document: document === undefined ? undefined : DocumentText.of(validDocument(document)) };
}
