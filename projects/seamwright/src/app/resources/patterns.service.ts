import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, catchError, throwError } from 'rxjs';
import type { PatternDocumentInput } from '@seamwright/piecing';
import { API } from '../core/api-paths';
import type { Page, PatternListItem, PatternListQuery, PatternWithRevision, Revision, SaveRevisionBody, StaleSaveDetails } from '../core/api-types';
import { ApiError, toApiError } from '../core/api-error';

/** Thrown by {@link PatternsService.save} when someone else saved first (HTTP 409). */
export class StaleSaveError extends ApiError {
  constructor(
    message: string,
    readonly latest: Revision,
  ) {
    super(409, message, { latest });
    this.name = 'StaleSaveError';
  }
}

/** Turns a 409 that carries the latest revision into a {@link StaleSaveError}. */
export function staleSaveOrError(err: unknown): ApiError {
  const e = toApiError(err);
  const latest = (e.details as Partial<StaleSaveDetails> | null)?.latest;
  return e.status === 409 && latest ? new StaleSaveError(e.message, latest) : e;
}

/** Patterns: list, create, read, save a revision, duplicate, trash, restore, delete. */
@Injectable({ providedIn: 'root' })
export class PatternsService {
  private readonly http = inject(HttpClient);

  list(query: PatternListQuery): Observable<Page<PatternListItem>> {
    let params = new HttpParams()
      .set('page', query.page)
      .set('pageSize', query.pageSize)
      .set('sort', query.sort)
      .set('order', query.order)
      .set('scope', query.scope);
    if (query.q.trim()) params = params.set('q', query.q.trim());
    return this.http.get<Page<PatternListItem>>(API.patterns, { params });
  }

  get(id: string): Observable<PatternWithRevision> {
    return this.http.get<PatternWithRevision>(API.pattern(id));
  }

  create(document: PatternDocumentInput): Observable<PatternWithRevision> {
    return this.http.post<PatternWithRevision>(API.patterns, { document });
  }

  /** Saves the document as a new revision on top of `baseRevision`; a stale base throws {@link StaleSaveError}. */
  save(id: string, body: SaveRevisionBody): Observable<PatternWithRevision> {
    return this.http.put<PatternWithRevision>(API.pattern(id), body).pipe(catchError((err: unknown) => throwError(() => staleSaveOrError(err))));
  }

  duplicate(id: string, title?: string): Observable<PatternWithRevision> {
    return this.http.post<PatternWithRevision>(API.duplicate(id), title ? { title } : {});
  }

  trash(id: string): Observable<unknown> {
    return this.http.post(API.trash(id), {});
  }

  restore(id: string): Observable<unknown> {
    return this.http.post(API.restore(id), {});
  }

  /** Deletes a trashed pattern for good. */
  deleteForGood(id: string): Observable<unknown> {
    return this.http.delete(API.pattern(id));
  }
}
