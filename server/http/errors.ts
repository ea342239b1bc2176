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

/**
 * The one error middleware: known errors keep their status, body-parser errors become 400/413,
 * everything else is a 500 with no detail. Stack traces are logged, never sent.
 */
export function errorMiddleware(log: (err: unknown) => void): ErrorRequestHandler {
  return (err, _req, res, next) => {
    if (res.headersSent) return next(err);
    if (err instanceof HttpError) {
      res.status(err.status).json({ error: err.message, details: err.details ?? null });
      return;
    }
    if (err instanceof z.ZodError) {
      res.status(400).json({ error: 'Invalid request', details: zodDetails(err) });
      return;
    }
    const e = err as { status?: unknown; statusCode?: unknown; type?: unknown; code?: unknown; message?: unknown };
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
      res.status(status).json({ error: byType ?? byCode ?? 'Bad request', details: null });
      return;
    }
    const storage = storageProblem(e.code);
    if (storage) {
      log(err);
      res.status(storage.status).json({ error: storage.message, details: null });
      return;
    }
    log(err);
    res.status(500).json({ error: 'Internal server error', details: null });
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
