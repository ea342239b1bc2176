import { HttpBackend, HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map, of, shareReplay, tap } from 'rxjs';
import { API } from './api-paths';

/** Keeps the CSRF token the server hands out; fetched once, refreshed after sign-in or a rejection. */
@Injectable({ providedIn: 'root' })
export class CsrfTokenService {
  // HttpBackend skips the interceptors, so fetching the token never loops through itself.
  private readonly http = new HttpClient(inject(HttpBackend));
  private token: string | null = null;
  private pending: Observable<string> | null = null;

  /** The current token, fetching one when none is known. */
  get(): Observable<string> {
    if (this.token) return of(this.token);
    this.pending ??= this.http.get<{ csrfToken: string }>(API.csrf, { withCredentials: true }).pipe(
      map((r) => r.csrfToken),
      tap({
        next: (t) => {
          this.token = t;
          this.pending = null;
        },
        error: () => (this.pending = null),
      }),
      shareReplay(1),
    );
    return this.pending;
  }

  /** Forgets the token (after sign-in/out the server binds a new one to the new session). */
  reset(): void {
    this.token = null;
    this.pending = null;
  }

  /** Takes a token the server sent along with another answer. */
  remember(token: string | null | undefined): void {
    if (token) this.token = token;
  }
}
