import { HttpErrorResponse } from '@angular/common/http';

/** One problem with a field, as the server reports it in `details`. */
export interface FieldIssue {
  path: string;
  message: string;
}

/** An error answered by the API as `{ error, details }`, or a network failure. */
export class ApiError extends Error {
  constructor(
    /** HTTP status; 0 when the server could not be reached. */
    readonly status: number,
    message: string,
    readonly details: unknown = null,
  ) {
    super(message);
    this.name = 'ApiError';
  }

  /** Field issues from `details`, when the server sent them as `[{ path, message }]`. */
  get issues(): FieldIssue[] {
    if (!Array.isArray(this.details)) return [];
    return this.details.filter(
      (d): d is FieldIssue => typeof d === 'object' && d !== null && typeof d.message === 'string',
    );
  }
}

/** Turns whatever HttpClient threw into an {@link ApiError} with words a person can read. */
export function toApiError(err: unknown): ApiError {
  if (err instanceof ApiError) return err;
  if (err instanceof HttpErrorResponse) {
    if (err.status === 0) return new ApiError(0, 'The server cannot be reached. Check your connection and try again.');
    const body = err.error as { error?: unknown; details?: unknown } | null;
    if (body && typeof body === 'object' && typeof body.error === 'string') {
      return new ApiError(err.status, body.error, body.details ?? null);
    }
    return new ApiError(err.status, err.status >= 500 ? 'Something went wrong on the server.' : err.statusText || 'Request failed');
  }
  return new ApiError(0, err instanceof Error ? err.message : 'Unexpected error');
}

/** A readable one-line message for a snackbar, with the first field issue when there is one. */
export function describeError(err: unknown): string {
  const e = toApiError(err);
  const first = e.issues[0];
  return first ? `${e.message}: ${first.path ? first.path + ' ' : ''}${first.message}` : e.message;
}
