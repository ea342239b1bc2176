import { HttpErrorResponse, HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { Router } from '@angular/router';
import { catchError, throwError } from 'rxjs';
import { API } from './api-paths';
import { AuthService } from './auth.service';

/** A 401 from any call but "who am I" and sign-in means the session ended: go to sign-in. */
export const sessionExpiredInterceptor: HttpInterceptorFn = (req, next) => {
  const auth = inject(AuthService);
  const router = inject(Router);
  return next(req).pipe(
    catchError((err: unknown) => {
      if (err instanceof HttpErrorResponse && err.status === 401 && req.url !== API.me && req.url !== API.session && req.url !== API.signIn && auth.signedIn()) {
        auth.forget();
        void router.navigate(['/sign-in'], { queryParams: { next: router.url } });
      }
      return throwError(() => err);
    }),
  );
};
