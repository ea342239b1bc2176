import { inject } from '@angular/core';
import { CanActivateFn, Router } from '@angular/router';
import { map } from 'rxjs';
import { AuthService } from './auth.service';
import type { Role } from './api-types';

/** Lets signed-in users through; others go to sign-in and come back afterwards. */
export const authGuard: CanActivateFn = (_route, state) => {
  const router = inject(Router);
  return inject(AuthService)
    .load()
    .pipe(map((user) => (user ? true : router.createUrlTree(['/sign-in'], { queryParams: { next: state.url } }))));
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
          if (!user) return router.createUrlTree(['/sign-in'], { queryParams: { next: state.url } });
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
