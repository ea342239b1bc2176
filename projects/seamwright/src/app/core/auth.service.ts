import { HttpClient, HttpErrorResponse } from '@angular/common/http';
import { Injectable, computed, inject, signal } from '@angular/core';
import { Observable, catchError, map, of, shareReplay, tap, throwError } from 'rxjs';
import { API } from './api-paths';
import type { ChangePasswordBody, ResetConfirmBody, ResetRequestBody, SignInBody, SignUpBody, User } from './api-types';
import { CsrfTokenService } from './csrf-token.service';
import { toApiError } from './api-error';

export type { SignUpBody } from './api-types';

/** The signed-in user and the account calls: sign in/up/out, password reset. */
@Injectable({ providedIn: 'root' })
export class AuthService {
  private readonly http = inject(HttpClient);
  private readonly csrf = inject(CsrfTokenService);
  private readonly current = signal<User | null>(null);
  private loaded$: Observable<User | null> | null = null;

  /** The signed-in user, or null. */
  readonly user = this.current.asReadonly();
  /** Whether someone is signed in. */
  readonly signedIn = computed(() => this.current() !== null);
  /** Whether the user may create patterns. */
  readonly canDesign = computed(() => this.current()?.role === 'designer' || this.current()?.role === 'admin');

  /** Asks the server who is signed in (once; later calls share the answer). */
  load(): Observable<User | null> {
    this.loaded$ ??= this.http.get<{ user: User | null; csrfToken?: string }>(API.session).pipe(
      tap((r) => this.csrf.remember(r.csrfToken)),
      map((r) => r.user ?? null),
      catchError((err: unknown) => (err instanceof HttpErrorResponse && err.status === 401 ? of(null) : throwError(() => toApiError(err)))),
      tap((u) => this.current.set(u)),
      shareReplay(1),
    );
    return this.loaded$;
  }

  signIn(email: string, password: string): Observable<User> {
    return this.http.post<{ user: User; csrfToken?: string }>(API.signIn, { email, password } satisfies SignInBody).pipe(
      tap((r) => this.afterSessionChange(r.user, r.csrfToken)),
      map((r) => r.user),
    );
  }

  signUp(body: SignUpBody): Observable<User> {
    return this.http.post<{ user: User; csrfToken?: string }>(API.signUp, body).pipe(
      tap((r) => this.afterSessionChange(r.user, r.csrfToken)),
      map((r) => r.user),
    );
  }

  signOut(): Observable<void> {
    return this.http.post<{ csrfToken?: string }>(API.signOut, {}).pipe(
      catchError(() => of(null)),
      tap((r) => this.afterSessionChange(null, r?.csrfToken)),
      map(() => undefined),
    );
  }

  /** Asks for a reset e-mail; the server answers the same whether or not the address exists. */
  requestPasswordReset(email: string): Observable<void> {
    return this.http.post<unknown>(API.resetRequest, { email } satisfies ResetRequestBody).pipe(map(() => undefined));
  }

  /** Sets a new password with the single-use token from the e-mail. */
  confirmPasswordReset(token: string, password: string): Observable<void> {
    return this.http.post<unknown>(API.resetConfirm, { token, newPassword: password } satisfies ResetConfirmBody).pipe(map(() => undefined));
  }

  /** Changes the password; the server signs out the user's other sessions. */
  changePassword(currentPassword: string, newPassword: string): Observable<void> {
    return this.http.post<unknown>(API.changePassword, { currentPassword, newPassword } satisfies ChangePasswordBody).pipe(map(() => undefined));
  }

  /** Forgets the user locally (the server said the session is gone). */
  forget(): void {
    this.afterSessionChange(null);
  }

  private afterSessionChange(user: User | null, csrfToken?: string): void {
    this.csrf.reset();
    this.csrf.remember(csrfToken);
    this.current.set(user);
    this.loaded$ = of(user);
  }
}
