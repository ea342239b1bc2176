import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import { API } from '../core/api-paths';
import type { DevMessage, Page, User, UserChangeBody } from '../core/api-types';

/** Admin: every account, its role, disabling; the development inbox. */
@Injectable({ providedIn: 'root' })
export class AdminUsersService {
  private readonly http = inject(HttpClient);

  /** `page` is 1-based. */
  list(q: string, page: number, pageSize: number): Observable<Page<User>> {
    let params = new HttpParams().set('page', page).set('pageSize', pageSize);
    if (q.trim()) params = params.set('q', q.trim());
    return this.http.get<Page<User>>(API.adminUsers, { params });
  }

  update(userId: string, change: UserChangeBody): Observable<User> {
    return this.http.patch<{ user: User }>(API.adminUser(userId), change).pipe(map((r) => r.user));
  }

  /** Mail caught by the local fake mail server (development only; 404 in production). */
  devInbox(): Observable<DevMessage[]> {
    return this.http.get<{ messages: DevMessage[] }>(API.devInbox).pipe(map((r) => r.messages));
  }
}
