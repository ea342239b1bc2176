import { HttpErrorResponse, HttpInterceptorFn, HttpRequest } from '@angular/common/http';
import { inject } from '@angular/core';
import { catchError, switchMap, throwError } from 'rxjs';
import { CsrfTokenService } from './csrf-token.service';
import { CSRF_HEADER } from './api-paths';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

function isApi(req: HttpRequest<unknown>): boolean {
  return req.url.startsWith('/api/') || req.url === '/api';
}

/**
 * Sends the session cookie with every API call and the CSRF token header with every state-changing
 * one. A request refused for its token is retried once with a fresh token (the token changes with
 * the session, e.g. right after signing in).
 */
export const csrfInterceptor: HttpInterceptorFn = (req, next) => {
  if (!isApi(req)) return next(req);
  const withCookie = req.clone({ withCredentials: true });
  if (SAFE_METHODS.has(req.method)) return next(withCookie);
  const csrf = inject(CsrfTokenService);
  const send = () => csrf.get().pipe(switchMap((token) => next(withCookie.clone({ setHeaders: { [CSRF_HEADER]: token } }))));
  return send().pipe(
    catchError((err: unknown) => {
      if (err instanceof HttpErrorResponse && err.status === 403 && /csrf/i.test(JSON.stringify(err.error ?? ''))) {
        csrf.reset();
        return send();
      }
      return throwError(() => err);
    }),
  );
};
