import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, catchError, throwError } from 'rxjs';
import { API } from '../core/api-paths';
import type { Page, PatternWithRevision, RevisionGroup, RevisionSummary, SaveVersionBody } from '../core/api-types';
import { staleSaveOrError } from './patterns.service';

/** History in runs of saves, the revisions of one run, and named versions (docs/api.md, "Revisions"). */
@Injectable({ providedIn: 'root' })
export class RevisionHistoryService {
  private readonly http = inject(HttpClient);

  /** Runs of saves, newest first; `page` is 1-based. */
  groups(patternId: string, page = 1, pageSize = 20): Observable<Page<RevisionGroup>> {
    const params = new HttpParams().set('page', page).set('pageSize', pageSize);
    return this.http.get<Page<RevisionGroup>>(API.revisionGroups(patternId), { params });
  }

  /** The revisions numbered `first`…`last`, newest first. */
  range(patternId: string, first: number, last: number, page = 1, pageSize = 100): Observable<Page<RevisionSummary>> {
    const params = new HttpParams().set('from', first).set('to', last).set('page', page).set('pageSize', pageSize);
    return this.http.get<Page<RevisionSummary>>(API.revisions(patternId), { params });
  }

  /** Stores a named version on top of `baseRevision`; a stale base throws `StaleSaveError`. */
  saveVersion(patternId: string, body: SaveVersionBody): Observable<PatternWithRevision> {
    return this.http
      .post<PatternWithRevision>(API.revisions(patternId), body)
      .pipe(catchError((err: unknown) => throwError(() => staleSaveOrError(err))));
  }
}
