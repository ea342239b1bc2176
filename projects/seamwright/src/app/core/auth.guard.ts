import { inject } from '@angular/core';
import { CanActivateFn, Router, UrlTree } from '@angular/router';
import { map } from 'rxjs';
import { AuthService } from './auth.service';
import type { Role } from './api-types';

/** The sign-in page, set to come back to `url` afterwards. */
function signInFirst(router: Router, url: string): UrlTree {
  return router.createUrlTree(['/sign-in'], { queryParams: { next: url } });
}

/** Lets signed-in users through; others go to sign-in and come back afterwards. */
export const authGuard: CanActivateFn = (_route, state) => {
  const router = inject(Router);
  return inject(AuthService)
    .load()
    .pipe(map((user) => (user ? true : signInFirst(router, state.url))));
};

/** Lets only users with one of `roles` through; others see "not found". */
export const roleGuard =
  (...roles: Role[]): CanActivateFn =>
  (_route, state) => {
    const router = inject(Router);
    return inject(AuthService)
      .load()
      .pipe(
        map((user) => {
          if (!user) return signInFirst(router, state.url);
          return roles.includes(user.role) ? true : router.createUrlTree(['/not-found']);
        }),
      );
  };

/** Sends a signed-in user past the sign-in and sign-up pages. */
export const guestGuard: CanActivateFn = () => {
  const router = inject(Router);
  return inject(AuthService)
    .load()
    .pipe(map((user) => (user ? router.createUrlTree(['/patterns']) : true)));
};
