import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, catchError, map, throwError } from 'rxjs';
import { API } from '../core/api-paths';
import type { PatternWithRevision, RestoreBody, Revision } from '../core/api-types';
import { staleSaveOrError } from './patterns.service';

/** A pattern's revisions: read one, restore one as a new revision (History's lists: RevisionHistoryService). */
@Injectable({ providedIn: 'root' })
export class RevisionsService {
  private readonly http = inject(HttpClient);

  get(patternId: string, n: number): Observable<Revision> {
    return this.http.get<{ revision: Revision }>(API.revision(patternId, n)).pipe(map((r) => r.revision));
  }

  /** Makes revision `n`'s document the newest revision, on top of `baseRevision`. */
  restore(patternId: string, n: number, baseRevision: number): Observable<PatternWithRevision> {
    return this.http
      .post<PatternWithRevision>(API.restoreRevision(patternId, n), { baseRevision } satisfies RestoreBody)
      .pipe(catchError((err: unknown) => throwError(() => staleSaveOrError(err))));
  }
}
