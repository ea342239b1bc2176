import { HttpErrorResponse, HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { Router } from '@angular/router';
import { catchError, throwError } from 'rxjs';
import { API } from './api-paths';
import { AuthService } from './auth.service';

/**
 * A 401 from any call but "who am I" and sign-in means the session ended: go to sign-in. A wrong
 * current password on change-password is a 401 about that field (details name it), not the session.
 */
export const sessionExpiredInterceptor: HttpInterceptorFn = (req, next) => {
  const auth = inject(AuthService);
  const router = inject(Router);
  return next(req).pipe(
    catchError((err: unknown) => {
      const wrongCurrentPassword = req.url === API.changePassword && fieldNamed(err, 'currentPassword');
      if (err instanceof HttpErrorResponse && err.status === 401 && req.url !== API.me && req.url !== API.session && req.url !== API.signIn && !wrongCurrentPassword && auth.signedIn()) {
        auth.forget();
        void router.navigate(['/sign-in'], { queryParams: { next: router.url } });
      }
      return throwError(() => err);
    }),
  );
};

function fieldNamed(err: unknown, path: string): boolean {
  const details: unknown = err instanceof HttpErrorResponse ? (err.error as { details?: unknown } | null)?.details : null;
  return Array.isArray(details) && details.some((d: { path?: unknown }) => d?.path === path);
}
