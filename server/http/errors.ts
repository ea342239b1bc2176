import type { ErrorRequestHandler, RequestHandler } from 'express';
import { z } from 'zod';

/** An error with an HTTP status that the error middleware answers as `{ error, details }`. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly details?: unknown,
  ) {
    super(message);
    this.name = 'HttpError';
  }
}

/** 404 in the one wording used for everything a user may not see. */
export const notFound = (what = 'Not found') => new HttpError(404, what);

/** Turns zod issues into `[{ path, message }]` with dotted paths. */
export function zodDetails(error: z.ZodError): { path: string; message: string }[] {
  return error.issues.map((i) => ({ path: i.path.map(String).join('.'), message: i.message }));
}

/** Answers 404 for any /api route that does not exist. */
export const apiNotFound: RequestHandler = (_req, _res, next) => next(new HttpError(404, 'No such API route'));

/** What an error is answered with: its status, the `{ error, details }` body, and whether it is logged. */
export interface ErrorAnswer {
  status: number;
  body: { error: string; details: unknown };
  log: boolean;
}

/**
 * The answer to an error: known errors keep their status, body-parser errors become 400/413,
 * everything else is a 500 with no detail. Shared by the error middleware and the hot routes
 * (server/http/hot-routes.ts).
 */
export function errorAnswer(err: unknown): ErrorAnswer {
  if (err instanceof HttpError) return { status: err.status, body: { error: err.message, details: err.details ?? null }, log: false };
  if (err instanceof z.ZodError) return { status: 400, body: { error: 'Invalid request', details: zodDetails(err) }, log: false };
  const e = (err ?? {}) as { status?: unknown; statusCode?: unknown; type?: unknown; code?: unknown; message?: unknown };
  const status = typeof e.status === 'number' ? e.status : typeof e.statusCode === 'number' ? e.statusCode : 500;
  if (status >= 400 && status < 500) {
    const messages: Record<string, string> = {
      'entity.parse.failed': 'Malformed JSON body',
      'entity.too.large': 'Request body too large',
      'encoding.unsupported': 'Unsupported body encoding',
      'charset.unsupported': 'Unsupported body charset',
    };
    const byType = typeof e.type === 'string' ? messages[e.type] : undefined;
    const byCode = e.code === 'EBADCSRFTOKEN' ? 'Missing or invalid CSRF token' : undefined;
    return { status, body: { error: byType ?? byCode ?? 'Bad request', details: null }, log: false };
  }
  const storage = storageProblem(e.code);
  if (storage) return { status: storage.status, body: { error: storage.message, details: null }, log: true };
  return { status: 500, body: { error: 'Internal server error', details: null }, log: true };
}

/** The one error middleware: answers {@link errorAnswer}. Stack traces are logged, never sent. */
export function errorMiddleware(log: (err: unknown) => void): ErrorRequestHandler {
  return (err, _req, res, next) => {
    if (res.headersSent) return next(err);
    const answer = errorAnswer(err);
    if (answer.log) log(err);
    res.status(answer.status).json(answer.body);
  };
}

/**
 * A full or unwritable disk gets a clear answer (nothing was stored) instead of a bare 500:
 * 507 Insufficient Storage (RFC 4918 §11.5) or 503 when the data folder cannot be written.
 */
function storageProblem(code: unknown): { status: number; message: string } | undefined {
  if (typeof code !== 'string') return undefined;
  // SQLite reports a write-ahead-log write that hit a full disk as SQLITE_FULL or, depending on the
  // call that failed, as one of the SQLITE_IOERR_* codes (SQLite documentation, "Result and Error Codes").
  if (code === 'ENOSPC' || code === 'EDQUOT' || code === 'EFBIG' || code === 'SQLITE_FULL' || code.startsWith('SQLITE_IOERR')) {
    return { status: 507, message: 'The server has no space left; nothing was stored' };
  }
  if (['EACCES', 'EPERM', 'EROFS', 'ENOTDIR'].includes(code) || code.startsWith('SQLITE_READONLY') || code === 'SQLITE_CANTOPEN') {
    return { status: 503, message: 'The server cannot write its data folder; nothing was stored' };
  }
  return undefined;
}
